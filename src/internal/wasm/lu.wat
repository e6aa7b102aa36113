;; LU factorisation with partial pivoting of a small dense complex matrix held
;; whole in the module memory (WebAssembly 128-bit SIMD, f64x2; one complex
;; entry [re, im] per vector).
;;
;;   lu(n, pa, pu, pp, pm) → number of row interchanges
;;
;; All addresses are in bytes of the exported memory.
;;
;; Data layout
;;   A   n×n interleaved complex Float64, row-major as in CMatrix, at pa; on
;;       return L (unit lower, strictly below the diagonal) and U (on and above).
;;   pu  scratch of 2·n vectors: the pivot row right of the diagonal, then the
;;       same entries as [−im, re].
;;   pp  n i32 row indices (the caller's permutation), interchanged with the rows.
;;   pm  one f64: the smallest squared pivot modulus (0 for an exactly zero pivot).
;;
;; Algorithm
;;   Right-looking elimination (Golub & Van Loan, *Matrix Computations*, 4th
;;   ed., 2013, Alg. 3.4.1, from memory): for each column k the entry of largest
;;   modulus at or below the diagonal is the pivot; its row is interchanged
;;   with row k across the full width; the multipliers l = a(i,k)/a(k,k) are
;;   stored in place and every later row receives the rank-one update
;;   a(i,j) −= l·u(k,j), two rows per pass so that they share the loads of u. With the pivot row kept both as u = [re, im] and as
;;   u' = [−im, re], one complex product is l_re·u + l_im·u' — two f64x2
;;   multiplies and an add — in the same operation order as the scalar code.
;;   A zero pivot leaves its column as it is and the elimination goes on.
;;   Meant for matrices that fit in cache (the caller sends larger ones to the
;;   blocked factorisation on the product kernel).
(module
  (memory (export "memory") 1)

  (func (export "lu")
    (param $n i32) (param $pa i32) (param $pu i32) (param $pp i32) (param $pm i32) (result i32)
    (local $rowBytes i32)  ;; 16·n
    (local $k i32)         ;; pivot column
    (local $i i32)         ;; row
    (local $p i32)         ;; pivot row
    (local $rowK i32)      ;; address of row k
    (local $rowI i32)      ;; address of row i
    (local $at i32)        ;; running address
    (local $end i32)       ;; end address of a row segment
    (local $swaps i32)
    (local $t i32)
    (local $best f64) (local $sq f64) (local $minSq f64)
    (local $pr f64) (local $pi f64) (local $den f64) (local $ir f64) (local $ii f64)
    (local $ar f64) (local $ai f64) (local $lr f64) (local $li f64)
    (local $v v128) (local $w v128) (local $vlr v128) (local $vli v128) (local $vlr2 v128) (local $vli2 v128)
    (local $j i32)         ;; byte offset of column j in a row
    (local $pu2 i32)       ;; address of the u' half of the scratch
    (local.set $rowBytes (i32.shl (local.get $n) (i32.const 4)))
    (local.set $pu2 (i32.add (local.get $pu) (local.get $rowBytes)))
    (local.set $minSq (f64.const inf))
    (local.set $k (i32.const 0))
    (block $colsDone
      (loop $cols
        (br_if $colsDone (i32.ge_u (local.get $k) (local.get $n)))
        (local.set $rowK (i32.add (local.get $pa) (i32.mul (local.get $k) (local.get $rowBytes))))
        ;; pivot search down column k
        (local.set $best (f64.const -1))
        (local.set $p (local.get $k))
        (local.set $i (local.get $k))
        (local.set $at (i32.add (local.get $rowK) (i32.shl (local.get $k) (i32.const 4))))
        (block $searchDone
          (loop $search
            (br_if $searchDone (i32.ge_u (local.get $i) (local.get $n)))
            (local.set $ar (f64.load offset=0 (local.get $at)))
            (local.set $ai (f64.load offset=8 (local.get $at)))
            (local.set $sq (f64.add (f64.mul (local.get $ar) (local.get $ar)) (f64.mul (local.get $ai) (local.get $ai))))
            (if (f64.gt (local.get $sq) (local.get $best))
              (then (local.set $best (local.get $sq)) (local.set $p (local.get $i))))
            (local.set $at (i32.add (local.get $at) (local.get $rowBytes)))
            (local.set $i (i32.add (local.get $i) (i32.const 1)))
            (br $search)))
        ;; interchange rows k and p across the full width
        (if (i32.ne (local.get $p) (local.get $k))
          (then
            (local.set $at (local.get $rowK))
            (local.set $rowI (i32.add (local.get $pa) (i32.mul (local.get $p) (local.get $rowBytes))))
            (local.set $end (i32.add (local.get $rowK) (local.get $rowBytes)))
            (block $swapDone
              (loop $swap
                (br_if $swapDone (i32.ge_u (local.get $at) (local.get $end)))
                (local.set $v (v128.load (local.get $at)))
                (v128.store (local.get $at) (v128.load (local.get $rowI)))
                (v128.store (local.get $rowI) (local.get $v))
                (local.set $at (i32.add (local.get $at) (i32.const 16)))
                (local.set $rowI (i32.add (local.get $rowI) (i32.const 16)))
                (br $swap)))
            (local.set $t (i32.load (i32.add (local.get $pp) (i32.shl (local.get $k) (i32.const 2)))))
            (i32.store (i32.add (local.get $pp) (i32.shl (local.get $k) (i32.const 2)))
              (i32.load (i32.add (local.get $pp) (i32.shl (local.get $p) (i32.const 2)))))
            (i32.store (i32.add (local.get $pp) (i32.shl (local.get $p) (i32.const 2))) (local.get $t))
            (local.set $swaps (i32.add (local.get $swaps) (i32.const 1)))))
        (local.set $pr (f64.load offset=0 (i32.add (local.get $rowK) (i32.shl (local.get $k) (i32.const 4)))))
        (local.set $pi (f64.load offset=8 (i32.add (local.get $rowK) (i32.shl (local.get $k) (i32.const 4)))))
        (local.set $den (f64.add (f64.mul (local.get $pr) (local.get $pr)) (f64.mul (local.get $pi) (local.get $pi))))
        (if (f64.lt (local.get $den) (local.get $minSq)) (then (local.set $minSq (local.get $den))))
        (if (f64.ne (local.get $den) (f64.const 0))
          (then
            (local.set $ir (f64.div (local.get $pr) (local.get $den)))
            (local.set $ii (f64.div (f64.neg (local.get $pi)) (local.get $den)))
            ;; u and u' = [−im, re] of the pivot row right of the diagonal (scratch indexed by column)
            (local.set $t (i32.add (local.get $k) (i32.const 1)))
            (block $prepDone
              (loop $prep
                (br_if $prepDone (i32.ge_u (local.get $t) (local.get $n)))
                (local.set $v (v128.load (i32.add (local.get $rowK) (i32.shl (local.get $t) (i32.const 4)))))
                (v128.store (i32.add (local.get $pu) (i32.shl (local.get $t) (i32.const 4))) (local.get $v))
                (v128.store (i32.add (local.get $pu2) (i32.shl (local.get $t) (i32.const 4)))
                  (f64x2.mul (i8x16.shuffle 8 9 10 11 12 13 14 15 0 1 2 3 4 5 6 7 (local.get $v) (local.get $v)) (v128.const f64x2 -1 1)))
                (local.set $t (i32.add (local.get $t) (i32.const 1)))
                (br $prep)))
            ;; multipliers and rank-one update of rows k+1 … n−1, two rows per pass
            ;; (they share the loads of u and u'), the last odd row alone
            (local.set $i (i32.add (local.get $k) (i32.const 1)))
            (local.set $rowI (i32.add (local.get $rowK) (local.get $rowBytes)))
            (local.set $t (i32.shl (i32.add (local.get $k) (i32.const 1)) (i32.const 4)))
            (block $rowsDone
              (loop $rows
                (br_if $rowsDone (i32.ge_u (local.get $i) (local.get $n)))
                (local.set $at (i32.add (local.get $rowI) (i32.shl (local.get $k) (i32.const 4))))
                (local.set $ar (f64.load offset=0 (local.get $at)))
                (local.set $ai (f64.load offset=8 (local.get $at)))
                (local.set $lr (f64.sub (f64.mul (local.get $ar) (local.get $ir)) (f64.mul (local.get $ai) (local.get $ii))))
                (local.set $li (f64.add (f64.mul (local.get $ar) (local.get $ii)) (f64.mul (local.get $ai) (local.get $ir))))
                (f64.store offset=0 (local.get $at) (local.get $lr))
                (f64.store offset=8 (local.get $at) (local.get $li))
                (local.set $vlr (f64x2.splat (local.get $lr)))
                (local.set $vli (f64x2.splat (local.get $li)))
                (if (i32.lt_u (i32.add (local.get $i) (i32.const 1)) (local.get $n))
                  (then
                    ;; second row: multiplier at (i+1, k)
                    (local.set $at (i32.add (local.get $at) (local.get $rowBytes)))
                    (local.set $ar (f64.load offset=0 (local.get $at)))
                    (local.set $ai (f64.load offset=8 (local.get $at)))
                    (local.set $lr (f64.sub (f64.mul (local.get $ar) (local.get $ir)) (f64.mul (local.get $ai) (local.get $ii))))
                    (local.set $li (f64.add (f64.mul (local.get $ar) (local.get $ii)) (f64.mul (local.get $ai) (local.get $ir))))
                    (f64.store offset=0 (local.get $at) (local.get $lr))
                    (f64.store offset=8 (local.get $at) (local.get $li))
                    (local.set $vlr2 (f64x2.splat (local.get $lr)))
                    (local.set $vli2 (f64x2.splat (local.get $li)))
                    ;; both rows: a −= l_re·u + l_im·u'
                    (local.set $at (i32.add (local.get $rowI) (local.get $t)))
                    (local.set $end (i32.add (local.get $rowI) (local.get $rowBytes)))
                    (local.set $j (local.get $t))
                    (block $upd2Done
                      (loop $upd2
                        (br_if $upd2Done (i32.ge_u (local.get $at) (local.get $end)))
                        (local.set $v (v128.load (i32.add (local.get $pu) (local.get $j))))
                        (local.set $w (v128.load (i32.add (local.get $pu2) (local.get $j))))
                        (v128.store (local.get $at)
                          (f64x2.sub (v128.load (local.get $at))
                            (f64x2.add (f64x2.mul (local.get $vlr) (local.get $v)) (f64x2.mul (local.get $vli) (local.get $w)))))
                        (v128.store (i32.add (local.get $at) (local.get $rowBytes))
                          (f64x2.sub (v128.load (i32.add (local.get $at) (local.get $rowBytes)))
                            (f64x2.add (f64x2.mul (local.get $vlr2) (local.get $v)) (f64x2.mul (local.get $vli2) (local.get $w)))))
                        (local.set $at (i32.add (local.get $at) (i32.const 16)))
                        (local.set $j (i32.add (local.get $j) (i32.const 16)))
                        (br $upd2)))
                    (local.set $rowI (i32.add (local.get $rowI) (i32.shl (local.get $rowBytes) (i32.const 1))))
                    (local.set $i (i32.add (local.get $i) (i32.const 2))))
                  (else
                    (local.set $at (i32.add (local.get $rowI) (local.get $t)))
                    (local.set $end (i32.add (local.get $rowI) (local.get $rowBytes)))
                    (local.set $j (local.get $t))
                    (block $updDone
                      (loop $upd
                        (br_if $updDone (i32.ge_u (local.get $at) (local.get $end)))
                        (v128.store (local.get $at)
                          (f64x2.sub (v128.load (local.get $at))
                            (f64x2.add
                              (f64x2.mul (local.get $vlr) (v128.load (i32.add (local.get $pu) (local.get $j))))
                              (f64x2.mul (local.get $vli) (v128.load (i32.add (local.get $pu2) (local.get $j)))))))
                        (local.set $at (i32.add (local.get $at) (i32.const 16)))
                        (local.set $j (i32.add (local.get $j) (i32.const 16)))
                        (br $upd)))
                    (local.set $rowI (i32.add (local.get $rowI) (local.get $rowBytes)))
                    (local.set $i (i32.add (local.get $i) (i32.const 1)))))
                (br $rows)))))
        (local.set $k (i32.add (local.get $k) (i32.const 1)))
        (br $cols)))
    (f64.store (local.get $pm) (local.get $minSq))
    (local.get $swaps)))
