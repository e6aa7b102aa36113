export type { Vector3, ArrayLayout, ArrayLayoutOptions } from './layout.js';
export {
  arrayLayout, withEnabledMask, activeLayout, activeCount, metresFromWavelengths, wavelengthsFromMetres,
  layoutCentroid, layoutDiameterM,
} from './layout.js';
export type {
  LineAxis, UniformLineOptions, RectangularGridSpec, LatticeBoundary, RectangleBoundary, CircleBoundary, HexagonBoundary, LatticeOptions, RingSpec,
} from './builders.js';
export { uniformLineLayout, rectangularGridLayout, latticeLayout, triangularLatticeLayout, ringLayout } from './builders.js';
export type { SphericalAngles, AzimuthElevation, DirectionCosines, Directions, WeightedDirections, ProductRule } from './directions.js';
export {
  UNIT_VECTOR_TOLERANCE, unitVectorFromAngles, unitVectorFromDegrees, anglesFromUnitVector, uvFromAngles, unitVectorFromUv,
  anglesFromUv, unitVectorFromAzEl, azElFromUnitVector, unitVectorsFromAngles, weightedDirections,
} from './directions.js';
export type { ThetaPhiGrid, UvGrid, PlaneCut, VisibleDirections } from './grids.js';
export { evenlySpaced, thetaPhiGrid, uvGrid, visibleDirections, planeCut } from './grids.js';
export type { GaussLegendreRule, SphereQuadrature, SphereQuadratureOptions, SphereQuadratureOrderOptions, SphereQuadratureOrder, SizedSphereQuadrature } from './quadrature.js';
export { gaussLegendre, sphereQuadrature, sphereQuadratureOrder, sphereQuadratureForLayout } from './quadrature.js';
export type { SplitSphereRuleOptions, SplitSphereRule } from './splitRule.js';
export { splitSphereRule } from './splitRule.js';
export type { PlanarLattice } from './lattice.js';
export { planarLattice, rectangularLattice, triangularLattice, scaleLattice } from './lattice.js';
export type { GratingLobe, GratingLobeCircle, ScanConeSpacing } from './gratingLobes.js';
export { gratingLobes, lineGratingLobes, gratingLobeCircles, gratingLobeFreeScanConeRad, latticeScaleForScanCone, spacingForScanCone } from './gratingLobes.js';
