/**
 * Example: design a 24-element Taylor taper for a line array, check its pattern figures and
 * draw the pattern cut as an SVG next to the uniform array's.
 *
 * Scenario (our own): an L-band receiving line array, half-wave spacing at 1.42 GHz.
 * Run: npx tsx examples/taper-and-plot.ts
 */
import { fromParts, uniformLineLayout, planeCut, evenlySpaced, arrayFactorMagnitude, taylorTaper, uniformTaper, taperEfficiency, linearArrayFigures, wavelengthM, radToDeg, amplitudeToDb } from 'phasewise';
import { patternCutSvg } from 'phasewise/plot';
import { mkdirSync, writeFileSync } from 'node:fs';

const frequencyHz = 1.42e9;
const n = 24;
const spacingM = wavelengthM(frequencyHz) / 2;
const layout = uniformLineLayout(n, spacingM);
const cut = planeCut(0, evenlySpaced(-Math.PI / 2, Math.PI / 2, 721));

const designs = [
  { label: 'uniform', weights: uniformTaper(n) },
  { label: 'Taylor 30 dB, n̄ = 5', weights: taylorTaper(n, 30, 5).weights },
];

const traces = designs.map(({ label, weights }) => {
  const w = fromParts(weights, null, n);
  const af = arrayFactorMagnitude(layout, w, cut.directions, frequencyHz);
  const peak = Math.max(...af);
  const figs = linearArrayFigures(w, spacingM, frequencyHz);
  console.log(`${label}: efficiency ${taperEfficiency(weights).toFixed(4)}, ` +
    `HPBW ${radToDeg(figs.halfPowerWidth ?? NaN).toFixed(2)}°, peak sidelobe ${(figs.peakSidelobeDb ?? NaN).toFixed(2)} dB, ` +
    `directivity ${figs.directivityDb.toFixed(2)} dBi`);
  return { label, angleRad: cut.angleRad, valueDb: Array.from(af, (a) => amplitudeToDb(a / peak)) };
});

const svg = patternCutSvg({ traces, floorDb: -60, title: '24-element line array at 1.42 GHz' });
mkdirSync('examples-output', { recursive: true });
writeFileSync('examples-output/taper-and-plot.svg', svg);
console.log(`pattern cut of ${traces.length} tapers written to examples-output/taper-and-plot.svg`);
