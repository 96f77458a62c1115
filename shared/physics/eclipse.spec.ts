import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { getBody } from './bodies';
import { AU_KM, SUN_RADIUS_KM } from './constants';
import { cylindricalEclipseFraction, eclipseSummary, shadowGeometry, sunlitFraction } from './eclipse';
import { defineOrbit } from './orbit-definition';
import { orbitBasis, orbitSampler } from './orbit-position';
import type { Vector3 } from './vector3';

const DEG = Math.PI / 180;
const earth = getBody('earth');

/** A Sun direction with elevation beta above the plane of an equatorial orbit. */
const sunAtBeta = (betaRad: number): Vector3 => [Math.cos(betaRad), 0, Math.sin(betaRad)];

function circularEclipse(altitudeKm: number, betaRad: number, distanceAu = 1) {
  const orbit = defineOrbit({ semiMajorAxisKm: earth.radiusKm + altitudeKm, eccentricity: 0 }, earth);
  return { orbit, eclipse: eclipseSummary(orbitSampler(orbit), orbit.periodS, sunAtBeta(betaRad), distanceAu * AU_KM, earth.radiusKm) };
}

describe('conical shadow', () => {
  it('a 400 km orbit at beta 0 has its longest eclipse, about 36 min (DOMAIN.md [calc])', () => {
    expect(circularEclipse(400, 0).eclipse.eclipseDurationS / 60).toBeCloseTo(36, 0);
  });

  it('GEO at equinox is eclipsed about 69-70 min (DOMAIN.md [calc])', () => {
    const minutes = circularEclipse(35786, 0).eclipse.eclipseDurationS / 60;
    expect(minutes).toBeGreaterThan(69);
    expect(minutes).toBeLessThan(70.5);
  });

  it('umbra + half penumbra matches the cylindrical formula where the penumbra is small (Gilmore ch. 2; property)', () => {
    fc.assert(fc.property(fc.double({ min: 300, max: 2000, noNaN: true }), fc.double({ min: 0, max: 0.9, noNaN: true }), (h, share) => {
      const beta = share * Math.asin(earth.radiusKm / (earth.radiusKm + h));
      const { eclipse } = circularEclipse(h, beta);
      // penumbra in LEO lasts seconds; the two shadow models differ by well under 0.3 % of the period
      expect(Math.abs(eclipse.eclipseFraction - cylindricalEclipseFraction(earth.radiusKm, h, beta))).toBeLessThan(3e-3);
    }), { numRuns: 20 });
  });

  it('above beta* there is no eclipse (Gilmore ch. 2)', () => {
    const betaStar = Math.asin(earth.radiusKm / (earth.radiusKm + 600));
    expect(circularEclipse(600, betaStar + 1 * DEG).eclipse.eclipseFraction).toBe(0);
    expect(cylindricalEclipseFraction(earth.radiusKm, 600, betaStar + 1 * DEG)).toBe(0);
  });

  it('penumbra: the Sun\'s 0.27 deg apparent radius makes each LEO shadow crossing last several seconds (geometry, no source)', () => {
    const { eclipse } = circularEclipse(400, 0);
    expect(eclipse.penumbraS / 2).toBeGreaterThan(5);
    expect(eclipse.penumbraS / 2).toBeLessThan(15);
    expect(Math.asin(SUN_RADIUS_KM / AU_KM) / DEG).toBeCloseTo(0.2666, 3);
  });

  it('sunlit fraction: 1 clear, 0 in umbra, 1/2 with the Sun\'s centre on a straight limb (two-circle overlap)', () => {
    expect(sunlitFraction({ sunRadiusRad: 0.0047, bodyRadiusRad: 1.2, separationRad: 1.3 })).toBe(1);
    expect(sunlitFraction({ sunRadiusRad: 0.0047, bodyRadiusRad: 1.2, separationRad: 1.1 })).toBe(0);
    // a huge body disk makes the limb nearly straight: half the Sun's disk is covered
    expect(sunlitFraction({ sunRadiusRad: 0.0047, bodyRadiusRad: 1.2, separationRad: 1.2 })).toBeCloseTo(0.5, 2);
    // annular: body disk inside the Sun's
    expect(sunlitFraction({ sunRadiusRad: 0.01, bodyRadiusRad: 0.005, separationRad: 0 })).toBeCloseTo(0.75, 12);
  });

  it('an elliptical orbit: the summary agrees with dense sampling of the sunlit fraction (numerical check, no source)', () => {
    const orbit = defineOrbit({ periapsisAltitudeKm: 500, apoapsisAltitudeKm: 20000, inclinationDeg: 30, argPeriapsisDeg: 200 }, earth);
    const sun: Vector3 = [0.8, 0.6, 0];
    const at = orbitSampler(orbit, orbitBasis(orbit.inclinationRad, orbit.raanRad, orbit.argPeriapsisRad));
    const summary = eclipseSummary(at, orbit.periodS, sun, AU_KM, earth.radiusKm);
    const n = 200000;
    let shadow = 0;
    for (let k = 0; k < n; k++) shadow += 1 - sunlitFraction(shadowGeometry(at((k * orbit.periodS) / n).positionKm, sun, AU_KM, earth.radiusKm));
    expect(summary.eclipseFraction).toBeGreaterThan(0.01);
    expect(Math.abs(summary.eclipseFraction - shadow / n)).toBeLessThan(2e-4);
  });
});
