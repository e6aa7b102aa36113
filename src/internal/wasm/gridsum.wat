;; Array factor of a full rectangular grid over arbitrary directions, two
;; directions per pass (WebAssembly 128-bit SIMD, f64x2; lane t = direction t).
;;
;;   gridsum(pairs, hx, oddx, hy, oddy, nyp, pb, ps, sBytes, yOff, mOff, px, py, pout)
;;
;; The sum AF(d) = Σ_r Σ_c W[r, c] e^{j δ_c(d)} e^{j ε_r(d)} over a grid whose
;; column and row phases are symmetric progressions about their mid values
;; (δ_c = −δ_{D−1−c}, ε_r = −ε_{R−1−r}) is, after pairing each column with its
;; mirror and each row with its mirror,
;;   AF(d) = m(d) · Σ_a Σ_b x_a(d) · B[a, b] · y_b(d)
;; with real vectors x = [cos δ_0 … cos δ_{hx−1}, (1 if D odd), sin δ_0 … sin δ_{hx−1}]
;; (δ_i the i-th phase outward from the middle), y likewise over the rows, the
;; complex matrix B built once from the weights, and m(d) the phase of the grid
;; centre. Per direction this is nx·ny complex-by-real multiply-adds, half of
;; the plain complex sum over the elements.
;;
;; All addresses and strides are in bytes of the exported memory.
;;
;; Data layout
;;   B     nx rows of nyp entries (nyp ≥ ny, a multiple of 4; padding zero),
;;         each entry [re, im] (16 bytes): B[a, b] at pb + 16·(a·nyp + b).
;;   seeds one record of sBytes per direction pair at ps + pair·sBytes, every
;;         value a lane pair (direction 0, direction 1):
;;           +0   x step cos, +16 x step sin
;;           +32  x seeds: cos, sin of δ_{16j} for j = 0, 1, … (32 bytes each)
;;           yOff the same for the rows (step, then seeds of ε_{16j})
;;           mOff cos, sin of the centre phase m(d)
;;   px    scratch for x: nx lane pairs (16 bytes each)
;;   py    scratch for y: nyp lane pairs; entries ny … nyp−1 are set to zero here
;;   pout  per pair 32 bytes: [re AF(d0), im AF(d0), re AF(d1), im AF(d1)]
;;
;; Algorithm
;;   The phase tables follow the recurrence z_{i+1} = z_i · e^{jΔ} in both lanes,
;;   re-seeded from a directly computed value every 16 steps, so the rounding of
;;   a table entry stays within ~20 ulp. Then, for four columns b at a time,
;;   eight accumulators (re and im of four entries of xᵀB, both lanes) run over
;;   a with one table load and four splatted [re, im] loads of B per step; the
;;   four partial sums are weighted by y_b and added to the result. Finally the
;;   result is rotated by m(d) and written interleaved.
(module
  (memory (export "memory") 1)

  ;; Phase table of one axis: cos at pt + 16·i, sin at pt + 16·(h + odd + i), 1 at pt + 16·h if odd.
  (func $fill (param $ps i32) (param $h i32) (param $odd i32) (param $pt i32)
    (local $i i32)       ;; table index
    (local $sinAt i32)   ;; address of the sine half
    (local $seed i32)    ;; address of the next seed
    (local $wr v128) (local $wi v128)   ;; step e^{jΔ}
    (local $zr v128) (local $zi v128)   ;; current phase
    (local $t v128)
    (local.set $wr (v128.load offset=0 (local.get $ps)))
    (local.set $wi (v128.load offset=16 (local.get $ps)))
    (local.set $seed (i32.add (local.get $ps) (i32.const 32)))
    (local.set $sinAt (i32.add (local.get $pt) (i32.shl (i32.add (local.get $h) (local.get $odd)) (i32.const 4))))
    (if (local.get $odd)
      (then (v128.store (i32.add (local.get $pt) (i32.shl (local.get $h) (i32.const 4))) (v128.const f64x2 1 1))))
    (local.set $i (i32.const 0))
    (block $done
      (loop $next
        (br_if $done (i32.ge_u (local.get $i) (local.get $h)))
        (if (i32.eqz (i32.and (local.get $i) (i32.const 15)))
          (then
            (local.set $zr (v128.load offset=0 (local.get $seed)))
            (local.set $zi (v128.load offset=16 (local.get $seed)))
            (local.set $seed (i32.add (local.get $seed) (i32.const 32))))
          (else
            (local.set $t (f64x2.sub (f64x2.mul (local.get $zr) (local.get $wr)) (f64x2.mul (local.get $zi) (local.get $wi))))
            (local.set $zi (f64x2.add (f64x2.mul (local.get $zr) (local.get $wi)) (f64x2.mul (local.get $zi) (local.get $wr))))
            (local.set $zr (local.get $t))))
        (v128.store (i32.add (local.get $pt) (i32.shl (local.get $i) (i32.const 4))) (local.get $zr))
        (v128.store (i32.add (local.get $sinAt) (i32.shl (local.get $i) (i32.const 4))) (local.get $zi))
        (local.set $i (i32.add (local.get $i) (i32.const 1)))
        (br $next))))

  (func (export "gridsum")
    (param $pairs i32) (param $hx i32) (param $oddx i32) (param $hy i32) (param $oddy i32) (param $nyp i32)
    (param $pb i32) (param $ps i32) (param $sBytes i32) (param $yOff i32) (param $mOff i32)
    (param $px i32) (param $py i32) (param $pout i32)
    (local $pair i32)
    (local $s i32)        ;; seed record of this pair
    (local $nx i32)       ;; rows of B
    (local $ny i32)       ;; used columns of B
    (local $rowB i32)     ;; 16·nyp, the byte stride of a row of B
    (local $bb i32)       ;; first of the four columns b
    (local $a i32)        ;; row of B
    (local $pa i32)       ;; address of B[a, bb]
    (local $xa i32)       ;; address of x_a
    (local $yb i32)       ;; address of y_bb
    (local $xv v128)
    (local $c0r v128) (local $c0i v128) (local $c1r v128) (local $c1i v128)
    (local $c2r v128) (local $c2i v128) (local $c3r v128) (local $c3i v128)
    (local $y0 v128) (local $y1 v128) (local $y2 v128) (local $y3 v128)
    (local $fr v128) (local $fi v128)   ;; AF before the centre phase
    (local $mr v128) (local $mi v128)
    (local $or v128) (local $oi v128)
    (local.set $nx (i32.add (i32.shl (local.get $hx) (i32.const 1)) (local.get $oddx)))
    (local.set $ny (i32.add (i32.shl (local.get $hy) (i32.const 1)) (local.get $oddy)))
    (local.set $rowB (i32.shl (local.get $nyp) (i32.const 4)))
    ;; zero the padding of y once (the fill never writes it)
    (local.set $bb (local.get $ny))
    (block $padDone
      (loop $pad
        (br_if $padDone (i32.ge_u (local.get $bb) (local.get $nyp)))
        (v128.store (i32.add (local.get $py) (i32.shl (local.get $bb) (i32.const 4))) (v128.const f64x2 0 0))
        (local.set $bb (i32.add (local.get $bb) (i32.const 1)))
        (br $pad)))
    (local.set $pair (i32.const 0))
    (block $pairsDone
      (loop $pairLoop
        (br_if $pairsDone (i32.ge_u (local.get $pair) (local.get $pairs)))
        (local.set $s (i32.add (local.get $ps) (i32.mul (local.get $pair) (local.get $sBytes))))
        (call $fill (local.get $s) (local.get $hx) (local.get $oddx) (local.get $px))
        (call $fill (i32.add (local.get $s) (local.get $yOff)) (local.get $hy) (local.get $oddy) (local.get $py))
        (local.set $fr (v128.const f64x2 0 0))
        (local.set $fi (v128.const f64x2 0 0))
        (local.set $bb (i32.const 0))
        (block $colsDone
          (loop $cols
            (br_if $colsDone (i32.ge_u (local.get $bb) (local.get $nyp)))
            (local.set $c0r (v128.const f64x2 0 0)) (local.set $c0i (v128.const f64x2 0 0))
            (local.set $c1r (v128.const f64x2 0 0)) (local.set $c1i (v128.const f64x2 0 0))
            (local.set $c2r (v128.const f64x2 0 0)) (local.set $c2i (v128.const f64x2 0 0))
            (local.set $c3r (v128.const f64x2 0 0)) (local.set $c3i (v128.const f64x2 0 0))
            (local.set $pa (i32.add (local.get $pb) (i32.shl (local.get $bb) (i32.const 4))))
            (local.set $xa (local.get $px))
            (local.set $a (i32.const 0))
            (block $rowsDone
              (loop $rows
                (br_if $rowsDone (i32.ge_u (local.get $a) (local.get $nx)))
                (local.set $xv (v128.load (local.get $xa)))
                (local.set $c0r (f64x2.add (local.get $c0r) (f64x2.mul (local.get $xv) (v128.load64_splat offset=0 (local.get $pa)))))
                (local.set $c0i (f64x2.add (local.get $c0i) (f64x2.mul (local.get $xv) (v128.load64_splat offset=8 (local.get $pa)))))
                (local.set $c1r (f64x2.add (local.get $c1r) (f64x2.mul (local.get $xv) (v128.load64_splat offset=16 (local.get $pa)))))
                (local.set $c1i (f64x2.add (local.get $c1i) (f64x2.mul (local.get $xv) (v128.load64_splat offset=24 (local.get $pa)))))
                (local.set $c2r (f64x2.add (local.get $c2r) (f64x2.mul (local.get $xv) (v128.load64_splat offset=32 (local.get $pa)))))
                (local.set $c2i (f64x2.add (local.get $c2i) (f64x2.mul (local.get $xv) (v128.load64_splat offset=40 (local.get $pa)))))
                (local.set $c3r (f64x2.add (local.get $c3r) (f64x2.mul (local.get $xv) (v128.load64_splat offset=48 (local.get $pa)))))
                (local.set $c3i (f64x2.add (local.get $c3i) (f64x2.mul (local.get $xv) (v128.load64_splat offset=56 (local.get $pa)))))
                (local.set $pa (i32.add (local.get $pa) (local.get $rowB)))
                (local.set $xa (i32.add (local.get $xa) (i32.const 16)))
                (local.set $a (i32.add (local.get $a) (i32.const 1)))
                (br $rows)))
            ;; weight the four entries of xᵀB by y_b
            (local.set $yb (i32.add (local.get $py) (i32.shl (local.get $bb) (i32.const 4))))
            (local.set $y0 (v128.load offset=0 (local.get $yb)))
            (local.set $y1 (v128.load offset=16 (local.get $yb)))
            (local.set $y2 (v128.load offset=32 (local.get $yb)))
            (local.set $y3 (v128.load offset=48 (local.get $yb)))
            (local.set $fr (f64x2.add (local.get $fr)
              (f64x2.add (f64x2.add (f64x2.mul (local.get $c0r) (local.get $y0)) (f64x2.mul (local.get $c1r) (local.get $y1)))
                         (f64x2.add (f64x2.mul (local.get $c2r) (local.get $y2)) (f64x2.mul (local.get $c3r) (local.get $y3))))))
            (local.set $fi (f64x2.add (local.get $fi)
              (f64x2.add (f64x2.add (f64x2.mul (local.get $c0i) (local.get $y0)) (f64x2.mul (local.get $c1i) (local.get $y1)))
                         (f64x2.add (f64x2.mul (local.get $c2i) (local.get $y2)) (f64x2.mul (local.get $c3i) (local.get $y3))))))
            (local.set $bb (i32.add (local.get $bb) (i32.const 4)))
            (br $cols)))
        ;; centre phase, then interleave [re, im] per direction
        (local.set $mr (v128.load offset=0 (i32.add (local.get $s) (local.get $mOff))))
        (local.set $mi (v128.load offset=16 (i32.add (local.get $s) (local.get $mOff))))
        (local.set $or (f64x2.sub (f64x2.mul (local.get $fr) (local.get $mr)) (f64x2.mul (local.get $fi) (local.get $mi))))
        (local.set $oi (f64x2.add (f64x2.mul (local.get $fr) (local.get $mi)) (f64x2.mul (local.get $fi) (local.get $mr))))
        (v128.store offset=0 (i32.add (local.get $pout) (i32.shl (local.get $pair) (i32.const 5)))
          (i8x16.shuffle 0 1 2 3 4 5 6 7 16 17 18 19 20 21 22 23 (local.get $or) (local.get $oi)))
        (v128.store offset=16 (i32.add (local.get $pout) (i32.shl (local.get $pair) (i32.const 5)))
          (i8x16.shuffle 8 9 10 11 12 13 14 15 24 25 26 27 28 29 30 31 (local.get $or) (local.get $oi)))
        (local.set $pair (i32.add (local.get $pair) (i32.const 1)))
        (br $pairLoop)))))
