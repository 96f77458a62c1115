// Ephemeris points moved from one row per point (migration 0000) into blocks (0001): a database
// written by the earlier release keeps every point, bit for bit, and the points page and the
// environment read them back. Also the block layout itself (point-blocks.ts).
import { cpSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { migrateDatabase, openDatabase } from '../../server/db/database';
import { BLOCK_POINTS, POINT_FIELDS, packPoints, unpackBlock } from '../../server/ephemerides/point-blocks';
import { storedBlocks } from '../../server/ephemerides/ephemeris-store';
import type { AppContext } from '../../server/app-context';

const dir = mkdtempSync(path.join(tmpdir(), 'eclipta-migration-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** A migrations folder holding only the first migration: the schema of the earlier release. */
function firstMigrationOnly(): string {
  const folder = path.join(dir, 'migrations-0000');
  mkdirSync(path.join(folder, 'meta'), { recursive: true });
  cpSync('migrations/0000_eclipta.sql', path.join(folder, '0000_eclipta.sql'));
  const journal = JSON.parse(readFileSync('migrations/meta/_journal.json', 'utf8')) as { entries: { tag: string }[] };
  journal.entries = journal.entries.filter((e) => e.tag === '0000_eclipta');
  writeFileSync(path.join(folder, 'meta', '_journal.json'), JSON.stringify(journal));
  return folder;
}

describe('the move of ephemeris points into blocks', () => {
  it('keeps every point of a database written before it, in order, bit for bit', () => {
    const file = path.join(dir, 'old.db');
    const old = openDatabase(file);
    old.sqlite.pragma('foreign_keys = OFF');
    migrateDatabase(old.db, firstMigrationOnly());
    const insertEphemeris = old.sqlite.prepare(
      `INSERT INTO ephemerides (id, mission_id, name, frame, format, rows, start_epoch, end_epoch, step_s, min_altitude_km, max_altitude_km, has_velocity, sha256, file_name, created_at)
       VALUES (?, 'm', ?, 'EME2000', 'csv', ?, '', '', 10, 0, 0, ?, '', 'f.csv', '2027-01-01T00:00:00.000Z')`,
    );
    const insertPoint = old.sqlite.prepare('INSERT INTO ephemeris_points VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?)');
    // 10,000 points with velocities (three blocks, the last partial) and 5 without; values that a
    // decimal round trip would change (thirds, tiny and huge magnitudes) to show nothing is rounded
    const expected = new Map<string, number[][]>();
    old.sqlite.transaction(() => {
      for (const [id, count, velocity] of [['with-v', 10_000, true], ['no-v', 5, false]] as const) {
        insertEphemeris.run(id, id, count, velocity ? 1 : 0);
        const rows: number[][] = [];
        // inserted in reverse seq order: the migration must order by seq, not by insertion
        for (let seq = count - 1; seq >= 0; seq--) {
          const p = [1.8e12 + seq * 10_000 + 1 / 3, 7000 + seq / 3, -1e-300 * (seq + 1), 6.02e23, 7.5 / 3, -(seq + 1) / 7, 1 / (seq + 1)];
          insertPoint.run(id, seq, p[0], p[1], p[2], p[3], velocity ? p[4] : null, velocity ? p[5] : null, velocity ? p[6] : null);
          rows[seq] = velocity ? p : [...p.slice(0, 4), NaN, NaN, NaN];
        }
        expected.set(id, rows);
      }
    })();
    old.sqlite.close();

    const reopened = openDatabase(file);
    try {
      migrateDatabase(reopened.db, 'migrations');
      const tables = reopened.sqlite.prepare("SELECT name FROM sqlite_master WHERE type = 'table' AND name LIKE 'ephemeris_point%'").pluck().all();
      expect(tables).toEqual(['ephemeris_point_blocks']);
      const ctx = { sqlite: reopened.sqlite, db: reopened.db } as AppContext;
      for (const [id, rows] of expected) {
        const blocks = [...storedBlocks(ctx, id)];
        expect(blocks.map((b) => [b.firstSeq, b.points])).toEqual(
          id === 'with-v' ? [[0, BLOCK_POINTS], [BLOCK_POINTS, BLOCK_POINTS], [2 * BLOCK_POINTS, 10_000 - 2 * BLOCK_POINTS]] : [[0, 5]],
        );
        const got = blocks.flatMap((b) => Array.from({ length: b.points }, (_, k) => Array.from(b.values.subarray(k * POINT_FIELDS, (k + 1) * POINT_FIELDS))));
        expect(got).toEqual(rows);
      }
    } finally {
      reopened.sqlite.close();
    }
  });
});

describe('point blocks', () => {
  it('round-trips doubles exactly, NaN included, from a buffer not aligned for doubles', () => {
    const values = Float64Array.from([1 / 3, -0, Number.MAX_VALUE, Number.MIN_VALUE, NaN, 1e-310, 6928.137, 1, 2, 3, 4, 5, 6, 7]);
    const packed = packPoints(values, 2);
    expect(packed.length).toBe(2 * POINT_FIELDS * 8);
    // little-endian IEEE 754, as point-blocks.ts documents: 1/3 is 0x3FD5555555555555
    expect(packed.subarray(0, 8).toString('hex')).toBe('555555555555d53f');
    const unaligned = Buffer.alloc(packed.length + 3);
    packed.copy(unaligned, 3);
    const back = unpackBlock(unaligned.subarray(3));
    expect(Array.from(back)).toEqual(Array.from(values));
    expect(Object.is(back[1], -0)).toBe(true);
  });

  it('refuses a block that is not a whole number of points', () => {
    expect(() => unpackBlock(Buffer.alloc(POINT_FIELDS * 8 + 4))).toThrow(/not a whole number of points/);
  });
});
