// Units as engineers type them ("550 km", "14 d", "9 days", "1.2 m²", "3 sq m", "97.6°"): ONE table
// that the client reads for its live previews (it cannot load mathjs) and the server reads
// authoritatively (server/missions/quantity-reader.ts), so both always agree on what was typed.
// Units outside the table still reach mathjs on the server (shared/physics/units.ts).
// Definitions: SI brochure (9th ed., 2019) tables 8 and 4 for min, h, d, the degree and the litre;
// NIST SP 811 (2008) appendix B for the exact mile (1609.344 m), nautical mile (1852 m), foot
// (0.3048 m) and inch (0.0254 m).

export type QuantityKind = 'length' | 'time' | 'angle' | 'area' | 'volume';

interface TypedUnit {
  readonly kind: QuantityKind;
  /** Size in the kind's coherent SI unit: m, s, rad, m², m³. */
  readonly factor: number;
  /** The unit's symbol first (as messages write it), then other spellings people type. */
  readonly names: readonly string[];
}

const FOOT_M = 0.3048;
const INCH_M = 0.0254;

const TYPED_UNITS: readonly TypedUnit[] = [
  { kind: 'length', factor: 1000, names: ['km', 'kilometre', 'kilometres', 'kilometer', 'kilometers'] },
  { kind: 'length', factor: 1, names: ['m', 'metre', 'metres', 'meter', 'meters'] },
  { kind: 'length', factor: 1609.344, names: ['mi', 'mile', 'miles'] },
  { kind: 'length', factor: 1852, names: ['nmi', 'nautical mile', 'nautical miles'] },
  { kind: 'time', factor: 1, names: ['s', 'sec', 'secs', 'second', 'seconds'] },
  { kind: 'time', factor: 60, names: ['min', 'mins', 'minute', 'minutes'] },
  { kind: 'time', factor: 3600, names: ['h', 'hr', 'hrs', 'hour', 'hours'] },
  { kind: 'time', factor: 86400, names: ['d', 'day', 'days'] },
  { kind: 'angle', factor: Math.PI / 180, names: ['deg', '°', 'degree', 'degrees'] },
  { kind: 'angle', factor: 1, names: ['rad', 'radian', 'radians'] },
  { kind: 'area', factor: 1, names: ['m^2', 'm2', 'sq m', 'square metre', 'square metres', 'square meter', 'square meters'] },
  { kind: 'area', factor: 1e-4, names: ['cm^2', 'cm2', 'sq cm'] },
  { kind: 'area', factor: 1e-6, names: ['mm^2', 'mm2', 'sq mm'] },
  { kind: 'area', factor: FOOT_M ** 2, names: ['ft^2', 'ft2', 'sq ft', 'square foot', 'square feet'] },
  { kind: 'area', factor: INCH_M ** 2, names: ['in^2', 'in2', 'sq in', 'square inch', 'square inches'] },
  { kind: 'volume', factor: 1, names: ['m^3', 'm3', 'cu m', 'cubic metre', 'cubic metres', 'cubic meter', 'cubic meters'] },
  { kind: 'volume', factor: 1e-6, names: ['cm^3', 'cm3', 'cc'] },
  { kind: 'volume', factor: 1e-3, names: ['L', 'l', 'litre', 'litres', 'liter', 'liters'] },
];

/** Every spelling the table reads, with its kind (for the test that holds it against mathjs). */
export function typedUnitNames(): { name: string; kind: QuantityKind }[] {
  return TYPED_UNITS.flatMap((unit) => unit.names.map((name) => ({ name, kind: unit.kind })));
}

const BY_NAME = new Map<string, TypedUnit>(TYPED_UNITS.flatMap((unit) => unit.names.map((name) => [name, unit] as const)));

const KIND_WORDS: Readonly<Record<QuantityKind, string>> = {
  length: 'a length', time: 'a time', angle: 'an angle', area: 'an area', volume: 'a volume',
};

/** The unit's symbol as people read it: "m²" for "m^2". */
export function unitSymbol(name: string): string {
  return name.replace('^2', '²').replace('^3', '³');
}

/**
 * A unit as typed, in the table's spelling: superscripts become powers ("m²" → "m^2"), "sq. m"
 * and "square m" become "sq m", spaces are tidied. Also what mathjs is given on the server.
 */
export function normaliseUnitText(text: string): string {
  return text
    .trim()
    .replace(/²/g, '^2')
    .replace(/³/g, '^3')
    .replace(/\s*\^\s*/g, '^')
    .replace(/\bsq\.\s*/gi, 'sq ')
    .replace(/\bsquare\s+(?=[a-z]{1,2}\b)/gi, 'sq ')
    .replace(/\s+/g, ' ');
}

function unitNamed(text: string): TypedUnit | undefined {
  const name = normaliseUnitText(text);
  return BY_NAME.get(name) ?? BY_NAME.get(name.toLowerCase());
}

/** The units the table reads for a kind, for messages: "s, min, h or d". */
export function unitsOfKind(kind: QuantityKind): string {
  const names = TYPED_UNITS.filter((u) => u.kind === kind).map((u) => unitSymbol(u.names[0]!));
  return names.length === 1 ? names[0]! : `${names.slice(0, -1).join(', ')} or ${names[names.length - 1]}`;
}

/**
 * The kind a unit of the table measures ("km" → length, "m²" → area), spelled exactly as the table
 * has it (symbols are case-sensitive: "M" is not "m"); undefined outside the table.
 */
export function kindOfUnit(name: string): QuantityKind | undefined {
  return BY_NAME.get(normaliseUnitText(name))?.kind;
}

export type TypedReading =
  | { readonly ok: true; readonly value: number; readonly bare: boolean }
  | { readonly ok: false; readonly message: string; readonly unknownUnit: boolean };

const NUMBER_THEN_UNIT = /^([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:e[+-]?\d+)?)\s*(.*)$/i;

const refuse = (message: string, unknownUnit = false): TypedReading => ({ ok: false, message, unknownUnit });

/**
 * Typed text as a number in `unit` (a unit of the table: "km", "s", "min", "deg", "m^2"). A bare
 * number is taken in `unit`; anything else that cannot be read says why in words a field can show
 * (`unknownUnit` when only the unit is outside the table, which the server then asks mathjs about).
 */
export function readTypedQuantity(text: string, unit: string): TypedReading {
  const target = unitNamed(unit);
  if (target === undefined) throw new RangeError(`${unit} is not a unit of the typed-unit table`);
  const trimmed = text.trim().replace(/\u2212/g, '-');
  if (trimmed === '') return refuse('enter a value');
  const match = NUMBER_THEN_UNIT.exec(trimmed);
  if (!match) return refuse(`"${trimmed}" does not start with a number`);
  const number = Number(match[1]);
  if (!Number.isFinite(number)) return refuse(`"${trimmed}" is not a finite number`);
  const unitText = match[2]!.trim();
  if (unitText === '') return { ok: true, value: number, bare: true };
  const typed = unitNamed(unitText);
  if (typed === undefined) {
    return refuse(`"${unitText}" is not a unit this field reads; use ${unitsOfKind(target.kind)}`, true);
  }
  if (typed.kind !== target.kind) return refuse(`"${trimmed}" is ${KIND_WORDS[typed.kind]}, not ${KIND_WORDS[target.kind]}`);
  return { ok: true, value: (number * typed.factor) / target.factor, bare: false };
}

const TIME_STEPS: readonly { readonly unit: string; readonly seconds: number; readonly below: number }[] = [
  { unit: 's', seconds: 1, below: 120 },
  { unit: 'min', seconds: 60, below: 48 * 3600 / 10 },
  { unit: 'h', seconds: 3600, below: 48 * 3600 },
  { unit: 'd', seconds: 86400, below: Infinity },
];

/**
 * A duration in the unit that reads best: seconds under two minutes, minutes up to 4.8 h (an orbit
 * of 95.6 min stays in minutes), hours up to two days, days beyond (13,482.78 min reads 9.36 d).
 * Two decimals; '–' when it is not a finite duration.
 */
export function durationText(seconds: number): string {
  if (!Number.isFinite(seconds)) return '–';
  const step = TIME_STEPS.find((s) => Math.abs(seconds) < s.below) ?? TIME_STEPS[TIME_STEPS.length - 1]!;
  const value = seconds / step.seconds;
  return `${value.toLocaleString('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 2 })} ${step.unit}`;
}
