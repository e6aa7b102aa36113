/**
 * The self-contained HTML page of a design report: inline SVG figures and
 * tables with units, no external resources.
 * @internal
 * @module
 */
import { esc } from '../../plot/svg.js';
import { num } from '../format.js';
import type { ReportFigures } from './figures.js';

const STYLE = `
body{font-family:system-ui,sans-serif;margin:0;background:#f7f6f2;color:#1d2a33}
header{background:#1d2a33;color:#f7f6f2;padding:1.2em 2em}
header h1{margin:0;font-size:1.4em;font-weight:600}
header p{margin:.3em 0 0;opacity:.8}
main{max-width:1100px;margin:0 auto;padding:1em 2em 3em}
h2{font-size:1.1em;border-bottom:2px solid #c9a227;padding-bottom:.2em;margin-top:2em}
table{border-collapse:collapse;font-size:.88em;margin:.6em 0}
th,td{padding:.25em .7em;text-align:right;border-bottom:1px solid #d8d4c8}
th{background:#ebe8df;font-weight:600}
td:first-child,th:first-child{text-align:left}
.figs{display:flex;flex-wrap:wrap;gap:1em}
figure{margin:0;background:#fff;border:1px solid #d8d4c8;padding:.5em}
figcaption{font-size:.85em;color:#4a5a66;margin-top:.3em}
.note{font-size:.85em;color:#4a5a66}
`;

function tableHtml(header: readonly string[], rows: ReadonlyArray<readonly string[]>): string {
  return `<table><thead><tr>${header.map((h) => `<th>${esc(h)}</th>`).join('')}</tr></thead><tbody>${
    rows.map((r) => `<tr>${r.map((c) => `<td>${esc(c)}</td>`).join('')}</tr>`).join('')}</tbody></table>`;
}

/** Renders the report page. @internal */
export function reportHtml(fig: ReportFigures, svgs: ReadonlyMap<string, string>, designText: string): string {
  const eff = fig.array.embeddedElementEfficiency;
  const effMin = Math.min(...eff), effMax = Math.max(...eff), effMean = eff.reduce((a, b) => a + b, 0) / eff.length;
  const summary = tableHtml(['quantity', 'value', 'unit'], [
    ['frequency', num(fig.frequencyHz / 1e9, 6), 'GHz'],
    ['bandwidth', num(fig.bandwidthHz / 1e6, 6), 'MHz'],
    ['elements', String(fig.elementCount), ''],
    ['beamformer', fig.beamformer, ''],
    ['beams', String(fig.beams.length), ''],
    ['sphere quadrature (θ × φ nodes)', `${fig.quadrature.thetaCount} × ${fig.quadrature.phiCount}`, ''],
    ['minimum receiver temperature T_rec,min', num(fig.array.minimumReceiverTemperatureK, 5), 'K'],
    ['embedded element efficiency (min / mean / max)', `${num(effMin, 4)} / ${num(effMean, 4)} / ${num(effMax, 4)}`, 'linear'],
  ]);
  const hasAp = fig.beams[0].apertureEfficiency !== undefined;
  const beamHeader = ['scan angle [deg]', 'T_sys [K]', 'T_rec [K]', 'T_sky [K]', 'T_spill [K]', 'A_e [m²]', 'A_e/T_sys [m²/K]', 'gain [dBi]', 'η_rad', 'η_sp', ...(hasAp ? ['η_ap'] : []), 'η_nm'];
  const db = (g: number) => num(10 * Math.log10(g), 4);
  const beamRows = fig.beams.map((b) => [
    num(b.scanAngleDeg, 4), num(b.systemTemperatureK, 5), num(b.receiverTemperatureK, 5), num(b.skyTemperatureK, 4), num(b.spilloverTemperatureK, 4),
    num(b.effectiveAreaM2, 4), num(b.sensitivityM2PerK, 4), db(b.gain), num(b.radiationEfficiency, 4), num(b.spilloverEfficiency, 4),
    ...(hasAp ? [num(b.apertureEfficiency as number, 4)] : []), num(b.noiseMatchingEfficiency ?? NaN, 4),
  ]);
  const figs = [...svgs.entries()].map(([name, svg]) => `<figure>${svg}<figcaption>${esc(name)}</figcaption></figure>`).join('\n');
  return `<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8"><title>${esc(fig.title)} — phasewise report</title><style>${STYLE}</style></head>
<body><header><h1>${esc(fig.title)}</h1><p>Receiving-array evaluation by phasewise · design file ${esc(fig.design)}</p></header>
<main>
<h2>Summary</h2>
${summary}
<h2>Figures</h2>
<div class="figs">
${figs}
</div>
<h2>Figures of merit per beam</h2>
${tableHtml(beamHeader, beamRows)}
<p class="note">Temperatures are referred to the beam's isotropic noise response (Warnick, Ivashina, Maaskant, Woestenburg, IEEE Trans. Antennas Propag. 58(6), 2010). A_e is for an unpolarized source. These are engineering estimates from the models named in the design; check them against measurements before relying on them.</p>
<h2>Design file</h2>
<pre>${esc(designText)}</pre>
</main></body></html>
`;
}
