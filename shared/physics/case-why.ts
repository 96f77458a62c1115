// Why a case is what it is, in words built from the case's own record: its conditions, its results
// and the facts of its derivation. The "why" panel, the stored rationale lines, the exports and the
// mails all come from caseFactors, so no sentence can quote a number the record does not hold, and
// an edit (margins, conditions) that recomputes the results recomputes the words with them.
// A new deciding factor is one more builder in factorBuilders.
import type { CaseConditions, CaseResults } from './design-cases';
import { opticalProperties, type CaseMaterial, type Margins, type PropertySet } from './design-environment';
import type { PhaseDecision, PhaseFigures, PhaseRanking } from './phase-cases';

/** What the derivation of a hot or cold case decided, kept with the case so its words can be rebuilt. */
export interface CaseDecision {
  /** Where the Sun distance comes from: the mission's own closest/farthest day, or the body's perihelion/aphelion. */
  sun: { basis: 'mission' | 'perihelion' | 'aphelion'; date: string; distanceAu: number };
  /** The day chosen for beta: the largest (hot) or smallest (cold) orbit-average absorbed load. */
  day: { date: string; betaDeg: number };
  /** The day of the shortest (hot) or longest (cold) eclipse when it is another day, evaluated as the case is. */
  eclipseExtreme: { date: string; betaDeg: number; eclipseDurationS: number; orbitAverageAbsorbedW: number } | null;
  /** The albedo/OLR pair; on an airless body, the surface temperature field its IR comes from. */
  pair: {
    albedo: number; olrWm2: number; source: string;
    surfaceField?: { emissivity: number; nightFloorK: number; subsolarK: number; albedoRange: boolean };
  };
  /** About a moon (cold case): the mission's longest shadow the planet takes part in, which set the case's orbit. */
  shadow?: { durationS: number; date: string; start: string; castBy: string[] };
  properties: PropertySet;
  /** A mission flown in phases: the phase whose case this is, and every phase's figure (phase-cases.ts). */
  phase?: PhaseDecision | undefined;
  /** A survival cold case: the dissipation each node keeps (the least any phase gives it), heaters only besides. */
  survival?: SurvivalDecision | undefined;
}

export interface SurvivalDecision {
  nodes: { node: string; dissipationW: number; phase: string }[];
}

/** The part of a stored case its words are built from. */
export interface CaseWhyRecord {
  kind: 'hot' | 'cold' | 'custom';
  bodyName: string;
  conditions: CaseConditions;
  results: CaseResults;
  margins: Margins;
  /** Hot and cold cases: what the derivation decided. */
  decision?: CaseDecision | undefined;
  /** Custom cases and cases from an ephemeris: the lines that say how they were set up (no margins in them). */
  facts?: string[] | undefined;
  /** Condition keys changed by hand since the case was derived or created. */
  handEdited?: string[] | undefined;
}

export type CaseFactorKey = 'phase' | 'survival' | 'sun' | 'shadow' | 'beta' | 'environment' | 'properties' | 'margins' | 'setup' | 'edited';

/** One deciding factor: a short headline figure, the full sentence and where its values come from. */
export interface CaseFactor {
  key: CaseFactorKey;
  title: string;
  figure: string;
  /** The sentence as stored and exported, sources in parentheses. */
  text: string;
  /** The sentence without its sources, for the page (the sources are one click away). */
  short?: string;
  /** What the figure is about when a factor has one per item (the material of a property factor). */
  about?: string;
  sources: string[];
}

/** What a phase's figures rank by (phase-cases.ts): the heat into the spacecraft, or its absorbed load alone. */
export const rankedW = (x: PhaseFigures, by: PhaseRanking | undefined): number => x.orbitAverageAbsorbedW + (by === 'heat' ? (x.dissipationW ?? 0) : 0);

/** Fixed digits for words; never "-0.0". */
export const fixed = (x: number, digits = 1): string => {
  const text = x.toFixed(digits);
  return Number(text) === 0 ? (0).toFixed(digits) : text;
};
const f = fixed;
const minutes = (s: number) => `${f(s / 60)} min`;
const edited = (r: CaseWhyRecord, key: keyof CaseConditions) => (r.handEdited ?? []).includes(key);

function phaseFactor(r: CaseWhyRecord): CaseFactor[] {
  const p = r.decision?.phase;
  if (!p) return [];
  const hot = r.kind === 'hot';
  const where = `${p.name} (${p.startDate} to ${p.endDate}, attitude mode ${p.modeName})`;
  const mine = p.compared.find((x) => x.name === p.name);
  const others = p.compared.filter((x) => x !== mine);
  const title = 'Phase';
  const figure = `${p.name} (${p.modeName})`;
  const absorbedOnly = p.by !== 'heat' || p.compared.every((x) => (x.dissipationW ?? 0) === 0);
  if (absorbedOnly || !mine) {
    const own = `${f(r.results.total.orbitAverageAbsorbedW)} W`;
    // the survival cold case: its dissipation is the same in every phase; hot and cold cases where no phase names any
    const why = r.decision?.survival ? '; survival dissipation is the same in every phase, so the absorbed load alone chose it'
      : p.by === 'heat' ? '; no phase names a dissipation' : '';
    const text = others.length === 0
      ? `phase ${where}: the only phase derived, ${own} orbit-average absorbed`
      : `phase ${where} gives the ${hot ? 'largest' : 'smallest'} total orbit-average absorbed load of the mission's phases (${own}); ` +
        others.map((x) => `${x.name} ${f(x.orbitAverageAbsorbedW)} W`).join(', ') + why;
    return [{ key: 'phase', title, figure, text, sources: [] }];
  }
  // the total of the parts as written, so the words add up
  const total = (x: PhaseFigures) => `${f(Number(f(x.orbitAverageAbsorbedW)) + Number(f(x.dissipationW ?? 0)))} W`;
  const sum = (x: PhaseFigures) => `${f(x.orbitAverageAbsorbedW)} W absorbed + ${f(x.dissipationW ?? 0)} W dissipated = ${total(x)}`;
  const heat = total(mine);
  if (others.length === 0) {
    const text = `phase ${where}: the only phase derived, ${sum(mine)} orbit-average into the spacecraft`;
    return [{ key: 'phase', title, figure: `${figure}, ${heat} absorbed + dissipated`, text, sources: [] }];
  }
  // the phase the environment alone would have chosen, when it is another one
  const sign = hot ? 1 : -1;
  const byEnvironment = p.compared.reduce((best, x) => (sign * x.orbitAverageAbsorbedW > sign * best.orbitAverageAbsorbedW ? x : best));
  const despite = byEnvironment === mine ? ''
    : `; ${byEnvironment.name} ${hot ? 'absorbs more' : 'absorbs less'} (${f(byEnvironment.orbitAverageAbsorbedW)} W) but dissipates ` +
      `${f(Math.abs((mine.dissipationW ?? 0) - (byEnvironment.dissipationW ?? 0)))} W ${hot ? 'less' : 'more'}`;
  const unnamed = p.compared.filter((x) => x.notNamed && x.notNamed.length > 0);
  const counted = unnamed.length === 0 ? ''
    : `; counted 0 W where a phase does not name a node (${unnamed.map((x) => `${x.name}: ${x.notNamed!.join(', ')}`).join('; ')}), a thermal run gives it its model's own value`;
  const text = `phase ${where} puts the ${hot ? 'most' : 'least'} heat into the spacecraft of the mission's phases, orbit-average absorbed load and the dissipation the phase names: ` +
    `${sum(mine)}; ` + others.map((x) => `${x.name} ${sum(x)}`).join(', ') + despite + counted;
  return [{ key: 'phase', title, figure: `${figure}, ${heat} absorbed + dissipated`, text, sources: ['dissipation: orbit average of each node\'s constant or on/off schedule'] }];
}

function survivalFactor(r: CaseWhyRecord): CaseFactor[] {
  const s = r.decision?.survival;
  if (!s) return [];
  const total = s.nodes.reduce((sum, n) => sum + n.dissipationW, 0);
  const listed = s.nodes.map((n) => `${n.node} ${f(n.dissipationW, 2)} W (${n.phase})`).join(', ');
  const text = `survival cold: minimum dissipation with heaters only; each node keeps the least any phase gives it${listed ? `: ${listed}` : ''}; a node no phase names dissipates nothing`;
  return [{ key: 'survival', title: 'Survival', figure: `${f(total, 1)} W dissipated, heaters only`, text, sources: [] }];
}

function sunFactor(r: CaseWhyRecord): CaseFactor[] {
  const c = r.conditions;
  const flux = `solar flux ${f(r.results.solarFluxWm2, 0)} W/m² at ${f(c.solarDistanceAu, 4)} AU`;
  const d = r.decision;
  if (!d) return [];
  if (edited(r, 'solarDistanceAu')) {
    return [{ key: 'sun', title: 'Sun distance', figure: `${f(c.solarDistanceAu, 4)} AU`, text: `${flux}: set by hand (the derivation gave ${f(d.sun.distanceAu, 4)} AU on ${d.sun.date})`, sources: ['TSI 1361 W/m² at 1 AU, inverse square'] }];
  }
  const where =
    d.sun.basis === 'mission'
      ? `the ${r.kind === 'hot' ? 'closest' : 'farthest'} the mission comes to the Sun, reached ${d.sun.date}`
      : `${d.sun.basis} of ${r.bodyName}'s orbit (a(1 ${d.sun.basis === 'perihelion' ? '-' : '+'} e)), the mission comes nearest to it on ${d.sun.date}`;
  const combined = d.sun.date === c.date ? '' : `; combined with the beta of ${c.date}: worst distance and worst beta on different days, conservative`;
  return [{ key: 'sun', title: 'Sun distance', figure: `${f(c.solarDistanceAu, 4)} AU (${d.sun.date})`, text: `${flux} (${where}${combined})`, sources: ['TSI 1361 W/m² at 1 AU, inverse square', 'VSOP87 for the Sun distance by date'] }];
}

function betaFactor(r: CaseWhyRecord): CaseFactor[] {
  const d = r.decision;
  // About a moon, the longest shadow chose the orbit (shadowFactor says so).
  if (!d || d.shadow) return [];
  const res = r.results;
  const hot = r.kind === 'hot';
  const eclipse = `eclipse ${minutes(res.eclipseDurationS)}`;
  const figure = `beta ${f(res.betaDeg)} deg, ${eclipse}`;
  if (['betaDeg', 'date', 'surfaces', 'orbit'].some((k) => edited(r, k as keyof CaseConditions))) {
    return [{ key: 'beta', title: 'Beta and eclipse', figure, text: `beta ${f(res.betaDeg)} deg on ${r.conditions.date} with an ${eclipse}, ${f(res.total.orbitAverageAbsorbedW)} W orbit-average absorbed: conditions changed by hand since the derivation chose beta ${f(d.day.betaDeg)} deg on ${d.day.date}`, sources: [] }];
  }
  const load = `${hot ? 'largest' : 'smallest'} total orbit-average absorbed load of the mission's candidate orbits (${f(res.total.orbitAverageAbsorbedW)} W)`;
  const which = hot ? 'shortest' : 'longest';
  const x = d.eclipseExtreme;
  const text = x
    ? `beta ${f(res.betaDeg)} deg on ${r.conditions.date} gives the ${load} with an ${eclipse}; the ${which} eclipse (${minutes(x.eclipseDurationS)}, beta ${f(x.betaDeg)} deg on ${x.date}) gives ${f(x.orbitAverageAbsorbedW)} W`
    : `beta ${f(res.betaDeg)} deg on ${r.conditions.date} gives the ${which} eclipse (${minutes(res.eclipseDurationS)}) and the ${load}`;
  return [{ key: 'beta', title: 'Beta and eclipse', figure, text, sources: ['conical shadow, Sun as a uniform disk; node drift under J2'] }];
}

function shadowFactor(r: CaseWhyRecord): CaseFactor[] {
  const x = r.decision?.shadow;
  if (!x) return [];
  const hhmm = (iso: string) => iso.slice(11, 16);
  const start = r.conditions.orbitStart;
  const how = x.castBy.length > 1 ? `${x.castBy[0]}'s own shadow joined to its planet's` : `${x.castBy[0]}'s shadow over the moon`;
  const text = `the mission's longest shadow, ${f(x.durationS / 3600, 2)} h from ${x.date} ${hhmm(x.start)} UTC, cast by ${x.castBy.join(' and ')} (${how})` +
    `${start ? `: the orbit from ${hhmm(start)} UTC is the case` : ''}, beta ${f(r.results.betaDeg)} deg on ${r.conditions.date}, eclipse ${minutes(r.results.eclipseDurationS)} of the orbit, ` +
    `orbit-average absorbed load (${f(r.results.total.orbitAverageAbsorbedW)} W)`;
  return [{ key: 'shadow', title: 'Longest shadow', figure: `${f(x.durationS / 3600, 2)} h on ${x.date}`, text, sources: ['conical umbra and penumbra with the Sun as a uniform disk; moons placed by their published theories'] }];
}

function environmentFactor(r: CaseWhyRecord): CaseFactor[] {
  const d = r.decision;
  if (!d) return [];
  const c = r.conditions;
  const field = d.pair.surfaceField;
  if (field && !(edited(r, 'albedo') || edited(r, 'olrWm2'))) {
    const range = field.albedoRange ? `, the end of the range that makes the case ${r.kind === 'hot' ? 'hotter' : 'colder'}` : '';
    const short = `planetary IR from the surface temperature field: Bond albedo ${f(c.albedo, 3)}${range}, emissivity ${f(field.emissivity, 2)}, ` +
      `subsolar ${f(field.subsolarK, 0)} K in radiative equilibrium, night floor ${f(field.nightFloorK, 0)} K`;
    return [{ key: 'environment', title: 'Albedo and ground temperature', figure: `albedo ${f(c.albedo, 2)}, ${f(field.subsolarK, 0)} K / ${f(field.nightFloorK, 0)} K`, text: `${short} (${d.pair.source})`, short, sources: [d.pair.source] }];
  }
  const figure = `albedo ${f(c.albedo, 2)}, OLR ${f(c.olrWm2, 0)} W/m²`;
  const byHand = edited(r, 'albedo') || edited(r, 'olrWm2');
  const text = byHand
    ? `${figure}: set by hand (the ${r.kind} pair was ${f(d.pair.albedo, 2)} with ${f(d.pair.olrWm2, 0)} W/m²)`
    : `albedo ${f(c.albedo, 2)} with OLR ${f(c.olrWm2, 0)} W/m²: the ${r.kind} pair`;
  return [{ key: 'environment', title: 'Albedo and OLR', figure, text: byHand ? text : `${text} (${d.pair.source})`, short: text, sources: byHand ? [] : [d.pair.source] }];
}

function propertyFactors(r: CaseWhyRecord): CaseFactor[] {
  if (!r.decision) return [];
  const set = r.conditions.properties;
  const seen = new Map<string, CaseMaterial>();
  for (const s of r.conditions.surfaces) seen.set(s.material.name, s.material);
  const label = set.toUpperCase();
  const note = edited(r, 'properties') ? ' (property set chosen by hand)' : '';
  return [...seen.values()].map((m) => {
    const p = opticalProperties(m, set);
    return {
      key: 'properties', title: `${label} properties`, about: m.name, figure: `α ${f(p.absorptivity, 2)}, ε ${f(p.emissivity, 2)}`,
      text: `${label} absorptivity ${f(p.absorptivity, 2)} and emissivity ${f(p.emissivity, 2)} for ${m.name}${note} (${m.source})`,
      short: `${label} absorptivity ${f(p.absorptivity, 2)} and emissivity ${f(p.emissivity, 2)} for ${m.name}${note}`, sources: [m.source],
    };
  });
}

function setupFactors(r: CaseWhyRecord): CaseFactor[] {
  return (r.facts ?? []).map((text) => ({ key: 'setup', title: 'Set up', figure: '', text, sources: [] }));
}

function marginFactor(r: CaseWhyRecord): CaseFactor[] {
  const m = r.margins;
  const sign = r.conditions.marginDirection === 'increase' ? '+' : '-';
  return [{
    key: 'margins', title: 'Margins',
    figure: `${sign}${m.heatLoadPercent} %, ${m.temperatureMarginC} K`,
    text: `heat loads ${sign}${m.heatLoadPercent} % (${m.sources.heatLoadPercent}): ${f(r.results.total.orbitAverageWithMarginW)} W orbit-average with margin; temperature margin ${m.temperatureMarginC} K (${m.sources.temperatureMarginC})`,
    short: `heat loads ${sign}${m.heatLoadPercent} %: ${f(r.results.total.orbitAverageWithMarginW)} W orbit-average with margin; temperature margin ${m.temperatureMarginC} K`,
    sources: [m.sources.heatLoadPercent, m.sources.temperatureMarginC],
  }];
}

const conditionWords: Partial<Record<keyof CaseConditions, string>> = {
  date: 'date', betaDeg: 'beta', solarDistanceAu: 'Sun distance', albedo: 'albedo', olrWm2: 'OLR', properties: 'property set',
  steps: 'time steps', surfaces: 'surfaces', orbit: 'orbit', marginDirection: 'margin direction',
};

function editedFactor(r: CaseWhyRecord): CaseFactor[] {
  const keys = r.handEdited ?? [];
  if (keys.length === 0) return [];
  const names = keys.map((k) => conditionWords[k as keyof CaseConditions] ?? k);
  return [{ key: 'edited', title: 'Changed by hand', figure: names.join(', '), text: `changed by hand after the case was made: ${names.join(', ')}`, sources: [] }];
}

/** The builders, in the order the factors are shown; one more deciding factor is one more entry. */
export const factorBuilders: ((r: CaseWhyRecord) => CaseFactor[])[] = [
  phaseFactor, survivalFactor, sunFactor, shadowFactor, betaFactor, environmentFactor, propertyFactors, setupFactors, marginFactor, editedFactor,
];

export const caseFactors = (r: CaseWhyRecord): CaseFactor[] => factorBuilders.flatMap((build) => build(r));

/** The stored rationale: one line per factor. */
export const caseRationale = (r: CaseWhyRecord): string[] => caseFactors(r).map((x) => x.text);
