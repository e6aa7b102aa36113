/**
 * Pieces shared by the Taylor-family designs (line Taylor, circular Taylor, Bayliss).
 * @internal
 * @module
 */

/** Taylor's A = arccosh(R)/π with R = 10^(sllDb/20) the main-beam to sidelobe field ratio. @internal */
export function taylorA(sllDb: number): number {
  const r = Math.pow(10, sllDb / 20);
  return Math.log(r + Math.sqrt((r - 1) * (r + 1))) / Math.PI;
}

/** Dilated zeros σ√(A² + (n − shift)²), n = 1 … count. @internal */
export function dilatedZeros(a: number, sigma: number, count: number, shift: number): Float64Array {
  const zeros = new Float64Array(count);
  for (let n = 1; n <= count; n++) zeros[n - 1] = sigma * Math.sqrt(a * a + (n - shift) * (n - shift));
  return zeros;
}

/** Whether g decreases (non-strictly) over 513 points from `start` to `end`. @internal */
export function isMonotonicDecreasing(g: (x: number) => number, start: number, end: number): boolean {
  let prev = g(start);
  for (let i = 1; i <= 512; i++) {
    const v = g(start + ((end - start) * i) / 512);
    if (v > prev + 1e-12) return false;
    prev = v;
  }
  return true;
}
