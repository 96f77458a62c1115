// The benchmark's invented network (issue 7): 100 nodes, 300 couplings (250 conductive, 50
// radiative), 10 thermostat heaters, 720 samples per orbit. 20 outer panels see a sunlit/eclipse
// load and radiate to space; 80 inner units dissipate and reach space only through the panels.
// A fixed-seed generator makes every run solve the same model.
import type { ConductiveCoupling, RadiativeCoupling, ThermalModelInput, ThermalNodeInput } from '../shared/physics/thermal-model';

function random(seed: number): () => number {
  // mulberry32: a small, well-mixed 32-bit generator (public domain).
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function benchThermalModel(): ThermalModelInput {
  const rand = random(7);
  const between = (lo: number, hi: number) => lo + (hi - lo) * rand();
  const steps = 720;
  const periodS = 5739;
  const eclipseFraction = 0.37;
  const nodes: ThermalNodeInput[] = [];
  for (let i = 0; i < 20; i++) {
    const area = between(0.1, 0.4);
    const facing = between(0, 2 * Math.PI);
    // Solar on a panel turning with the orbit, plus a steady albedo-and-IR share; none in eclipse.
    const absorbedW = Array.from({ length: steps }, (_, s) => {
      const phase = (2 * Math.PI * s) / steps;
      const sunlit = s / steps < 1 - eclipseFraction ? 1 : 0;
      return Math.round(area * (0.5 * 1361 * Math.max(0, Math.cos(phase + facing)) * sunlit + 60) * 1000) / 1000;
    });
    nodes.push({ name: `panel ${i + 1}`, capacitanceJK: between(2000, 6000), initialC: 0, absorbedW, radiatorAreaM2: area, emissivity: between(0.8, 0.9) });
  }
  for (let i = 0; i < 80; i++) {
    nodes.push({ name: `unit ${i + 1}`, capacitanceJK: between(500, 20000), initialC: 10, dissipationW: Math.round(between(2, 14) * 100) / 100 });
  }
  const couplings: ConductiveCoupling[] = [];
  const seen = new Set<string>();
  const join = (a: number, b: number) => {
    const key = a < b ? `${a},${b}` : `${b},${a}`;
    if (a === b || seen.has(key)) return false;
    seen.add(key);
    return true;
  };
  // A tree first, so every unit has a path to a panel; then random links.
  for (let i = 1; i < 100; i++) {
    const j = Math.floor(rand() * i);
    join(i, j);
    couplings.push({ from: nodes[i].name, to: nodes[j].name, conductanceWK: Math.round(between(0.2, 3) * 1000) / 1000 });
  }
  while (couplings.length < 250) {
    const a = Math.floor(rand() * 100);
    const b = Math.floor(rand() * 100);
    if (join(a, b)) couplings.push({ from: nodes[a].name, to: nodes[b].name, conductanceWK: Math.round(between(0.1, 2) * 1000) / 1000 });
  }
  const radiativeCouplings: RadiativeCoupling[] = [];
  while (radiativeCouplings.length < 50) {
    const a = 20 + Math.floor(rand() * 80);
    const b = 20 + Math.floor(rand() * 80);
    if (join(a, b)) {
      radiativeCouplings.push({ from: nodes[a].name, to: nodes[b].name, areaM2: Math.round(between(0.05, 0.3) * 1000) / 1000, effectiveEmissivity: 0.7, viewFactor: Math.round(between(0.2, 0.6) * 100) / 100 });
    }
  }
  const heaters = Array.from({ length: 10 }, (_, k) => {
    // Set points in the units' range, so the heaters cycle rather than sit on or off.
    const onC = Math.round(between(25, 35) * 10) / 10;
    return { node: nodes[20 + k * 8].name, powerW: Math.round(between(4, 12) * 10) / 10, onC, offC: onC + 3 };
  });
  return { periodS, steps, nodes, couplings, radiativeCouplings, heaters };
}
