import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { getBody } from './bodies';
import { capNodes, plateFluxes, plateNodes, spinPlateNodes } from './cap-radiance';
import { J2000_JD } from './constants';
import { computeEnvironment, computeEnvironmentColumns } from './environment';
import type { Surface, SurfaceNormal } from './heat-loads';
import { sweepMission } from './mission-sweep';
import { defineOrbit } from './orbit-definition';
import { orbitBasis, orbitSampler } from './orbit-position';
import { gridShade, orbitGrid, shadeGrid } from './orbit-grid';
import { directionAt, orientPlan, pointingColumns, pointingPlan, spinViewFactor, tableViewFactor, viewFactorTable } from './pointing';
import { pointingWords } from './pointing-words';
import { bodyFrameAxes, sunFromBody, toBodyFrame } from './sun';
import { cross, dot, norm, scale, type Vector3 } from './vector3';
import { plateToSphereViewFactor } from './view-factors';

const DEG = Math.PI / 180;
const LEO = { periapsisAltitudeKm: 550, apoapsisAltitudeKm: 550, inclinationDeg: 97.6, raanDeg: 30 };
const plate = (name: string, normal: SurfaceNormal): Surface => ({ name, normal, areaM2: 1, absorptivity: 0.9, emissivity: 0.8 });
const raDecDeg = (v: Vector3) => ({ raDeg: ((Math.atan2(v[1], v[0]) / DEG) + 360) % 360, decDeg: Math.asin(v[2]) / DEG });
const unitArb = fc.tuple(fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }))
  .filter(([x, y, z]) => Math.hypot(x, y, z) > 0.1)
  .map(([x, y, z]): Vector3 => scale([x, y, z], 1 / Math.hypot(x, y, z)));

describe('pointing: checks against closed forms', () => {
  it('an inertial plate facing the Sun receives S in sunlight and 0 in umbra (closed form; EME2000 for Earth)', () => {
    const epoch = '2027-05-10T06:00:00Z';
    const sun = sunFromBody(getBody('earth'), new Date(epoch));
    const c = computeEnvironmentColumns({ bodyId: 'earth', orbit: LEO, epoch, steps: 360, surfaces: [plate('at the Sun', { inertial: raDecDeg(sun.direction) })] });
    let sunlitSamples = 0;
    for (let k = 0; k < c.grid.steps; k++) {
      const solar = c.loads.solarWm2[0][k];
      expect(solar).toBeCloseTo(c.solarFluxWm2 * c.shade.sunlit[k], 6);
      if (c.shade.sunlit[k] === 1) sunlitSamples++;
    }
    expect(sunlitSamples).toBeGreaterThan(180);
    // facing away from the Sun: never any sunlight
    const away = computeEnvironmentColumns({ bodyId: 'earth', orbit: LEO, epoch, steps: 90, surfaces: [plate('away', { inertial: raDecDeg(scale(sun.direction, -1)) })] });
    expect(Math.max(...away.loads.solarWm2[0])).toBe(0);
  });

  it("about Mars an inertial plate set in Mars's equatorial frame of J2000 faces the Sun of 2030 (the IAU pole's drift taken into account; closed form)", () => {
    const mars = getBody('mars');
    const epoch = '2030-08-01T00:00:00Z';
    const sun = sunFromBody(mars, new Date(epoch));
    const inJ2000 = toBodyFrame(bodyFrameAxes(mars, J2000_JD), sun.directionIcrf);
    const c = computeEnvironmentColumns({ bodyId: 'mars', orbit: { periapsisAltitudeKm: 400, apoapsisAltitudeKm: 400, inclinationDeg: 93 }, epoch, steps: 120, surfaces: [plate('p', { inertial: raDecDeg(inJ2000) })] });
    const k = c.shade.sunlit.findIndex((s) => s === 1);
    expect(c.loads.solarWm2[0][k] / c.solarFluxWm2).toBeCloseTo(1, 8);
  });

  it('a Sun-tracking array driven about the orbit normal receives S cos(beta) in sunlight (closed form)', () => {
    for (const betaDeg of [0, 25, 60, -40]) {
      const c = computeEnvironmentColumns({
        bodyId: 'earth', orbit: LEO, betaDeg, steps: 240, surfaces: [plate('array', { trackSun: { axis: 'orbit-normal' } })],
      });
      for (let k = 0; k < c.grid.steps; k++) {
        expect(c.loads.solarWm2[0][k]).toBeCloseTo(c.solarFluxWm2 * Math.cos(betaDeg * DEG) * c.shade.sunlit[k], 6);
      }
    }
  });

  it('two-axis tracking ("both") faces the Sun exactly: every load equals a Sun-pointed plate\'s (closed form)', () => {
    const c = computeEnvironment({
      bodyId: 'earth', orbit: LEO, epoch: '2027-01-15T00:00:00Z', steps: 120,
      surfaces: [plate('sun', 'sun'), plate('both', { trackSun: { axis: 'both' } })],
    });
    const [a, b] = c.orbitAverage.surfaces;
    expect(b.solarWm2).toBeCloseTo(a.solarWm2, 10);
    expect(b.albedoWm2).toBeCloseTo(a.albedoWm2, 10);
    expect(b.irWm2).toBeCloseTo(a.irWm2, 10);
  });

  it('a plate on a spinner with its normal perpendicular to the spin axis receives S cos(elevation of the Sun above the spin plane) / pi over a turn (closed form)', () => {
    const epoch = '2027-09-01T00:00:00Z';
    const sun = sunFromBody(getBody('earth'), new Date(epoch)).direction;
    for (const axis of [{ raDeg: 40, decDeg: 10 }, { raDeg: 200, decDeg: -65 }, raDecDeg(sun)]) {
      const a: Vector3 = [Math.cos(axis.decDeg * DEG) * Math.cos(axis.raDeg * DEG), Math.cos(axis.decDeg * DEG) * Math.sin(axis.raDeg * DEG), Math.sin(axis.decDeg * DEG)];
      const elevation = Math.asin(dot(a, sun));
      const c = computeEnvironmentColumns({
        bodyId: 'earth', orbit: LEO, epoch, steps: 120, surfaces: [plate('band', { spin: { axis: { inertial: axis }, angleDeg: 90 } })],
      });
      const k = c.shade.sunlit.findIndex((s) => s === 1);
      expect(c.loads.solarWm2[0][k]).toBeCloseTo((c.solarFluxWm2 * Math.cos(elevation)) / Math.PI, 3);
    }
  });

  it('the spin average of the Sun on a plate at any cone angle equals a fine numerical average over the turn (property, fast-check; elementary calculus)', () => {
    fc.assert(fc.property(unitArb, unitArb, fc.double({ min: 0, max: 180, noNaN: true }), (axis, sun, angleDeg) => {
      const plan = pointingPlan({ spin: { axis: { x: axis[0], y: axis[1], z: axis[2] }, angleDeg } });
      const c = computeSpinSolar(axis, sun, angleDeg);
      const out = new Float64Array(3);
      directionAt(plan.direction, sun[0], sun[1], sun[2], 0, 0, 0, out);
      const closed = spinSunCosine(plan, out, sun);
      expect(Math.abs(closed - c)).toBeLessThan(2e-5);
    }), { numRuns: 200 });
  });

  it('a spinner about nadir keeps its tilt: its averaged view factor is the Howell closed form at that tilt; otherwise a fine numerical average (Howell catalogue)', () => {
    const R = 6378.137;
    const r = R + 550;
    for (const angleDeg of [0, 30, 90, 120, 170]) {
      expect(spinViewFactor(r, R, 1, Math.cos(angleDeg * DEG), Math.sin(angleDeg * DEG))).toBeCloseTo(plateToSphereViewFactor(r, R, angleDeg * DEG), 12);
    }
    fc.assert(fc.property(fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: 0, max: 180, noNaN: true }), fc.double({ min: 200, max: 40000, noNaN: true }), (u, angleDeg, altitudeKm) => {
      const [cos, sin] = [Math.cos(angleDeg * DEG), Math.sin(angleDeg * DEG)];
      const fine = fineSpinViewFactor(R + altitudeKm, R, u, cos, sin);
      expect(Math.abs(spinViewFactor(R + altitudeKm, R, u, cos, sin) - fine)).toBeLessThan(2e-4 * Math.max(fine, 0.05));
    }), { numRuns: 60 });
  });

  it("a spinner's averaged view factor (elementary on the arcs of the turn that see all or none of the body, Gauss-Legendre between) is within 2e-7 of the nadir plate's 1/h^2 of a brute-force average of the Howell form over 20,000 phases, for every radius, tilt and cone angle, degenerate ones included (property, fast-check; Howell catalogue)", () => {
    const edge = <T>(values: T[], arbitrary: fc.Arbitrary<T>) => fc.oneof(fc.constantFrom(...values), arbitrary);
    fc.assert(fc.property(
      // h - 1 from 1e-4 (Earth at 640 m) to 100, the axis's tilt cosine from nadir and the cone angle, with their ends
      edge([-4, 2], fc.double({ min: -4, max: 2, noNaN: true })),
      edge([-1, 0, 1, 1 - 1e-12, -1 + 1e-12], fc.double({ min: -1, max: 1, noNaN: true })),
      edge([0, 1e-9, 90, 180 - 1e-9, 180], fc.double({ min: 0, max: 180, noNaN: true })),
      (logHeight, u, angleDeg) => {
        const h = 1 + 10 ** logHeight;
        const axis: Vector3 = [Math.sqrt(Math.max(0, 1 - u * u)), 0, -u];
        const brute = bruteSpinViewFactor(h, axis, angleDeg);
        const fast = spinViewFactor(h, 1, u, Math.cos(angleDeg * DEG), Math.sin(angleDeg * DEG));
        expect(Math.abs(fast - brute) * h * h).toBeLessThan(2e-7);
      },
    ), { numRuns: 150 });
  });

  it("the sweep's spinning plate: its Sun factor, its view factor read from the table and its orbit sums of sunlit Sun, albedo and IR factors are within 1e-5 of brute-force averages over the turn (property, fast-check; Howell catalogue, elementary calculus)", () => {
    const earth = getBody('earth');
    fc.assert(fc.property(
      fc.double({ min: 150, max: 40000, noNaN: true }), unitArb, unitArb, fc.oneof(fc.constantFrom(0, 90, 180), fc.double({ min: 0, max: 180, noNaN: true })),
      (altitudeKm, axisPerifocal, sunPerifocal, angleDeg) => {
        const orbit = defineOrbit({ periapsisAltitudeKm: altitudeKm, apoapsisAltitudeKm: altitudeKm, inclinationDeg: 30 }, earth);
        const grid = orbitGrid(orbit, earth.radiusKm, 24);
        const shade = gridShade(grid.steps);
        const sun = { sp: sunPerifocal[0], sq: sunPerifocal[1], sw: sunPerifocal[2], distanceKm: 1.496e8 };
        shadeGrid(grid, sun, shade);
        // an axis fixed in inertial space, given straight in the orbit's perifocal frame
        const plan = orientPlan(pointingPlan({ spin: { axis: { inertial: { raDeg: 0, decDeg: 90 } }, angleDeg } }), () => axisPerifocal);
        const r = grid.radiusKm[0];
        const h = r / earth.radiusKm;
        const columns = pointingColumns(plan, grid, shade, sun.sw, earth.radiusKm, undefined, viewFactorTable(plan, r, earth.radiusKm), shade.sunlit);
        const want = [0, 0, 0];
        for (let k = 0; k < grid.steps; k++) {
          const axis: Vector3 = [columns.nx[k], columns.ny[k], columns.nz[k]];
          const sunLocal: Vector3 = [shade.cx[k], sun.sw, shade.cz[k]];
          const solar = turnAverage(axis, angleDeg, (n) => Math.max(0, dot(n, sunLocal)), 4000);
          const f = bruteSpinViewFactor(h, axis, angleDeg, 4000);
          expect(Math.abs(columns.sunCos[k] - solar)).toBeLessThan(1e-5);
          expect(Math.abs(columns.viewFactor[k] - f) * h * h).toBeLessThan(1e-5);
          want[0] += shade.sunlit[k] * solar;
          want[1] += f * Math.max(0, shade.cz[k]);
          want[2] += f;
        }
        expect(Math.abs(columns.sums[0] - want[0]) / grid.steps).toBeLessThan(1e-5);
        expect((Math.abs(columns.sums[1] - want[1]) / grid.steps) * h * h).toBeLessThan(1e-5);
        expect((Math.abs(columns.sums[2] - want[2]) / grid.steps) * h * h).toBeLessThan(1e-5);
      },
    ), { numRuns: 25 });
  });

  it("the cap quadrature's spin-averaged weights give, with a uniform exitance, the averaged view factor (within the quadrature's 1 %)", () => {
    const h = (6378.137 + 550) / 6378.137;
    const cap = capNodes(h);
    const out = new Float64Array(2);
    for (const [axis, angleDeg] of [[[0, 0, -1], 45], [[1, 0, 0], 90], [[0, 0.6, -0.8], 70]] as [Vector3, number][]) {
      const [cos, sin] = [Math.cos(angleDeg * DEG), Math.sin(angleDeg * DEG)];
      plateFluxes(spinPlateNodes(cap, axis[0], axis[1], axis[2], cos, sin), 0, 0, 1, 0, 0, 1, out);
      const expected = spinViewFactor(h, 1, -axis[2], cos, sin);
      expect(Math.abs(out[1] - expected)).toBeLessThan(0.01 * expected + 1e-4);
    }
    // with no cone angle the spinner is a plate along its axis
    plateFluxes(spinPlateNodes(cap, 0.6, 0, -0.8, 1, 0), 0.3, 0.1, 0.95, 1, 0, 1, out);
    const plain = new Float64Array(2);
    plateFluxes(plateNodes(cap, 0.6, 0, -0.8), 0.3, 0.1, 0.95, 1, 0, 1, plain);
    expect(out[0]).toBeCloseTo(plain[0], 12);
  });

  it('a Sun-tracking drive turns the plate perpendicular to its axis toward the Sun as far as it can (property, fast-check; closed form)', () => {
    fc.assert(fc.property(unitArb, unitArb, (axis, sun) => {
      const plan = pointingPlan({ trackSun: { axis: { x: axis[0], y: axis[1], z: axis[2] } } });
      const n = new Float64Array(3);
      directionAt(plan.direction, sun[0], sun[1], sun[2], 0, 0, 0, n);
      const v: Vector3 = [n[0], n[1], n[2]];
      expect(norm(v)).toBeCloseTo(1, 12);
      const best = Math.sqrt(Math.max(0, 1 - dot(axis, sun) ** 2));
      // The normal is p / |p| with p = s - (s . a) a, whose rounding (some 1e-16 in each part) the
      // division magnifies by 1 / |p|; the drive moves only while |p| > 1e-6 (pointing.ts), so a Sun
      // 1e-6 off the axis leaves up to ~1e-9 along it (a stressed fast-check run found 6e-10 there).
      const rounding = 1e-14 / Math.max(best, 1e-6);
      expect(Math.abs(dot(v, axis))).toBeLessThan(rounding);
      // Within rounding of the code's 1e-6 the plate may rest (edge-on) or turn: checked clear of it.
      if (best > 2e-6) expect(Math.abs(dot(v, sun) - best)).toBeLessThan(rounding);
    }), {
      examples: [
        // Suns about 1e-6 off the axis (found by probing) that failed the former fixed 5e-10: the first by
        // 6e-10 along the axis, the second resting while the test's own sqrt(1 - c^2) read 1.0003e-6
        [[-0.6546519891686537, -0.516277234141151, 0.5521671763017865], [-0.6546521007618442, -0.5162779278413303, 0.5521663953845493]],
        [[-0.6497146586728091, 0.3397165157887737, 0.6800467272224834], [-0.6497153761793095, 0.33971594650726583, 0.6800463261020169]],
      ],
    });
  });

  it('yaw steering keeps the Sun in the spacecraft y-z plane on the +y side: the -y face never sees it, the x faces see it edge-on, tilts from nadir keep (property, fast-check; our definition)', () => {
    fc.assert(fc.property(unitArb, unitArb, (face, sun) => {
      const n = new Float64Array(3);
      const at = (v: Vector3): Vector3 => {
        directionAt(pointingPlan({ yawSteered: { normal: { x: v[0], y: v[1], z: v[2] } } }).direction, sun[0], sun[1], sun[2], 0, 0, 0, n);
        return [n[0], n[1], n[2]];
      };
      // 1e-9: with the Sun within 1e-12 of the nadir axis the yaw angle is set by rounding noise
      expect(dot(at([0, -1, 0]), sun)).toBeLessThanOrEqual(1e-9);
      expect(dot(at([1, 0, 0]), sun)).toBeCloseTo(0, 9);
      expect(dot(at([0, 1, 0]), sun)).toBeCloseTo(Math.hypot(sun[0], sun[1]), 9);
      const turned = at(face);
      expect(norm(turned)).toBeCloseTo(1, 12);
      expect(turned[2]).toBeCloseTo(face[2], 12);
    }));
  });

  it('orbit averages of yaw-steered faces equal a direct, independently written integration over the orbit (20,000 steps, vectors in the inertial frame; our definition of yaw steering)', () => {
    const earth = getBody('earth');
    const S = 1361;
    const albedo = 0.3;
    const olr = 237;
    const orbit = { periapsisAltitudeKm: 700, apoapsisAltitudeKm: 700, inclinationDeg: 51.6, raanDeg: 10 };
    const faces: [string, { x: number; y: number; z: number }][] = [
      ['+y', { x: 0, y: 1, z: 0 }], ['-y', { x: 0, y: -1, z: 0 }], ['+x', { x: 1, y: 0, z: 0 }],
      ['tilted', { x: 0.48, y: 0.6, z: -0.64 }], ['up', { x: 0.6, y: -0.48, z: 0.64 }],
    ];
    for (const betaDeg of [75, 20]) {
      const answer = computeEnvironment({
        bodyId: 'earth', orbit, betaDeg, solarDistanceAu: 1, albedo, olrWm2: olr, steps: 3600, albedoModel: 'subsolar-cosine',
        surfaces: faces.map(([name, v]) => plate(name, { yawSteered: { normal: v } })),
      });
      const direct = directYawAverages(orbit, betaDeg, faces.map(([, v]) => [v.x, v.y, v.z] as Vector3), S, albedo, olr, earth.radiusKm, earth.gmKm3S2);
      for (const [j, [name]] of faces.entries()) {
        const got = answer.orbitAverage.surfaces[j];
        const want = direct[j];
        // the direct integration's shadow is a cylinder; the route's a cone with penumbra: within 0.5 % of S
        expect(Math.abs(got.solarWm2 - want.solar), `${name} solar at beta ${betaDeg}`).toBeLessThan(0.005 * S * (betaDeg > 70 ? 0.01 : 1));
        expect(Math.abs(got.albedoWm2 - want.albedo), `${name} albedo`).toBeLessThan(1e-3 * S * albedo);
        expect(Math.abs(got.irWm2 - want.ir), `${name} IR`).toBeLessThan(1e-6 * olr);
      }
      expect(answer.orbitAverage.surfaces[1].solarWm2).toBe(0);
    }
  });
});

describe('pointing: the sweep and the table agree with the compute route', () => {
  it("the view-factor table reads the direct form within 1e-4 of the nadir plate's factor", () => {
    const R = 6378.137;
    for (const normal of ['sun', { spin: { axis: 'sun', angleDeg: 90 } }] as SurfaceNormal[]) {
      const plan = pointingPlan(normal);
      const table = viewFactorTable(plan, R + 550, R);
      const nadirF = plateToSphereViewFactor(R + 550, R, 0);
      for (let u = -1; u <= 1; u += 0.0137) {
        const direct = plan.spin ? spinViewFactor(R + 550, R, u, plan.spin.cos, plan.spin.sin) : plateToSphereViewFactor(R + 550, R, Math.acos(u));
        expect(Math.abs(tableViewFactor(table, u) - direct)).toBeLessThan(1e-4 * nadirF);
      }
    }
  });

  it('view-factor tables kept across the chunks of a sweep (as the route computes it) give the rows of chunks made with fresh tables, for other orbits and cone angles too (consistency)', () => {
    const surfaces: Surface[] = [plate('band', { spin: { axis: 'sun', angleDeg: 90 } }), plate('cone', { spin: { axis: 'sun', angleDeg: 30 } }), plate('inertial', { inertial: { raDeg: 10, decDeg: 20 } })];
    const kept = new Map();
    for (const altitudeKm of [550, 1200]) {
      const request = { bodyId: 'earth', orbit: { ...LEO, periapsisAltitudeKm: altitudeKm, apoapsisAltitudeKm: altitudeKm }, orbitEpoch: '2027-02-01T12:00:00Z', days: 2, steps: 72, surfaces };
      for (const epochStart of ['2027-02-01T12:00:00Z', '2027-02-04T12:00:00Z']) {
        expect(sweepMission({ ...request, epochStart, viewFactorTables: kept }).rows).toEqual(sweepMission({ ...request, epochStart }).rows);
      }
    }
    // one table per radius and cone angle (and one for the plate that does not spin)
    expect(kept.size).toBe(6);
  });

  it("each sweep row's orbit averages equal the compute route's for every pointing form, inertial ones turned with the drifting node (consistency)", () => {
    const surfaces: Surface[] = [
      plate('inertial', { inertial: { raDeg: 120, decDeg: 20 } }),
      plate('drive', { trackSun: { axis: 'orbit-normal' } }),
      plate('drive about ram', { trackSun: { axis: 'ram' } }),
      plate('spinner', { spin: { axis: 'sun', angleDeg: 90 } }),
      plate('inertial spinner', { spin: { axis: { inertial: { raDeg: 0, decDeg: 90 } }, angleDeg: 60 } }),
      plate('yaw', { yawSteered: { normal: { x: 0.6, y: 0, z: -0.8 } } }),
    ];
    const orbit = { periapsisAltitudeKm: 600, apoapsisAltitudeKm: 600, inclinationDeg: 63, raanDeg: 20 };
    const sweep = sweepMission({ bodyId: 'earth', orbit, epochStart: '2027-02-01T00:00:00Z', days: 60, stepDays: 30, steps: 360, surfaces });
    for (const [i, row] of sweep.rows.entries()) {
      const single = computeEnvironment({ bodyId: 'earth', epoch: row.date, steps: 360, surfaces, orbit: { ...orbit, raanDeg: 20 + sweep.nodalRateDegPerDay * i * 30 } });
      for (const [j, load] of row.surfaces.entries()) {
        const reference = single.orbitAverage.surfaces[j];
        for (const key of ['solarWm2', 'albedoWm2', 'irWm2'] as const) {
          expect(Math.abs(load[key] - reference[key]), `${surfaces[j].name} ${key}`).toBeLessThan(1e-3 * Math.max(1, reference[key]));
        }
      }
    }
  });

  it('an eccentric orbit and the Moon\'s cap quadrature take the moving forms too (the compute route within the sweep\'s 1 %)', () => {
    const surfaces: Surface[] = [plate('inertial', { inertial: { raDeg: 300, decDeg: -10 } }), plate('spinner', { spin: { axis: 'orbit-normal', angleDeg: 80 } })];
    const orbit = { periapsisAltitudeKm: 100, apoapsisAltitudeKm: 100, inclinationDeg: 90, raanDeg: 40 };
    const sweep = sweepMission({ bodyId: 'moon', orbit, epochStart: '2027-03-01T12:00:00Z', days: 0, steps: 360, surfaces });
    const single = computeEnvironment({ bodyId: 'moon', epoch: sweep.rows[0].date, steps: 360, surfaces, orbit });
    for (const [j, load] of sweep.rows[0].surfaces.entries()) {
      const reference = single.orbitAverage.surfaces[j];
      expect(Math.abs(load.irWm2 - reference.irWm2)).toBeLessThan(Math.max(0.5, 0.01 * reference.irWm2));
      expect(Math.abs(load.albedoWm2 - reference.albedoWm2)).toBeLessThan(Math.max(0.5, 0.01 * reference.albedoWm2));
      expect(Math.abs(load.solarWm2 - reference.solarWm2)).toBeLessThan(Math.max(0.5, 1e-3 * reference.solarWm2));
    }
    const eccentric = { periapsisAltitudeKm: 500, apoapsisAltitudeKm: 6000, inclinationDeg: 63, raanDeg: 20, argPeriapsisDeg: 40 };
    const e = sweepMission({ bodyId: 'earth', orbit: eccentric, epochStart: '2027-06-01T00:00:00Z', days: 0, steps: 720, surfaces });
    const eSingle = computeEnvironment({ bodyId: 'earth', epoch: e.rows[0].date, steps: 720, surfaces, orbit: eccentric });
    for (const [j, load] of e.rows[0].surfaces.entries()) {
      expect(load.absorbedW / eSingle.orbitAverage.surfaces[j].absorbedW).toBeCloseTo(1, 3);
    }
  });
});

describe('pointing: refusals and words', () => {
  it('refuses a drive about the Sun, a spin inside a spin and a zero vector, naming the field', () => {
    expect(() => pointingPlan({ trackSun: { axis: 'sun' as never } }, 'surfaces.0.normal')).toThrow(/two-axis/);
    expect(() => pointingPlan({ spin: { axis: { spin: { axis: 'sun', angleDeg: 1 } } as never, angleDeg: 90 } })).toThrow(/spin/);
    expect(() => pointingPlan({ yawSteered: { normal: { x: 0, y: 0, z: 0 } } }, 'surfaces.2.normal')).toThrow(expect.objectContaining({ details: [expect.objectContaining({ path: 'surfaces.2.normal.yawSteered.normal' })] }));
  });

  it('says every form in words', () => {
    expect(pointingWords('nadir')).toBe('facing nadir');
    expect(pointingWords({ inertial: { raDeg: 0, decDeg: 90 } })).toContain('declination 90°');
    expect(pointingWords({ trackSun: { axis: 'orbit-normal' } })).toBe('turned about the orbit normal to face the Sun (one-axis drive)');
    expect(pointingWords({ trackSun: { axis: 'both' } })).toBe('tracking the Sun on two axes');
    expect(pointingWords({ spin: { axis: 'sun', angleDeg: 90 } })).toBe('on a body spinning about the Sun, 90° from the spin axis (loads averaged over a turn)');
    expect(pointingWords({ yawSteered: { normal: 'anti-orbit-normal' } })).toContain('yaw-steered');
  });
});

// ---- Independent references, written apart from pointing.ts ------------------------------------

/** Mean over a turn of `of(n)`, n at angleDeg from the unit axis, by an N-point midpoint sum over the full turn (vectors built apart from pointing.ts). */
function turnAverage(axis: Vector3, angleDeg: number, of: (n: Vector3) => number, N = 20000): number {
  const helper: Vector3 = Math.abs(axis[2]) < 0.9 ? [0, 0, 1] : [1, 0, 0];
  const e1 = scale(cross(axis, helper), 1 / norm(cross(axis, helper)));
  const e2 = cross(axis, e1);
  const [c, s] = [Math.cos(angleDeg * DEG), Math.sin(angleDeg * DEG)];
  let sum = 0;
  for (let i = 0; i < N; i++) {
    const phi = ((i + 0.5) * 2 * Math.PI) / N;
    const n: Vector3 = [
      c * axis[0] + s * (Math.cos(phi) * e1[0] + Math.sin(phi) * e2[0]),
      c * axis[1] + s * (Math.cos(phi) * e1[1] + Math.sin(phi) * e2[1]),
      c * axis[2] + s * (Math.cos(phi) * e1[2] + Math.sin(phi) * e2[2]),
    ];
    sum += of(n);
  }
  return sum / N;
}

/** Mean over a turn of max(0, n . s), n at angleDeg from the axis, by a 20,000-point sum. */
const computeSpinSolar = (axis: Vector3, sun: Vector3, angleDeg: number): number => turnAverage(axis, angleDeg, (n) => Math.max(0, dot(n, sun)));

/** Mean over a turn of the Howell view factor at r/R = h, the local frame's z being zenith (nadir = -z). */
const bruteSpinViewFactor = (h: number, axis: Vector3, angleDeg: number, N = 20000): number =>
  turnAverage(axis, angleDeg, (n) => plateToSphereViewFactor(h, 1, Math.acos(Math.max(-1, Math.min(1, -n[2])))), N);

function spinSunCosine(plan: ReturnType<typeof pointingPlan>, axis: Float64Array, sun: Vector3): number {
  const c = axis[0] * sun[0] + axis[1] * sun[1] + axis[2] * sun[2];
  const a = plan.spin!.sin * Math.sqrt(Math.max(0, 1 - c * c));
  const b = plan.spin!.cos * c;
  if (b >= a) return b;
  if (b <= -a) return 0;
  return (b * Math.acos(-b / a) + Math.sqrt(a * a - b * b)) / Math.PI;
}

/** The spin-averaged view factor by 4,000 phases over a full turn. */
function fineSpinViewFactor(rKm: number, R: number, u: number, cos: number, sin: number): number {
  const N = 4000;
  const sinTilt = Math.sqrt(Math.max(0, 1 - u * u));
  let sum = 0;
  for (let i = 0; i < N; i++) {
    const c = cos * u + sin * sinTilt * Math.cos(((i + 0.5) * 2 * Math.PI) / N);
    sum += plateToSphereViewFactor(rKm, R, Math.acos(Math.max(-1, Math.min(1, c))));
  }
  return sum / N;
}

/**
 * Orbit averages of yaw-steered faces by brute force: positions from orbitSampler, the Sun as an
 * inertial vector at beta above the plane (azimuth at the node), the yaw built from vectors (y_b the
 * Sun's horizontal part, x_b = y_b x zenith), a cylindrical shadow, closed-form albedo and IR.
 */
function directYawAverages(
  orbitInput: { periapsisAltitudeKm: number; apoapsisAltitudeKm: number; inclinationDeg: number; raanDeg: number },
  betaDeg: number, faces: Vector3[], S: number, albedo: number, olr: number, R: number, _gm: number,
) {
  const orbit = defineOrbit(orbitInput, getBody('earth'));
  const basis = orbitBasis(orbit.inclinationRad, orbit.raanRad, 0);
  const b = betaDeg * DEG;
  const sun: Vector3 = [
    basis.p[0] * Math.cos(b) + basis.w[0] * Math.sin(b), basis.p[1] * Math.cos(b) + basis.w[1] * Math.sin(b), basis.p[2] * Math.cos(b) + basis.w[2] * Math.sin(b),
  ];
  const at = orbitSampler(orbit);
  const N = 20000;
  const sums = faces.map(() => ({ solar: 0, albedo: 0, ir: 0 }));
  for (let i = 0; i < N; i++) {
    const state = at(((i + 0.5) * orbit.periodS) / N);
    const zen = state.zenith;
    const horizontal: Vector3 = [sun[0] - dot(sun, zen) * zen[0], sun[1] - dot(sun, zen) * zen[1], sun[2] - dot(sun, zen) * zen[2]];
    const yb = scale(horizontal, 1 / norm(horizontal));
    const xb = cross(yb, zen);
    // cylindrical shadow: behind the Earth and within R of the Sun line
    const along = dot(state.positionKm, sun);
    const off = norm([state.positionKm[0] - along * sun[0], state.positionKm[1] - along * sun[1], state.positionKm[2] - along * sun[2]]);
    const lit = along < 0 && off < R ? 0 : 1;
    faces.forEach((f, j) => {
      const n: Vector3 = [f[0] * xb[0] + f[1] * yb[0] + f[2] * zen[0], f[0] * xb[1] + f[1] * yb[1] + f[2] * zen[1], f[0] * xb[2] + f[1] * yb[2] + f[2] * zen[2]];
      const F = plateToSphereViewFactor(state.radiusKm, R, Math.acos(Math.max(-1, Math.min(1, -dot(n, zen)))));
      sums[j].solar += lit * S * Math.max(0, dot(n, sun));
      sums[j].albedo += S * albedo * F * Math.max(0, dot(sun, zen));
      sums[j].ir += olr * F;
    });
  }
  return sums.map((s) => ({ solar: s.solar / N, albedo: s.albedo / N, ir: s.ir / N }));
}
