// The built-in material library: DOMAIN.md's table of beginning-of-life optical properties, with
// end-of-life values where DOMAIN.md gives a range. Written at every start (after the migrations),
// so a database that was created before the library, or without the demo seed, still has it.
import { and, eq, isNull } from 'drizzle-orm';
import type { Db } from '../db/database';
import { materials } from '../db/schema';
import type { CaseMaterial } from '../../shared/physics/design-environment';

/** A library material: the same fields a case keeps of a surface's material. */
type LibraryMaterial = CaseMaterial;

const bolSource = 'BOL: Fortescue, Swinerd & Stark 2011, Table 11.3; Gilmore 2002, App. A';
// Shown to users beside each material, so in their words: no file names, no shorthand.
const emissivityKept = 'EOL emissivity taken equal to BOL (no change assumed; common practice, no source)';
// DOMAIN.md's end-of-life paragraph is marked [M]: from memory, to be confirmed against the source.
const eolFromRange = (range: string, chosen: number): string =>
  `EOL absorptivity ${chosen}: middle of the end-of-life range ${range} usually quoted for it (value not yet checked against its published source)`;

/** A coating cannot absorb more than all the sunlight that reaches it; library values stay below this. */
export const MAX_LIBRARY_ABSORPTIVITY = 0.99;

/**
 * End-of-life absorptivity where no published degradation figure is at hand: BOL + 0.05, but never
 * more than half of what is left below 1, so a black coating (0.95) ends at 0.97, not at an
 * impossible 1.00. Common practice, no source; the material's source text says so.
 */
export function assumedEolAbsorptivity(absorptivityBol: number): number {
  const rise = Math.min(0.05, (1 - absorptivityBol) / 2);
  return Math.min(MAX_LIBRARY_ABSORPTIVITY, Math.floor((absorptivityBol + rise) * 100 + 1e-9) / 100);
}

/** A library material: emissivity kept at end of life, the source naming where each value comes from. */
function libraryMaterial(name: string, absorptivityBol: number, emissivityBol: number, absorptivityEol: number, eolWords: string): LibraryMaterial {
  return {
    name,
    absorptivityBol,
    emissivityBol,
    absorptivityEol,
    emissivityEol: emissivityBol,
    source: `${bolSource}. ${eolWords}. ${emissivityKept}.`,
  };
}

function assumedEol(name: string, absorptivityBol: number, emissivityBol: number): LibraryMaterial {
  const absorptivityEol = assumedEolAbsorptivity(absorptivityBol);
  const rule = absorptivityEol < Math.round((absorptivityBol + 0.05) * 100) / 100 ? 'BOL + half the distance to 1' : 'BOL + 0.05';
  return libraryMaterial(name, absorptivityBol, emissivityBol, absorptivityEol, `EOL absorptivity ${absorptivityEol} = ${rule}, no published degradation figure at hand (common practice, no source)`);
}

function rangedEol(name: string, absorptivityBol: number, emissivityBol: number, range: string, absorptivityEol: number): LibraryMaterial {
  return libraryMaterial(name, absorptivityBol, emissivityBol, absorptivityEol, eolFromRange(range, absorptivityEol));
}

/** DOMAIN.md "Optical properties, beginning of life" [S: F, G App. A], in its order. */
export const libraryMaterials: readonly LibraryMaterial[] = [
  rangedEol('optical solar reflector (silvered quartz)', 0.07, 0.8, '0.10-0.15', 0.12),
  rangedEol('silver-backed FEP', 0.08, 0.78, '0.15-0.25', 0.2),
  rangedEol('white silicone paint', 0.26, 0.83, '0.4-0.6', 0.5),
  assumedEol('white silicate paint', 0.12, 0.9),
  assumedEol('black paint', 0.95, 0.87),
  assumedEol('aluminized polyimide, polyimide outward (blanket outer layer)', 0.4, 0.63),
  assumedEol('polished aluminium', 0.24, 0.08),
  assumedEol('silicon solar cells', 0.75, 0.82),
  assumedEol('GaAs solar cells', 0.88, 0.8),
];

/**
 * Inserts the library rows that are missing and brings existing ones to the values above, by name;
 * idempotent, and leaves every workspace's own materials alone. Ids of existing rows are kept, so
 * surfaces that use them stay valid.
 */
export function ensureMaterialLibrary(db: Db): void {
  db.transaction((tx) => {
    for (const entry of libraryMaterials) {
      const existing = tx
        .select()
        .from(materials)
        .where(and(isNull(materials.workspaceId), eq(materials.name, entry.name)))
        .get();
      if (!existing) {
        tx.insert(materials).values({ ...entry, workspaceId: null }).run();
      } else if (
        existing.absorptivityBol !== entry.absorptivityBol ||
        existing.emissivityBol !== entry.emissivityBol ||
        existing.absorptivityEol !== entry.absorptivityEol ||
        existing.emissivityEol !== entry.emissivityEol ||
        existing.source !== entry.source
      ) {
        tx.update(materials).set(entry).where(eq(materials.id, existing.id)).run();
      }
    }
  });
}

/** The library row of this name (for the demo seed); throws when the library was not written first. */
export function libraryMaterialId(db: Pick<Db, 'select'>, name: string): string {
  const row = db
    .select({ id: materials.id })
    .from(materials)
    .where(and(isNull(materials.workspaceId), eq(materials.name, name)))
    .get();
  if (!row) throw new Error(`the material library has no "${name}"; ensureMaterialLibrary runs before the seed`);
  return row.id;
}
