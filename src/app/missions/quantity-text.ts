// Reads what a person types into a number field ("550 km", "341.8 mi", "95 min", "97.6 deg") for the
// live preview only. The server reads the same text authoritatively with its full unit system; this
// small table keeps mathjs out of the client bundle and covers the units an orbit form meets.

export type QuantityKind = 'length' | 'time' | 'angle';

/** The unit a field shows as its suffix; a bare number is taken in it. */
export type FieldUnit = 'km' | 's' | 'min' | 'deg';

interface UnitEntry {
  readonly kind: QuantityKind;
  /** Size in the kind's base: km, s, deg. */
  readonly factor: number;
}

// Exact definitions: international mile 1609.344 m, nautical mile 1852 m (NIST SP 811, appendix B).
const UNITS: Readonly<Record<string, UnitEntry>> = {
  km: { kind: 'length', factor: 1 },
  m: { kind: 'length', factor: 0.001 },
  mi: { kind: 'length', factor: 1.609344 },
  nmi: { kind: 'length', factor: 1.852 },
  s: { kind: 'time', factor: 1 },
  sec: { kind: 'time', factor: 1 },
  min: { kind: 'time', factor: 60 },
  h: { kind: 'time', factor: 3600 },
  hr: { kind: 'time', factor: 3600 },
  deg: { kind: 'angle', factor: 1 },
  '°': { kind: 'angle', factor: 1 },
  rad: { kind: 'angle', factor: 180 / Math.PI },
};

const KIND_OF_FIELD: Readonly<Record<FieldUnit, QuantityKind>> = { km: 'length', s: 'time', min: 'time', deg: 'angle' };

const KIND_WORDS: Readonly<Record<QuantityKind, string>> = { length: 'a length', time: 'a time', angle: 'an angle' };

export type QuantityReading =
  | { readonly ok: true; readonly value: number; readonly bare: boolean }
  | { readonly ok: false; readonly message: string };

/** The units accepted for a kind, for messages: "km, m, mi or nmi". */
export function unitsOfKind(kind: QuantityKind): string {
  const names = Object.entries(UNITS)
    .filter(([name, u]) => u.kind === kind && name !== 'sec' && name !== 'hr')
    .map(([name]) => name);
  return `${names.slice(0, -1).join(', ')} or ${names[names.length - 1]}`;
}

const NUMBER_THEN_UNIT = /^([+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:e[+-]?\d+)?)\s*(.*)$/i;

/**
 * The typed text as a number in the field's unit. A bare number is already in it; a number with a
 * unit is converted; anything else says what is wrong in words the field can show.
 */
export function readQuantityText(text: string, fieldUnit: FieldUnit): QuantityReading {
  const trimmed = text.trim();
  if (trimmed === '') return { ok: false, message: 'enter a value' };
  const match = NUMBER_THEN_UNIT.exec(trimmed);
  if (!match) return { ok: false, message: `"${trimmed}" does not start with a number` };
  const number = Number(match[1]);
  if (!Number.isFinite(number)) return { ok: false, message: `"${trimmed}" is not a finite number` };
  const unitText = match[2].trim();
  if (unitText === '') return { ok: true, value: number, bare: true };
  const kind = KIND_OF_FIELD[fieldUnit];
  const unit = UNITS[unitText] ?? UNITS[unitText.toLowerCase()];
  if (unit === undefined) {
    return { ok: false, message: `"${unitText}" is not a unit this field reads; use ${unitsOfKind(kind)}` };
  }
  if (unit.kind !== kind) {
    return { ok: false, message: `"${trimmed}" is ${KIND_WORDS[unit.kind]}, not ${KIND_WORDS[kind]}` };
  }
  return { ok: true, value: (number * unit.factor) / UNITS[fieldUnit].factor, bare: false };
}

/**
 * What to send the server for a field: the text as typed, but a bare number gets the field's
 * suffix unit written out, so "95" in a field showing "min" cannot be read as 95 seconds.
 */
export function quantityForServer(text: string, fieldUnit: FieldUnit, serverUnit: FieldUnit): string | number {
  const trimmed = text.trim();
  const reading = readQuantityText(trimmed, fieldUnit);
  if (reading.ok && reading.bare) return fieldUnit === serverUnit ? reading.value : `${trimmed} ${fieldUnit}`;
  return trimmed;
}
