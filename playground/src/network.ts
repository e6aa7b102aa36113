/**
 * Network viewer panel: a pasted or dropped Touchstone file → Smith chart, |S| versus
 * frequency, and the reciprocity and passivity checks of the network module.
 */
import {
  type CMatrix, type Multiport,
  parseTouchstone, convertMultiport, multiportMatrix, checkReciprocity, checkPassivity, createMultiport,
  formatTouchstone, fromRows, multiply, ParseError,
} from 'phasewise';
import { smithChartSvg, linePlotSvg } from 'phasewise/plot';
import { byId, showFigure, showStatus, describeError, debounce } from './dom.js';

/** Tolerance of the reciprocity and passivity verdicts shown (files carry ~6 significant digits). */
export const CHECK_TOLERANCE = 1e-5;

/**
 * Demonstration two-port of our own: a series R-L-C resonator (2 Ω, 40 nH, tuned to 1 GHz)
 * between shunt capacitors of 1 pF (port 1) and 1.8 pF (port 2), from 0.8 to 1.2 GHz, as a version 1 Touchstone text.
 */
export function demoTouchstone(): string {
  const freqs: number[] = [];
  const chains: CMatrix[] = [];
  const l = 40e-9, c = 1 / ((2 * Math.PI * 1e9) ** 2 * l), r = 2, c1 = 1e-12, c2 = 1.8e-12;
  for (let k = 0; k <= 80; k++) {
    const f = 0.8e9 + k * 5e6, w = 2 * Math.PI * f;
    const series = { re: r, im: w * l - 1 / (w * c) };
    const y1 = fromRows([[1, 0], [{ re: 0, im: w * c1 }, 1]]);
    const z = fromRows([[1, series], [0, 1]]);
    const y2 = fromRows([[1, 0], [{ re: 0, im: w * c2 }, 1]]);
    freqs.push(f);
    chains.push(multiply(multiply(y1, z), y2));
  }
  const net = createMultiport('chain', freqs, chains);
  return formatTouchstone(convertMultiport(net, 'scattering'), {
    version: 1, format: 'MA', frequencyUnit: 'MHz', significantDigits: 7,
    comments: [' phasewise playground demo: series RLC resonator between shunt capacitors (invented example)'],
  });
}

/** Which S entries to draw: all of them up to three ports, else the diagonal and column 1. */
function entriesToDraw(n: number): Array<[number, number]> {
  const out: Array<[number, number]> = [];
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) if (n <= 3 || i === j || j === 0) out.push([i, j]);
  }
  return out.slice(0, 12);
}

/** Parses the text and draws everything; a ParseError is shown with its line number. */
export function viewNetwork(text: string, portsHint?: number): Multiport | undefined {
  const errorBox = byId('network-error');
  let net: Multiport;
  try {
    net = parseTouchstone(text, portsHint === undefined ? {} : { ports: portsHint }).network;
  } catch (e) {
    // A ParseError's message starts with "line N:" (the library adds it).
    errorBox.textContent = `Could not read the file — ${e instanceof ParseError ? e.message : describeError(e)}. The plots show the last file that was read.`;
    errorBox.dataset.line = e instanceof ParseError ? String(e.line) : '';
    errorBox.hidden = false;
    byId('network-results').dataset.stale = 'yes';
    return undefined;
  }
  byId('network-results').dataset.stale = '';
  errorBox.hidden = true;
  errorBox.textContent = '';
  errorBox.dataset.line = '';
  try {
    const s = net.form === 'scattering' ? net : convertMultiport(net, 'scattering');
    const n = s.ports, fCount = s.frequencyHz.length;
    const fGHz = Array.from(s.frequencyHz, (f) => f / 1e9);
    const pairs = entriesToDraw(n);
    const re = pairs.map(() => new Float64Array(fCount)), im = pairs.map(() => new Float64Array(fCount));
    for (let k = 0; k < fCount; k++) {
      const m = multiportMatrix(s, k);
      pairs.forEach(([i, j], p) => {
        const q = 2 * (i * n + j);
        re[p][k] = m.data[q];
        im[p][k] = m.data[q + 1];
      });
    }
    const label = ([i, j]: [number, number]): string => `S${i + 1}${j + 1}`;
    const diag = pairs.map((pr, p) => [pr, p] as const).filter(([[i, j]]) => i === j).slice(0, 4);
    const z0 = s.referenceOhm[0];
    byId('network-smith').innerHTML = smithChartSvg({
      traces: diag.map(([pr, p]) => ({ label: label(pr), gammaRe: re[p], gammaIm: im[p], startLabel: `${Number(fGHz[0].toPrecision(4))} GHz`, endLabel: `${Number(fGHz[fCount - 1].toPrecision(4))} GHz` })),
      z0Ohm: z0, widthPx: 330, heightPx: 330,
    });
    const magDb = pairs.map((_, p) => Array.from(re[p], (x, k) => Math.max(20 * Math.log10(Math.hypot(x, im[p][k])), -80)));
    const lowest = Math.min(...magDb.map((t) => Math.min(...t)));
    const highest = Math.max(...magDb.map((t) => Math.max(...t)));
    byId('network-magnitude').innerHTML = linePlotSvg({
      traces: pairs.map((pr, p) => ({ label: label(pr), x: fGHz, y: magDb[p] })),
      yRange: [Math.floor(lowest / 5) * 5 - 5, Math.max(0, Math.ceil(highest / 5) * 5)],
      xLabel: 'frequency [GHz]', yLabel: '|S| [dB]', widthPx: 470, heightPx: 330,
    });
    const rec = checkReciprocity(s, CHECK_TOLERANCE), pas = checkPassivity(s, CHECK_TOLERANCE);
    showFigure('network-ports', n, 6);
    showFigure('network-points', fCount, 6);
    byId('network-range').textContent = `${Number(fGHz[0].toPrecision(6))} – ${Number(fGHz[fCount - 1].toPrecision(6))} GHz`;
    showFigure('network-reciprocity', rec.violation, 3);
    showFigure('network-passivity', pas.violation, 3);
    byId('network-reciprocity-verdict').textContent = rec.satisfied ? 'reciprocal' : `not reciprocal (worst at ${fGHz[rec.worstIndex].toPrecision(5)} GHz)`;
    byId('network-passivity-verdict').textContent = pas.satisfied ? 'passive' : `active (worst at ${fGHz[pas.worstIndex].toPrecision(5)} GHz)`;
    showStatus('network-status', '');
  } catch (e) {
    showStatus('network-status', describeError(e));
  }
  return net;
}

/** Port count from a file name ending in .sNp, if any. */
export function portsFromFileName(name: string): number | undefined {
  const m = /\.s(\d+)p$/i.exec(name);
  return m ? Number(m[1]) : undefined;
}

/** Wires the text area, the file picker and drag-and-drop. */
export function initNetwork(): void {
  const area = byId<HTMLTextAreaElement>('network-text');
  const picker = byId<HTMLInputElement>('network-file');
  const drop = byId('network-drop');
  let portsHint: number | undefined;
  area.value = demoTouchstone();
  const later = debounce(() => viewNetwork(area.value, portsHint), 200);
  area.addEventListener('input', () => { portsHint = undefined; byId('network-file-name').textContent = ''; later(); });
  const load = async (file: File): Promise<void> => {
    portsHint = portsFromFileName(file.name);
    area.value = await file.text();
    byId('network-file-name').textContent = `Loaded ${file.name}`;
    viewNetwork(area.value, portsHint);
  };
  picker.addEventListener('change', () => { const f = picker.files?.[0]; if (f) void load(f); });
  drop.addEventListener('dragover', (e) => { e.preventDefault(); drop.dataset.over = 'yes'; });
  drop.addEventListener('dragleave', () => { drop.dataset.over = ''; });
  drop.addEventListener('drop', (e) => {
    e.preventDefault();
    drop.dataset.over = '';
    const f = e.dataTransfer?.files?.[0];
    if (f) void load(f);
  });
  byId('network-demo').addEventListener('click', () => {
    portsHint = undefined;
    picker.value = '';
    byId('network-file-name').textContent = '';
    area.value = demoTouchstone();
    viewNetwork(area.value);
  });
  viewNetwork(area.value);
}
