// Reading quantities typed by people ("550 km", "341.8 mi", "20 degC", "97.6 deg", "95 min") into
// the unit a field wants, refusing quantities of the wrong kind. Built on mathjs's unit system
// (its own module: mathjs is large and only this file should pull it in).
// Leaves out: compound expressions ("1 km + 3 m"), and temperature differences (degC is read as a
// temperature, so "20 degC" is 293.15 K). Source: mathjs Unit documentation.
import { create, unitDependencies, type Unit } from 'mathjs';
import { PhysicsError } from './physics-error';

const math = create({ unitDependencies });

// Names for the dimensions a user meets; the rest fall back to mathjs's base-unit name.
const dimensionNames: Record<string, string> = {
  LENGTH: 'a length', MASS: 'a mass', TIME: 'a time', TEMPERATURE: 'a temperature', ANGLE: 'an angle',
  SURFACE: 'an area', VOLUME: 'a volume', POWER: 'a power', ENERGY: 'an energy', FORCE: 'a force',
  PRESSURE: 'a pressure', CURRENT: 'an electric current', FREQUENCY: 'a frequency', NONE: 'a pure number',
  ELECTRIC_POTENTIAL: 'a voltage', ELECTRIC_RESISTANCE: 'a resistance',
};

/** "a mass", "a length", ... for a unit, or its SI form when it has no everyday name. */
export function dimensionOf(unit: Unit): string {
  for (const [name, base] of Object.entries(math.Unit.BASE_UNITS)) {
    const dims = (base as { dimensions: number[] }).dimensions;
    if (dims.every((d, i) => Math.abs(d - unit.dimensions[i]) < 1e-12)) {
      return dimensionNames[name] ?? `a quantity of ${name.toLowerCase().replaceAll('_', ' ')}`;
    }
  }
  return `a quantity in ${unit.toSI().formatUnits()}`;
}

const refuse = (path: string, message: string): PhysicsError => new PhysicsError('invalid_quantity', message, [{ path, message }]);

// mathjs's own message ("Unexpected "²" in ... at index 5") is for programmers, so the user reads words.
function parse(text: string, path: string): Unit {
  try {
    return math.unit(text);
  } catch {
    throw refuse(path, `"${text}" is not a quantity Eclipta can read; write a number and a unit, e.g. "550 km"`);
  }
}

/** Whether mathjs reads the text as a quantity at all (its dimension is checked later). */
export function canReadQuantity(text: string): boolean {
  try {
    math.unit(text);
    return true;
  } catch {
    return false;
  }
}

/**
 * The value of `input` in `targetUnit` (e.g. "km", "s", "K", "deg", "W/m^2"). A bare number, or a
 * numeric string without a unit, is taken in `defaultUnit` (the target unit when not given).
 * Throws a PhysicsError with code 'invalid_quantity' (a 400 at the route) naming value and dimension.
 */
export function readQuantity(input: string | number, targetUnit: string, defaultUnit = targetUnit, path = 'value'): number {
  const target = math.unit(targetUnit);
  const fallback = math.unit(defaultUnit);
  if (!fallback.equalBase(target)) {
    throw new RangeError(`default unit ${defaultUnit} is ${dimensionOf(fallback)}, not ${dimensionOf(target)} like ${targetUnit}`);
  }
  if (typeof input === 'number') {
    if (!Number.isFinite(input)) throw refuse(path, `${input} is not a finite number`);
    return math.unit(input, defaultUnit).toNumber(targetUnit);
  }
  const text = input.trim();
  if (text === '') throw refuse(path, 'enter a value');
  const bare = Number(text);
  if (Number.isFinite(bare)) return math.unit(bare, defaultUnit).toNumber(targetUnit);
  const quantity = parse(text, path);
  if (quantity.value === null) throw refuse(path, `"${text}" has a unit but no number`);
  if (!quantity.equalBase(target)) {
    throw refuse(path, `"${text}" is ${dimensionOf(quantity)}, not ${dimensionOf(target)}`);
  }
  const value = quantity.toNumber(targetUnit);
  if (!Number.isFinite(value)) throw refuse(path, `"${text}" is not a finite quantity`);
  return value;
}

/** The value of `input` in SI base units for its dimension (m, s, K, rad, kg, W, ...). */
export function readSi(input: string | number, defaultUnit: string, path = 'value'): number {
  const si = math.unit(defaultUnit).toSI().formatUnits();
  return readQuantity(input, si === '' ? defaultUnit : si, defaultUnit, path);
}

/**
 * `input` in `unit`, for the client's unit fields: a bare number is taken as already in `unit`.
 * An unknown target unit is refused like an unreadable quantity (path "unit").
 */
export function convertQuantity(input: string | number, unit: string): number {
  let target: Unit;
  try {
    target = math.unit(unit);
  } catch {
    throw refuse('unit', `"${unit}" is not a unit Eclipta can read; give a unit alone, e.g. "km"`);
  }
  if (target.value !== null) throw refuse('unit', `"${unit}" is a quantity; give the unit alone, e.g. "km"`);
  return readQuantity(input, unit, unit, 'value');
}
