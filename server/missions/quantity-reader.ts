// Typed quantities ("550 km", "341.8 mi", 97.6) read on the server without loading mathjs until a
// request needs it: shared/physics/units.ts pulls in mathjs, about 90 MB of memory, and most
// requests (an ephemeris upload, a sign-in) never convert a unit. A bare number, or a number
// followed by the field's own unit, needs no conversion and is read here; anything else goes to
// units.ts, which the routes that take typed quantities load first (await loadUnits()).
// Units people type ("14 d", "1.2 m²", "sq m") are read with the table the client previews with
// (shared/physics/typed-units.ts), so the preview and the stored value always agree; only units
// outside that table reach mathjs.
import { PhysicsError } from '../../shared/physics/physics-error';
import { kindOfUnit, normaliseUnitText, readTypedQuantity } from '../../shared/physics/typed-units';

type Units = typeof import('../../shared/physics/units');

let units: Units | null = null;
let loading: Promise<Units> | null = null;

/** Loads the unit system once; every later call answers at once. */
export function loadUnits(): Promise<Units> {
  loading ??= import('../../shared/physics/units').then((module) => (units = module));
  return loading;
}

// The same plain decimal form readQuantity's Number() accepts for the numeric part of "480 km".
const plainNumber = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * The value when it is already in `unit` (a finite number, a numeric string, or "<number> <unit>"
 * with exactly that unit), else undefined: then only the unit system can read it.
 */
export function valueInOwnUnit(input: string | number, unit: string): number | undefined {
  if (typeof input === 'number') return Number.isFinite(input) ? input : undefined;
  const text = input.trim();
  if (text === '') return undefined;
  const bare = Number(text);
  if (Number.isFinite(bare)) return bare;
  if (!text.endsWith(unit)) return undefined;
  const number = text.slice(0, text.length - unit.length);
  // A space between number and unit, as people type it; "480km" and the like go to mathjs.
  if (number.length === number.trimEnd().length) return undefined;
  const digits = number.trimEnd();
  if (!plainNumber.test(digits)) return undefined;
  const value = Number(digits);
  return Number.isFinite(value) ? value : undefined;
}

/**
 * `input` in `unit` (a unit of the typed-unit table: "km", "s", "deg", "m^2"): a bare number is in
 * `unit`; typed text is read with the shared table, and a unit outside it with mathjs
 * (shared/physics/units.ts). Refusals are PhysicsErrors in words, never a parser's message.
 */
export function readQuantityIn(input: string | number, unit: string, path: string): number {
  const own = valueInOwnUnit(input, unit);
  if (own !== undefined) return own;
  if (typeof input === 'number') throw new PhysicsError('invalid_quantity', `${input} is not a finite number`, [{ path, message: `${input} is not a finite number` }]);
  const reading = readTypedQuantity(input, unit);
  if (reading.ok) return reading.value;
  const refusal = new PhysicsError('invalid_quantity', reading.message, [{ path, message: reading.message }]);
  if (!reading.unknownUnit) throw refusal;
  if (!units) throw new Error(`reading ${path} needs the unit system: the route must await loadUnits() first`);
  const text = normaliseUnitText(input);
  // mathjs knows many more units ("300000 ft", "2 kg"); what it cannot read gets the table's words.
  if (!units.canReadQuantity(text)) throw refusal;
  return units.readQuantity(text, unit, unit, path);
}

/** POST /units/convert: a unit of the typed-unit table is read as the forms read it ("14 d", "1.2 m²"); others by mathjs. */
export async function convertTypedValue(value: string | number, unit: string): Promise<number> {
  const { convertQuantity } = await loadUnits();
  return kindOfUnit(unit) ? readQuantityIn(value, normaliseUnitText(unit), 'value') : convertQuantity(value, unit);
}
