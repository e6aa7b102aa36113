/**
 * The self-contained HTML page of a design report: inline SVG figures and
 * tables with units, no external resources.
 * @internal
 * @module
 */
import { esc } from '../../plot/svg.js';
import { num } from '../format.js';
import type { DesignEvaluation } from '../../design/index.js';
import { beamLabel, frequencyUnit, type ReportFigure } from './figures.js';
import { ARRAY_FIGURES_AUTO_MAX_PORTS } from '../../reception/index.js';

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
figcaption{font-size:.85em;color:#4a5a66;margin-top:.3em;max-width:640px}
.note{font-size:.85em;color:#4a5a66}
.failed{background:#8b1e1e;color:#fff;padding:.8em 1.2em;margin:1em 0;border-radius:4px}
.failed h2{color:#fff;border-color:#fff;margin-top:0}
.failed td,.failed th{color:#1d2a33}
`;

function tableHtml(header: readonly string[], rows: ReadonlyArray<readonly string[]>): string {
  return `<table><thead><tr>${header.map((h) => `<th>${esc(h)}</th>`).join('')}</tr></thead><tbody>${
    rows.map((r) => `<tr>${r.map((c) => `<td>${esc(c)}</td>`).join('')}</tr>`).join('')}</tbody></table>`;
}

/** The largest integration error of T_sys over the beams (refinement on a finer adaptive rule), as text. */
function worstIntegrationError(r: DesignEvaluation['frequencies'][number]): string {
  let worst = -1;
  r.integrationErrors.forEach((e, k) => { if (e.systemTemperatureK !== undefined) worst = Math.max(worst, e.systemTemperatureK / r.beams[k].systemTemperatureK); });
  return worst < 0 ? '' : ` (integration error of T_sys ≤ ${worst.toExponential(1)} relative)`;
}

/** A banner listing every failed physical check: the figures they name are not trustworthy. */
function failedBanner(ev: DesignEvaluation): string {
  const f = ev.failedChecks;
  if (f.length === 0) return '<p class="note">Every physical self-check passed (energy, the Twiss identity of the sphere rule, passivity, element-model validity; listed in figures.json per frequency).</p>';
  const { scale, unit } = frequencyUnit(ev);
  const rows = f.slice(0, 40).map((c) => [num(c.frequencyHz * scale, 6), c.name, num(c.value, 4), `${c.comparison === 'atMost' ? '≤' : '≥'} ${num(c.limit, 4)}`, c.figures.join(', '), c.meaning]);
  return `<section class="failed" id="failed-checks"><h2>Failed physical checks: ${f.length}</h2>
<p>The figures these checks guard are not trustworthy; they are shown below only so that you can see what failed. Fix the design (or the sphere rule, or the data) before relying on any of them.</p>
${tableHtml([`frequency [${unit}]`, 'check', 'value', 'limit', 'figures affected', 'meaning'], rows)}${f.length > 40 ? `<p>… and ${f.length - 40} more (figures.json lists all).</p>` : ''}</section>`;
}

/**
 * Notes that explain figures a reader may take for an error, each written only
 * when the evaluation's data show the effect: aperture efficiency above one,
 * and where the noise match (and with it A_e/T_sys) is best across the beams.
 * @internal
 */
function explanationNotes(ev: DesignEvaluation): string {
  const { scale, unit } = frequencyUnit(ev);
  const notes: string[] = [];
  let apMax = -Infinity, apAt = '';
  for (const r of ev.frequencies) {
    r.beams.forEach((b, k) => {
      if (b.apertureEfficiency !== undefined && b.apertureEfficiency > apMax) { apMax = b.apertureEfficiency; apAt = beamLabel(ev, k); }
    });
  }
  if (apMax > 1) {
    notes.push(`<p class="note"><strong>Why η_ap exceeds 1</strong> (up to ${num(apMax, 4)}, ${esc(apAt)}): the aperture efficiency is A_e divided by the stated physical area (N cells of the lattice). The edge elements of a finite array over an infinite ground plane collect power from beyond the edge of the N cells (their effective areas reach past the array's outline), so against N cells the efficiency exceeds one, by about 0.24/n for uniform weights and n elements across, and tends to one as the array grows (docs/reception.md, notes under the worked example). ${ev.failedChecks.length === 0 ? 'It is not an energy error: the energy, Twiss and passivity checks of this evaluation passed.' : 'Check the failed checks listed above before relying on it.'}</p>`);
  }
  const r0 = ev.frequencies[ev.reportFrequencyIndices[0] ?? 0];
  const nm = r0.beams.map((b) => b.noiseMatchingEfficiency);
  if (r0.amplifiers && nm.every((x): x is number => x !== undefined) && nm.length > 1) {
    let best = 0, worst = 0;
    nm.forEach((x, k) => { if (x > nm[best]) best = k; if (x < nm[worst]) worst = k; });
    const y = r0.amplifiers.optimumSourceAdmittanceS;
    notes.push(`<p class="note"><strong>Noise match across the beams</strong> (${num(r0.frequencyHz * scale, 6)} ${unit}): each amplifier sees its element's active impedance, which changes with the beam direction, so the amplifiers are noise-matched for one beam only. With Y_opt = ${num(y.re, 4)} ${y.im < 0 ? '−' : '+'} j${num(Math.abs(y.im), 4)} S the noise-matching efficiency is highest at ${esc(beamLabel(ev, best))} (η_nm ${num(nm[best], 4)}) and lowest at ${esc(beamLabel(ev, worst))} (η_nm ${num(nm[worst], 4)}); T_rec and A_e/T_sys follow it. Choose Y_opt equal to the array's active admittance where the beam is used most (for broadside, 1/Σ_j Z_ij averaged over the elements; Warnick and Jensen, IEEE Trans. Antennas Propag. 55(6), 2007).</p>`);
  }
  return notes.join('\n');
}

/** Renders the report page. @internal */
export function reportHtml(ev: DesignEvaluation, figures: readonly ReportFigure[], designText: string): string {
  const { scale, unit } = frequencyUnit(ev);
  const fl = ev.frequenciesHz;
  const bandText = fl.length === 1 ? `${num(fl[0] * scale, 6)} ${unit}` : `${num(fl[0] * scale, 6)} – ${num(fl[fl.length - 1] * scale, 6)} ${unit}, ${fl.length} points`;
  const summary = tableHtml(['quantity', 'value', 'unit'], [
    ['band', bandText, ''],
    ['noise bandwidth', num(ev.bandwidthHz / 1e6, 6), 'MHz'],
    ['elements', String(ev.elementCount), ''],
    ...(ev.frequencies[0].polarization ? [['polarisations', `2 (crossed dipoles: ports X and Y per element, ${2 * ev.elementCount} ports)`, '']] : []),
    ...(ev.failures ? [['failed elements', `${ev.failures.failedElements.length} (${ev.failures.termination}): ${ev.failures.failedElements.slice(0, 20).join(', ')}${ev.failures.failedElements.length > 20 ? ', …' : ''}`, '']] : []),
    ['beamformer', ev.beamformer, ''],
    ['beams', `${ev.beams.thetaDeg.length} (${ev.beams.kind})`, ''],
  ]);
  const bandRows = ev.bandSummary.map((s, k) => [
    beamLabel(ev, k), num(s.worstSensitivityM2PerK, 4), num(s.worstFrequencyHz * scale, 6), num(s.meanSensitivityM2PerK, 4),
    num(s.bandAverageSensitivityM2PerK, 4), num(s.worstGainOverTemperatureDbPerK, 4), num(s.worstSefdJy, 4),
    ...(s.worstFailureLossDb !== undefined ? [num(s.worstFailureLossDb, 4)] : []),
    ...(s.worstIxrDb !== undefined ? [s.worstIxrDb >= 300 ? '∞' : num(s.worstIxrDb, 4)] : []),
  ]);
  const bandTable = tableHtml(['beam', 'worst A_e/T_sys [m²/K]', `at [${unit}]`, 'mean A_e/T_sys [m²/K]', 'band-average A_e/T_sys [m²/K]', 'worst G/T [dB/K]', 'worst SEFD [Jy]',
    ...(ev.bandSummary[0]?.worstFailureLossDb !== undefined ? ['worst failure loss of A_e/T_sys [dB]'] : []),
    ...(ev.bandSummary[0]?.worstIxrDb !== undefined ? ['worst IXR of the X/Y pair [dB]'] : [])], bandRows);
  const hasAp = ev.frequencies[0].beams[0].apertureEfficiency !== undefined;
  const perFrequency = ev.reportFrequencyIndices.map((i) => ev.frequencies[i]).map((r) => {
    const rows = r.beams.map((b, k) => [
      beamLabel(ev, k), num(b.systemTemperatureK, 5), num(b.receiverTemperatureK, 5), num(b.skyTemperatureK, 4), num(b.spilloverTemperatureK, 4),
      num(b.effectiveAreaM2, 4), num(b.sensitivityM2PerK, 4), num(b.gainOverTemperatureDbPerK, 4), num(b.sefdJy, 4), num(10 * Math.log10(b.gain), 4),
      num(b.radiationEfficiency, 4), num(b.spilloverEfficiency, 4), ...(hasAp ? [num(b.apertureEfficiency as number, 4)] : []), num(b.noiseMatchingEfficiency ?? NaN, 4),
    ]);
    const header = ['beam', 'T_sys [K]', 'T_rec [K]', 'T_sky [K]', 'T_spill [K]', 'A_e [m²]', 'A_e/T_sys [m²/K]', 'G/T [dB/K]', 'SEFD [Jy]', 'gain [dBi]', 'η_rad', 'η_sp', ...(hasAp ? ['η_ap'] : []), 'η_nm'];
    return `<h3>${num(r.frequencyHz * scale, 7)} ${unit} · sky ${num(r.skyK, 4)} K · T_rec,min ${r.minimumReceiverTemperatureK !== null ? `${num(r.minimumReceiverTemperatureK, 5)} K` : r.arrayFiguresComputed === false ? `not computed (array figures are O(N³) and computed up to ${ARRAY_FIGURES_AUTO_MAX_PORTS} ports)` : 'not computed (failed check)'} · sphere rule: ${r.quadrature.kind}, ${r.quadrature.directionCount} directions${worstIntegrationError(r)}</h3>\n${tableHtml(header, rows)}`;
  }).join('\n');
  const figs = figures.map((f) => `<figure>${f.svg}<figcaption>${esc(f.caption)}</figcaption></figure>`).join('\n');
  return `<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8"><title>${esc(ev.title)} — phasewise report</title><style>${STYLE}</style></head>
<body><header><h1>${esc(ev.title)}</h1><p>Receiving-array evaluation by phasewise · design file ${esc(ev.fileName)}</p></header>
<main>
${failedBanner(ev)}
<h2>Summary</h2>
${summary}
<h2>Figures</h2>
<div class="figs">
${figs}
</div>
<h2>Band summary per beam</h2>
${bandTable}
<p class="note">G/T = (4π/λ²)·A_e/T_sys and SEFD = 2k_B·T_sys/A_e for an unpolarized source; gain and T_sys are both referred to the beamformer output and normalised by the beam's isotropic noise response (Warnick, Ivashina, Maaskant, Woestenburg, IEEE Trans. Antennas Propag. 58(6), 2010), so their ratio does not depend on the reference plane. The band average is the trapezoid-rule mean over frequency.</p>
<h2>Figures of merit per beam${fl.length > 1 ? ' at the report frequencies' : ''}</h2>
${fl.length > 1 ? `<p class="note">Tables at ${ev.reportFrequencyIndices.length} of the ${fl.length} band frequencies; figures.json holds every frequency.</p>` : ''}
${perFrequency}
${explanationNotes(ev)}
<p class="note">These are engineering estimates from the models named in the design; check them against measurements before relying on them.</p>
<h2>Design file</h2>
<pre>${esc(designText)}</pre>
</main></body></html>
`;
}
