;; Plane rotations of one implicit QL sweep applied to the accumulated
;; eigenvector matrix (WebAssembly 128-bit SIMD, f64x2).
;;
;;   rotate(pz, panelBytes, panels, lo, m, pc, ps):
;;     for every panel (eight columns k of Zt):
;;       carry = Zt[m]
;;       for t = m−1 down to lo:
;;         Zt[t+1] = s_t·Zt[t] + c_t·carry
;;         carry   = c_t·Zt[t] − s_t·carry
;;       Zt[lo] = carry
;;
;; All addresses are in bytes of the exported memory.
;;
;; Data layout
;;   Zt  the transposed eigenvector matrix Zt[t][k] = Z[k][t], real Float64,
;;       stored in panels of eight columns k: panel b at pz + b·panelBytes, and
;;       in it row t as the 64 bytes [Zt[t][8b] … Zt[t][8b+7]] at offset 64·t.
;;       So a sweep over t walks one panel contiguously (backwards) instead of
;;       striding over whole rows; padding columns are carried along.
;;   c, s  the cosines and sines of the sweep, Float64 arrays at pc and ps
;;       (rotation t mixes rows t and t+1).
;;
;; Algorithm
;;   Eight doubles (four f64x2 vectors) per panel give four independent running
;;   values, which hides the latency of the carried recurrence (Golub & Van
;;   Loan, Matrix Computations, 4th ed., 2013, §8.3.5, from memory: the
;;   implicit symmetric QL/QR step and its accumulated Givens rotations).
(module
  (memory (export "memory") 1)

  (func (export "rotate")
    (param $pz i32) (param $panelBytes i32) (param $panels i32) (param $lo i32) (param $m i32)
    (param $pc i32) (param $ps i32)
    (local $kb i32)    ;; byte offset of the panel
    (local $end i32)   ;; panels·panelBytes
    (local $t i32)     ;; rotation index, m−1 down to lo
    (local $ptr i32)   ;; address of Zt[t] in this column block
    (local $cos v128) (local $sin v128)  ;; c_t and s_t in both lanes
    (local $carry0 v128) (local $carry1 v128) (local $carry2 v128) (local $carry3 v128)
    (local $z0 v128) (local $z1 v128) (local $z2 v128) (local $z3 v128)

    (local.set $kb (i32.const 0))
    (local.set $end (i32.mul (local.get $panels) (local.get $panelBytes)))
    (block $blocksDone
      (loop $blocks
        (br_if $blocksDone (i32.ge_u (local.get $kb) (local.get $end)))
        ;; ptr = address of Zt[m] in this panel; the carries start as Zt[m]
        (local.set $ptr (i32.add (i32.add (local.get $pz) (i32.shl (local.get $m) (i32.const 6))) (local.get $kb)))
        (local.set $carry0 (v128.load offset=0 (local.get $ptr)))
        (local.set $carry1 (v128.load offset=16 (local.get $ptr)))
        (local.set $carry2 (v128.load offset=32 (local.get $ptr)))
        (local.set $carry3 (v128.load offset=48 (local.get $ptr)))
        (local.set $t (i32.sub (local.get $m) (i32.const 1)))
        (local.set $ptr (i32.sub (local.get $ptr) (i32.const 64)))
        (block $sweepDone
          (loop $sweep
            (br_if $sweepDone (i32.lt_s (local.get $t) (local.get $lo)))
            (local.set $cos (f64x2.splat (f64.load (i32.add (local.get $pc) (i32.shl (local.get $t) (i32.const 3))))))
            (local.set $sin (f64x2.splat (f64.load (i32.add (local.get $ps) (i32.shl (local.get $t) (i32.const 3))))))
            (local.set $z0 (v128.load offset=0 (local.get $ptr)))
            (local.set $z1 (v128.load offset=16 (local.get $ptr)))
            (local.set $z2 (v128.load offset=32 (local.get $ptr)))
            (local.set $z3 (v128.load offset=48 (local.get $ptr)))
            ;; Zt[t+1] = s·z + c·carry
            (v128.store offset=0 (i32.add (local.get $ptr) (i32.const 64))
              (f64x2.add (f64x2.mul (local.get $sin) (local.get $z0)) (f64x2.mul (local.get $cos) (local.get $carry0))))
            (v128.store offset=16 (i32.add (local.get $ptr) (i32.const 64))
              (f64x2.add (f64x2.mul (local.get $sin) (local.get $z1)) (f64x2.mul (local.get $cos) (local.get $carry1))))
            (v128.store offset=32 (i32.add (local.get $ptr) (i32.const 64))
              (f64x2.add (f64x2.mul (local.get $sin) (local.get $z2)) (f64x2.mul (local.get $cos) (local.get $carry2))))
            (v128.store offset=48 (i32.add (local.get $ptr) (i32.const 64))
              (f64x2.add (f64x2.mul (local.get $sin) (local.get $z3)) (f64x2.mul (local.get $cos) (local.get $carry3))))
            ;; carry = c·z − s·carry
            (local.set $carry0 (f64x2.sub (f64x2.mul (local.get $cos) (local.get $z0)) (f64x2.mul (local.get $sin) (local.get $carry0))))
            (local.set $carry1 (f64x2.sub (f64x2.mul (local.get $cos) (local.get $z1)) (f64x2.mul (local.get $sin) (local.get $carry1))))
            (local.set $carry2 (f64x2.sub (f64x2.mul (local.get $cos) (local.get $z2)) (f64x2.mul (local.get $sin) (local.get $carry2))))
            (local.set $carry3 (f64x2.sub (f64x2.mul (local.get $cos) (local.get $z3)) (f64x2.mul (local.get $sin) (local.get $carry3))))
            (local.set $t (i32.sub (local.get $t) (i32.const 1)))
            (local.set $ptr (i32.sub (local.get $ptr) (i32.const 64)))
            (br $sweep)))
        ;; Zt[lo] = carry (ptr is one row above lo)
        (v128.store offset=0 (i32.add (local.get $ptr) (i32.const 64)) (local.get $carry0))
        (v128.store offset=16 (i32.add (local.get $ptr) (i32.const 64)) (local.get $carry1))
        (v128.store offset=32 (i32.add (local.get $ptr) (i32.const 64)) (local.get $carry2))
        (v128.store offset=48 (i32.add (local.get $ptr) (i32.const 64)) (local.get $carry3))
        (local.set $kb (i32.add (local.get $kb) (local.get $panelBytes)))
        (br $blocks)))))
