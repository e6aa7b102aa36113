/**
 * Figures of a pattern cut: peak, half-power and first-null beamwidths, peak
 * sidelobe level and integrated sidelobe ratio.
 * @module
 */
import { DomainError } from '../errors.js';
import { assertFinite, assertInteger, describeValue } from '../internal/validate.js';
import { displayable } from '../display/attach.js';

/**
 * Figures of a one-dimensional pattern cut. Angles are in the cut's own
 * variable (an angle [rad] or a direction cosine); `undefined` means "not found
 * inside the sampled interval" (for example a main lobe that reaches the edge).
 * @category Pattern
 */
export interface CutFigures {
  /** Position of the main-lobe peak (the global maximum), refined. */
  readonly peakAt: number;
  /** |F| at the peak (field, linear). */
  readonly peakValue: number;
  /** Half-power points [left, right] (|F| = peak/√2), refined by bisection. */
  readonly halfPowerAt: readonly [number | undefined, number | undefined];
  /** Right − left half-power point, or undefined. */
  readonly halfPowerWidth: number | undefined;
  /** First minima on either side of the peak (the first nulls), refined. */
  readonly firstNullAt: readonly [number | undefined, number | undefined];
  /** Right − left first null, or undefined. */
  readonly firstNullWidth: number | undefined;
  /** Highest lobe outside the first-null interval, relative to the peak [dB, power ratio, ≤ 0], or undefined. */
  readonly peakSidelobeDb: number | undefined;
  /** Position of that sidelobe, or undefined. */
  readonly peakSidelobeAt: number | undefined;
  /** ∫|F|² outside / ∫|F|² inside the first-null interval, in the cut variable [dB, power ratio], or undefined. */
  readonly integratedSidelobeRatioDb: number | undefined;
}

/**
 * Options of {@link cutFigures}.
 * @category Pattern
 */
export interface CutFiguresOptions {
  /** Number of uniform samples over the interval (must resolve every lobe). @defaultValue 4001 */
  samples?: number;
}

const GOLDEN = (Math.sqrt(5) - 1) / 2;

/** Golden-section search for the maximum (sign = 1) or minimum (sign = −1) of f on [a, b]. */
function goldenSection(f: (t: number) => number, a: number, b: number, sign: number): [number, number] {
  let c = b - GOLDEN * (b - a), d = a + GOLDEN * (b - a);
  let fc = sign * f(c), fd = sign * f(d);
  for (let it = 0; it < 80 && Math.abs(b - a) > 1e-15 * (Math.abs(a) + Math.abs(b) + 1e-300); it++) {
    if (fc > fd) { b = d; d = c; fd = fc; c = b - GOLDEN * (b - a); fc = sign * f(c); }
    else { a = c; c = d; fc = fd; d = a + GOLDEN * (b - a); fd = sign * f(d); }
  }
  const t = (a + b) / 2;
  return [t, f(t)];
}

/** Bisection for f(t) = target on [a, b] with f(a) ≥ target > f(b) (or reversed). */
function bisect(f: (t: number) => number, a: number, b: number, target: number): number {
  const fa = f(a) - target;
  for (let it = 0; it < 100; it++) {
    const m = (a + b) / 2;
    if (m === a || m === b) break;
    if ((f(m) - target) * fa > 0) a = m; else b = m;
  }
  return (a + b) / 2;
}

/**
 * Peak, beamwidths and sidelobe figures of a cut F(t), t ∈ [start, end].
 *
 * @remarks
 * The cut is sampled uniformly; the main lobe is the lobe of the global maximum
 * (so a scanned beam is handled like a broadside one), its edges are the first
 * local minima on either side (the first nulls), refined by golden-section
 * search; half-power points are refined by bisection on |F| = peak/√2. The peak
 * sidelobe is the largest sample outside the first-null interval, refined.
 * The integrated sidelobe ratio uses the trapezoid rule in t.
 * @param field - |F(t)| (field magnitude, ≥ 0), evaluated at any t in the interval.
 * @param start - Start of the interval (e.g. −π/2 [rad] or u = −1).
 * @param end - End of the interval, > start.
 * @param options - Sampling density.
 * @returns The figures.
 * @throws {@link DomainError} for a bad interval or sample count, or if `field` returns a negative or non-finite value.
 * @example
 * ```ts
 * // 10-element uniform array, d = λ/2, in u = sinθ:
 * const f = (u: number) => Math.abs(Math.sin(5 * Math.PI * u) / (10 * Math.sin(Math.PI * u / 2)) || 1);
 * cutFigures(f, -1, 1).peakSidelobeDb; // ≈ −12.97
 * ```
 * @category Pattern
 */
export function cutFigures(field: (t: number) => number, start: number, end: number, options: CutFiguresOptions = {}): CutFigures {
  assertFinite('start', start);
  assertFinite('end', end);
  if (!(end > start)) throw new DomainError(`invalid arguments "start", "end": expected start < end, received [${start}, ${end}].`);
  const s = options.samples ?? 4001;
  assertInteger('options.samples', s, 5, 1e8);
  if (typeof field !== 'function') throw new DomainError(`invalid argument "field": expected a function t → |F(t)|, received ${describeValue(field)}.`);
  const f = (t: number): number => {
    const v = field(t);
    if (typeof v !== 'number' || !Number.isFinite(v) || v < 0) {
      throw new DomainError(`invalid argument "field": returned ${describeValue(v)} at t = ${t}; a pattern magnitude must be finite and ≥ 0.`);
    }
    return v;
  };
  const h = (end - start) / (s - 1);
  const t = new Float64Array(s), y = new Float64Array(s);
  let ip = 0;
  for (let i = 0; i < s; i++) {
    t[i] = i === s - 1 ? end : start + i * h;
    y[i] = f(t[i]);
    if (y[i] > y[ip]) ip = i;
  }
  let [peakAt, peakValue] = ip > 0 && ip < s - 1 ? goldenSection(f, t[ip - 1], t[ip + 1], 1) : [t[ip], y[ip]];
  if (peakValue < y[ip]) { peakAt = t[ip]; peakValue = y[ip]; }
  // first nulls: first local minima walking outward
  let iR = ip;
  while (iR < s - 1 && y[iR + 1] <= y[iR]) iR++;
  let iL = ip;
  while (iL > 0 && y[iL - 1] <= y[iL]) iL--;
  const nullR = iR < s - 1 ? goldenSection(f, t[iR - 1], t[iR + 1], -1)[0] : undefined;
  const nullL = iL > 0 ? goldenSection(f, t[iL - 1], t[iL + 1], -1)[0] : undefined;
  // half-power points
  const target = peakValue * Math.SQRT1_2;
  let hpR: number | undefined, hpL: number | undefined;
  for (let i = ip; i < s - 1; i++) {
    if (y[i + 1] < target) { hpR = bisect(f, i === ip ? peakAt : t[i], t[i + 1], target); break; }
  }
  for (let i = ip; i > 0; i--) {
    if (y[i - 1] < target) { hpL = bisect(f, i === ip ? peakAt : t[i], t[i - 1], target); break; }
  }
  // sidelobes outside [nullL, nullR]
  const lo = nullL ?? -Infinity, hi = nullR ?? Infinity;
  let is = -1;
  for (let i = 0; i < s; i++) if ((t[i] < lo || t[i] > hi) && (is < 0 || y[i] > y[is])) is = i;
  let sllAt: number | undefined, sllDb: number | undefined;
  if (is >= 0 && y[is] > 0) {
    let [ts, fs] = is > 0 && is < s - 1 ? goldenSection(f, t[is - 1], t[is + 1], 1) : [t[is], y[is]];
    if (fs < y[is]) { ts = t[is]; fs = y[is]; }
    sllAt = ts;
    sllDb = 20 * Math.log10(fs / peakValue);
  }
  let isr: number | undefined;
  if (nullL !== undefined || nullR !== undefined) {
    let inside = 0, outside = 0;
    for (let i = 0; i < s - 1; i++) {
      const seg = (h * (y[i] * y[i] + y[i + 1] * y[i + 1])) / 2;
      const mid = (t[i] + t[i + 1]) / 2;
      if (mid > lo && mid < hi) inside += seg; else outside += seg;
    }
    isr = outside > 0 ? 10 * Math.log10(outside / inside) : -Infinity;
  }
  return displayable<CutFigures>({
    peakAt, peakValue,
    halfPowerAt: [hpL, hpR],
    halfPowerWidth: hpL !== undefined && hpR !== undefined ? hpR - hpL : undefined,
    firstNullAt: [nullL, nullR],
    firstNullWidth: nullL !== undefined && nullR !== undefined ? nullR - nullL : undefined,
    peakSidelobeDb: sllDb, peakSidelobeAt: sllAt,
    integratedSidelobeRatioDb: isr,
  }, 'CutFigures');
}
