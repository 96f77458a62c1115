// The invented orbits behind fixtures/ephemerides/ (see make-ephemeris-fixtures.ts), kept apart so
// tests can send the same orbit to the compute route without running the generator.
import type { OrbitInput } from '../shared/physics/orbit-definition';

/** Kestrel-1: 550 km circular, sun-synchronous-like inclination. */
export const leoOrbit: OrbitInput = { periapsisAltitudeKm: 550, apoapsisAltitudeKm: 550, inclinationDeg: 97.6, raanDeg: 30, argPeriapsisDeg: 0 };
/** A 300 x 35786 km transfer orbit. */
export const gtoOrbit: OrbitInput = { periapsisAltitudeKm: 300, apoapsisAltitudeKm: 35786, inclinationDeg: 27, raanDeg: 120, argPeriapsisDeg: 180 };
export const fixtureEpoch = '2027-03-20T12:00:00.000Z';
