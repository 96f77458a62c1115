// Hot and cold cases over a mission's phases: the phase is chosen by the heat it puts into the
// spacecraft (absorbed load plus the dissipation it names; DOMAIN.md "Cases": hot = maximum
// dissipation with the hot environment, cold = the minimum), checked against closed forms for the
// absorbed loads and the orbit-average dissipation.
import { describe, expect, it } from 'vitest';
import { caseFactors } from './case-why';
import { getBody } from './bodies';
import { deriveDesignCases, type CaseResults, type CaseSurface } from './design-cases';
import { defaultMargins } from './design-environment';
import { derivePhasedCases, survivalDissipation, type PhaseToDerive } from './phase-cases';
import { orbitAverageDissipationW } from './thermal-network';

// DOMAIN.md optical properties, BOL [S: F Table 11.3, G App. A]; EOL white silicone 0.4-0.6 [M]
const whiteSilicone = { name: 'white silicone paint', absorptivityBol: 0.26, emissivityBol: 0.83, absorptivityEol: 0.5, emissivityEol: 0.83, source: 'F Table 11.3' };
const earth = getBody('earth');
const orbit = { semiMajorAxisKm: earth.radiusKm + 600, eccentricity: 0, inclinationDeg: 97.8, raanDeg: 135, argPeriapsisDeg: 0 };
const input = { bodyId: 'earth' as const, orbit, orbitEpoch: '2028-03-10T00:00:00Z', margins: defaultMargins(), steps: 360 };
const plate = (normal: 'zenith' | 'sun'): CaseSurface[] => [{ name: 'radiator', normal, areaM2: 1, material: whiteSilicone }];
// Kepler's third law, T = 2 pi sqrt(a^3 / mu) (Vallado ch. 1)
const periodS = 2 * Math.PI * Math.sqrt(orbit.semiMajorAxisKm ** 3 / earth.gmKm3S2);

// Imaging points the radiator to zenith (modest environment) and dissipates a lot: 400 W constant and
// a unit on for a quarter of each half-orbit cycle at 200 W, 50 W otherwise: 50 + 150 / 4 = 87.5 W mean.
const imagingDissipationW = 400 + 87.5;
const imaging: PhaseToDerive = {
  id: 'imaging', name: 'Imaging', startDate: '2028-03-10', endDate: '2028-03-31', modeName: 'radiator to zenith', surfaces: plate('zenith'),
  dissipation: [{ node: 'payload', dissipationW: 400 }, { node: 'camera', dissipationW: { onW: 200, offW: 50, periodS: periodS / 2, onS: periodS / 8 } }],
};
// Sun hold points it at the Sun (the hotter environment) and dissipates 50 W.
const sunHold: PhaseToDerive = {
  id: 'sun-hold', name: 'Sun hold', startDate: '2028-04-01', endDate: '2028-04-20', modeName: 'radiator to the Sun', surfaces: plate('sun'),
  dissipation: [{ node: 'payload', dissipationW: 50 }, { node: 'camera', dissipationW: 0 }],
};

// Closed forms for a 1 m^2 plate on a circular orbit (Gilmore Vol. I ch. 2 / from memory): facing the
// Sun its direct solar load is alpha S (1 - eclipse fraction), plus the albedo and planetary IR it sees
// of the Earth's limb (alpha and epsilon times the case's own fluxes); facing zenith alpha S cos(beta) / pi
// (the Sun is above its horizon half the orbit, never in the shadow; no albedo or IR, view factor 0).
const sunPointedW = (r: CaseResults) => {
  const s = r.surfaces[0]!;
  return s.absorptivity * r.solarFluxWm2 * (1 - r.eclipseFraction) + s.absorptivity * s.orbitAverage.albedoWm2 + s.emissivity * s.orbitAverage.irWm2;
};
const zenithW = (r: CaseResults) => (r.surfaces[0]!.absorptivity * r.solarFluxWm2 * Math.cos((r.betaDeg * Math.PI) / 180)) / Math.PI;

describe('phases compared by the heat into the spacecraft', () => {
  const d = derivePhasedCases(input, [imaging, sunHold]);
  // each phase's own cases, derived alone on its own dates (the figures the comparison holds)
  const alone = (p: PhaseToDerive) => deriveDesignCases({ ...input, startDate: p.startDate, endDate: p.endDate, surfaces: p.surfaces });
  const own = { imaging: alone(imaging), sunHold: alone(sunHold) };

  it('orbit-average dissipation: a constant as it is; an on/off schedule offW + (onW - offW) onS / period over whole cycles (duty cycle, DOMAIN.md "Thermal model")', () => {
    expect(orbitAverageDissipationW(12, periodS)).toBe(12);
    expect(orbitAverageDissipationW({ onW: 200, offW: 50, periodS: periodS / 2, onS: periodS / 8 }, periodS)).toBeCloseTo(87.5, 9);
    // the demo's camera: 22 W for 1500 s of 5800 s, 3 W otherwise, over one 5800 s cycle
    expect(orbitAverageDissipationW({ onW: 22, offW: 3, periodS: 5800, onS: 1500 }, 5800)).toBeCloseTo(3 + 19 * 1500 / 5800, 9);
  });

  it('each phase\'s absorbed load follows its closed form (a Sun-pointed and a zenith plate)', () => {
    expect(own.sunHold.hot.results.total.orbitAverageAbsorbedW / sunPointedW(own.sunHold.hot.results)).toBeCloseTo(1, 2);
    expect(own.sunHold.cold.results.total.orbitAverageAbsorbedW / sunPointedW(own.sunHold.cold.results)).toBeCloseTo(1, 2);
    expect(own.imaging.hot.results.total.orbitAverageAbsorbedW / zenithW(own.imaging.hot.results)).toBeCloseTo(1, 2);
    expect(own.imaging.cold.results.total.orbitAverageAbsorbedW / zenithW(own.imaging.cold.results)).toBeCloseTo(1, 2);
  });

  // each phase's absorbed load and heat into the spacecraft (absorbed + dissipation) from the closed forms
  const closedForm = (kind: 'hot' | 'cold') => {
    const imagingW = zenithW(own.imaging[kind].results);
    const sunHoldW = sunPointedW(own.sunHold[kind].results);
    return { imagingW, sunHoldW, imagingHeatW: imagingW + imagingDissipationW, sunHoldHeatW: sunHoldW + 50 };
  };

  it.each([
    { kind: 'hot' as const, driver: 'Imaging', other: 'Sun hold', most: 'most', otherAbsorbs: 'more', dissipates: 'less', where: '2028-03-10 to 2028-03-31, attitude mode radiator to zenith' },
    { kind: 'cold' as const, driver: 'Sun hold', other: 'Imaging', most: 'least', otherAbsorbs: 'less', dissipates: 'more', where: '2028-04-01 to 2028-04-20, attitude mode radiator to the Sun' },
  ])('the $kind case: $other absorbs $otherAbsorbs, $driver puts the $most heat in (closed-form absorbed + dissipation), so $driver drives it and "why" says so', (t) => {
    const w = closedForm(t.kind);
    const sign = t.kind === 'hot' ? 1 : -1;
    const [driverW, otherW, driverHeatW, otherHeatW] = t.driver === 'Imaging' ? [w.imagingW, w.sunHoldW, w.imagingHeatW, w.sunHoldHeatW] : [w.sunHoldW, w.imagingW, w.sunHoldHeatW, w.imagingHeatW];
    expect(sign * (otherW - driverW)).toBeGreaterThan(0);
    expect(sign * (driverHeatW - otherHeatW)).toBeGreaterThan(0);
    const c = d[t.kind];
    expect(c.decision.phase?.name).toBe(t.driver);
    expect(c.results.total.orbitAverageAbsorbedW).toBe((t.driver === 'Imaging' ? own.imaging : own.sunHold)[t.kind].results.total.orbitAverageAbsorbedW);
    const text = c.rationale[0]!;
    expect(text.startsWith(`phase ${t.driver} (${t.where}) puts the ${t.most} heat into the spacecraft of the mission's phases`)).toBe(true);
    expect(text).toContain(`${c.results.total.orbitAverageAbsorbedW.toFixed(1)} W absorbed + ${t.driver === 'Imaging' ? '487.5' : '50.0'} W dissipated`);
    expect(text).toMatch(new RegExp(`${t.other} absorbs ${t.otherAbsorbs} \\(\\d+\\.\\d W\\) but dissipates 437\\.5 W ${t.dissipates}$`));
    // the page's factor is the stored sentence, built from the same record
    expect(caseFactors({ kind: t.kind, bodyName: 'Earth', conditions: c.conditions, results: c.results, margins: input.margins, decision: c.decision })[0]!.text).toBe(text);
  });

  it('both cases keep every phase\'s own absorbed load and dissipation (the schedule at its orbit mean)', () => {
    for (const kind of ['hot', 'cold'] as const) {
      const phase = d[kind].decision.phase!;
      expect(phase.by).toBe('heat');
      const compared = Object.fromEntries(phase.compared.map((x) => [x.name, x]));
      expect(compared['Imaging']!.dissipationW).toBeCloseTo(imagingDissipationW, 3);
      expect(compared['Sun hold']!.dissipationW).toBe(50);
      expect(compared['Imaging']!.orbitAverageAbsorbedW).toBe(own.imaging[kind].results.total.orbitAverageAbsorbedW);
      expect(compared['Sun hold']!.orbitAverageAbsorbedW).toBe(own.sunHold[kind].results.total.orbitAverageAbsorbedW);
    }
  });

  it('the survival cold case dissipates the same in every phase, so the least absorbed load alone chooses its phase (Imaging)', () => {
    expect(d.survival.decision.phase?.name).toBe('Imaging');
    expect(d.survival.decision.phase?.by).toBe('environment');
    expect(d.survival.results.total.orbitAverageAbsorbedW).toBe(own.imaging.cold.results.total.orbitAverageAbsorbedW);
    expect(d.survival.decision.phase!.compared.every((x) => x.dissipationW === undefined)).toBe(true);
  });

  it('without dissipation the choice is the environment\'s, worded as before', () => {
    const quiet = derivePhasedCases(input, [{ ...imaging, dissipation: [] }, { ...sunHold, dissipation: [] }]);
    expect([quiet.hot.decision.phase?.name, quiet.cold.decision.phase?.name]).toEqual(['Sun hold', 'Imaging']);
    expect(quiet.hot.rationale[0]).toMatch(/^phase Sun hold .* gives the largest total orbit-average absorbed load of the mission's phases .*; no phase names a dissipation$/);
  });

  it('a node one phase names and another does not counts 0 W there, and "why" says so', () => {
    const partial = derivePhasedCases(input, [imaging, { ...sunHold, dissipation: [{ node: 'payload', dissipationW: 50 }] }]);
    const sun = partial.hot.decision.phase!.compared.find((x) => x.name === 'Sun hold')!;
    expect(sun.notNamed).toEqual(['camera']);
    expect(partial.hot.rationale[0]).toMatch(/counted 0 W where a phase does not name a node \(Sun hold: camera\)/);
  });

  it('a case derived before dissipation counted (no "by") keeps its old words', () => {
    const phase = { ...d.hot.decision.phase!, by: undefined, compared: d.hot.decision.phase!.compared.map(({ name, orbitAverageAbsorbedW }) => ({ name, orbitAverageAbsorbedW })) };
    const [factor] = caseFactors({ kind: 'hot', bodyName: 'Earth', conditions: d.hot.conditions, results: d.hot.results, margins: input.margins, decision: { ...d.hot.decision, phase } });
    expect(factor!.text).toMatch(/^phase Imaging .* gives the largest total orbit-average absorbed load of the mission's phases \(\d+\.\d W\); Sun hold \d+\.\d W$/);
  });
});

describe('survivalDissipation', () => {
  it("keeps each node's least over the phases and the phase that gives it; a schedule counts its lower level (DOMAIN.md: survival cold, minimum dissipation)", () => {
    const survival = survivalDissipation([
      { name: 'Cruise', dissipation: [{ node: 'bus', dissipationW: 10 }, { node: 'camera', dissipationW: { onW: 5, offW: 2, periodS: 600, onS: 60 } }] },
      { name: 'Safe', dissipation: [{ node: 'bus', dissipationW: 4 }, { node: 'camera', dissipationW: { onW: 3, periodS: 600, onS: 600 } }] },
    ]);
    expect(survival.nodes).toEqual([
      { node: 'bus', dissipationW: 4, phase: 'Safe' },
      // Cruise's camera is off at 2 W part of each cycle; Safe's is on all the cycle at 3 W
      { node: 'camera', dissipationW: 2, phase: 'Cruise' },
    ]);
  });
});
