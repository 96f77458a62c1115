// How the comparison view writes a difference: signed, in the quantity's unit and as a percentage
// of the first case, and whether it counts as a change at all (floating noise does not).

import { sourceWords } from '../shell/user-words';

export interface Compared {
  readonly a: number;
  readonly b: number;
  /** b − a, as the server reports it. */
  readonly difference: number;
}

export interface DifferenceText {
  readonly absolute: string;
  readonly percent: string;
  readonly changed: boolean;
}

const MINUS = '\u2212';

// The API puts the unit at the end of a field's name (API.md): periapsisAltitudeKm, olrWm2, areaM2.
// Longer suffixes come first so that Km3S2 is not read as S.
const UNIT_SUFFIXES: readonly (readonly [RegExp, string])[] = [
  [/Km3S2$/, 'km³/s²'],
  [/Wm2$/, 'W/m²'],
  [/Km$/, 'km'],
  [/Deg$/, 'deg'],
  [/M2$/, 'm²'],
  [/Au$/, 'AU'],
  [/Percent$/, '%'],
  [/W$/, 'W'],
  [/S$/, 's'],
  // A temperature margin is a difference of temperatures: K, as the case's words write it.
  [/MarginC$/, 'K'],
  [/C$/, '°C'],
];

/** Decimals worth showing per unit: an engineer reads 0.1 W and 0.01 deg, not 14 digits. */
const DECIMALS: Readonly<Record<string, number>> = {
  km: 1, deg: 2, 'W/m²': 1, W: 2, 'm²': 3, AU: 4, s: 0, '°C': 1, K: 1, '%': 1, 'km³/s²': 1,
};

/** The unit a field's name carries, '' for a pure number (albedo, eccentricity). */
export function unitOfPath(path: string): string {
  const field = path.split(/[.[\]]/).filter((part) => part !== '').at(-1) ?? '';
  return UNIT_SUFFIXES.find(([suffix]) => suffix.test(field))?.[1] ?? '';
}

export function decimalsFor(unit: string): number {
  return DECIMALS[unit] ?? 4;
}

function withUnit(text: string, unit: string): string {
  return unit === '' ? text : `${text} ${unit}`;
}

/** A number with a fixed count of decimals and a true minus sign. */
export function formatNumber(value: number, decimals: number): string {
  const text = Math.abs(value).toFixed(decimals);
  const isZero = Number(text) === 0;
  return value < 0 && !isZero ? `${MINUS}${text}` : text;
}

function formatSigned(value: number, decimals: number): string {
  let text = Math.abs(value).toFixed(decimals);
  // A real change smaller than the usual rounding still shows, with two significant figures.
  if (Number(text) === 0 && value !== 0) text = Math.abs(value).toPrecision(2);
  if (value === 0) return text;
  return `${value > 0 ? '+' : MINUS}${text}`;
}

export function formatQuantity(value: number, unit: string): string {
  return withUnit(formatNumber(value, decimalsFor(unit)), unit);
}

/**
 * A difference in its unit and in percent of case A; percent is "n/a" when A is zero. A quantity
 * that is itself a percentage differs in percentage points ("+5.0 pp"), never in "%".
 */
export function formatDifference(compared: Compared, unit: string, decimals = decimalsFor(unit)): DifferenceText {
  const { a, b, difference } = compared;
  const changed = Math.abs(difference) > 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));
  const d = changed ? difference : 0;
  if (unit === '%') return { absolute: `${formatSigned(d, decimals)} percentage points`, percent: '', changed };
  const percent = a === 0 ? (changed ? 'n/a (A is 0)' : '0.0 %') : `${formatSigned((d / Math.abs(a)) * 100, 1)} %`;
  return { absolute: withUnit(formatSigned(d, decimals), unit), percent, changed };
}

/** An input value of any kind as the comparison table shows it. */
export function formatInputValue(path: string, value: unknown): string {
  if (typeof value === 'number') return formatQuantity(value, unitOfPath(path));
  if (typeof value === 'string') return value === '' ? '—' : sourceWords(value);
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (value === null || value === undefined) return '—';
  return JSON.stringify(value);
}

/** The difference of two input values, when both are numbers; text inputs only say they differ. */
export function inputDifference(path: string, a: unknown, b: unknown): DifferenceText | null {
  if (typeof a !== 'number' || typeof b !== 'number') return null;
  return formatDifference({ a, b, difference: b - a }, unitOfPath(path));
}

// Input paths in words (the comparison never shows a field path). Exact paths first, then the
// last field's name for paths under a list (a surface's area, a material's absorptivity).
const PATH_LABELS: Readonly<Record<string, string>> = {
  'margins.heatLoadPercent': 'Heat-load margin',
  'margins.temperatureMarginC': 'Temperature margin',
  'margins.sources.heatLoadPercent': 'Heat-load margin source',
  'margins.sources.temperatureMarginC': 'Temperature margin source',
  'conditions.date': 'Date of the beta angle',
  'conditions.betaDeg': 'Beta angle',
  'conditions.solarDistanceAu': 'Distance from the Sun',
  'conditions.albedo': 'Albedo',
  'conditions.olrWm2': 'OLR',
  'conditions.properties': 'Property set',
  'conditions.steps': 'Time steps per orbit',
  'conditions.marginDirection': 'Margin direction',
  'conditions.orbitEpoch': 'Orbit epoch',
  revisionReason: 'Reason for the revision',
  attitude: 'Attitude',
  environmentSource: 'Albedo and OLR source',
  provisional: 'Provisional values',
  'orbit.name': 'Orbit',
  'orbit.epoch': 'Orbit epoch',
  'orbit.periapsisAltitudeKm': 'Periapsis altitude',
  'orbit.apoapsisAltitudeKm': 'Apoapsis altitude',
  'orbit.semiMajorAxisKm': 'Semi-major axis',
  'orbit.eccentricity': 'Eccentricity',
  'orbit.periodS': 'Orbital period',
  'orbit.inclinationDeg': 'Inclination',
  'orbit.raanDeg': 'RAAN',
  'orbit.argPeriapsisDeg': 'Argument of periapsis',
  'mission.name': 'Mission',
  'mission.startDate': 'Mission start',
  'mission.endDate': 'Mission end',
};

const FIELD_WORDS: Readonly<Record<string, string>> = {
  areaM2: 'area', name: 'name', absorptivityBol: 'BOL absorptivity', emissivityBol: 'BOL emissivity',
  absorptivityEol: 'EOL absorptivity', emissivityEol: 'EOL emissivity', source: 'source', x: 'normal x', y: 'normal y', z: 'normal z',
  normal: 'pointing', semiMajorAxisKm: 'semi-major axis', eccentricity: 'eccentricity', inclinationDeg: 'inclination',
  raanDeg: 'RAAN', argPeriapsisDeg: 'argument of periapsis',
};

/** A comparison row's label in words: "Heat-load margin", "Surface 2 area", "Surface 1 material BOL absorptivity". */
export function labelOfPath(path: string): string {
  const exact = PATH_LABELS[path];
  if (exact) return exact;
  const surface = /^conditions\.surfaces\[(\d+)\]\.(material\.)?(\w+)(?:\.(\w+))?$/.exec(path);
  if (surface) {
    const [, index, material, field, sub] = surface;
    const words = FIELD_WORDS[sub ?? field!] ?? (sub ?? field!);
    return `Surface ${Number(index) + 1}${material ? ' material' : ''} ${words}`;
  }
  const last = path.split(/[.[\]]/).filter((p) => p !== '');
  const field = last.at(-1) ?? path;
  const words = FIELD_WORDS[field] ?? field.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase();
  return `${last[0] === 'body' ? 'Body ' : last[0] === 'conditions' && last[1] === 'orbit' ? 'Orbit ' : ''}${words}`.replace(/^./, (c) => c.toUpperCase());
}

/** Inputs a comparison leaves out: the "why" sentences are built from the other inputs and the results, so they differ when those do. */
export const derivedPath = (path: string): boolean => /^(rationale|surfaceDrivers|decision|facts|handEdited|assumptions)\b/.test(path);
