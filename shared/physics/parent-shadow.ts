// The planet's shadow on a spacecraft orbiting one of its moons: the moon placed about its planet by
// its theory (moon-ephemeris.ts), the spacecraft about the moon on its orbit (node and periapsis
// drifting under J2, the spacecraft at periapsis - at the ascending node for a circular orbit - at
// the orbit's epoch), and the conical umbra and penumbra of both bodies with the Sun's finite disk
// (eclipse.ts's shadowGeometry and sunlitFraction). Where both disks cover part of the Sun at once
// their covered shares are added (sunlit = max(0, f_moon + f_planet - 1)), the darker bound.
// What it answers: the spacecraft's sunlit share behind each body at an instant, and the shadow
// spans that involve the planet - each the whole continuous darkness, the moon's own shadows that
// touch it included - with which bodies cast it.
// Leaves out: the planet's atmosphere and oblateness (Jupiter's shadow is about 7 % flatter
// pole-to-pole), light scattered by the planet, the moon's illumination by planetshine, and the
// spacecraft's position within one orbit when the orbit's phase at its epoch is unknown (periapsis
// is assumed there). Edges are found on samples 1/64 of the spacecraft's orbit apart, each refined
// by linear interpolation of the shadow test (about a second). Sources: Montenbruck & Gill,
// Satellite Orbits, sect. 3.4.2 (conical shadow, from memory); Vallado ch. 2 and 9 (orbit, J2 drift).
import { getBody, type Body, type BodyId } from './bodies';
import { AU_KM, SUN_RADIUS_KM } from './constants';
import { shadowGeometry, sunlitFraction, type ShadowGeometry } from './eclipse';
import { apsidalRateRadS } from './kepler';
import { moonTrack, jdeOfMs, type MoonTrack } from './moon-ephemeris';
import type { Orbit } from './orbit-definition';
import { trueAnomalyAt } from './orbit-grid';
import { orbitBasis } from './orbit-position';
import { bodyFrameAxes, eclipticToEquatorial, heliocentricEclipticAu } from './sun';
import { cross, dot, norm, type Vector3 } from './vector3';

export interface ShadowSpan {
  startMs: number;
  endMs: number;
  durationS: number;
  /** Time of the span in the planet's shadow (penumbra included), s. */
  parentS: number;
  /** The bodies whose shadow makes up the span: the planet, and the moon where its own shadow joins on. */
  castBy: BodyId[];
}

export interface ShadowAt {
  /** Share of the Sun's disk seen past the moon and past the planet, and the two together. */
  moon: number;
  parent: number;
  sunlit: number;
}

export interface ParentShadow {
  parent: Body;
  /** The spacecraft's shade at a UTC instant (ms). */
  at(ms: number): ShadowAt;
  /** The spans involving the planet whose middle falls within [startMs, endMs). */
  spans(startMs: number, endMs: number): ShadowSpan[];
  /** The moon's position about the planet (km, ICRF) at ms. */
  moonKm(ms: number): Vector3;
}

/** Combined sunlit share of two disks covering parts of the Sun: their covered shares added. */
export const combinedSunlit = (moon: number, parent: number): number => Math.max(0, moon + parent - 1);

/** Shadow test: negative inside the body's shadow (penumbra or umbra). */
const shadowTest = (g: ShadowGeometry): number => g.separationRad - (g.sunRadiusRad + g.bodyRadiusRad);

interface Frame {
  /** The moon's equatorial axes in ICRF. */
  axes: { x: Vector3; y: Vector3; z: Vector3 };
  /** Unit vector planet to Sun, ICRF, and the distance, km. */
  sun: Vector3;
  sunKm: number;
}

/** The planet's shadow for a spacecraft on `orbit` about the moon `body`; null when the body is a planet. */
export function parentShadow(body: Body, orbit: Orbit, orbitEpochMs: number): ParentShadow | null {
  if (!body.parentId || !body.parentOrbit) return null;
  const parent = getBody(body.parentId);
  const track: MoonTrack = moonTrack(body);
  const moonOrbit = body.parentOrbit;
  const apsidalRate = orbit.circular ? 0 : apsidalRateRadS(body, orbit.semiMajorAxisKm, orbit.eccentricity, orbit.inclinationRad);
  const { semiMajorAxisKm: a, eccentricity: e } = orbit;
  const buffer = new Float64Array(3);

  const frameAt = (ms: number): Frame => {
    const jde = jdeOfMs(ms);
    const towardSun = eclipticToEquatorial(heliocentricEclipticAu(parent.id as Parameters<typeof heliocentricEclipticAu>[0], jde));
    const sunKm = norm(towardSun) * AU_KM;
    const n = norm(towardSun);
    return { axes: bodyFrameAxes(body, jde), sun: [-towardSun[0] / n, -towardSun[1] / n, -towardSun[2] / n], sunKm };
  };
  const moonKm = (ms: number): Vector3 => {
    track.at(ms, buffer);
    return [buffer[0], buffer[1], buffer[2]];
  };
  /** The spacecraft from the moon's centre, km, ICRF. */
  const spacecraftKm = (ms: number, frame: Frame): Vector3 => {
    const elapsedS = (ms - orbitEpochMs) / 1000;
    const raan = orbit.raanRad + orbit.nodalRateRadS * elapsedS;
    const argp = orbit.argPeriapsisRad + apsidalRate * elapsedS;
    const tS = ((elapsedS % orbit.periodS) + orbit.periodS) % orbit.periodS;
    const nu = trueAnomalyAt(orbit, tS);
    const r = (a * (1 - e * e)) / (1 + e * Math.cos(nu));
    const { p, q } = orbitBasis(orbit.inclinationRad, raan, argp);
    const [c, s] = [Math.cos(nu) * r, Math.sin(nu) * r];
    const b: Vector3 = [p[0] * c + q[0] * s, p[1] * c + q[1] * s, p[2] * c + q[2] * s];
    const { x, y, z } = frame.axes;
    return [x[0] * b[0] + y[0] * b[1] + z[0] * b[2], x[1] * b[0] + y[1] * b[1] + z[1] * b[2], x[2] * b[0] + y[2] * b[1] + z[2] * b[2]];
  };
  /** Both shadow tests and sunlit shares at ms. */
  const shadeAt = (ms: number, frame: Frame) => {
    const m = moonKm(ms);
    const sc = spacecraftKm(ms, frame);
    const fromPlanet: Vector3 = [m[0] + sc[0], m[1] + sc[1], m[2] + sc[2]];
    const planetGeometry = shadowGeometry(fromPlanet, frame.sun, frame.sunKm, parent.radiusKm);
    // The Sun seen from the moon's centre: the planet's Sun moved by the moon's offset.
    const sunFromMoon: Vector3 = [frame.sun[0] * frame.sunKm - m[0], frame.sun[1] * frame.sunKm - m[1], frame.sun[2] * frame.sunKm - m[2]];
    const moonSunKm = norm(sunFromMoon);
    const moonGeometry = shadowGeometry(sc, [sunFromMoon[0] / moonSunKm, sunFromMoon[1] / moonSunKm, sunFromMoon[2] / moonSunKm], moonSunKm, body.radiusKm);
    const fMoon = sunlitFraction(moonGeometry);
    const fParent = sunlitFraction(planetGeometry);
    return { moonTest: shadowTest(moonGeometry), parentTest: shadowTest(planetGeometry), moon: fMoon, parent: fParent, sunlit: combinedSunlit(fMoon, fParent) };
  };

  // How far off the shadow's axis the moon's centre may be for the spacecraft to reach the penumbra.
  const reachKm = orbit.apoapsisKm;
  const moonPeriodMs = moonOrbit.periodDays * 86400e3;
  // The moon's returns to the anti-Sun direction: its synodic rate (the planet's own motion about the Sun taken off).
  const meanRate = (2 * Math.PI) / moonPeriodMs - (2 * Math.PI) / (body.solarYearDays * 86400e3);
  const synodicMs = (2 * Math.PI) / meanRate;
  // Departure from uniform motion: about 2e for the moon and for the planet (equations of centre) plus 0.04 rad of perturbations.
  const phaseSlackRad = 2 * moonOrbit.eccentricity + 2 * body.eccentricity + 0.04;
  const penumbraKm = (behindKm: number, sunKm: number): number => parent.radiusKm + (behindKm * (SUN_RADIUS_KM + parent.radiusKm)) / sunKm;

  /** Mid-times of the moon's passages behind the planet (opposite the Sun) with middle in [startMs, endMs). */
  const passages = (startMs: number, endMs: number, frame: Frame): number[] => {
    const m0 = moonKm(startMs);
    const m1 = moonKm(startMs + 60e3);
    const h = cross(m0, m1);
    const hn = norm(h);
    const k: Vector3 = [h[0] / hn, h[1] / hn, h[2] / hn];
    const anti: Vector3 = [-frame.sun[0], -frame.sun[1], -frame.sun[2]];
    const along = dot(anti, k);
    const target: Vector3 = [anti[0] - along * k[0], anti[1] - along * k[1], anti[2] - along * k[2]];
    // angle from the moon to the anti-Sun direction, in the sense of its motion
    const angle = Math.atan2(dot(cross(m0, target), k), dot(m0, target));
    const first = startMs + (((angle % (2 * Math.PI)) + 2 * Math.PI) % (2 * Math.PI)) / meanRate;
    const out: number[] = [];
    for (let t = first - synodicMs; t < endMs + synodicMs; t += synodicMs) if (t >= startMs - 0.5 * synodicMs) out.push(t);
    return out;
  };

  /** The spans around one predicted passage. */
  const spansNear = (centreMs: number, frame: Frame): ShadowSpan[] => {
    const moonSpeedKmMs = (norm(moonKm(centreMs)) * 2 * Math.PI) / moonPeriodMs;
    const behind = norm(moonKm(centreMs));
    const halfWidthMs = (penumbraKm(behind, frame.sunKm) + reachKm) / moonSpeedKmMs + phaseSlackRad / meanRate;
    // 1. Where the moon's centre comes within reach of the penumbra (coarse, the moon's own motion).
    const coarseMs = Math.max(60e3, Math.min(halfWidthMs / 40, orbit.periodS * 1000));
    let firstIn = Infinity;
    let lastIn = -Infinity;
    for (let t = centreMs - halfWidthMs; t <= centreMs + halfWidthMs; t += coarseMs) {
      const m = moonKm(t);
      const back = -dot(m, frame.sun);
      if (back <= 0) continue;
      const off = Math.sqrt(Math.max(0, dot(m, m) - back * back));
      if (off < penumbraKm(back, frame.sunKm) + reachKm + moonSpeedKmMs * coarseMs) {
        firstIn = Math.min(firstIn, t);
        lastIn = Math.max(lastIn, t);
      }
    }
    if (!(lastIn >= firstIn)) return [];
    // 2. The spacecraft, 64 samples an orbit, one orbit beyond either side so the moon's own shadows joining on are whole.
    const periodMs = orbit.periodS * 1000;
    const stepMs = periodMs / 64;
    const from = firstIn - coarseMs - periodMs;
    const to = lastIn + coarseMs + periodMs;
    const spans: ShadowSpan[] = [];
    let run: { startMs: number; parentS: number; moon: boolean } | null = null;
    let prev = shadeAt(from, frame);
    let prevT = from;
    for (let t = from + stepMs; t <= to + stepMs / 2; t += stepMs) {
      const cur = shadeAt(t, frame);
      const wasDark = prev.sunlit < 1;
      const isDark = cur.sunlit < 1;
      // edge time by linear interpolation of the test that changed sign
      const edge = (test: 'moonTest' | 'parentTest'): number => {
        const [f0, f1] = [prev[test], cur[test]];
        return f0 === f1 ? t : prevT + ((t - prevT) * f0) / (f0 - f1);
      };
      const edgeOf = (): number => (((prev.parentTest < 0) !== (cur.parentTest < 0)) ? edge('parentTest') : edge('moonTest'));
      if (!wasDark && isDark) run = { startMs: edgeOf(), parentS: 0, moon: cur.moon < 1, };
      if (run && isDark) {
        if (cur.parent < 1 || prev.parent < 1) run.parentS += (t - prevT) / 1000;
        if (cur.moon < 1) run.moon = true;
      }
      if (run && wasDark && !isDark) {
        const endMs = edgeOf();
        // Only darkness the planet takes part in, and only a span whole within the window.
        if (run.parentS > 0 && run.startMs > from) {
          spans.push({
            startMs: run.startMs, endMs, durationS: (endMs - run.startMs) / 1000, parentS: run.parentS,
            castBy: run.moon ? [body.id, parent.id] : [parent.id],
          });
        }
        run = null;
      }
      prev = cur;
      prevT = t;
    }
    return spans;
  };

  return {
    parent,
    moonKm,
    at(ms: number): ShadowAt {
      const s = shadeAt(ms, frameAt(ms));
      return { moon: s.moon, parent: s.parent, sunlit: s.sunlit };
    },
    spans(startMs: number, endMs: number): ShadowSpan[] {
      const out: ShadowSpan[] = [];
      for (const centre of passages(startMs, endMs, frameAt(startMs))) {
        for (const span of spansNear(centre, frameAt(centre))) {
          const middle = (span.startMs + span.endMs) / 2;
          if (middle >= startMs && middle < endMs && !out.some((o) => Math.abs(o.startMs - span.startMs) < 1000)) out.push(span);
        }
      }
      return out;
    },
  };
}
