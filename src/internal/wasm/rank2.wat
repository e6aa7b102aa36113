;; Hermitian rank-two update of the Householder tridiagonalisation
;; (WebAssembly 128-bit SIMD, f64x2; one complex entry [re, im] per vector).
;;
;;   rank2(pw, rowBytes, k1, n, pqc, pqs, puc, pus, pu, pq):
;;     for k1 ≤ j < i < n:  W[i, j] −= u_i·conj(q_j) + q_i·conj(u_j)
;;
;; Only the strict lower triangle of the trailing block is written.
;; All addresses are in bytes of the exported memory.
;;
;; Data layout
;;   W   n×n interleaved complex Float64, as in CMatrix: entry (i, j) at
;;       pw + i·rowBytes + 16·j.
;;   u, q  the two vectors of the update, interleaved complex at pu and pq.
;;   QC, QS, UC, US  vectors prepared by the caller, one complex slot (16 bytes)
;;       per index j:  QC_j = (Re q_j, −Im q_j),  QS_j = (Im q_j, Re q_j),
;;       and UC, US likewise from u.
;;
;; Algorithm
;;   With ū = Re u_i and ũ = Im u_i splatted to both lanes,
;;     u_i·conj(q_j) = ū·QC_j + ũ·QS_j     (as an [re, im] vector),
;;   and likewise for q_i·conj(u_j); so one entry costs four vector
;;   multiply-subtracts (Golub & Van Loan, Matrix Computations, 4th ed., 2013,
;;   §8.3.1, from memory: the symmetric rank-two update of tridiagonalisation).
(module
  (memory (export "memory") 1)

  (func (export "rank2")
    (param $pw i32) (param $rowBytes i32) (param $k1 i32) (param $n i32)
    (param $pqc i32) (param $pqs i32) (param $puc i32) (param $pus i32)
    (param $pu i32) (param $pq i32)
    (local $i i32)      ;; row of W
    (local $jb i32)     ;; byte offset of column j in a row: 16·j
    (local $end i32)    ;; 16·i, the end of the j loop (strict lower triangle)
    (local $row i32)    ;; address of row i of W
    (local $at i32)     ;; address of W[i, j]
    (local $uRe v128) (local $uIm v128)  ;; Re u_i, Im u_i in both lanes
    (local $qRe v128) (local $qIm v128)  ;; Re q_i, Im q_i in both lanes
    (local $w v128)                      ;; W[i, j] as [re, im]

    (local.set $i (local.get $k1))
    (block $rowsDone
      (loop $rows
        (br_if $rowsDone (i32.ge_u (local.get $i) (local.get $n)))
        (local.set $row (i32.add (local.get $pw) (i32.mul (local.get $i) (local.get $rowBytes))))
        (local.set $uRe (f64x2.splat (f64.load offset=0 (i32.add (local.get $pu) (i32.shl (local.get $i) (i32.const 4))))))
        (local.set $uIm (f64x2.splat (f64.load offset=8 (i32.add (local.get $pu) (i32.shl (local.get $i) (i32.const 4))))))
        (local.set $qRe (f64x2.splat (f64.load offset=0 (i32.add (local.get $pq) (i32.shl (local.get $i) (i32.const 4))))))
        (local.set $qIm (f64x2.splat (f64.load offset=8 (i32.add (local.get $pq) (i32.shl (local.get $i) (i32.const 4))))))
        (local.set $jb (i32.shl (local.get $k1) (i32.const 4)))
        (local.set $end (i32.shl (local.get $i) (i32.const 4)))
        (block $colsDone
          (loop $cols
            (br_if $colsDone (i32.ge_u (local.get $jb) (local.get $end)))
            (local.set $at (i32.add (local.get $row) (local.get $jb)))
            (local.set $w (v128.load (local.get $at)))
            ;; W −= ū·QC + ũ·QS + q̄·UC + q̃·US, in this order
            (v128.store (local.get $at)
              (f64x2.sub
                (f64x2.sub
                  (f64x2.sub
                    (f64x2.sub (local.get $w)
                      (f64x2.mul (local.get $uRe) (v128.load (i32.add (local.get $pqc) (local.get $jb)))))
                    (f64x2.mul (local.get $uIm) (v128.load (i32.add (local.get $pqs) (local.get $jb)))))
                  (f64x2.mul (local.get $qRe) (v128.load (i32.add (local.get $puc) (local.get $jb)))))
                (f64x2.mul (local.get $qIm) (v128.load (i32.add (local.get $pus) (local.get $jb))))))
            (local.set $jb (i32.add (local.get $jb) (i32.const 16)))
            (br $cols)))
        (local.set $i (i32.add (local.get $i) (i32.const 1)))
        (br $rows)))))
