import { describe, expect, it } from 'vitest';
import { getBody } from './bodies';
import { defineOrbit } from './orbit-definition';
import { orbitSampler } from './orbit-position';
import { elementsFromState } from './state-elements';
import { scale, type Vector3 } from './vector3';

const earth = getBody('earth');
/** The smaller angle between two directions given in degrees. */
const turnDiff = (a: number, b: number): number => Math.abs(((((a - b) % 360) + 540) % 360) - 180);

describe('elementsFromState (RV2COE)', () => {
  it('gives the elements of Vallado Example 2-5 to the rounding of the book (Fundamentals of Astrodynamics and Applications; figures from memory of the book)', () => {
    const r: Vector3 = [6524.834, 6862.875, 6448.296];
    const v: Vector3 = [4.901327, 5.533756, -1.976341];
    const el = elementsFromState(r, v, 398600.4418);
    expect(el.pKm).toBeCloseTo(11067.79, 0);
    expect(el.semiMajorAxisKm).toBeCloseTo(36127.34, 0);
    expect(el.eccentricity).toBeCloseTo(0.832853, 5);
    expect(el.inclinationDeg).toBeCloseTo(87.87, 1);
    expect(el.raanDeg).toBeCloseTo(227.89, 1);
    expect(el.argPeriapsisDeg).toBeCloseTo(53.38, 1);
    expect(el.trueAnomalyDeg).toBeCloseTo(92.335, 1);
  });

  it('recovers the elements an orbit was defined with, at points all round it (round trip with orbit-position.ts; common practice, no source)', () => {
    const orbit = defineOrbit({ periapsisAltitudeKm: 500, apoapsisAltitudeKm: 4000, inclinationDeg: 63.4, raanDeg: 300, argPeriapsisDeg: 270 }, earth);
    const at = orbitSampler(orbit);
    for (const fraction of [0, 0.13, 0.5, 0.77]) {
      const tS = fraction * orbit.periodS;
      const state = at(tS);
      // the speed along the ram direction and outward from the vis-viva and angular-momentum laws
      const h = Math.sqrt(earth.gmKm3S2 * orbit.semiMajorAxisKm * (1 - orbit.eccentricity ** 2));
      const nu = state.trueAnomalyRad;
      const vRadial = (earth.gmKm3S2 / h) * orbit.eccentricity * Math.sin(nu);
      const vTangential = h / state.radiusKm;
      const along = (k: number) => state.zenith[k] * vRadial + state.ram[k] * vTangential;
      const v: Vector3 = [along(0), along(1), along(2)];
      const el = elementsFromState(state.positionKm, v, earth.gmKm3S2);
      expect(el.semiMajorAxisKm).toBeCloseTo(orbit.semiMajorAxisKm, 6);
      expect(el.eccentricity).toBeCloseTo(orbit.eccentricity, 9);
      expect(el.inclinationDeg).toBeCloseTo(63.4, 9);
      expect(el.raanDeg).toBeCloseTo(300, 9);
      expect(turnDiff(el.argPeriapsisDeg, 270)).toBeLessThan(1e-5);
      expect(turnDiff(el.trueAnomalyDeg, (nu * 180) / Math.PI)).toBeLessThan(1e-5);
    }
  });

  it('takes a circular orbit as circular: argument of periapsis 0, anomaly from the ascending node (the convention of orbit-definition.ts; common practice, no source)', () => {
    const orbit = defineOrbit({ periapsisAltitudeKm: 550, apoapsisAltitudeKm: 550, inclinationDeg: 97.6, raanDeg: 45 }, earth);
    const state = orbitSampler(orbit)(orbit.periodS / 4);
    const el = elementsFromState(state.positionKm, scale(state.ram, Math.sqrt(earth.gmKm3S2 / orbit.semiMajorAxisKm)), earth.gmKm3S2);
    expect(el.eccentricity).toBeLessThan(1e-9);
    expect(el.argPeriapsisDeg).toBe(0);
    expect(el.trueAnomalyDeg).toBeCloseTo(90, 6);
    expect(el.raanDeg).toBeCloseTo(45, 9);
  });
});
