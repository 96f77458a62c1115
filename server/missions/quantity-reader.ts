// Typed quantities ("550 km", "341.8 mi", 97.6) read on the server without loading mathjs until a
// request needs it: shared/physics/units.ts pulls in mathjs, about 90 MB of memory, and most
// requests (an ephemeris upload, a sign-in) never convert a unit. A bare number, or a number
// followed by the field's own unit, needs no conversion and is read here; anything else goes to
// units.ts, which the routes that take typed quantities load first (await loadUnits()).
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

/** readQuantity (shared/physics/units.ts) with `unit` as target and default; see the file comment. */
export function readQuantityIn(input: string | number, unit: string, path: string): number {
  const own = valueInOwnUnit(input, unit);
  if (own !== undefined) return own;
  if (!units) throw new Error(`reading ${path} needs the unit system: the route must await loadUnits() first`);
  return units.readQuantity(input, unit, unit, path);
}
