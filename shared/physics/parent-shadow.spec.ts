import { describe, expect, it } from 'vitest';
import { getBody, solarDistanceRangeAu } from './bodies';
import { AU_KM, SUN_RADIUS_KM } from './constants';
import { jdeOfMs, localMoonTrack, moonOffsetKm, moonTrack } from './moon-ephemeris';
import { defineOrbit } from './orbit-definition';
import { combinedSunlit, parentShadow } from './parent-shadow';
import { eclipticToEquatorial, heliocentricEclipticAu, poleRaDecRad, solarFluxWm2, sunFromBody } from './sun';
import { cross, DEG, dot, fromSpherical, norm } from './vector3';
import { sweepMission } from './mission-sweep';
import { computeEnvironment } from './environment';
import { deriveDesignCases } from './design-cases';
import { defaultMargins } from './design-environment';

/** A moon's centre against its planet's conical shadow: distance off the axis and the umbra and penumbra radii there, km. */
function moonAgainstShadow(moonId: string, ms: number) {
  const moon = getBody(moonId);
  const planet = getBody(moon.planetId);
  const jde = jdeOfMs(ms);
  const m = moonOffsetKm(moon, jde);
  const s = eclipticToEquatorial(heliocentricEclipticAu(moon.planetId, jde));
  const sunKm = norm(s) * AU_KM;
  const u = [s[0] / norm(s), s[1] / norm(s), s[2] / norm(s)] as const;
  const behind = dot(m, u);
  const off = Math.sqrt(dot(m, m) - behind * behind);
  return {
    behind, off,
    umbra: planet.radiusKm - (behind * (SUN_RADIUS_KM - planet.radiusKm)) / sunKm,
    penumbra: planet.radiusKm + (behind * (SUN_RADIUS_KM + planet.radiusKm)) / sunKm,
  };
}

/** Times (ms) where f changes sign, scanned every stepMs and refined by bisection. */
function crossings(fromMs: number, toMs: number, stepMs: number, f: (ms: number) => number): number[] {
  const out: number[] = [];
  let prev = f(fromMs);
  for (let t = fromMs + stepMs; t <= toMs; t += stepMs) {
    const cur = f(t);
    if ((cur < 0) !== (prev < 0)) {
      let [lo, hi] = [t - stepMs, t];
      for (let i = 0; i < 40; i++) {
        const mid = (lo + hi) / 2;
        if ((f(mid) < 0) === (prev < 0)) lo = mid;
        else hi = mid;
      }
      out.push((lo + hi) / 2);
    }
    prev = cur;
  }
  return out;
}

const MOON_RADIUS_KM = 1737.4;
const minutes = (ms: number) => ms / 60e3;

describe('the planet\'s shadow on a moon and its orbiters', () => {
  // NASA lunar eclipse catalogue (Espenak), total eclipse of 2025-03-14 (from memory): penumbral
  // 03:57-10:00 UT (6 h 03 min), umbral 05:09-08:48 UT (3 h 38 min), total 06:26-07:31 (65 min).
  // The catalogue enlarges Earth's shadow for the atmosphere (about 1-2 %); this model does not, so
  // its contacts fall a minute or two inside the published ones.
  it('times the total lunar eclipse of 2025-03-14 as the NASA catalogue does (Espenak; from memory), within a few minutes', () => {
    const from = Date.parse('2025-03-14T00:00:00Z');
    const to = Date.parse('2025-03-14T14:00:00Z');
    const contact = (radius: (g: ReturnType<typeof moonAgainstShadow>) => number) =>
      crossings(from, to, 300e3, (ms) => { const g = moonAgainstShadow('moon', ms); return g.off - radius(g); });
    const [p1, p4] = contact((g) => g.penumbra + MOON_RADIUS_KM);
    const [u1, u4] = contact((g) => g.umbra + MOON_RADIUS_KM);
    const [u2, u3] = contact((g) => g.umbra - MOON_RADIUS_KM);
    expect(Math.abs(minutes(p4 - p1) - (6 * 60 + 3))).toBeLessThan(5);
    expect(Math.abs(minutes(u4 - u1) - (3 * 60 + 38))).toBeLessThan(4);
    expect(Math.abs(minutes(u3 - u2) - 65)).toBeLessThan(5);
    // greatest eclipse 06:58 UT
    expect(Math.abs(minutes((u1 + u4) / 2 - Date.parse('2025-03-14T06:58:00Z')))).toBeLessThan(3);
  });

  it('puts a lunar orbiter in Earth\'s shadow through that eclipse, with the Moon\'s own shadows joined on (same catalogue entry, from memory)', () => {
    const body = getBody('moon');
    const orbit = defineOrbit({ periapsisAltitudeKm: 100, apoapsisAltitudeKm: 100, inclinationDeg: 90 }, body);
    const start = Date.parse('2025-03-13T12:00:00Z');
    const shadow = parentShadow(body, orbit, start)!;
    const spans = shadow.spans(start, start + 86400e3);
    expect(spans).toHaveLength(1);
    const [span] = spans;
    expect(span.castBy).toContain('earth');
    // In Earth's penumbra about as long as the Moon's centre is (P1-P4 less one lunar diameter's crossing, about 5 h), +- the orbit's 1,838 km.
    expect(span.parentS / 3600).toBeGreaterThan(4.3);
    expect(span.parentS / 3600).toBeLessThan(5.6);
    // Mid-eclipse the Sun is wholly hidden.
    expect(shadow.at(Date.parse('2025-03-14T06:58:00Z')).parent).toBe(0);
    // Not in shadow a week later.
    expect(shadow.spans(start + 7 * 86400e3, start + 8 * 86400e3)).toEqual([]);
  });

  // Europa crosses Jupiter's umbra once every synodic period, 3.554 d, for about 2.5 to 2.9 hours
  // (the chord of a 143,000 km wide umbra at 13.7 km/s, shorter as Jupiter's season tilts the
  // shadow: Meeus, Astronomical Algorithms ch. 44, and Jupiter satellite phenomena tables; from memory).
  it('eclipses Europa in Jupiter\'s umbra for 2.4-2.95 h every 3.55 days (Jupiter satellite phenomena; from memory)', () => {
    const from = Date.parse('2030-01-01T00:00:00Z');
    const to = from + 11 * 86400e3;
    const inUmbra = (ms: number) => { const g = moonAgainstShadow('europa', ms); return g.behind > 0 ? g.off - g.umbra : 1; };
    const edges = crossings(from, to, 600e3, inUmbra);
    expect(edges.length).toBeGreaterThanOrEqual(6);
    const durations: number[] = [];
    const starts: number[] = [];
    for (let i = 0; i + 1 < edges.length; i++) {
      if (inUmbra((edges[i] + edges[i + 1]) / 2) < 0) {
        durations.push((edges[i + 1] - edges[i]) / 3600e3);
        starts.push(edges[i]);
      }
    }
    for (const hours of durations) {
      expect(hours).toBeGreaterThan(2.4);
      expect(hours).toBeLessThan(2.95);
    }
    expect(Math.abs((starts[1] - starts[0]) / 86400e3 - 3.554)).toBeLessThan(0.01);
  });

  it('puts a low Europa orbiter in Jupiter\'s shadow for the whole of Europa\'s passage, and finds every passage (same source, from memory)', () => {
    const body = getBody('europa');
    const orbit = defineOrbit({ periapsisAltitudeKm: 100, apoapsisAltitudeKm: 100, inclinationDeg: 85 }, body);
    const start = Date.parse('2030-01-01T00:00:00Z');
    const spans = parentShadow(body, orbit, start)!.spans(start, start + 10 * 86400e3);
    expect(spans.length).toBeGreaterThanOrEqual(2);
    expect(spans.length).toBeLessThanOrEqual(3);
    for (const span of spans) {
      expect(span.parentS / 3600).toBeGreaterThan(2.4);
      expect(span.parentS / 3600).toBeLessThan(3.1);
      expect(span.durationS).toBeGreaterThanOrEqual(span.parentS - 120);
    }
  });

  it('adds the covered shares of two disks, never below zero (common practice, no source)', () => {
    expect(combinedSunlit(1, 0.4)).toBeCloseTo(0.4, 12);
    expect(combinedSunlit(0.7, 0.6)).toBeCloseTo(0.3, 12);
    expect(combinedSunlit(0.2, 0.3)).toBe(0);
  });

  it('has no planet shadow for a planet\'s own orbiter', () => {
    const body = getBody('jupiter');
    expect(parentShadow(body, defineOrbit({ periapsisAltitudeKm: 5000, apoapsisAltitudeKm: 5000 }, body), 0)).toBeNull();
  });
});

describe('the moon where it is', () => {
  it('puts the full Moon an Earth-Moon distance farther from the Sun, 0.5 % less flux (inverse square law, closed form)', () => {
    const at = new Date('2025-03-14T06:58:00Z');
    const earth = sunFromBody(getBody('earth'), at);
    const moon = sunFromBody(getBody('moon'), at);
    const moonKm = norm(moonOffsetKm(getBody('moon'), jdeOfMs(at.getTime())));
    // At a lunar eclipse the Moon is straight behind Earth: the distances differ by the Earth-Moon distance.
    expect(Math.abs((moon.distanceAu - earth.distanceAu) * AU_KM - moonKm)).toBeLessThan(50);
    const ratio = solarFluxWm2(moon.distanceAu) / solarFluxWm2(earth.distanceAu);
    expect(ratio).toBeCloseTo((earth.distanceAu / (earth.distanceAu + moonKm / AU_KM)) ** 2, 6);
    expect(1 - ratio).toBeGreaterThan(0.004);
  });

  it('places the Galilean moons at their mean distances, orbiting prograde in Jupiter\'s equator (JPL SSD mean elements; from memory)', () => {
    const jde = jdeOfMs(Date.parse('2031-06-01T00:00:00Z'));
    for (const [id, km] of [['io', 421800], ['europa', 671100], ['ganymede', 1070400], ['callisto', 1882700]] as const) {
      const r0 = moonOffsetKm(getBody(id), jde);
      const r1 = moonOffsetKm(getBody(id), jde + 0.01);
      expect(Math.abs(norm(r0) / km - 1), id).toBeLessThan(0.015);
      // the orbit's angular momentum within 1 deg of Jupiter's pole (IAU), so prograde in its equator
      const { raRad, decRad } = poleRaDecRad(getBody('jupiter'), jde);
      const h = cross(r0, r1);
      expect(dot(h, fromSpherical(raRad, decRad)) / norm(h), id).toBeGreaterThan(Math.cos(DEG));
    }
  });

  it('widens the Moon\'s perihelion-aphelion range by its distance from Earth (closed form)', () => {
    const moon = solarDistanceRangeAu(getBody('moon'));
    const earth = solarDistanceRangeAu(getBody('earth'));
    expect((earth.min - moon.min) * AU_KM).toBeCloseTo(384400 * 1.0549, 0);
    expect((moon.max - earth.max) * AU_KM).toBeCloseTo(384400 * 1.0549, 0);
  });

  it('carries the moon\'s offset into a ten-year sweep\'s solar flux (sun-track against the full theory, within 1e-4)', () => {
    const result = sweepMission({
      bodyId: 'europa', orbit: { periapsisAltitudeKm: 200, apoapsisAltitudeKm: 200, inclinationDeg: 80 },
      epochStart: '2030-01-01T12:00:00Z', days: 60, stepDays: 6, steps: 36,
    });
    for (const row of result.rows) {
      const exact = sunFromBody(getBody('europa'), new Date(row.date));
      expect(Math.abs(row.solarFluxWm2 / solarFluxWm2(exact.distanceAu) - 1)).toBeLessThan(1e-4);
    }
  });
});

describe('the compute route about a moon at an epoch', () => {
  it('darkens a low Europa orbit wholly while Europa is in Jupiter\'s umbra (same source as above, from memory)', () => {
    const body = getBody('europa');
    const orbitInput = { periapsisAltitudeKm: 100, apoapsisAltitudeKm: 100, inclinationDeg: 85 };
    const start = Date.parse('2030-01-01T00:00:00Z');
    const [span] = parentShadow(body, defineOrbit(orbitInput, body), start)!.spans(start, start + 4 * 86400e3);
    // the middle of Europa's own passage through the umbra (its centre's entry and exit)
    const inUmbra = (ms: number) => { const g = moonAgainstShadow('europa', ms); return g.behind > 0 ? g.off - g.umbra : 1; };
    const [entry, exit] = crossings(span.startMs - 3600e3, span.endMs + 3600e3, 60e3, inUmbra);
    // the orbit (from the epoch) centred on it
    const middle = new Date((entry + exit) / 2 - defineOrbit(orbitInput, body).periodS * 500).toISOString();
    const surfaces = [{ name: 'zenith', normal: 'zenith' as const, areaM2: 1, absorptivity: 0.5, emissivity: 0.8 }];
    const dark = computeEnvironment({ bodyId: 'europa', orbit: orbitInput, epoch: middle, steps: 72, surfaces });
    expect(dark.parentBodyId).toBe('jupiter');
    expect(dark.eclipseFraction).toBeCloseTo(1, 9);
    expect(dark.parentShadowDurationS).toBeCloseTo(dark.periodS, 6);
    expect(dark.orbitAverage.surfaces[0].solarWm2).toBe(0);
    expect(dark.profile.every((p) => p.parentSunlit === 0 && p.sunlit === 0)).toBe(true);
    // A day later Europa is clear of Jupiter's shadow: only its own.
    const clear = computeEnvironment({ bodyId: 'europa', orbit: orbitInput, epoch: new Date(Date.parse(middle) + 86400e3).toISOString(), steps: 72, surfaces });
    expect(clear.parentShadowDurationS).toBe(0);
    expect(clear.eclipseFraction).toBeLessThan(0.6);
  });
});

describe('the cold case about a moon', () => {
  it('takes the orbit amid the mission\'s longest shadow, saying when and who cast it (Europa in Jupiter\'s shadow, source above)', () => {
    const europa = getBody('europa');
    const paint = { name: 'white paint', absorptivityBol: 0.26, emissivityBol: 0.83, absorptivityEol: 0.5, emissivityEol: 0.83, source: 'test' };
    const d = deriveDesignCases({
      bodyId: 'europa', orbit: { semiMajorAxisKm: europa.radiusKm + 100, eccentricity: 0, inclinationDeg: 85, raanDeg: 0, argPeriapsisDeg: 0 },
      orbitEpoch: '2030-01-01T00:00:00Z', startDate: '2030-01-01', endDate: '2030-01-10',
      surfaces: [{ name: 'zenith radiator', normal: 'zenith', areaM2: 0.5, material: paint }], margins: defaultMargins(),
    });
    expect(d.cold.conditions.orbitStart).toBeDefined();
    expect(d.cold.rationale[1]).toMatch(/longest shadow, [23]\.\d\d h from 2030-01-\d\d \d\d:\d\d UTC, cast by (Europa and )?Jupiter/);
    expect(d.cold.results.eclipseFraction).toBeGreaterThan(0.99);
    expect(d.cold.results.total.orbitAverageAbsorbedW).toBeLessThan(d.hot.results.total.orbitAverageAbsorbedW);
    expect(d.hot.conditions.orbitStart).toBeUndefined();
    // the stored results keep the planet's shadow apart for the case's plot: the orbit amid Europa's passage is all behind Jupiter
    expect(d.cold.results.parentSunlit).toHaveLength(d.cold.results.sunlit.length);
    expect(Math.max(...d.cold.results.parentSunlit!)).toBeLessThan(1);
    expect(d.hot.results.parentSunlit).toBeUndefined();
  });
});

describe('moon tracks against the theory they interpolate (closed form: the theory itself)', () => {
  const worst = (id: string, at: (ms: number, out: Float64Array) => void, fromMs: number, toMs: number) => {
    const out = new Float64Array(3);
    let max = 0;
    for (let ms = fromMs; ms <= toMs; ms += (toMs - fromMs) / 97) {
      at(ms, out);
      const exact = moonOffsetKm(getBody(id), jdeOfMs(ms));
      max = Math.max(max, Math.hypot(out[0] - exact[0], out[1] - exact[1], out[2] - exact[2]));
    }
    return max;
  };
  it('keeps the global track within 150 km for Europa and 80 km for the Moon over a month', () => {
    const from = Date.parse('2031-03-01T00:00:00Z');
    const to = from + 30 * 86400e3;
    const europa = moonTrack(getBody('europa'));
    const moon = moonTrack(getBody('moon'));
    expect(worst('europa', (ms, out) => europa.at(ms, out), from, to)).toBeLessThan(150);
    expect(worst('moon', (ms, out) => moon.at(ms, out), from, to)).toBeLessThan(80);
  });
  it('keeps a passage\'s three-point track within 20 km over 6 h for Europa and 50 km over 12 h for the Moon', () => {
    const from = Date.parse('2031-03-01T00:00:00Z');
    expect(worst('europa', localMoonTrack(getBody('europa'), from, from + 6 * 3600e3), from, from + 6 * 3600e3)).toBeLessThan(20);
    expect(worst('moon', localMoonTrack(getBody('moon'), from, from + 12 * 3600e3), from, from + 12 * 3600e3)).toBeLessThan(50);
  });
});

describe('the passage scan against the shade sampled every 20 s (self-consistency of parent-shadow.ts; no outside source)', () => {
  // spans() looks only near each predicted passage, narrowed on the moon's own motion, and samples the
  // spacecraft 32 times an orbit; at() here is taken every 20 s over the whole stretch with the
  // moon's global track. Their dark runs that involve the planet must agree.
  const denseRuns = (shadow: NonNullable<ReturnType<typeof parentShadow>>, from: number, to: number) => {
    const runs: { startMs: number; endMs: number }[] = [];
    let start: number | null = null;
    let planet = false;
    for (let t = from; t <= to; t += 20e3) {
      const s = shadow.at(t);
      if (s.sunlit < 1 && start === null) [start, planet] = [t, false];
      if (s.sunlit < 1 && s.parent < 1) planet = true;
      if (s.sunlit >= 1 && start !== null) {
        if (planet) runs.push({ startMs: start, endMs: t });
        start = null;
      }
    }
    return runs;
  };
  for (const [id, altitudeKm, inclinationDeg, passages] of [['europa', 100, 85, 3], ['io', 300, 45, 6], ['ganymede', 1500, 20, 1]] as const) {
    it(`finds every darkness ${id}'s planet takes part in over 12 days, edges within 60 s`, () => {
      const body = getBody(id);
      const orbit = defineOrbit({ periapsisAltitudeKm: altitudeKm, apoapsisAltitudeKm: altitudeKm, inclinationDeg }, body);
      const start = Date.parse('2031-05-01T00:00:00Z');
      const shadow = parentShadow(body, orbit, start)!;
      // the dense scan over a day more on each side, so that runs crossing the ends are whole
      const dense = denseRuns(shadow, start - 86400e3, start + 13 * 86400e3)
        .filter((r) => (r.startMs + r.endMs) / 2 >= start && (r.startMs + r.endMs) / 2 < start + 12 * 86400e3);
      const spans = shadow.spans(start, start + 12 * 86400e3);
      expect(dense.length).toBeGreaterThanOrEqual(passages);
      expect(spans).toHaveLength(dense.length);
      spans.forEach((span, i) => {
        expect(Math.abs(span.startMs - dense[i].startMs) / 1000).toBeLessThan(60);
        expect(Math.abs(span.endMs - dense[i].endMs) / 1000).toBeLessThan(60);
      });
    });
  }
});
