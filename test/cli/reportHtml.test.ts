import { describe, it, expect } from 'vitest';
import { evaluateDesign, validateDesign } from '../../src/design/index.js';
import { reportHtml } from '../../src/cli/report/html.js';
import { show } from '../../src/display/index.js';
import { fourDipoleLine } from '../helpers/designs.js';

describe('report and show() when the array figures were not computed (above 1024 ports by default)', () => {
  const ev = evaluateDesign(validateDesign(fourDipoleLine({ frequencyHz: 1.4e9 }), 'four.json'));
  // the same evaluation as a run above ARRAY_FIGURES_AUTO_MAX_PORTS returns it: no T_rec,min, no efficiencies
  const skipped = { ...ev, frequencies: ev.frequencies.map((f) => ({ ...f, minimumReceiverTemperatureK: null, embeddedElementEfficiency: [], arrayFiguresComputed: false })) };
  it('says "not computed" with the reason, not "failed check", and a computed T_rec,min is printed in K', () => {
    expect(ev.frequencies[0].arrayFiguresComputed).toBe(true);
    const done = reportHtml(ev, [], '{}');
    expect(done).toMatch(/T_rec,min [0-9.]+ K/);
    const html = reportHtml(skipped as never, [], '{}');
    expect(html).toContain('T_rec,min not computed (array figures are O(N³) and computed up to 1024 ports)');
    expect(html).not.toContain('not computed (failed check)');
    expect(show(skipped.frequencies[0])).toContain('— (array figures not computed)');
    expect(show(ev.frequencies[0])).not.toContain('not computed');
  });
});
