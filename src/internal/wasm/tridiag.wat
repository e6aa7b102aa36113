;; One fused pass of the Householder tridiagonalisation of a Hermitian matrix
;; (WebAssembly 128-bit SIMD, f64x2; one complex entry [re, im] per vector):
;; the pending rank-two update of step k−1 and the Hermitian matrix-vector
;; product of step k, in one sweep over the strict lower triangle.
;;
;;   rank2mv(pw, rowBytes, k2, n, pqc, pqs, puc, pus, pu, pq,
;;           pvrr, pvis, pvpr, pvii, pp):
;;     for k2 ≤ j < i < n:
;;       W[i, j] −= u_i·conj(q_j) + q_i·conj(u_j)       (rank-two update)
;;       p_i     += W[i, j]·v_j                          (row part of p = W v)
;;       p_j     += conj(W[i, j])·v_i                    (column part, W Hermitian)
;;     using the updated W[i, j]. The diagonal terms W[i, i]·v_i and the
;;     diagonal of the update are left to the caller (O(n) work).
;;
;; Reading the trailing block once for both operations halves its memory
;; traffic, which is what bounds the unblocked reduction once the matrix
;; leaves the cache (the idea of fusing the two level-2 operations, e.g.
;; Howell et al., "Cache efficient bidiagonalization using BLAS 2.5
;; operators", ACM TOMS 34(3), 2008, from memory). With u = q = 0 the pass is a
;; plain Hermitian matrix-vector product (the first step of the reduction).
;;
;; All addresses are in bytes of the exported memory.
;;
;; Data layout (every vector has one 16-byte slot [re, im] per index j)
;;   W     n×n interleaved complex Float64, as in CMatrix: (i, j) at
;;         pw + i·rowBytes + 16·j. Only the strict lower triangle is touched.
;;   u, q  the vectors of the pending update, interleaved at pu, pq.
;;   QC_j = (Re q_j, −Im q_j), QS_j = (Im q_j, Re q_j), and UC, US likewise
;;         from u: u_i·conj(q_j) = Re u_i·QC_j + Im u_i·QS_j.
;;   VRR_j = (Re v_j, Re v_j), VIS_j = (−Im v_j, Im v_j):
;;         W·v_j = W·VRR_j + swap(W)·VIS_j.
;;   VPR_i = (Re v_i, −Re v_i), VII_i = (Im v_i, Im v_i):
;;         conj(W)·v_i = W·VPR_i + swap(W)·VII_i.
;;   p     the product, interleaved at pp; accumulated into (the caller zeroes it).
;; Here swap([a, b]) = [b, a].
(module
  (memory (export "memory") 1)

  (func (export "rank2mv")
    (param $pw i32) (param $rowBytes i32) (param $k2 i32) (param $n i32)
    (param $pqc i32) (param $pqs i32) (param $puc i32) (param $pus i32)
    (param $pu i32) (param $pq i32)
    (param $pvrr i32) (param $pvis i32) (param $pvpr i32) (param $pvii i32) (param $pp i32)
    (local $i i32)      ;; row of W
    (local $jb i32)     ;; byte offset of column j in a row and in the vectors: 16·j
    (local $end i32)    ;; 16·i, the end of the j loop (strict lower triangle)
    (local $row i32)    ;; address of row i of W
    (local $at i32)     ;; address of W[i, j]
    (local $ib i32)     ;; 16·i
    (local $uRe v128) (local $uIm v128)  ;; Re u_i, Im u_i in both lanes
    (local $qRe v128) (local $qIm v128)  ;; Re q_i, Im q_i in both lanes
    (local $vpr v128) (local $vii v128)  ;; VPR_i, VII_i
    (local $w v128)                      ;; the updated W[i, j]
    (local $ws v128)                     ;; swap(w)
    (local $s v128)                      ;; Σ_j W[i, j]·v_j for this row

    (local.set $i (local.get $k2))
    (block $rowsDone
      (loop $rows
        (br_if $rowsDone (i32.ge_u (local.get $i) (local.get $n)))
        (local.set $ib (i32.shl (local.get $i) (i32.const 4)))
        (local.set $row (i32.add (local.get $pw) (i32.mul (local.get $i) (local.get $rowBytes))))
        (local.set $uRe (f64x2.splat (f64.load offset=0 (i32.add (local.get $pu) (local.get $ib)))))
        (local.set $uIm (f64x2.splat (f64.load offset=8 (i32.add (local.get $pu) (local.get $ib)))))
        (local.set $qRe (f64x2.splat (f64.load offset=0 (i32.add (local.get $pq) (local.get $ib)))))
        (local.set $qIm (f64x2.splat (f64.load offset=8 (i32.add (local.get $pq) (local.get $ib)))))
        (local.set $vpr (v128.load (i32.add (local.get $pvpr) (local.get $ib))))
        (local.set $vii (v128.load (i32.add (local.get $pvii) (local.get $ib))))
        (local.set $s (v128.const f64x2 0 0))
        (local.set $jb (i32.shl (local.get $k2) (i32.const 4)))
        (local.set $end (local.get $ib))
        (block $colsDone
          (loop $cols
            (br_if $colsDone (i32.ge_u (local.get $jb) (local.get $end)))
            (local.set $at (i32.add (local.get $row) (local.get $jb)))
            ;; W −= ū·QC + ũ·QS + q̄·UC + q̃·US, in this order
            (local.set $w
              (f64x2.sub
                (f64x2.sub
                  (f64x2.sub
                    (f64x2.sub (v128.load (local.get $at))
                      (f64x2.mul (local.get $uRe) (v128.load (i32.add (local.get $pqc) (local.get $jb)))))
                    (f64x2.mul (local.get $uIm) (v128.load (i32.add (local.get $pqs) (local.get $jb)))))
                  (f64x2.mul (local.get $qRe) (v128.load (i32.add (local.get $puc) (local.get $jb)))))
                (f64x2.mul (local.get $qIm) (v128.load (i32.add (local.get $pus) (local.get $jb))))))
            (v128.store (local.get $at) (local.get $w))
            (local.set $ws (i8x16.shuffle 8 9 10 11 12 13 14 15 0 1 2 3 4 5 6 7 (local.get $w) (local.get $w)))
            ;; s += W·v_j
            (local.set $s (f64x2.add (local.get $s)
              (f64x2.add
                (f64x2.mul (local.get $w) (v128.load (i32.add (local.get $pvrr) (local.get $jb))))
                (f64x2.mul (local.get $ws) (v128.load (i32.add (local.get $pvis) (local.get $jb)))))))
            ;; p_j += conj(W)·v_i
            (v128.store (i32.add (local.get $pp) (local.get $jb))
              (f64x2.add (v128.load (i32.add (local.get $pp) (local.get $jb)))
                (f64x2.add
                  (f64x2.mul (local.get $w) (local.get $vpr))
                  (f64x2.mul (local.get $ws) (local.get $vii)))))
            (local.set $jb (i32.add (local.get $jb) (i32.const 16)))
            (br $cols)))
        ;; p_i += s
        (v128.store (i32.add (local.get $pp) (local.get $ib))
          (f64x2.add (v128.load (i32.add (local.get $pp) (local.get $ib))) (local.get $s)))
        (local.set $i (i32.add (local.get $i) (i32.const 1)))
        (br $rows)))))
