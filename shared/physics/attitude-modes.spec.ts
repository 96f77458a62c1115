import { describe, expect, it } from 'vitest';
import { isLocalOrbitalNormal, pointedNormals, yawSteeredNormal } from './attitude-modes';
import { sweepMission } from './mission-sweep';

// Checks of our own bookkeeping (common practice, no source): which normal a mode gives a surface,
// and that a sweep over phases computes each day exactly as a sweep with that phase's pointing does.
describe('attitude modes', () => {
  it('yaw steering wraps every local-orbital normal (named or vector) as {yawSteered: {normal}} and leaves Sun-pointed and other forms alone', () => {
    expect(yawSteeredNormal('nadir', true)).toEqual({ yawSteered: { normal: 'nadir' } });
    expect(yawSteeredNormal('orbit-normal', true)).toEqual({ yawSteered: { normal: 'orbit-normal' } });
    expect(yawSteeredNormal({ x: 0, y: 0.6, z: 0.8 }, true)).toEqual({ yawSteered: { normal: { x: 0, y: 0.6, z: 0.8 } } });
    expect(yawSteeredNormal('sun', true)).toBe('sun');
    const spin = { spin: { axis: 'sun', angleDeg: 90 } };
    expect(yawSteeredNormal(spin, true)).toBe(spin);
    expect(yawSteeredNormal({ inertial: { raDeg: 0, decDeg: 90 } }, true)).toEqual({ inertial: { raDeg: 0, decDeg: 90 } });
    expect(yawSteeredNormal('nadir', false)).toBe('nadir');
    expect(isLocalOrbitalNormal({ x: 1, y: 0, z: 0, extra: 1 })).toBe(false);
  });

  it("a mode points the surfaces it lists; the others keep their own normal; yaw steering applies to the mode's whole pointing", () => {
    const surfaces = [{ id: 'a', normal: 'zenith' }, { id: 'b', normal: 'ram' }];
    expect(pointedNormals(surfaces, { yawSteering: false, pointing: [{ surfaceId: 'a', normal: 'sun' }] })).toEqual(['sun', 'ram']);
    expect(pointedNormals(surfaces, { yawSteering: true, pointing: [{ surfaceId: 'a', normal: 'sun' }] })).toEqual(['sun', { yawSteered: { normal: 'ram' } }]);
    expect(pointedNormals(surfaces, { yawSteering: false, pointing: [{ surfaceId: 'gone', normal: 'sun' }] })).toEqual(['zenith', 'ram']);
  });

  it('a sweep over attitude spans gives each row the loads of a sweep with that span\'s pointing, the rest the surfaces\' own (same computation)', () => {
    const own = [
      { name: 'array', normal: 'zenith' as const, areaM2: 0.5, absorptivity: 0.88, emissivity: 0.8 },
      { name: 'radiator', normal: 'orbit-normal' as const, areaM2: 0.2, absorptivity: 0.08, emissivity: 0.78 },
    ];
    const safe = own.map((s) => (s.name === 'array' ? { ...s, normal: 'sun' as const } : s));
    const orbit = { periapsisAltitudeKm: 600, apoapsisAltitudeKm: 600, inclinationDeg: 97.8, raanDeg: 135 };
    const base = { bodyId: 'earth', orbit, epochStart: '2028-01-10T12:00:00Z', days: 40, stepDays: 5, steps: 180 } as const;
    const from = Date.parse('2028-01-20T00:00:00Z');
    const to = Date.parse('2028-02-01T00:00:00Z');
    const phased = sweepMission({ ...base, surfaces: own, attitudeSpans: [{ fromMs: from, toMs: to, surfaces: safe }] });
    const plain = sweepMission({ ...base, surfaces: own });
    const sunSafe = sweepMission({ ...base, surfaces: safe });
    for (const [i, row] of phased.rows.entries()) {
      const ms = Date.parse(row.date);
      const inSpan = ms >= from && ms < to;
      expect(row.spanIndex).toBe(inSpan ? 0 : null);
      expect(row.surfaces).toEqual((inSpan ? sunSafe : plain).rows[i]!.surfaces);
      expect(row.betaDeg).toBe(plain.rows[i]!.betaDeg);
    }
    expect(phased.rows.filter((r) => r.spanIndex === 0)).toHaveLength(3);
  });
});
