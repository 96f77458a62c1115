import { sweepMission, type MissionSweepRequest } from './shared/physics/mission-sweep';
import type { Surface, SurfaceNormal } from './shared/physics/heat-loads';
const named = ['nadir', 'zenith', 'ram', 'wake', 'orbit-normal', 'anti-orbit-normal'] as const;
const panel = (name: string, normal: SurfaceNormal, i: number): Surface => ({ name, normal, areaM2: 0.1 + 0.02 * i, absorptivity: 0.2 + 0.03 * i, emissivity: 0.9 - 0.02 * i });
const six = named.map((n, i) => panel(n, n, i));
const base: MissionSweepRequest = { bodyId: 'earth', orbit: { periapsisAltitudeKm: 550, apoapsisAltitudeKm: 550, inclinationDeg: 51.6, raanDeg: 40 }, epochStart: '2027-01-01T12:00:00Z', days: 3652, stepDays: 1, steps: 360, surfaces: six, albedo: 0.3, olrWm2: 237 };
const forms: Record<string, Surface[]> = {
  fixed: six,
  yaw: named.map((n, i) => panel(n, { yawSteered: { normal: n } }, i)),
  inertial: named.map((n, i) => panel(n, { inertial: { raDeg: 60 * i, decDeg: -75 + 30 * i } }, i)),
  spin: named.map((n, i) => panel(n, { spin: { axis: 'sun', angleDeg: 30 * i } }, i)),
};
const time = (s: Surface[]) => { const req = { ...base, surfaces: s }; sweepMission(req); const t: number[] = []; for (let i = 0; i < 3; i++) { const t0 = process.cpuUsage(); sweepMission(req); const u = process.cpuUsage(t0); t.push((u.user + u.system) / 1000); } t.sort((a, b) => a - b); return t[1]; };
const best: Record<string, number> = {};
for (let round = 0; round < 3; round++) for (const [k, s] of Object.entries(forms)) best[k] = Math.min(best[k] ?? Infinity, time(s));
console.log(Object.entries(best).map(([k, v]) => `${k} ${v.toFixed(0)} (${(v / best['fixed']).toFixed(2)}x)`).join('\n'));
