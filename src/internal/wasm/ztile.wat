;; Register-tiled complex matrix product, the one product kernel of phasewise
;; (WebAssembly 128-bit SIMD, f64x2; no fused multiply-add in WebAssembly SIMD).
;;
;;   ztile(m, n, k, pa, lda, pb, ldbq, pcr, pci, ldc, ldcq):
;;     for i < m, j < n (n a multiple of 4), p < k:
;;       C[i, j] += A[i, p] · B[p, j]            (complex)
;;
;; All addresses and strides are in bytes of the exported memory.
;;
;; Data layout
;;   A  interleaved complex Float64, as in CMatrix: row i at pa + i·lda holds
;;      [re a(i,0), im a(i,0), re a(i,1), im a(i,1), ...] (16 bytes per entry).
;;   B  packed in panels of four columns: panel q (columns 4q … 4q+3) at
;;      pb + q·ldbq; inside a panel, for each p, the 64 bytes
;;      [re b(p,4q) … re b(p,4q+3) | im b(p,4q) … im b(p,4q+3)].
;;   C  for row i and panel q, the four real parts at pcr + i·ldc + q·ldcq and
;;      the four imaginary parts at pci + i·ldc + q·ldcq. So C may be two
;;      separate planes (ldcq = 32) or a row of the same panel layout as B
;;      (pci = pcr + 32, ldcq = the panel stride), as the triangular solves use.
;;
;; Algorithm
;;   A 1 × 4 tile of C (row i, columns 4q … 4q+3) lives in four f64x2
;;   accumulators (real and imaginary parts of two column pairs) while p runs
;;   over the whole inner dimension; per step four vectors of B and the two
;;   parts of a(i,p), splatted to both lanes, give four complex multiply-adds:
;;     cr += ar·br − ai·bi,   ci += ar·bi + ai·br.
;;   Each pair of products is summed before it is added to the accumulator, so
;;   every accumulator has one dependent add per step. C is read and written
;;   once per tile (Goto & van de Geijn, "Anatomy of high-performance matrix
;;   multiplication", ACM TOMS 34(3), 2008, from memory: packed panels and a
;;   register-resident micro-tile).
;;
;; Memory: imported, not owned, and shared (WebAssembly threads: a shared memory
;; needs a maximum; 65536 pages = 4 GiB, the whole 32-bit address space), so
;; that the kernel threads (src/internal/wasm/threads.ts) run this same kernel on
;; the same bytes: each thread forms a disjoint set of rows or column groups of
;; C. scripts/build-wasm.ts also derives from this file the single-thread
;; variant `ztileLocal` (the same module with the memory import not shared), for
;; runtimes without shared memory.
(module
  (import "env" "memory" (memory 1 65536 shared))

  (func (export "ztile")
    (param $m i32) (param $n i32) (param $k i32)
    (param $pa i32) (param $lda i32)
    (param $pb i32) (param $ldbq i32)
    (param $pcr i32) (param $pci i32) (param $ldc i32) (param $ldcq i32)
    (local $i i32)       ;; row of A and C
    (local $q i32)       ;; panel of B and C (columns 4q … 4q+3)
    (local $p i32)       ;; byte offset of a(i, p) in row i of A: 16·p
    (local $rowA i32)    ;; address of row i of A
    (local $bp i32)      ;; address of step p in panel q of B
    (local $cq i32)      ;; byte offset of panel q in a row of C
    (local $rowCr i32)   ;; address of the real parts of row i of C
    (local $rowCi i32)   ;; address of the imaginary parts of row i of C
    (local $panels i32)  ;; n / 4
    (local $kBytes i32)  ;; 16·k, the end of the p loop
    ;; accumulators: columns (4q, 4q+1) = pair 0, (4q+2, 4q+3) = pair 1
    (local $acc0re v128) (local $acc0im v128) (local $acc1re v128) (local $acc1im v128)
    ;; the B vectors of one step
    (local $b0re v128) (local $b0im v128) (local $b1re v128) (local $b1im v128)
    ;; a(i, p) with each part in both lanes
    (local $are v128) (local $aim v128)

    (local.set $kBytes (i32.shl (local.get $k) (i32.const 4)))
    (local.set $panels (i32.shr_u (local.get $n) (i32.const 2)))
    (local.set $i (i32.const 0))
    (block $rowsDone
      (loop $rows
        (br_if $rowsDone (i32.ge_u (local.get $i) (local.get $m)))
        (local.set $rowA (i32.add (local.get $pa) (i32.mul (local.get $i) (local.get $lda))))
        (local.set $rowCr (i32.add (local.get $pcr) (i32.mul (local.get $i) (local.get $ldc))))
        (local.set $rowCi (i32.add (local.get $pci) (i32.mul (local.get $i) (local.get $ldc))))
        (local.set $q (i32.const 0))
        (block $panelsDone
          (loop $panel
            (br_if $panelsDone (i32.ge_u (local.get $q) (local.get $panels)))
            (local.set $acc0re (v128.const f64x2 0 0))
            (local.set $acc0im (v128.const f64x2 0 0))
            (local.set $acc1re (v128.const f64x2 0 0))
            (local.set $acc1im (v128.const f64x2 0 0))
            (local.set $bp (i32.add (local.get $pb) (i32.mul (local.get $q) (local.get $ldbq))))
            (local.set $cq (i32.mul (local.get $q) (local.get $ldcq)))
            (local.set $p (i32.const 0))
            (block $stepsDone
              (loop $step
                (br_if $stepsDone (i32.ge_u (local.get $p) (local.get $kBytes)))
                (local.set $b0re (v128.load offset=0 (local.get $bp)))
                (local.set $b1re (v128.load offset=16 (local.get $bp)))
                (local.set $b0im (v128.load offset=32 (local.get $bp)))
                (local.set $b1im (v128.load offset=48 (local.get $bp)))
                (local.set $are (v128.load64_splat offset=0 (i32.add (local.get $rowA) (local.get $p))))
                (local.set $aim (v128.load64_splat offset=8 (i32.add (local.get $rowA) (local.get $p))))
                ;; pair 0: cr += ar·br − ai·bi, ci += ar·bi + ai·br
                (local.set $acc0re (f64x2.add (local.get $acc0re)
                  (f64x2.sub (f64x2.mul (local.get $are) (local.get $b0re)) (f64x2.mul (local.get $aim) (local.get $b0im)))))
                (local.set $acc0im (f64x2.add (local.get $acc0im)
                  (f64x2.add (f64x2.mul (local.get $are) (local.get $b0im)) (f64x2.mul (local.get $aim) (local.get $b0re)))))
                ;; pair 1
                (local.set $acc1re (f64x2.add (local.get $acc1re)
                  (f64x2.sub (f64x2.mul (local.get $are) (local.get $b1re)) (f64x2.mul (local.get $aim) (local.get $b1im)))))
                (local.set $acc1im (f64x2.add (local.get $acc1im)
                  (f64x2.add (f64x2.mul (local.get $are) (local.get $b1im)) (f64x2.mul (local.get $aim) (local.get $b1re)))))
                (local.set $bp (i32.add (local.get $bp) (i32.const 64)))
                (local.set $p (i32.add (local.get $p) (i32.const 16)))
                (br $step)))
            ;; C tile += accumulators
            (v128.store offset=0 (i32.add (local.get $rowCr) (local.get $cq))
              (f64x2.add (v128.load offset=0 (i32.add (local.get $rowCr) (local.get $cq))) (local.get $acc0re)))
            (v128.store offset=16 (i32.add (local.get $rowCr) (local.get $cq))
              (f64x2.add (v128.load offset=16 (i32.add (local.get $rowCr) (local.get $cq))) (local.get $acc1re)))
            (v128.store offset=0 (i32.add (local.get $rowCi) (local.get $cq))
              (f64x2.add (v128.load offset=0 (i32.add (local.get $rowCi) (local.get $cq))) (local.get $acc0im)))
            (v128.store offset=16 (i32.add (local.get $rowCi) (local.get $cq))
              (f64x2.add (v128.load offset=16 (i32.add (local.get $rowCi) (local.get $cq))) (local.get $acc1im)))
            (local.set $q (i32.add (local.get $q) (i32.const 1)))
            (br $panel)))
        (local.set $i (i32.add (local.get $i) (i32.const 1)))
        (br $rows)))))
