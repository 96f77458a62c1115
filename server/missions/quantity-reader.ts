// Typed quantities ("550 km", "14 d", "1.2 m²", 97.6) read on the server with the one table the
// client previews with (shared/physics/typed-units.ts), so the preview and the stored value always
// agree. Only a unit outside that table ("300000 ft") reaches mathjs (shared/physics/units.ts),
// about 90 MB of memory that most requests never need: it is loaded the first time a quantity
// asks for it, and never by a route "just in case".
//
// Work functions read their quantities inside their transaction (synchronous, better-sqlite3), so
// the reader is handed to them by `withQuantityReader`: when a quantity needs mathjs before it is
// loaded, the work stops (its transaction rolls back, nothing written), mathjs is loaded and the
// work runs again. No caller has to remember to load anything first.
import { PhysicsError } from '../../shared/physics/physics-error';
import { kindOfUnit, normaliseUnitText, readTypedQuantity } from '../../shared/physics/typed-units';

type Units = typeof import('../../shared/physics/units');

/** `input` in `unit` (a unit of the typed-unit table: "km", "s", "deg", "m^2"); a bare number is in `unit`. */
export type ReadQuantity = (input: string | number, unit: string, path: string) => number;

let units: Units | null = null;
let loading: Promise<Units> | null = null;

function loadUnits(): Promise<Units> {
  loading ??= import('../../shared/physics/units').then((module) => (units = module));
  return loading;
}

/** Thrown by a reader without mathjs at a unit outside the table; only withQuantityReader sees it. */
class UnitsNotLoaded extends Error {}

/** Refusals are PhysicsErrors in words (a 400 naming the field), never a parser's message. */
function readerWith(loaded: Units | null): ReadQuantity {
  return (input, unit, path) => {
    const refuse = (message: string) => new PhysicsError('invalid_quantity', message, [{ path, message }]);
    if (typeof input === 'number') {
      if (Number.isFinite(input)) return input;
      throw refuse(`${input} is not a finite number`);
    }
    // Any numeric text Number() takes is a bare number in `unit`, as it always was.
    const bare = input.trim() === '' ? Number.NaN : Number(input);
    if (Number.isFinite(bare)) return bare;
    const reading = readTypedQuantity(input, unit);
    if (reading.ok) return reading.value;
    if (!reading.unknownUnit) throw refuse(reading.message);
    if (!loaded) throw new UnitsNotLoaded();
    const text = normaliseUnitText(input);
    // mathjs knows many more units ("300000 ft", "2 kg"); what it cannot read gets the table's words.
    if (!loaded.canReadQuantity(text)) throw refuse(reading.message);
    return loaded.readQuantity(text, unit, unit, path);
  };
}

/**
 * Runs `work` (a work function's checks and its transaction, synchronous) with a reader of typed
 * quantities, and answers what it answers. Should a quantity need mathjs before it is loaded, the
 * work is run once more with it; `work` must therefore write only inside its transaction.
 */
export async function withQuantityReader<T>(work: (read: ReadQuantity) => T): Promise<T> {
  try {
    return work(readerWith(units));
  } catch (error) {
    if (!(error instanceof UnitsNotLoaded)) throw error;
  }
  return work(readerWith(await loadUnits()));
}

/**
 * `input` in a unit the caller names (POST /units/convert): a unit of the table is read as the
 * forms read it ("14 d", "1.2 m²"); any other unit is mathjs's to read.
 */
export async function convertTypedValue(input: string | number, unit: string): Promise<number> {
  if (kindOfUnit(unit)) return withQuantityReader((read) => read(input, normaliseUnitText(unit), 'value'));
  return (await loadUnits()).convertQuantity(input, unit);
}
