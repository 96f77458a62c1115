// An uploaded ephemeris to the database: received by multer onto disk and read as it arrives
// (ephemeris-reader.ts: hash, sniff, parse as a stream, check every row, spool the points), then
// the metadata and every point written in one transaction with prepared statements. A refused
// file answers 400 invalid_ephemeris with its first problems; its temp files are deleted whatever
// the outcome.
import { sql } from 'drizzle-orm';
import { randomUUID } from 'node:crypto';
import { createReadStream, rmSync } from 'node:fs';
import path from 'node:path';
import { pipeline } from 'node:stream/promises';
import type { Request, Response } from 'express';
import { ephemerisUploadFields, type EphemerisUploadFields } from '../../shared/api/ephemerides';
import { withoutControls } from '../../shared/api/text';
import { getBody } from '../../shared/physics/bodies';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit-log';
import { ephemerides, ephemerisPointBlocks, type EphemerisRow, type MissionRow } from '../db/schema';
import { ApiError, badRequest, parse } from '../errors';
import { MAX_PROBLEMS, type Problem } from './ephemeris-checker';
import { checkFrame } from './ephemeris-frames';
import { EphemerisReader, sameSetup, type ReadOutcome, type ReadSetup } from './ephemeris-reader';
import { receiveUpload, uploadsDir } from './ephemeris-upload';
import { epochText, parseEpochMs } from './epoch-text';
import { packPoints } from './point-blocks';
import type { PointSpool } from './point-spool';

export interface IngestRequest {
  mission: MissionRow;
  userId: string;
  file: { path: string; originalName: string };
  fields: EphemerisUploadFields;
  /** What the reader made of the file's bytes. */
  read: ReadOutcome;
}

/** The client's file name made safe to show: no folders, no control characters, bounded. */
export function displayFileName(original: string): string {
  const base = withoutControls(path.basename(original.replaceAll('\\', '/'))).replace(/[<>"]/g, '').trim();
  return (base || 'ephemeris').slice(0, 120);
}

function refusal(problems: Problem[]): ApiError {
  const first = problems[0];
  const where = first.row > 0 ? `row ${first.row}${first.column ? `, ${first.column}` : ''}` : first.column ? first.column : 'the file';
  const count = problems.length >= MAX_PROBLEMS ? `at least ${MAX_PROBLEMS} problems (the first ${MAX_PROBLEMS} are listed)` : `${problems.length} problem${problems.length > 1 ? 's' : ''}`;
  return new ApiError(400, 'invalid_ephemeris', `The file was refused, nothing was kept: ${count}; first, ${where}: ${first.message}.`, problems);
}

export const spoolPathFor = (uploadsDir: string): string => path.join(uploadsDir, `${randomUUID()}.points`);

/** How the file will be read, from the upload's fields; a frame the body cannot take is a 400. */
export function readSetupFor(mission: MissionRow, fields: EphemerisUploadFields): ReadSetup {
  const body = getBody(mission.bodyId);
  let declaredFrame: string | null = null;
  if (fields.frame) {
    const checked = checkFrame(body, fields.frame);
    if ('refused' in checked) throw badRequest(`frame: ${checked.refused}.`, [{ path: 'frame', message: checked.refused }]);
    declaredFrame = checked.frame;
  }
  return { body, declaredFrame, epochMs: fields.epoch ? parseEpochMs(fields.epoch) : null };
}

/**
 * The setup from the fields that came before the file in the form, or null when they would not
 * do (the file may then still be read from disk once every field is in).
 */
export function earlyReadSetup(mission: MissionRow, early: Record<string, unknown>): ReadSetup | null {
  const fields = ephemerisUploadFields.safeParse(early);
  if (!fields.success) return null;
  try {
    return readSetupFor(mission, fields.data);
  } catch {
    return null;
  }
}

/**
 * Receives the upload and reads it. The file is read while it arrives when the fields it depends
 * on (frame, epoch) came before it, as Eclipta's upload screen and the README's curl example send them;
 * if they came after it, or differ from what the early read assumed, the stored file is read
 * again from disk with the final fields. Either way the answer is the same.
 */
export async function receiveEphemeris(ctx: AppContext, req: Request, res: Response, mission: MissionRow, userId: string): Promise<EphemerisRow> {
  const written: string[] = [];
  const readers: EphemerisReader[] = [];
  const newReader = (setup: ReadSetup): EphemerisReader => {
    const spoolPath = spoolPathFor(uploadsDir(ctx.config));
    written.push(spoolPath);
    const reader = new EphemerisReader(setup, spoolPath);
    readers.push(reader);
    return reader;
  };
  try {
    const upload = await receiveUpload(ctx.config, req, res, written, (early) => {
      const setup = earlyReadSetup(mission, early);
      return setup ? newReader(setup) : null;
    });
    if (!upload.file) throw badRequest('Send the ephemeris as multipart/form-data with the file in the field "file".', [{ path: 'file', message: 'no file' }]);
    const fields = parse(ephemerisUploadFields, upload.fields);
    const setup = readSetupFor(mission, fields);
    let reader = readers.find((r) => sameSetup(r.setup, setup));
    if (!reader) {
      reader = newReader(setup);
      // 256 KiB reads: a quarter as many chunks through the hash and csv-parse as the 64 KiB default.
      await pipeline(createReadStream(upload.file.path, { highWaterMark: 256 * 1024 }), reader);
    }
    return storeRead(ctx, { mission, userId, file: upload.file, fields, read: await reader.result });
  } finally {
    // Accepted or refused, the uploaded bytes are never kept: the points are in the database.
    for (const reader of readers) reader.close();
    for (const file of written) rmSync(file, { force: true });
  }
}

/** The read file to the database, or its refusal. */
function storeRead(ctx: AppContext, request: IngestRequest): EphemerisRow {
  const { mission, file, fields, read } = request;
  if ('refused' in read.sniffed) throw refusal([{ row: 0, message: read.sniffed.refused }]);
  if (!read.checker) {
    throw badRequest('frame: a CSV ephemeris needs its frame declared with the upload (EME2000, J2000, ICRF or GCRF).', [{ path: 'frame', message: 'give the inertial frame of the positions' }]);
  }
  const stats = read.checker.finish();
  if (!stats || !read.checker.clean) throw refusal(read.checker.problems);
  const fileName = displayFileName(file.originalName);
  const name = fields.name || read.objectName || fileName.replace(/\.[^.]+$/, '') || 'ephemeris';
  return storeEphemeris(ctx, request, read.spool, {
    missionId: mission.id,
    name: name.slice(0, 120),
    frame: read.frame ?? 'ICRF',
    format: read.sniffed.format,
    rows: stats.rows,
    startEpoch: epochText(stats.startMs),
    endEpoch: epochText(stats.endMs),
    stepS: stats.stepS,
    minAltitudeKm: stats.minAltitudeKm,
    maxAltitudeKm: stats.maxAltitudeKm,
    hasVelocity: stats.hasVelocity,
    sha256: read.sha256,
    fileName,
    createdBy: request.userId,
  });
}

type NewEphemeris = typeof ephemerides.$inferInsert;

/** The metadata row and the spooled points, one block a statement, in one transaction. */
function storeEphemeris(ctx: AppContext, request: IngestRequest, spool: PointSpool, values: NewEphemeris): EphemerisRow {
  return ctx.db.transaction((tx) => {
    const row = tx.insert(ephemerides).values(values).returning().get();
    // One statement prepared for the transaction, run once a block (4,096 points).
    const insertBlock = tx
      .insert(ephemerisPointBlocks)
      .values({
        ephemerisId: sql.placeholder('ephemerisId'),
        block: sql.placeholder('block'),
        firstSeq: sql.placeholder('firstSeq'),
        points: sql.placeholder('points'),
        data: sql.placeholder('data'),
      })
      .prepare();
    let block = 0;
    let firstSeq = 0;
    spool.forEachChunk((chunk, points) => {
      insertBlock.run({ ephemerisId: row.id, block: block++, firstSeq, points, data: packPoints(chunk, points) });
      firstSeq += points;
    });
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
