import { describe, it } from 'vitest';
import type { WireDipole } from '../../src/element/index.js';
import type { Vector3 } from '../../src/geometry/layout.js';
import { sphereQuadrature, sphereQuadratureOrder } from '../../src/geometry/quadrature.js';
import { brightnessCorrelation, isotropicBrightness } from '../../src/reception/brightness.js';
import { quadratureDirections } from '../../src/reception/patterns.js';
import { dipoleArrayPorts } from '../../src/reception/ports.js';
import { thermalImpedanceNoise } from '../../src/network/noise.js';
import { expectCMatrixClose } from '../helpers/matchers.js';

const F = 299792458;
const dip = (centerM: Vector3, axis: Vector3 = [0, 0, 1], lengthM = 0.5): WireDipole => ({ centerM, axis, lengthM, radiusM: 1e-6 });

describe('element data through the reception module', () => {
  it('DESIGN brightness row in an isotropic bath equals the Twiss row 2k_B T B (Z + Zᴴ) over ground (even θ count, 1e-9)', () => {
    // Twiss 1955; DESIGN thermal-noise and brightness rows. The lower hemisphere is empty; with an even
    // number of Gauss nodes in cosθ no node sits on the horizon (see radiationResistanceMatrix).
    const ds = [dip([0, 0, 0.25], [1, 0, 0]), dip([0, 0.5, 0.25], [1, 0, 0]), dip([0.5, 0.2, 0.3], [0, 1, 0.3], 0.4), dip([-0.4, 0.3, 0.4], [0, 0, 1], 0.45)];
    const o = sphereQuadratureOrder(2 * Math.PI * 2.5, { tolerance: 1e-14, extraDegree: 16 });
    const q = quadratureDirections(sphereQuadrature(o.thetaCount + (o.thetaCount % 2), o.phiCount));
    const ports = dipoleArrayPorts(ds, F, { groundPlane: { zM: 0 } });
    const r = brightnessCorrelation(ports.patterns, q, isotropicBrightness(290), 1e6);
    expectCMatrixClose(r, thermalImpedanceNoise(ports.impedanceOhm, 290, 1e6), { rtol: 1e-9 });
  });
});
