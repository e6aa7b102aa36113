export { C0_M_PER_S, MU0_H_PER_M, EPS0_F_PER_M, ETA0_OHM, K_BOLTZMANN_J_PER_K, T0_K, JANSKY_W_PER_M2_HZ } from './constants.js';
export {
  degToRad, radToDeg, powerToDb, dbToPower, amplitudeToDb, dbToAmplitude, wavelengthM, wavenumberRadPerM, janskyToSi, siToJansky,
} from './convert.js';
