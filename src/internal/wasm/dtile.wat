;; Register-tiled REAL matrix product (WebAssembly 128-bit SIMD, f64x2), for
;; the real eigenvector updates of the divide-and-conquer eigensolver
;; (src/internal/divideConquer.ts), where the complex kernel ztile would
;; waste half of its multiplies on zero imaginary parts.
;;
;;   dtile(m, n, k, pa, lda, pb, ldbq, pc, ldc):
;;     for i < m, j < n (n a multiple of 4), p < k:
;;       C[i, j] += A[i, p] · B[p, j]
;;
;; All addresses and strides are in bytes of the exported memory.
;;
;; Data layout
;;   A  row-major Float64: row i at pa + i·lda, entry p at +8p.
;;   B  packed in panels of four columns: panel q (columns 4q … 4q+3) at
;;      pb + q·ldbq; inside a panel, for each p, the 32 bytes
;;      [b(p,4q), b(p,4q+1), b(p,4q+2), b(p,4q+3)].
;;   C  row-major Float64: row i at pc + i·ldc, columns 4q … 4q+3 at +32q.
;;
;; Algorithm
;;   A 4 × 4 tile of C (rows i … i+3, columns 4q … 4q+3) lives in eight f64x2
;;   accumulators while p runs over the whole inner dimension; per step two
;;   vectors of B and four entries of A, each splatted to both lanes, give
;;   sixteen multiply-adds, so every accumulator has one dependent add per
;;   step. Rows left over (m mod 4) are done with a 1 × 4 tile. C is read and
;;   written once per tile (Goto & van de Geijn, "Anatomy of high-performance
;;   matrix multiplication", ACM TOMS 34(3), 2008, from memory).
(module
  (memory (export "memory") 1)

  (func (export "dtile")
    (param $m i32) (param $n i32) (param $k i32)
    (param $pa i32) (param $lda i32)
    (param $pb i32) (param $ldbq i32)
    (param $pc i32) (param $ldc i32)
    (local $i i32)       ;; first row of the tile
    (local $q i32)       ;; panel of B and C (columns 4q … 4q+3)
    (local $panels i32)  ;; n / 4
    (local $p i32)       ;; byte offset of a(i, p) in a row of A: 8·p
    (local $kBytes i32)  ;; 8·k, the end of the p loop
    (local $a0 i32) (local $a1 i32) (local $a2 i32) (local $a3 i32)  ;; addresses of rows i … i+3 of A
    (local $bp i32)      ;; address of step p in panel q of B
    (local $c i32)       ;; address of C[i, 4q]
    (local $b0 v128) (local $b1 v128)  ;; b(p, 4q … 4q+1), b(p, 4q+2 … 4q+3)
    (local $x v128)                    ;; one entry of A in both lanes
    ;; accumulators: row r, column pair h as $crh
    (local $c00 v128) (local $c01 v128) (local $c10 v128) (local $c11 v128)
    (local $c20 v128) (local $c21 v128) (local $c30 v128) (local $c31 v128)

    (local.set $kBytes (i32.shl (local.get $k) (i32.const 3)))
    (local.set $panels (i32.shr_u (local.get $n) (i32.const 2)))
    (local.set $i (i32.const 0))
    ;; 4 × 4 tiles
    (block $rowsDone
      (loop $rows
        (br_if $rowsDone (i32.gt_u (i32.add (local.get $i) (i32.const 4)) (local.get $m)))
        (local.set $a0 (i32.add (local.get $pa) (i32.mul (local.get $i) (local.get $lda))))
        (local.set $a1 (i32.add (local.get $a0) (local.get $lda)))
        (local.set $a2 (i32.add (local.get $a1) (local.get $lda)))
        (local.set $a3 (i32.add (local.get $a2) (local.get $lda)))
        (local.set $q (i32.const 0))
        (block $panelsDone
          (loop $panel
            (br_if $panelsDone (i32.ge_u (local.get $q) (local.get $panels)))
            (local.set $c00 (v128.const f64x2 0 0)) (local.set $c01 (v128.const f64x2 0 0))
            (local.set $c10 (v128.const f64x2 0 0)) (local.set $c11 (v128.const f64x2 0 0))
            (local.set $c20 (v128.const f64x2 0 0)) (local.set $c21 (v128.const f64x2 0 0))
            (local.set $c30 (v128.const f64x2 0 0)) (local.set $c31 (v128.const f64x2 0 0))
            (local.set $bp (i32.add (local.get $pb) (i32.mul (local.get $q) (local.get $ldbq))))
            (local.set $p (i32.const 0))
            (block $stepsDone
              (loop $step
                (br_if $stepsDone (i32.ge_u (local.get $p) (local.get $kBytes)))
                (local.set $b0 (v128.load offset=0 (local.get $bp)))
                (local.set $b1 (v128.load offset=16 (local.get $bp)))
                (local.set $x (v128.load64_splat (i32.add (local.get $a0) (local.get $p))))
                (local.set $c00 (f64x2.add (local.get $c00) (f64x2.mul (local.get $x) (local.get $b0))))
                (local.set $c01 (f64x2.add (local.get $c01) (f64x2.mul (local.get $x) (local.get $b1))))
                (local.set $x (v128.load64_splat (i32.add (local.get $a1) (local.get $p))))
                (local.set $c10 (f64x2.add (local.get $c10) (f64x2.mul (local.get $x) (local.get $b0))))
                (local.set $c11 (f64x2.add (local.get $c11) (f64x2.mul (local.get $x) (local.get $b1))))
                (local.set $x (v128.load64_splat (i32.add (local.get $a2) (local.get $p))))
                (local.set $c20 (f64x2.add (local.get $c20) (f64x2.mul (local.get $x) (local.get $b0))))
                (local.set $c21 (f64x2.add (local.get $c21) (f64x2.mul (local.get $x) (local.get $b1))))
                (local.set $x (v128.load64_splat (i32.add (local.get $a3) (local.get $p))))
                (local.set $c30 (f64x2.add (local.get $c30) (f64x2.mul (local.get $x) (local.get $b0))))
                (local.set $c31 (f64x2.add (local.get $c31) (f64x2.mul (local.get $x) (local.get $b1))))
                (local.set $bp (i32.add (local.get $bp) (i32.const 32)))
                (local.set $p (i32.add (local.get $p) (i32.const 8)))
                (br $step)))
            ;; C tile += accumulators, row by row
            (local.set $c (i32.add (i32.add (local.get $pc) (i32.mul (local.get $i) (local.get $ldc))) (i32.shl (local.get $q) (i32.const 5))))
            (v128.store offset=0 (local.get $c) (f64x2.add (v128.load offset=0 (local.get $c)) (local.get $c00)))
            (v128.store offset=16 (local.get $c) (f64x2.add (v128.load offset=16 (local.get $c)) (local.get $c01)))
            (local.set $c (i32.add (local.get $c) (local.get $ldc)))
            (v128.store offset=0 (local.get $c) (f64x2.add (v128.load offset=0 (local.get $c)) (local.get $c10)))
            (v128.store offset=16 (local.get $c) (f64x2.add (v128.load offset=16 (local.get $c)) (local.get $c11)))
            (local.set $c (i32.add (local.get $c) (local.get $ldc)))
            (v128.store offset=0 (local.get $c) (f64x2.add (v128.load offset=0 (local.get $c)) (local.get $c20)))
            (v128.store offset=16 (local.get $c) (f64x2.add (v128.load offset=16 (local.get $c)) (local.get $c21)))
            (local.set $c (i32.add (local.get $c) (local.get $ldc)))
            (v128.store offset=0 (local.get $c) (f64x2.add (v128.load offset=0 (local.get $c)) (local.get $c30)))
            (v128.store offset=16 (local.get $c) (f64x2.add (v128.load offset=16 (local.get $c)) (local.get $c31)))
            (local.set $q (i32.add (local.get $q) (i32.const 1)))
            (br $panel)))
        (local.set $i (i32.add (local.get $i) (i32.const 4)))
        (br $rows)))
    ;; rows left over: 1 × 4 tiles
    (block $restDone
      (loop $rest
        (br_if $restDone (i32.ge_u (local.get $i) (local.get $m)))
        (local.set $a0 (i32.add (local.get $pa) (i32.mul (local.get $i) (local.get $lda))))
        (local.set $q (i32.const 0))
        (block $panelsDone1
          (loop $panel1
            (br_if $panelsDone1 (i32.ge_u (local.get $q) (local.get $panels)))
            (local.set $c00 (v128.const f64x2 0 0)) (local.set $c01 (v128.const f64x2 0 0))
            (local.set $bp (i32.add (local.get $pb) (i32.mul (local.get $q) (local.get $ldbq))))
            (local.set $p (i32.const 0))
            (block $stepsDone1
              (loop $step1
                (br_if $stepsDone1 (i32.ge_u (local.get $p) (local.get $kBytes)))
                (local.set $x (v128.load64_splat (i32.add (local.get $a0) (local.get $p))))
                (local.set $c00 (f64x2.add (local.get $c00) (f64x2.mul (local.get $x) (v128.load offset=0 (local.get $bp)))))
                (local.set $c01 (f64x2.add (local.get $c01) (f64x2.mul (local.get $x) (v128.load offset=16 (local.get $bp)))))
                (local.set $bp (i32.add (local.get $bp) (i32.const 32)))
                (local.set $p (i32.add (local.get $p) (i32.const 8)))
                (br $step1)))
            (local.set $c (i32.add (i32.add (local.get $pc) (i32.mul (local.get $i) (local.get $ldc))) (i32.shl (local.get $q) (i32.const 5))))
            (v128.store offset=0 (local.get $c) (f64x2.add (v128.load offset=0 (local.get $c)) (local.get $c00)))
            (v128.store offset=16 (local.get $c) (f64x2.add (v128.load offset=16 (local.get $c)) (local.get $c01)))
            (local.set $q (i32.add (local.get $q) (i32.const 1)))
            (br $panel1)))
        (local.set $i (i32.add (local.get $i) (i32.const 1)))
        (br $rest)))))
