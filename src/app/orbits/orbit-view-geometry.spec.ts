import type { EnvironmentResponse } from '../../../shared/api/environment';
import { inShadow, orbitPoint, shadedArcs, shadowOutline, sunAzimuthDeg } from './orbit-view-geometry';

type Sample = EnvironmentResponse['profile'][number];
const sample = (trueAnomalyDeg: number, sunlit: number, parentSunlit?: number): Sample => ({
  tS: trueAnomalyDeg * 10,
  trueAnomalyDeg,
  sunlit,
  ...(parentSunlit === undefined ? {} : { parentSunlit }),
  surfaces: [],
});

// Earth radius 6378 km; a 500 km circular orbit.
const R = 6378;
const A = R + 500;

describe('orbit view geometry', () => {
  it('puts periapsis at a(1 − e) and apoapsis at a(1 + e) from the focus (conic equation, Vallado ch. 2)', () => {
    const p = orbitPoint(10000, 0.3, 0);
    expect(p.x).toBeCloseTo(7000, 6);
    expect(p.y).toBeCloseTo(0, 6);
    const q = orbitPoint(10000, 0.3, 180);
    expect(q.x).toBeCloseTo(-13000, 6);
    // semi-latus rectum a(1 − e²) at ν = 90°
    expect(orbitPoint(10000, 0.3, 90).y).toBeCloseTo(9100, 6);
  });

  it('at beta 0 a sample with sunlit 0 lies on the anti-Sun side, behind the disk (closed form, cylindrical shadow)', () => {
    // Circular orbit, eclipse half-angle asin(R/r) ≈ 68° about ν = 180° (Sun at ν = 0).
    const half = (Math.asin(R / A) * 180) / Math.PI;
    const profile = Array.from({ length: 72 }, (_, k) => k * 5).map((nu) => sample(nu, Math.abs(nu - 180) < half ? 0 : 1));
    // the Sun along +x of the perifocal frame, in the orbit plane (beta 0)
    const sun = { deg: sunAzimuthDeg({ x: 1, y: 0, z: 0 }) };
    expect(sun.deg).toBeCloseTo(0, 6);
    for (const p of profile.filter((s) => s.sunlit === 0)) {
      const point = orbitPoint(A, 0, p.trueAnomalyDeg);
      expect(point.x).toBeLessThan(0); // anti-Sun side
      expect(Math.abs(point.y)).toBeLessThan(R); // behind the disk
      expect(inShadow(point, R, 0, sun.deg)).toBe(true);
    }
    expect(inShadow(orbitPoint(A, 0, 0), R, 0, sun.deg)).toBe(false);
  });

  it("reads the Sun's angle along the orbit from its direction in the perifocal frame, whatever the beta (atan2 of the in-plane part)", () => {
    const b = (40 * Math.PI) / 180;
    const at = (nuDeg: number) => {
      const nu = (nuDeg * Math.PI) / 180;
      return { x: Math.cos(b) * Math.cos(nu), y: Math.cos(b) * Math.sin(nu), z: Math.sin(b) };
    };
    expect(sunAzimuthDeg(at(240))).toBeCloseTo(240, 9);
    expect(sunAzimuthDeg(at(-30))).toBeCloseTo(330, 9);
    expect(sunAzimuthDeg(at(90))).toBeCloseTo(90, 9);
  });

  it('the shadow in the orbit plane reaches R / sin β behind the body, and is a strip of width 2R at β = 0 (closed form)', () => {
    const outline = shadowOutline(R, 30, 0, 1e6);
    expect(Math.min(...outline.map((p) => p.x))).toBeCloseTo(-2 * R, 6);
    expect(Math.max(...outline.map((p) => Math.abs(p.y)))).toBeCloseTo(R, 6);
    const strip = shadowOutline(R, 0, 90, 50000);
    expect(Math.min(...strip.map((p) => p.y))).toBeCloseTo(-50000, 6);
    // above R / sin β the orbit never enters the shadow: at beta 70° a 500 km orbit is always sunlit
    expect(inShadow(orbitPoint(A, 0, 180), R, 70, 0)).toBe(false);
    expect(inShadow(orbitPoint(A, 0, 180), R, 20, 0)).toBe(true);
  });

  it('draws the eclipse and a planet\'s shadow as separate arcs', () => {
    const profile = [0, 90, 180, 270].map((nu) => sample(nu, nu === 180 ? 0 : nu === 270 ? 0.4 : 1, nu === 270 ? 0.4 : undefined));
    const arcs = shadedArcs(profile, A, 0);
    expect(arcs.map((a) => a.kind)).toEqual(['eclipse', 'parent-shadow']);
    // the eclipse arc runs from the midpoint 135° to 225°
    const first = arcs[0].points;
    expect(Math.atan2(first[0].y, first[0].x) * (180 / Math.PI)).toBeCloseTo(135, 6);
  });
});
