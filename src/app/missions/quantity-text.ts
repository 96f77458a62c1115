// Reads what a person types into a number field ("550 km", "14 d", "95 min", "97.6 deg", "1.2 m²")
// for the live preview only. The server reads the same text authoritatively with the same table
// (shared/physics/typed-units.ts; mathjs stays out of the client bundle).
import { readTypedQuantity, type TypedReading } from '../../../shared/physics/typed-units';

export { unitsOfKind, durationText } from '../../../shared/physics/typed-units';

/** The unit a field shows as its suffix; a bare number is taken in it. */
export type FieldUnit = 'km' | 's' | 'min' | 'd' | 'deg' | 'm^2';

export type QuantityReading = TypedReading;

/**
 * The typed text as a number in the field's unit: the shared table's own reader, limited to the
 * units a field shows. A bare number is already in it; a number with a unit is converted; anything
 * else says what is wrong in words the field can show.
 */
export const readQuantityText: (text: string, fieldUnit: FieldUnit) => QuantityReading = readTypedQuantity;

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
