/**
 * Example: efficiencies of a prime-focus dish fed by cosⁿ feeds of different widths, and the
 * secondary pattern of the best one by physical optics.
 *
 * Scenario (our own): a 6 m, f/D = 0.45 dish for a 4.8 GHz radiometer.
 * Run: npx tsx examples/reflector-feed.ts
 */
import { paraboloidReflector, cosinePowerFeed, feedEfficiencies, secondaryPatternsPhysicalOptics, analyticFeedSource, powerToDb } from 'phasewise';

const dish = paraboloidReflector({ diameterM: 6, focalLengthM: 2.7 });
let best = { n: 0, aperture: 0 };
for (const n of [0.5, 1, 1.5, 2, 3, 4, 6]) {
  const e = feedEfficiencies(dish, cosinePowerFeed(n));
  console.log(`cos^${n}: spillover ${e.spillover.toFixed(3)}, illumination ${e.illumination.toFixed(3)}, aperture ${e.aperture.toFixed(3)}, edge taper ${e.edgeTaperDb.toFixed(1)} dB`);
  if (e.aperture > best.aperture) best = { n, aperture: e.aperture };
}
const theta = Float64Array.from({ length: 61 }, (_, i) => (i * 0.05 * Math.PI) / 180);
const phi = new Float64Array(61);
const po = secondaryPatternsPhysicalOptics(dish, analyticFeedSource([cosinePowerFeed(best.n)], 4.8e9), theta, phi);
const p0 = po.thetaComponentV.data[0] ** 2 + po.thetaComponentV.data[1] ** 2;
const db = Array.from(theta, (_, i) => powerToDb((po.thetaComponentV.data[2 * i] ** 2 + po.thetaComponentV.data[2 * i + 1] ** 2) / p0));
const hp = db.findIndex((v) => v < -3);
console.log(`best: cos^${best.n}, aperture efficiency ${best.aperture.toFixed(3)}; secondary beam falls below −3 dB at ${(hp * 0.05).toFixed(2)}° (${po.integrationPoints} PO points)`);
