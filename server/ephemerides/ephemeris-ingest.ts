// An uploaded ephemeris from the stored temp file to the database: sniff, parse as a stream
// (hashing the bytes on the way), check every row, then write the metadata and every point in one
// transaction with a prepared statement. A refused file answers 400 invalid_ephemeris with its
// first problems; the caller deletes the temp files whatever the outcome.
import { createHash, randomUUID } from 'node:crypto';
import { createReadStream } from 'node:fs';
import path from 'node:path';
import type { EphemerisUploadFields } from '../../shared/api/ephemerides';
import { getBody } from '../../shared/physics/bodies';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit-log';
import { ephemerides, type EphemerisRow, type MissionRow } from '../db/schema';
import { ApiError, badRequest } from '../errors';
import { EphemerisChecker, MAX_PROBLEMS, type Problem } from './ephemeris-checker';
import { checkFrame } from './ephemeris-frames';
import { epochText, parseEpochMs } from './epoch-text';
import { sniffFile } from './file-sniff';
import { readCsvEphemeris } from './csv-ephemeris';
import { readOemEphemeris } from './oem-ephemeris';
import { PointSpool } from './point-spool';

export interface IngestRequest {
  mission: MissionRow;
  userId: string;
  file: { path: string; originalName: string };
  fields: EphemerisUploadFields;
  /** Where the point spool may be written; the caller removes it. */
  spoolPath: string;
}

/** The client's file name made safe to show: no folders, no control characters, bounded. */
export function displayFileName(original: string): string {
  // eslint-disable-next-line no-control-regex
  const base = path.basename(original.replaceAll('\\', '/')).replace(/[\u0000-\u001f\u007f<>"]/g, '').trim();
  return (base || 'ephemeris').slice(0, 120);
}

function refusal(problems: Problem[]): ApiError {
  const first = problems[0];
  const where = first.row > 0 ? `row ${first.row}${first.column ? `, ${first.column}` : ''}` : first.column ? first.column : 'the file';
  const count = problems.length >= MAX_PROBLEMS ? `at least ${MAX_PROBLEMS} problems (the first ${MAX_PROBLEMS} are listed)` : `${problems.length} problem${problems.length > 1 ? 's' : ''}`;
  return new ApiError(400, 'invalid_ephemeris', `The file was refused, nothing was kept: ${count}; first, ${where}: ${first.message}.`, problems);
}

export const spoolPathFor = (uploadsDir: string): string => path.join(uploadsDir, `${randomUUID()}.points`);

export async function ingestEphemeris(ctx: AppContext, request: IngestRequest): Promise<EphemerisRow> {
  const { mission, file, fields } = request;
  const body = getBody(mission.bodyId);
  const sniffed = sniffFile(file.path);
  if ('refused' in sniffed) throw refusal([{ row: 0, message: sniffed.refused }]);

  let declaredFrame: string | null = null;
  if (fields.frame) {
    const checked = checkFrame(body, fields.frame);
    if ('refused' in checked) throw badRequest(`frame: ${checked.refused}.`, [{ path: 'frame', message: checked.refused }]);
    declaredFrame = checked.frame;
  } else if (sniffed.format === 'csv') {
    throw badRequest('frame: a CSV ephemeris needs its frame declared with the upload (EME2000, J2000, ICRF or GCRF).', [{ path: 'frame', message: 'give the inertial frame of the positions' }]);
  }
  const epochMs = fields.epoch ? parseEpochMs(fields.epoch) : null;

  const spool = new PointSpool(request.spoolPath);
  try {
    const checker = new EphemerisChecker(body, spool);
    const hash = createHash('sha256');
    // 256 KiB reads: a quarter as many chunks through the hash and csv-parse as the 64 KiB default.
    const input = createReadStream(file.path, { highWaterMark: 256 * 1024 });
    input.on('data', (chunk) => hash.update(chunk));
    let objectName: string | null = null;
    let frame = declaredFrame;
    try {
      if (sniffed.format === 'csv') {
        await readCsvEphemeris(input, checker, epochMs);
      } else {
        const meta = await readOemEphemeris(input, checker, body, declaredFrame);
        objectName = meta.objectName;
        frame = meta.frame ?? declaredFrame;
      }
    } finally {
      input.destroy();
    }
    const stats = checker.finish();
    if (!stats || !checker.clean) throw refusal(checker.problems);
    const fileName = displayFileName(file.originalName);
    const name = fields.name || objectName || fileName.replace(/\.[^.]+$/, '') || 'ephemeris';
    return storeEphemeris(ctx, request, spool, {
      missionId: mission.id,
      name: name.slice(0, 120),
      frame: frame ?? 'ICRF',
      format: sniffed.format,
      rows: stats.rows,
      startEpoch: epochText(stats.startMs),
      endEpoch: epochText(stats.endMs),
      stepS: stats.stepS,
      minAltitudeKm: stats.minAltitudeKm,
      maxAltitudeKm: stats.maxAltitudeKm,
      hasVelocity: stats.hasVelocity,
      sha256: hash.digest('hex'),
      fileName,
      createdBy: request.userId,
    });
  } finally {
    spool.close();
  }
}

type NewEphemeris = typeof ephemerides.$inferInsert;

/**
 * Points per INSERT statement: one statement execution per batch instead of per row. The
 * ephemeris id is bound once per statement (@id, named in every row) rather than once per row:
 * each string binding is a UTF-8 copy, a million of them otherwise. 1 + 8 x 500 = 4001 parameters,
 * well under SQLite's 32766.
 */
const INSERT_BATCH_ROWS = 500;
const ROW_PARAMS = 8;
const insertPointsSql = (rows: number): string =>
  'INSERT INTO ephemeris_points (ephemeris_id, seq, t_ms, x_km, y_km, z_km, vx_km_s, vy_km_s, vz_km_s) VALUES '
  + Array.from({ length: rows }, () => '(@id, ?, ?, ?, ?, ?, ?, ?, ?)').join(', ');

function storeEphemeris(ctx: AppContext, request: IngestRequest, spool: PointSpool, values: NewEphemeris): EphemerisRow {
  const insertBatch = ctx.sqlite.prepare(insertPointsSql(INSERT_BATCH_ROWS));
  const insertOne = ctx.sqlite.prepare(insertPointsSql(1));
  const orNull = (x: number): number | null => (Number.isNaN(x) ? null : x);
  // One parameter array, refilled for each batch: no per-row objects. Numbers only after the id.
  const params: (number | null)[] = new Array(INSERT_BATCH_ROWS * ROW_PARAMS).fill(null);
  return ctx.db.transaction((tx) => {
    const row = tx.insert(ephemerides).values(values).returning().get();
    const id = { id: row.id };
    let seq = 0;
    let filled = 0;
    spool.forEach((b, i) => {
      const at = filled * ROW_PARAMS;
      params[at] = seq++;
      params[at + 1] = b[i];
      params[at + 2] = b[i + 1];
      params[at + 3] = b[i + 2];
      params[at + 4] = b[i + 3];
      params[at + 5] = orNull(b[i + 4]);
      params[at + 6] = orNull(b[i + 5]);
      params[at + 7] = orNull(b[i + 6]);
      if (++filled === INSERT_BATCH_ROWS) {
        insertBatch.run(id, params);
        filled = 0;
      }
    });
    // The last partial batch row by row (at most INSERT_BATCH_ROWS - 1 of them).
    for (let k = 0; k < filled; k++) insertOne.run(id, params.slice(k * ROW_PARAMS, (k + 1) * ROW_PARAMS));
    recordAudit(tx, {
      workspaceId: request.mission.workspaceId,
      actorUserId: request.userId,
      action: 'ephemeris.uploaded',
      targetType: 'ephemeris',
      targetId: row.id,
      summary: `Ephemeris "${row.name}" (${row.rows} rows, ${row.format.toUpperCase()}) uploaded to mission "${request.mission.name}".`,
    });
    return row;
  });
}
