/**
 * The entry type of the bench:compare registry. Each file in scripts/compare/
 * (other than this one) exports `kernels: CompareKernel[]`; the runner
 * (scripts/bench-compare.ts) discovers the files itself, so a module adds its
 * kernels by adding a file, without touching the runner.
 */

/** One kernel timed in phasewise and, optionally, in numpy. */
export interface CompareKernel<S = unknown> {
  /** Short unique label printed in the table, e.g. "complex product 128×128". */
  name: string;
  /** Target median in milliseconds from the issue table, if there is one. */
  targetMs?: number;
  /** Target ratio phasewise/numpy (one thread) from the issue, if there is one. */
  targetRatio?: number;
  /** Builds the seeded inputs (untimed). */
  setup: () => S;
  /** The timed work; its result is consumed by the runner (NaN fails the run). */
  run: (state: S) => unknown;
  /**
   * The same work in numpy: `setup` runs once (untimed) with `np` and a seeded
   * `rng = np.random.default_rng(1)` in scope; `run` is the timed statement.
   * `alternatives` are other formulations of the same work (e.g. scipy with
   * `check_finite=False`, a BLAS rank-k routine): the runner times each briefly
   * and compares against the fastest, naming it, so numpy is always taken in
   * its best formulation. Omit the snippet when numpy has no counterpart.
   */
  numpySnippet?: { setup: string; run: string; alternatives?: Array<{ label: string; run: string }> };
}
