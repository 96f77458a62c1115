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
// is assumed there). Edges are found on samples 1/32 of the spacecraft's orbit apart, each refined
// by linear interpolation of the shadow test (seconds); within one passage (hours) the orbit's
// plane is held where it is at the passage's middle. Sources: Montenbruck & Gill,
// Satellite Orbits, sect. 3.4.2 (conical shadow, from memory); Vallado ch. 2 and 9 (orbit, J2 drift).
import { getBody, type AnyBodyId, type Body } from './bodies';
import { AU_KM, DAY_MS, SUN_RADIUS_KM } from './constants';
import { shadowGeometryInto, sunlitFraction, type ShadowGeometry } from './eclipse';
import { apsidalRateRadS } from './kepler';
import { jdeOfMs, localMoonTrack, moonTrack, type MoonTrack } from './moon-ephemeris';
import type { Orbit } from './orbit-definition';
import { trueAnomalyAt } from './orbit-grid';
import { orbitBasis } from './orbit-position';
import { bodyFrameAxes } from './sun';
import { sunTrack, type SunTrack } from './sun-track';
import { cross, dot, norm, type Vector3 } from './vector3';

export interface ShadowSpan {
  startMs: number;
  endMs: number;
  durationS: number;
  /** Time of the span in the planet's shadow (penumbra included), s, and the middle of that part (ms). */
  parentS: number;
  parentMiddleMs: number;
  /** The bodies whose shadow makes up the span: the planet, and the moon where its own shadow joins on. */
  castBy: AnyBodyId[];
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

interface Shade {
  moonTest: number;
  parentTest: number;
  moon: number;
  parent: number;
  sunlit: number;
}

/** Where a run of samples crossed into or out of shadow: linear interpolation of the test that changed sign. */
function edgeMs(t0: number, a: Shade, t1: number, b: Shade): number {
  const test = (a.parentTest < 0) !== (b.parentTest < 0) ? 'parentTest' : 'moonTest';
  const [f0, f1] = [a[test], b[test]];
  return f0 === f1 ? t1 : t0 + ((t1 - t0) * f0) / (f0 - f1);
}

/** The planet's Sun at a UTC instant: unit vector (ICRF) into out, distance in AU returned. */
export type PlanetSun = (ms: number, out: Float64Array) => number;

/**
 * The planet's shadow for a spacecraft on `orbit` about the moon `body`; null when the body is a
 * planet. `planetSun` may hand in a Sun track the caller already has (mission-days.ts does).
 */
export function parentShadow(body: Body, orbit: Orbit, orbitEpochMs: number, planetSun?: PlanetSun, coarseMoon?: MoonTrack | null): ParentShadow | null {
  if (!body.parentId || !body.parentOrbit) return null;
  const parent = getBody(body.parentId);
  const track: MoonTrack = moonTrack(body);
  const moonOrbit = body.parentOrbit;
  const apsidalRate = orbit.circular ? 0 : apsidalRateRadS(body, orbit.semiMajorAxisKm, orbit.eccentricity, orbit.inclinationRad);
  const { semiMajorAxisKm: a, eccentricity: e } = orbit;
  const buffer = new Float64Array(3);

  // The planet's Sun from its own Sun track (VSOP87 at 4-day nodes, sun-track.ts), a year at a time.
  const yearMs = 365.25 * DAY_MS;
  const sunTracks = new Map<number, SunTrack>();
  const sunVector = new Float64Array(3);
  const sunOfPlanet: PlanetSun = planetSun ?? ((ms, out) => {
    const year = Math.floor(ms / yearMs);
    let sunTrackOfYear = sunTracks.get(year);
    if (!sunTrackOfYear) {
      if (sunTracks.size > 8) sunTracks.clear();
      sunTrackOfYear = sunTrack(parent, year * yearMs, (year + 1) * yearMs);
      sunTracks.set(year, sunTrackOfYear);
    }
    return sunTrackOfYear.atIcrf(ms, out);
  });
  const frameAt = (ms: number): Frame => {
    const distanceAu = sunOfPlanet(ms, sunVector);
    return { axes: bodyFrameAxes(body, jdeOfMs(ms)), sun: [sunVector[0], sunVector[1], sunVector[2]], sunKm: distanceAu * AU_KM };
  };
  const moonKm = (ms: number): Vector3 => {
    track.at(ms, buffer);
    return [buffer[0], buffer[1], buffer[2]];
  };
  // For finding a passage's reach only, the caller's coarser track (a few thousand km) will do.
  const roughMoonKm = coarseMoon
    ? (ms: number): Vector3 => {
      coarseMoon.at(ms, buffer);
      return [buffer[0], buffer[1], buffer[2]];
    }
    : moonKm;
  const ROUGH_KM = coarseMoon ? 10000 : 0;
  /** Bound on the local track's error over a passage's stretch (localMoonTrack: tens of km over a day; parent-shadow.spec.ts), km. */
  const LOCAL_TRACK_KM = 1000;
  /** The orbit's perifocal P and Q in ICRF at ms (node and periapsis drifted), for a window of a few hours. */
  const perifocalAt = (ms: number, frame: Frame): { p: Vector3; q: Vector3 } => {
    const elapsedS = (ms - orbitEpochMs) / 1000;
    const basis = orbitBasis(orbit.inclinationRad, orbit.raanRad + orbit.nodalRateRadS * elapsedS, orbit.argPeriapsisRad + apsidalRate * elapsedS);
    const { x, y, z } = frame.axes;
    const icrf = (b: Vector3): Vector3 => [
      x[0] * b[0] + y[0] * b[1] + z[0] * b[2], x[1] * b[0] + y[1] * b[1] + z[1] * b[2], x[2] * b[0] + y[2] * b[1] + z[2] * b[2],
    ];
    return { p: icrf(basis.p), q: icrf(basis.q) };
  };
  /** Both shadow tests and sunlit shares at ms, the orbit's plane held as `axes` gives it. */
  const planetGeometry: ShadowGeometry = { sunRadiusRad: 0, bodyRadiusRad: 0, separationRad: 0 };
  const moonGeometry: ShadowGeometry = { sunRadiusRad: 0, bodyRadiusRad: 0, separationRad: 0 };
  const moonAtBuffer = new Float64Array(3);
  /** `planetPossible` false: the caller knows the planet's penumbra is out of reach, so only the moon's shadow is worked. */
  const shadeAt = (
    ms: number, frame: Frame, axes: { p: Vector3; q: Vector3 }, moonAt: (ms: number, out: Float64Array) => void = (t, out) => track.at(t, out), planetPossible = true,
  ): Shade => {
    moonAt(ms, moonAtBuffer);
    const [mx, my, mz] = [moonAtBuffer[0], moonAtBuffer[1], moonAtBuffer[2]];
    const elapsedS = (ms - orbitEpochMs) / 1000;
    const nu = trueAnomalyAt(orbit, ((elapsedS % orbit.periodS) + orbit.periodS) % orbit.periodS);
    const r = (a * (1 - e * e)) / (1 + e * Math.cos(nu));
    const [c, s] = [Math.cos(nu) * r, Math.sin(nu) * r];
    const { p, q } = axes;
    const [x, y, z] = [p[0] * c + q[0] * s, p[1] * c + q[1] * s, p[2] * c + q[2] * s];
    // The Sun's centre from the spacecraft: the planet's Sun moved by the moon's offset and the spacecraft's.
    const [tx, ty, tz] = [frame.sun[0] * frame.sunKm - mx - x, frame.sun[1] * frame.sunKm - my - y, frame.sun[2] * frame.sunKm - mz - z];
    shadowGeometryInto(x, y, z, tx, ty, tz, body.radiusKm, moonGeometry);
    const fMoon = sunlitFraction(moonGeometry);
    if (!planetPossible) return { moonTest: shadowTest(moonGeometry), parentTest: 1, moon: fMoon, parent: 1, sunlit: fMoon };
    shadowGeometryInto(mx + x, my + y, mz + z, tx, ty, tz, parent.radiusKm, planetGeometry);
    const fParent = sunlitFraction(planetGeometry);
    return { moonTest: shadowTest(moonGeometry), parentTest: shadowTest(planetGeometry), moon: fMoon, parent: fParent, sunlit: combinedSunlit(fMoon, fParent) };
  };

  // How far off the shadow's axis the moon's centre may be for the spacecraft to reach the penumbra.
  const reachKm = orbit.apoapsisKm;
  const moonPeriodMs = moonOrbit.periodDays * DAY_MS;
  // The moon's returns to the anti-Sun direction: its synodic rate (the planet's own motion about the Sun taken off).
  const meanRate = (2 * Math.PI) / moonPeriodMs - (2 * Math.PI) / (body.solarYearDays * DAY_MS);
  const synodicMs = (2 * Math.PI) / meanRate;
  // Departure from uniform motion: about 2e for the moon and for the planet (equations of centre) plus 0.04 rad of perturbations.
  const phaseSlackRad = 2 * moonOrbit.eccentricity + 2 * body.eccentricity + 0.04;
  const penumbraKm = (behindKm: number, sunKm: number): number => parent.radiusKm + (behindKm * (SUN_RADIUS_KM + parent.radiusKm)) / sunKm;
  const umbraKm = (behindKm: number, sunKm: number): number => parent.radiusKm - (behindKm * (SUN_RADIUS_KM - parent.radiusKm)) / sunKm;

  /** The first passage behind the planet (opposite the Sun) after startMs, predicted at the moon's mean synodic rate. */
  const nextPassage = (startMs: number): number => {
    const frame = frameAt(startMs);
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
    return startMs + (((angle % (2 * Math.PI)) + 2 * Math.PI) % (2 * Math.PI)) / meanRate;
  };
  // Passages are predicted from one anchor, whole synodic periods apart (the mean rate holds over
  // decades to minutes; the moon's and planet's unequal motions stay within the slack).
  let anchorMs: number | null = null;
  /** Predicted mid-times of the passages from a little before startMs to a little after endMs, with their count from the anchor. */
  const passages = (startMs: number, endMs: number): { key: number; centreMs: number }[] => {
    anchorMs ??= nextPassage(startMs);
    const out: { key: number; centreMs: number }[] = [];
    const firstKey = Math.floor((startMs - anchorMs) / synodicMs) - 1;
    for (let key = firstKey; anchorMs + key * synodicMs < endMs + synodicMs; key++) out.push({ key, centreMs: anchorMs + key * synodicMs });
    return out;
  };

  /** The spans around one predicted passage. */
  const spansNear = (centreMs: number): ShadowSpan[] => {
    const frame = frameAt(centreMs);
    const behind = norm(roughMoonKm(centreMs));
    const moonSpeedKmMs = (behind * 2 * Math.PI) / moonPeriodMs;
    // the slack twice: once for the anchor's own departure, once for this passage's
    const halfWidthMs = (penumbraKm(behind, frame.sunKm) + reachKm) / moonSpeedKmMs + (2 * phaseSlackRad) / meanRate;
    // 1. Where the moon's centre may come within reach of the penumbra (coarse, on the moon's own
    //    motion and the rough track): the stretch to look at more closely, or no passage at all.
    const coarseMs = Math.max(60e3, Math.min(halfWidthMs / 12, orbit.periodS * 1000));
    const coarseMarginKm = moonSpeedKmMs * coarseMs + ROUGH_KM;
    let [roughFrom, roughTo] = [Infinity, -Infinity];
    for (let t = centreMs - halfWidthMs; t <= centreMs + halfWidthMs; t += coarseMs) {
      const m = roughMoonKm(t);
      const back = -dot(m, frame.sun);
      if (back <= 0) continue;
      const off = Math.sqrt(Math.max(0, dot(m, m) - back * back));
      if (off < penumbraKm(back, frame.sunKm) + reachKm + coarseMarginKm) {
        roughFrom = Math.min(roughFrom, t - coarseMs);
        roughTo = Math.max(roughTo, t + coarseMs);
      }
    }
    if (!(roughTo >= roughFrom)) return [];
    const periodMs = orbit.periodS * 1000;
    const stepMs = periodMs / 32;
    // The moon over this stretch and half an orbit beyond either side from three evaluations of its theory.
    const local = localMoonTrack(body, roughFrom - periodMs / 2, roughTo + periodMs / 2 + stepMs);
    // 1b. The same on the accurate track in fine steps: where the moon's centre is within reach of
    //     the penumbra, and where it is so deep in the umbra that the whole orbit is. The margin is
    //     the moon's motion in one step (the distance off the axis changes no faster) and the
    //     local track's own error (LOCAL_TRACK_KM).
    const fineMs = Math.max(10e3, Math.min(stepMs, coarseMs / 8));
    const marginKm = moonSpeedKmMs * fineMs + LOCAL_TRACK_KM;
    let [firstIn, lastIn, firstDeep, lastDeep] = [Infinity, -Infinity, Infinity, -Infinity];
    const [sx, sy, sz] = frame.sun;
    for (let t = roughFrom; t <= roughTo; t += fineMs) {
      local(t, buffer);
      const [bx, by, bz] = [buffer[0], buffer[1], buffer[2]];
      const back = -(bx * sx + by * sy + bz * sz);
      if (back <= 0) continue;
      const off = Math.sqrt(Math.max(0, bx * bx + by * by + bz * bz - back * back));
      if (off < penumbraKm(back, frame.sunKm) + reachKm + marginKm) {
        firstIn = Math.min(firstIn, t);
        lastIn = Math.max(lastIn, t);
      }
      if (off + reachKm + marginKm < umbraKm(back, frame.sunKm)) {
        firstDeep = Math.min(firstDeep, t);
        lastDeep = Math.max(lastDeep, t);
      }
    }
    if (!(lastIn >= firstIn)) return [];
    // 2. The spacecraft, 32 samples an orbit, half an orbit beyond either side (more than any
    //    shadow of the moon's own lasts) so that those joining on are whole; deep in the umbra it is
    //    dark throughout and is not sampled.
    //    The samples keep the phase of the rough stretch (whole steps from its start), so that
    //    narrowing the stretch changes no sample's time.
    const from = roughFrom - periodMs / 2 + Math.max(0, Math.floor((firstIn - fineMs - roughFrom) / stepMs)) * stepMs;
    const to = lastIn + fineMs + periodMs / 2;
    const axes = perifocalAt(centreMs, frame);
    // Outside [firstIn, lastIn] the fine scan proved the planet's penumbra out of reach: there only the
    // moon's shadow is worked, from a sample step beyond (an edge is interpolated between two real tests).
    const shade = (ms: number): Shade => shadeAt(ms, frame, axes, local, ms >= firstIn - fineMs - stepMs && ms <= lastIn + fineMs + stepMs);
    const spans: ShadowSpan[] = [];
    let run: { startMs: number; parentS: number; moon: boolean; parentFirstMs: number; parentLastMs: number } | null = null;
    let prev = shade(from);
    let prevT = from;
    for (let t = from + stepMs; t <= to + stepMs / 2; t += stepMs) {
      // (a sample after a lit one is always taken: an edge is interpolated between the two)
      const deep = t > firstDeep && t < lastDeep && prev.sunlit < 1;
      const cur: Shade = deep ? { moonTest: -1, parentTest: -1, moon: 1, parent: 0, sunlit: 0 } : shade(t);
      const wasDark = prev.sunlit < 1;
      const isDark = cur.sunlit < 1;
      if (!wasDark && isDark) run = { startMs: edgeMs(prevT, prev, t, cur), parentS: 0, moon: cur.moon < 1 && cur.parent >= 1, parentFirstMs: Infinity, parentLastMs: -Infinity };
      if (run && isDark) {
        if (cur.parent < 1 || prev.parent < 1) {
          run.parentS += (t - prevT) / 1000;
          run.parentFirstMs = Math.min(run.parentFirstMs, prevT);
          run.parentLastMs = t;
        }
        // the moon's shadow joins on where it darkens the spacecraft outside the planet's shadow
        if (cur.moon < 1 && cur.parent >= 1) run.moon = true;
      }
      if (run && wasDark && !isDark) {
        const endMs = edgeMs(prevT, prev, t, cur);
        // Only darkness the planet takes part in, and only a span whole within the window.
        if (run.parentS > 0 && run.startMs > from) {
          spans.push({
            startMs: run.startMs, endMs, durationS: (endMs - run.startMs) / 1000, parentS: run.parentS,
            parentMiddleMs: (run.parentFirstMs + run.parentLastMs) / 2,
            castBy: run.moon ? [body.id, parent.id] : [parent.id],
          });
        }
        run = null;
      }
      if (deep && t + stepMs >= lastDeep) {
        // leaving the deep stretch: sample properly again from here
        prev = shade(t);
      } else prev = cur;
      prevT = t;
    }
    return spans;
  };

  // Each passage is worked once, however many days ask for it: keyed by its count of synodic periods from the anchor.
  const worked = new Map<number, ShadowSpan[]>();
  const spansOfPassage = (key: number, centreMs: number): ShadowSpan[] => {
    let spans = worked.get(key);
    if (!spans) {
      if (worked.size > 256) worked.clear();
      spans = spansNear(centreMs);
      worked.set(key, spans);
    }
    return spans;
  };

  return {
    parent,
    moonKm,
    at(ms: number): ShadowAt {
      const frame = frameAt(ms);
      const s = shadeAt(ms, frame, perifocalAt(ms, frame));
      return { moon: s.moon, parent: s.parent, sunlit: s.sunlit };
    },
    spans(startMs: number, endMs: number): ShadowSpan[] {
      const out: ShadowSpan[] = [];
      for (const { key, centreMs } of passages(startMs, endMs)) {
        for (const span of spansOfPassage(key, centreMs)) {
          const middle = (span.startMs + span.endMs) / 2;
          if (middle >= startMs && middle < endMs && !out.some((o) => Math.abs(o.startMs - span.startMs) < 1000)) out.push(span);
        }
      }
      return out;
    },
  };
}
