// An orbit as typed ("550 km", "341.8 mi", 97.6, "95 min") read into canonical values (km, s, deg):
// each quantity through the reader of quantity-reader.ts, then the body's defineOrbit, which refuses the
// impossible (a 422 saying by how much). Unit errors are 400s naming the field and the value.
import { orbitInput } from '../../shared/api/environment';
import type { orbitDefinitions } from '../../shared/api/missions';
import type { Body } from '../../shared/physics/bodies';
import { defineOrbit, type OrbitInput } from '../../shared/physics/orbit-definition';
import { PhysicsError } from '../../shared/physics/physics-error';
import { ApiError, parse } from '../errors';
import type { ReadQuantity } from './quantity-reader';

export type OrbitFields = Record<string, number | string>;
export type OrbitDefinition = (typeof orbitDefinitions)[number];

export interface CanonicalOrbit {
  definition: OrbitDefinition;
  periapsisAltitudeKm: number;
  apoapsisAltitudeKm: number;
  semiMajorAxisKm: number;
  eccentricity: number;
  periodS: number;
  inclinationDeg: number;
  raanDeg: number;
  argPeriapsisDeg: number;
}

/** The typed orbit fields, their unit and the unit a bare number is in. */
const fieldUnits: Record<Exclude<keyof OrbitInput, 'eccentricity'>, string> = {
  periapsisAltitudeKm: 'km',
  apoapsisAltitudeKm: 'km',
  semiMajorAxisKm: 'km',
  periodS: 's',
  inclinationDeg: 'deg',
  raanDeg: 'deg',
  argPeriapsisDeg: 'deg',
};
export const orbitFieldNames = [...Object.keys(fieldUnits), 'eccentricity'] as readonly string[];
export const shapeFieldNames: readonly string[] = ['periapsisAltitudeKm', 'apoapsisAltitudeKm', 'semiMajorAxisKm', 'periodS', 'eccentricity'];

/** Puts the field's path in front of the physics' sentence, so the message alone names the field. */
function withPath(error: PhysicsError, status: number): ApiError {
  const path = error.details?.[0]?.path;
  const message = path && !error.message.startsWith(path) ? `${path}: ${error.message}` : error.message;
  return new ApiError(status, error.code, message.endsWith('.') ? message : `${message}.`, error.details);
}

function readField(read: ReadQuantity, value: number | string, unit: string, path: string): number {
  try {
    return read(value, unit, path);
  } catch (error) {
    if (error instanceof PhysicsError) throw withPath(error, 400);
    throw error;
  }
}

export function definitionOf(fields: OrbitFields): OrbitDefinition | null {
  if (fields.periapsisAltitudeKm !== undefined || fields.apoapsisAltitudeKm !== undefined) return 'altitudes';
  if (fields.semiMajorAxisKm !== undefined) return 'semi-major-axis';
  if (fields.periodS !== undefined) return 'period';
  return null;
}

/** Canonical values of a typed orbit around `body`; throws a 400 (units, definition) or a 422 (impossible). */
export function canonicalOrbit(fields: OrbitFields, body: Body, read: ReadQuantity): CanonicalOrbit {
  const input: OrbitInput = {};
  for (const [name, unit] of Object.entries(fieldUnits) as [keyof typeof fieldUnits, string][]) {
    const value = fields[name];
    if (value !== undefined) input[name] = readField(read, value, unit, `orbit.${name}`);
  }
  const e = fields.eccentricity;
  // The contract types eccentricity as a plain number; defineOrbit refuses anything not finite.
  if (e !== undefined) input.eccentricity = typeof e === 'number' ? e : Number(e);
  // The same schema, and so the same limits, as the compute route's orbit (400 naming the field).
  const checked = parse(orbitInput, input, 'orbit');
  let orbit;
  try {
    orbit = defineOrbit(checked, body);
  } catch (error) {
    if (error instanceof PhysicsError) {
      const malformed = error.code === 'invalid_quantity' || error.code === 'invalid_orbit_definition';
      throw withPath(error, malformed ? 400 : 422);
    }
    throw error;
  }
  const definition = definitionOf(fields);
  if (!definition) throw new Error('defineOrbit accepted an orbit without a definition');
  const deg = 180 / Math.PI;
  return {
    definition,
    periapsisAltitudeKm: orbit.periapsisAltitudeKm,
    apoapsisAltitudeKm: orbit.apoapsisAltitudeKm,
    semiMajorAxisKm: orbit.semiMajorAxisKm,
    eccentricity: orbit.eccentricity,
    periodS: orbit.periodS,
    inclinationDeg: orbit.inclinationRad * deg,
    raanDeg: orbit.raanRad * deg,
    argPeriapsisDeg: orbit.argPeriapsisRad * deg,
  };
}

/**
 * The typed fields after a change: the change's fields over the stored ones, except that a change
 * to another definition (altitudes for a period, say) drops the stored shape fields.
 */
export function mergedFields(stored: OrbitFields, change: OrbitFields): OrbitFields {
  const storedDefinition = definitionOf(stored);
  const changeDefinition = definitionOf(change);
  const merged: OrbitFields = { ...stored };
  if (changeDefinition && changeDefinition !== storedDefinition) {
    for (const name of shapeFieldNames) if (change[name] === undefined) delete merged[name];
  }
  return { ...merged, ...change };
}
