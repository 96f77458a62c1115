// How the comparison view writes a difference: signed, in the quantity's unit and as a percentage
// of the first case, and whether it counts as a change at all (floating noise does not).

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
  [/C$/, '°C'],
];

/** Decimals worth showing per unit: an engineer reads 0.1 W and 0.01 deg, not 14 digits. */
const DECIMALS: Readonly<Record<string, number>> = {
  km: 1, deg: 2, 'W/m²': 1, W: 2, 'm²': 3, AU: 4, s: 0, '°C': 1, '%': 1, 'km³/s²': 1,
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

/** A difference in its unit and in percent of case A; percent is "n/a" when A is zero. */
export function formatDifference(compared: Compared, unit: string, decimals = decimalsFor(unit)): DifferenceText {
  const { a, b, difference } = compared;
  const changed = Math.abs(difference) > 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));
  const d = changed ? difference : 0;
  const percent = a === 0 ? (changed ? 'n/a (A is 0)' : '0.0 %') : `${formatSigned((d / Math.abs(a)) * 100, 1)} %`;
  return { absolute: withUnit(formatSigned(d, decimals), unit), percent, changed };
}

/** An input value of any kind as the comparison table shows it. */
export function formatInputValue(path: string, value: unknown): string {
  if (typeof value === 'number') return formatQuantity(value, unitOfPath(path));
  if (typeof value === 'string') return value === '' ? '—' : value;
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (value === null || value === undefined) return '—';
  return JSON.stringify(value);
}

/** The difference of two input values, when both are numbers; text inputs only say they differ. */
export function inputDifference(path: string, a: unknown, b: unknown): DifferenceText | null {
  if (typeof a !== 'number' || typeof b !== 'number') return null;
  return formatDifference({ a, b, difference: b - a }, unitOfPath(path));
}
