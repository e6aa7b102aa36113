/**
 * The moment-method impedance matrix of a placed model: segment-pair
 * reactions gathered onto the basis functions, one block per pair of
 * placements, identical relative placements computed once.
 * @internal
 * @module
 */
import type { CMatrix } from '../linalg/cmatrix.js';
import { addSegmentReaction } from './kernel.js';
import type { PlacedModel } from './model.js';
import { matrixView } from '../linalg/cmatrix.js';

const pair = new Float64Array(8);

/**
 * The L×L block of reactions between the basis functions of placements p
 * (test) and q (source), free space plus the ground image (image currents
 * mirrored and reversed in their horizontal part: −1 times the mirrored
 * segment's half-mode). For p = q the block is built from the upper triangle
 * of segment pairs and mirrored, so it is exactly symmetric.
 */
function placementBlock(m: PlacedModel, p: number, q: number, blk: Float64Array = new Float64Array(2 * m.basis.count * m.basis.count)): Float64Array {
  const S = m.template.segmentCount, L = m.basis.count;
  const { halfStart, halfBasis, halfSign } = m.basis;
  for (let s = 0; s < S; s++) {
    for (let t = p === q ? s : 0; t < S; t++) {
      pair.fill(0);
      addSegmentReaction(pair, m.k, m.geo, p * S + s, m.geo, q * S + t, 1);
      if (m.image) addSegmentReaction(pair, m.k, m.geo, p * S + s, m.image, q * S + t, -1);
      for (let hs = 0; hs < 2; hs++) {
        for (let es = halfStart[2 * s + hs]; es < halfStart[2 * s + hs + 1]; es++) {
          const bs = halfBasis[es], ss = halfSign[es];
          for (let ht = 0; ht < 2; ht++) {
            const zr = pair[2 * (2 * hs + ht)], zi = pair[2 * (2 * hs + ht) + 1];
            for (let et = halfStart[2 * t + ht]; et < halfStart[2 * t + ht + 1]; et++) {
              const bt = halfBasis[et], sg = ss * halfSign[et];
              const o = 2 * (bs * L + bt);
              blk[o] += sg * zr; blk[o + 1] += sg * zi;
              if (p === q && t !== s) {
                const r = 2 * (bt * L + bs);
                blk[r] += sg * zr; blk[r + 1] += sg * zi;
              }
            }
          }
        }
      }
    }
  }
  return blk;
}

/** Key of the relative placement of q with respect to p (rotations, offset, heights above the plane). */
function placementKey(m: PlacedModel, p: number, q: number, quantumM: number): string {
  const o = m.offsets;
  const d = (i: number): number => Math.round((o[3 * q + i] - o[3 * p + i]) / quantumM);
  const z = m.plane ? `|${Math.round(o[3 * p + 2] / quantumM)}` : '';
  return `${p === q ? 's' : 'x'}${m.rotationId[p]}.${m.rotationId[q]}|${d(0)}|${d(1)}|${d(2)}${z}`;
}

/** Statistics of a fill. */
export interface FillStats {
  /** Placement-pair blocks computed. */
  blocksComputed: number;
  /** Placement-pair blocks in the matrix (upper triangle including the diagonal). */
  blocksUsed: number;
}

/**
 * @internal The full impedance matrix (P·L)², symmetric, blocks reused across
 * placement pairs with the same relative position, rotations and height.
 */
export function fillImpedanceMatrix(m: PlacedModel, stats?: FillStats): CMatrix {
  const P = m.placements, L = m.basis.count, n = P * L;
  const z = new Float64Array(2 * n * n);
  if (P === 1) {
    // one placement: the block is the matrix, filled in place
    placementBlock(m, 0, 0, z);
    if (stats) { stats.blocksComputed = 1; stats.blocksUsed = 1; }
    return matrixView(n, n, z);
  }
  const cache = new Map<string, Float64Array>();
  const quantum = 1e-9 * (2 * Math.PI / m.k);
  let computed = 0;
  for (let p = 0; p < P; p++) {
    for (let q = p; q < P; q++) {
      const key = placementKey(m, p, q, quantum);
      let blk = cache.get(key);
      if (!blk) { blk = placementBlock(m, p, q); cache.set(key, blk); computed++; }
      for (let a = 0; a < L; a++) {
        const row = p * L + a;
        for (let b = 0; b < L; b++) {
          const col = q * L + b, src = 2 * (a * L + b);
          z[2 * (row * n + col)] = blk[src]; z[2 * (row * n + col) + 1] = blk[src + 1];
          if (p !== q) { z[2 * (col * n + row)] = blk[src]; z[2 * (col * n + row) + 1] = blk[src + 1]; }
        }
      }
    }
  }
  if (stats) { stats.blocksComputed = computed; stats.blocksUsed = (P * (P + 1)) / 2; }
  return matrixView(n, n, z);
}
