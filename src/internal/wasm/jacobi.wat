;; One sweep of the one-sided (Hestenes) Jacobi SVD over all column pairs
;; (WebAssembly 128-bit SIMD, f64x2; one complex entry [re, im] per vector).
;;
;;   sweep(pg, m, pv, n, tol, pnorm) -> number of rotations applied
;;     first ν_j = ‖g_j‖² for every column (stored at pnorm, n f64), then for p < q < n,
;;     cyclic by rows, each row p starting with de Rijk's pivot (the column of largest ν
;;     among p … n − 1 is swapped into place p, with its row of Vᵀ and its ν):
;;       α = ν_p, β = ν_q (kept up to date, see below), γ = g_pᴴ g_q
;;       skip when |γ| = 0 or |γ| ≤ tol·√α·√β (already orthogonal)
;;       ζ = (β − α)/(2|γ|), t = sign(ζ)/(|ζ| + √(1 + ζ²)), c = 1/√(1 + t²), s = c·t,
;;       e = conj(γ)/|γ|:
;;       g_p ← c·g_p − s·e·g_q,  g_q ← s·g_p + c·e·g_q   (and the same on the rows of Vᵀ)
;;       ν_p ← α − t|γ|, ν_q ← β + t|γ| (the exact squared norms after the rotation); a norm
;;       that this update shrinks below 10⁻⁴ of its old value is recomputed from the column,
;;       so the cancellation costs at most about 10⁴ ε relative.
;;
;; Updating the norms instead of summing them again for every pair halves the work of the
;; inner products (as in Drmač & Veselić, "New fast and accurate Jacobi SVD algorithm I",
;; SIAM J. Matrix Anal. Appl. 29(4), 2008, from memory); every sweep starts from freshly
;; summed norms. The pivoting (de Rijk, "A one-sided Jacobi algorithm for computing the
;; singular value decomposition on a vector computer", SIAM J. Sci. Stat. Comput. 10(2),
;; 1989, from memory) cuts the sweeps of random 64 × 64 matrices from 10–11 to 8–9. (Hestenes, "Inversion of matrices by biorthogonalization", J. SIAM 6, 1958;
;; the complex rotation as in Drmač, "Implementation of Jacobi rotations for accurate
;; singular value computation in floating point arithmetic", SIAM J. Sci. Comput. 18(4),
;; 1997, from memory.) The arithmetic is that of the scalar loop of svd.ts, with the sums
;; kept per lane and added at the end.
;;
;; All addresses are in bytes of the exported memory.
;;
;; Data layout
;;   g      the n columns of the m×n work matrix, each stored contiguously as m
;;          interleaved complex Float64 ([re, im], 16 bytes): column p at pg + 16·m·p.
;;   vt     the n columns of V as rows, n×n interleaved complex: row p at pv + 16·n·p.
;;   pnorm  n Float64 squared column norms (written by the sweep).
(module
  (memory (export "memory") 1)

  ;; x ← c·x − s·(e·y), y ← s·x + c·(e·y) over len16/16 complex entries (two entries per pass)
  (func $rotate (param $px i32) (param $py i32) (param $len16 i32)
    (param $c f64) (param $s f64) (param $er f64) (param $ei f64)
    (local $k i32)
    (local $cv v128) (local $sv v128)    ;; c, s in both lanes
    (local $err v128) (local $eis v128)  ;; (er, er), (−ei, ei): e·y = y·err + swap(y)·eis
    (local $x v128) (local $y v128) (local $h v128)
    (local.set $cv (f64x2.splat (local.get $c)))
    (local.set $sv (f64x2.splat (local.get $s)))
    (local.set $err (f64x2.splat (local.get $er)))
    (local.set $eis (f64x2.replace_lane 0 (f64x2.splat (local.get $ei)) (f64.neg (local.get $ei))))
    (local.set $k (i32.const 0))
    (block $done
      (loop $pairs
        (br_if $done (i32.gt_u (i32.add (local.get $k) (i32.const 32)) (local.get $len16)))
        (local.set $x (v128.load (i32.add (local.get $px) (local.get $k))))
        (local.set $y (v128.load (i32.add (local.get $py) (local.get $k))))
        (local.set $h (f64x2.add
          (f64x2.mul (local.get $y) (local.get $err))
          (f64x2.mul (i8x16.shuffle 8 9 10 11 12 13 14 15 0 1 2 3 4 5 6 7 (local.get $y) (local.get $y)) (local.get $eis))))
        (v128.store (i32.add (local.get $px) (local.get $k))
          (f64x2.sub (f64x2.mul (local.get $cv) (local.get $x)) (f64x2.mul (local.get $sv) (local.get $h))))
        (v128.store (i32.add (local.get $py) (local.get $k))
          (f64x2.add (f64x2.mul (local.get $sv) (local.get $x)) (f64x2.mul (local.get $cv) (local.get $h))))
        (local.set $x (v128.load offset=16 (i32.add (local.get $px) (local.get $k))))
        (local.set $y (v128.load offset=16 (i32.add (local.get $py) (local.get $k))))
        (local.set $h (f64x2.add
          (f64x2.mul (local.get $y) (local.get $err))
          (f64x2.mul (i8x16.shuffle 8 9 10 11 12 13 14 15 0 1 2 3 4 5 6 7 (local.get $y) (local.get $y)) (local.get $eis))))
        (v128.store offset=16 (i32.add (local.get $px) (local.get $k))
          (f64x2.sub (f64x2.mul (local.get $cv) (local.get $x)) (f64x2.mul (local.get $sv) (local.get $h))))
        (v128.store offset=16 (i32.add (local.get $py) (local.get $k))
          (f64x2.add (f64x2.mul (local.get $sv) (local.get $x)) (f64x2.mul (local.get $cv) (local.get $h))))
        (local.set $k (i32.add (local.get $k) (i32.const 32)))
        (br $pairs)))
    (if (i32.lt_u (local.get $k) (local.get $len16))   ;; odd length: the last entry
      (then
        (local.set $x (v128.load (i32.add (local.get $px) (local.get $k))))
        (local.set $y (v128.load (i32.add (local.get $py) (local.get $k))))
        (local.set $h (f64x2.add
          (f64x2.mul (local.get $y) (local.get $err))
          (f64x2.mul (i8x16.shuffle 8 9 10 11 12 13 14 15 0 1 2 3 4 5 6 7 (local.get $y) (local.get $y)) (local.get $eis))))
        (v128.store (i32.add (local.get $px) (local.get $k))
          (f64x2.sub (f64x2.mul (local.get $cv) (local.get $x)) (f64x2.mul (local.get $sv) (local.get $h))))
        (v128.store (i32.add (local.get $py) (local.get $k))
          (f64x2.add (f64x2.mul (local.get $sv) (local.get $x)) (f64x2.mul (local.get $cv) (local.get $h))))
      )))

  ;; x ↔ y over len16/16 complex entries
  (func $swap (param $px i32) (param $py i32) (param $len16 i32)
    (local $k i32) (local $x v128)
    (local.set $k (i32.const 0))
    (block $done
      (loop $entries
        (br_if $done (i32.ge_u (local.get $k) (local.get $len16)))
        (local.set $x (v128.load (i32.add (local.get $px) (local.get $k))))
        (v128.store (i32.add (local.get $px) (local.get $k)) (v128.load (i32.add (local.get $py) (local.get $k))))
        (v128.store (i32.add (local.get $py) (local.get $k)) (local.get $x))
        (local.set $k (i32.add (local.get $k) (i32.const 16)))
        (br $entries))))

  ;; ‖x‖² over len16/16 complex entries (two entries per pass, two lane sums)
  (func $norm2 (param $px i32) (param $len16 i32) (result f64)
    (local $k i32) (local $a v128) (local $b v128) (local $acc1 v128) (local $acc2 v128)
    (local.set $k (i32.const 0))
    (block $done
      (loop $pairs
        (br_if $done (i32.gt_u (i32.add (local.get $k) (i32.const 32)) (local.get $len16)))
        (local.set $a (v128.load (i32.add (local.get $px) (local.get $k))))
        (local.set $b (v128.load offset=16 (i32.add (local.get $px) (local.get $k))))
        (local.set $acc1 (f64x2.add (local.get $acc1) (f64x2.mul (local.get $a) (local.get $a))))
        (local.set $acc2 (f64x2.add (local.get $acc2) (f64x2.mul (local.get $b) (local.get $b))))
        (local.set $k (i32.add (local.get $k) (i32.const 32)))
        (br $pairs)))
    (if (i32.lt_u (local.get $k) (local.get $len16))
      (then
        (local.set $a (v128.load (i32.add (local.get $px) (local.get $k))))
        (local.set $acc1 (f64x2.add (local.get $acc1) (f64x2.mul (local.get $a) (local.get $a))))))
    (local.set $acc1 (f64x2.add (local.get $acc1) (local.get $acc2)))
    (f64.add (f64x2.extract_lane 0 (local.get $acc1)) (f64x2.extract_lane 1 (local.get $acc1))))

  (func (export "sweep") (param $pg i32) (param $m i32) (param $pv i32) (param $n i32) (param $tol f64) (param $pnorm i32) (result i32)
    (local $p i32) (local $q i32) (local $k i32) (local $best i32)
    (local $m16 i32) (local $n16 i32)
    (local $ga i32) (local $gb i32)     ;; columns p and q of g
    (local $rotations i32)
    (local $a v128) (local $b v128)
    (local $accG1 v128) (local $accG2 v128) (local $accH1 v128) (local $accH2 v128)
    (local $alpha f64) (local $beta f64) (local $gr f64) (local $gi f64) (local $gabs f64)
    (local $zeta f64) (local $t f64) (local $c f64) (local $tg f64) (local $nu f64)
    (local.set $m16 (i32.shl (local.get $m) (i32.const 4)))
    (local.set $n16 (i32.shl (local.get $n) (i32.const 4)))
    ;; fresh squared norms
    (local.set $p (i32.const 0))
    (block $nDone
      (loop $nLoop
        (br_if $nDone (i32.ge_u (local.get $p) (local.get $n)))
        (f64.store (i32.add (local.get $pnorm) (i32.shl (local.get $p) (i32.const 3)))
          (call $norm2 (i32.add (local.get $pg) (i32.mul (local.get $p) (local.get $m16))) (local.get $m16)))
        (local.set $p (i32.add (local.get $p) (i32.const 1)))
        (br $nLoop)))
    (local.set $p (i32.const 0))
    (block $pDone
      (loop $pLoop
        (br_if $pDone (i32.ge_u (i32.add (local.get $p) (i32.const 1)) (local.get $n)))
        (local.set $ga (i32.add (local.get $pg) (i32.mul (local.get $p) (local.get $m16))))
        ;; de Rijk's pivot: the remaining column of largest norm moves to position p
        (local.set $best (local.get $p))
        (local.set $alpha (f64.load (i32.add (local.get $pnorm) (i32.shl (local.get $p) (i32.const 3)))))
        (local.set $q (i32.add (local.get $p) (i32.const 1)))
        (block $mDone
          (loop $mLoop
            (br_if $mDone (i32.ge_u (local.get $q) (local.get $n)))
            (local.set $beta (f64.load (i32.add (local.get $pnorm) (i32.shl (local.get $q) (i32.const 3)))))
            (if (f64.gt (local.get $beta) (local.get $alpha))
              (then (local.set $alpha (local.get $beta)) (local.set $best (local.get $q))))
            (local.set $q (i32.add (local.get $q) (i32.const 1)))
            (br $mLoop)))
        (if (i32.ne (local.get $best) (local.get $p))
          (then
            (call $swap (local.get $ga) (i32.add (local.get $pg) (i32.mul (local.get $best) (local.get $m16))) (local.get $m16))
            (call $swap
              (i32.add (local.get $pv) (i32.mul (local.get $p) (local.get $n16)))
              (i32.add (local.get $pv) (i32.mul (local.get $best) (local.get $n16)))
              (local.get $n16))
            (f64.store (i32.add (local.get $pnorm) (i32.shl (local.get $best) (i32.const 3)))
              (f64.load (i32.add (local.get $pnorm) (i32.shl (local.get $p) (i32.const 3)))))
            (f64.store (i32.add (local.get $pnorm) (i32.shl (local.get $p) (i32.const 3))) (local.get $alpha))))
        (local.set $q (i32.add (local.get $p) (i32.const 1)))
        (block $qDone
          (loop $qLoop
            (br_if $qDone (i32.ge_u (local.get $q) (local.get $n)))
            (local.set $gb (i32.add (local.get $pg) (i32.mul (local.get $q) (local.get $m16))))
            ;; γ: lane sums of a·b = [ar·br, ai·bi] and a·swap(b) = [ar·bi, ai·br], two entries per pass
            (local.set $accG1 (v128.const f64x2 0 0))
            (local.set $accG2 (v128.const f64x2 0 0))
            (local.set $accH1 (v128.const f64x2 0 0))
            (local.set $accH2 (v128.const f64x2 0 0))
            (local.set $k (i32.const 0))
            (block $dotDone
              (loop $dot
                (br_if $dotDone (i32.gt_u (i32.add (local.get $k) (i32.const 32)) (local.get $m16)))
                (local.set $a (v128.load (i32.add (local.get $ga) (local.get $k))))
                (local.set $b (v128.load (i32.add (local.get $gb) (local.get $k))))
                (local.set $accG1 (f64x2.add (local.get $accG1) (f64x2.mul (local.get $a) (local.get $b))))
                (local.set $accG2 (f64x2.add (local.get $accG2)
                  (f64x2.mul (local.get $a) (i8x16.shuffle 8 9 10 11 12 13 14 15 0 1 2 3 4 5 6 7 (local.get $b) (local.get $b)))))
                (local.set $a (v128.load offset=16 (i32.add (local.get $ga) (local.get $k))))
                (local.set $b (v128.load offset=16 (i32.add (local.get $gb) (local.get $k))))
                (local.set $accH1 (f64x2.add (local.get $accH1) (f64x2.mul (local.get $a) (local.get $b))))
                (local.set $accH2 (f64x2.add (local.get $accH2)
                  (f64x2.mul (local.get $a) (i8x16.shuffle 8 9 10 11 12 13 14 15 0 1 2 3 4 5 6 7 (local.get $b) (local.get $b)))))
                (local.set $k (i32.add (local.get $k) (i32.const 32)))
                (br $dot)))
            (if (i32.lt_u (local.get $k) (local.get $m16))
              (then
                (local.set $a (v128.load (i32.add (local.get $ga) (local.get $k))))
                (local.set $b (v128.load (i32.add (local.get $gb) (local.get $k))))
                (local.set $accG1 (f64x2.add (local.get $accG1) (f64x2.mul (local.get $a) (local.get $b))))
                (local.set $accG2 (f64x2.add (local.get $accG2)
                  (f64x2.mul (local.get $a) (i8x16.shuffle 8 9 10 11 12 13 14 15 0 1 2 3 4 5 6 7 (local.get $b) (local.get $b)))))))
            (local.set $accG1 (f64x2.add (local.get $accG1) (local.get $accH1)))
            (local.set $accG2 (f64x2.add (local.get $accG2) (local.get $accH2)))
            (local.set $alpha (f64.load (i32.add (local.get $pnorm) (i32.shl (local.get $p) (i32.const 3)))))
            (local.set $beta (f64.load (i32.add (local.get $pnorm) (i32.shl (local.get $q) (i32.const 3)))))
            (local.set $gr (f64.add (f64x2.extract_lane 0 (local.get $accG1)) (f64x2.extract_lane 1 (local.get $accG1))))
            (local.set $gi (f64.sub (f64x2.extract_lane 0 (local.get $accG2)) (f64x2.extract_lane 1 (local.get $accG2))))
            (local.set $gabs (f64.sqrt (f64.add (f64.mul (local.get $gr) (local.get $gr)) (f64.mul (local.get $gi) (local.get $gi)))))
            (if (i32.eqz (i32.or
                  (f64.eq (local.get $gabs) (f64.const 0))
                  (f64.le (local.get $gabs) (f64.mul (f64.mul (local.get $tol) (f64.sqrt (local.get $alpha))) (f64.sqrt (local.get $beta))))))
              (then
                (local.set $rotations (i32.add (local.get $rotations) (i32.const 1)))
                (local.set $zeta (f64.div (f64.sub (local.get $beta) (local.get $alpha)) (f64.mul (f64.const 2) (local.get $gabs))))
                (local.set $t (f64.div
                  (select (f64.const 1) (f64.const -1) (f64.ge (local.get $zeta) (f64.const 0)))
                  (f64.add (f64.abs (local.get $zeta)) (f64.sqrt (f64.add (f64.const 1) (f64.mul (local.get $zeta) (local.get $zeta)))))))
                (local.set $c (f64.div (f64.const 1) (f64.sqrt (f64.add (f64.const 1) (f64.mul (local.get $t) (local.get $t))))))
                ;; s = c·t, e = conj(γ)/|γ| = (gr, −gi)/|γ|
                (call $rotate (local.get $ga) (local.get $gb) (local.get $m16)
                  (local.get $c) (f64.mul (local.get $c) (local.get $t))
                  (f64.div (local.get $gr) (local.get $gabs)) (f64.div (f64.neg (local.get $gi)) (local.get $gabs)))
                (call $rotate
                  (i32.add (local.get $pv) (i32.mul (local.get $p) (local.get $n16)))
                  (i32.add (local.get $pv) (i32.mul (local.get $q) (local.get $n16)))
                  (local.get $n16)
                  (local.get $c) (f64.mul (local.get $c) (local.get $t))
                  (f64.div (local.get $gr) (local.get $gabs)) (f64.div (f64.neg (local.get $gi)) (local.get $gabs)))
                ;; updated squared norms; recomputed when the update cancels
                (local.set $tg (f64.mul (local.get $t) (local.get $gabs)))
                (local.set $nu (f64.sub (local.get $alpha) (local.get $tg)))
                (if (f64.lt (local.get $nu) (f64.mul (f64.const 1e-4) (local.get $alpha)))
                  (then (local.set $nu (call $norm2 (local.get $ga) (local.get $m16)))))
                (f64.store (i32.add (local.get $pnorm) (i32.shl (local.get $p) (i32.const 3))) (local.get $nu))
                (local.set $nu (f64.add (local.get $beta) (local.get $tg)))
                (if (f64.lt (local.get $nu) (f64.mul (f64.const 1e-4) (local.get $beta)))
                  (then (local.set $nu (call $norm2 (local.get $gb) (local.get $m16)))))
                (f64.store (i32.add (local.get $pnorm) (i32.shl (local.get $q) (i32.const 3))) (local.get $nu))))
            (local.set $q (i32.add (local.get $q) (i32.const 1)))
            (br $qLoop)))
        (local.set $p (i32.add (local.get $p) (i32.const 1)))
        (br $pLoop)))
    (local.get $rotations)))
