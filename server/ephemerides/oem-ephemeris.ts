// CCSDS Orbit Ephemeris Message in its plain-text (KVN) form, read line by line with readline:
// the header (CCSDS_OEM_VERS first), META_START…META_STOP blocks with OBJECT_NAME, CENTER_NAME,
// REF_FRAME, TIME_SYSTEM, START_TIME, STOP_TIME, then data lines "epoch X Y Z X_DOT Y_DOT Z_DOT"
// (km, km/s; three accelerations may follow and are ignored). COMMENT lines and covariance blocks
// are skipped. Source: CCSDS 502.0-B (OEM), the KVN layout as DOMAIN.md "Ephemerides" describes it.
import { createInterface } from 'node:readline';
import type { Readable } from 'node:stream';
import type { Body } from '../../shared/physics/bodies';
import type { EphemerisChecker } from './ephemeris-checker';
import { centreMatches, checkFrame } from './ephemeris-frames';
import { parseEpochMs } from './epoch-text';

const requiredMeta = ['OBJECT_NAME', 'CENTER_NAME', 'REF_FRAME', 'TIME_SYSTEM', 'START_TIME', 'STOP_TIME'] as const;
const dataColumns = ['EPOCH', 'X', 'Y', 'Z', 'X_DOT', 'Y_DOT', 'Z_DOT'];

export interface OemMetadata {
  objectName: string | null;
  frame: string | null;
}

interface Segment {
  startMs: number | null;
  stopMs: number | null;
}

/** Feeds the OEM's data lines to the checker and answers what its metadata said. */
export async function readOemEphemeris(input: Readable, checker: EphemerisChecker, body: Body, declaredFrame: string | null): Promise<OemMetadata> {
  const lines = createInterface({ input, crlfDelay: Infinity });
  const result: OemMetadata = { objectName: null, frame: null };
  let state: 'start' | 'header' | 'meta' | 'data' | 'covariance' = 'start';
  let meta = new Map<string, string>();
  let segment: Segment = { startMs: null, stopMs: null };
  let row = 0;
  try {
    for await (const raw of lines) {
      const line = (state === 'start' ? raw.replace(/^\uFEFF/, '') : raw).trim();
      if (line === '' || line.startsWith('COMMENT')) continue;
      if (state === 'start') {
        if (!/^CCSDS_OEM_VERS\s*=\s*\S+/.test(line)) checker.problem(0, 'CCSDS_OEM_VERS', line, 'an OEM file starts with CCSDS_OEM_VERS = <version>');
        state = 'header';
        continue;
      }
      if (line === 'META_START') {
        state = 'meta';
        meta = new Map();
        continue;
      }
      if (line === 'META_STOP') {
        segment = checkMeta(meta, checker, body, declaredFrame, result);
        state = 'data';
        continue;
      }
      if (line === 'COVARIANCE_START') { state = 'covariance'; continue; }
      if (line === 'COVARIANCE_STOP') { state = 'data'; continue; }
      if (state === 'covariance') continue;
      if (state === 'header' || state === 'meta') {
        const kv = /^([A-Z_0-9]+)\s*=\s*(.*)$/.exec(line);
        if (!kv) checker.problem(0, undefined, line, state === 'header' ? 'this header line is not KEY = value, and no META_START came before data' : 'this metadata line is not KEY = value');
        else if (state === 'meta') meta.set(kv[1], kv[2].trim());
      } else {
        row++;
        readDataLine(row, line, checker, segment);
      }
      if (checker.full) return result;
    }
    if (state === 'meta') checker.problem(0, 'META_STOP', undefined, 'the metadata block has no META_STOP');
    else if (row === 0 && state !== 'data' && checker.clean) checker.problem(0, 'META_START', undefined, 'no META_START…META_STOP block and no data lines');
    return result;
  } finally {
    lines.close();
  }
}

function checkMeta(meta: Map<string, string>, checker: EphemerisChecker, body: Body, declaredFrame: string | null, result: OemMetadata): Segment {
  for (const key of requiredMeta) if (!meta.get(key)) checker.problem(0, key, undefined, `the metadata block has no ${key}`);
  const centre = meta.get('CENTER_NAME');
  if (centre && !centreMatches(body, centre)) {
    checker.problem(0, 'CENTER_NAME', centre, `the trajectory is centred on ${centre}, but this mission is about ${body.name}`);
  }
  const frame = meta.get('REF_FRAME');
  if (frame) {
    const checked = checkFrame(body, frame);
    if ('refused' in checked) checker.problem(0, 'REF_FRAME', frame, checked.refused);
    else if (declaredFrame && declaredFrame.trim().toUpperCase() !== checked.frame) {
      checker.problem(0, 'REF_FRAME', frame, `the file says ${checked.frame} but the upload declared ${declaredFrame}`);
    } else result.frame = checked.frame;
  }
  const timeSystem = meta.get('TIME_SYSTEM');
  if (timeSystem && timeSystem.toUpperCase() !== 'UTC') {
    checker.problem(0, 'TIME_SYSTEM', timeSystem, `Eclipta reads UTC epochs only; this file's are ${timeSystem}: convert it to UTC first`);
  }
  result.objectName ??= meta.get('OBJECT_NAME') ?? null;
  const bound = (key: string): number | null => {
    const text = meta.get(key);
    if (!text) return null;
    const ms = parseEpochMs(text);
    if (ms === null) checker.problem(0, key, text, 'not an epoch like 2027-03-20T12:00:00.000');
    return ms;
  };
  return { startMs: bound('START_TIME'), stopMs: bound('STOP_TIME') };
}

function readDataLine(row: number, line: string, checker: EphemerisChecker, segment: Segment): void {
  const cells = line.split(/\s+/);
  if (cells.length !== 7 && cells.length !== 10) {
    const message = cells.length < 7
      ? `missing column: ${dataColumns.slice(cells.length).join(', ')} (a data line is epoch X Y Z X_DOT Y_DOT Z_DOT; found ${cells.length} values)`
      : `extra column: a data line is epoch X Y Z X_DOT Y_DOT Z_DOT (and optionally three accelerations); found ${cells.length} values`;
    checker.problem(row, cells.length < 7 ? dataColumns[cells.length] : undefined, undefined, message);
    return;
  }
  const tMs = parseEpochMs(cells[0]);
  if (tMs === null) checker.problem(row, 'EPOCH', cells[0], 'not an epoch like 2027-03-20T12:00:00.000');
  else if ((segment.startMs !== null && tMs < segment.startMs - 0.5) || (segment.stopMs !== null && tMs > segment.stopMs + 0.5)) {
    checker.problem(row, 'EPOCH', cells[0], 'outside the START_TIME…STOP_TIME of its metadata block');
  }
  const [x, y, z, vx, vy, vz] = [1, 2, 3, 4, 5, 6].map((i) => checker.number(row, dataColumns[i], cells[i]));
  checker.point(row, 'EPOCH', cells[0], tMs, x, y, z, true, vx, vy, vz);
}
