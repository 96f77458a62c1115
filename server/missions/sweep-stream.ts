// Writes a mission sweep as it is computed: NDJSON lines (start, one per day, end) or CSV rows, a
// chunk of days at a time (every CSV row ends with the caution column) with a turn of the event loop between chunks, so other requests are
// served meanwhile; stops computing when the client goes away.
import type { Response } from 'express';
import type { SweepDay, SweepLine } from '../../shared/api/missions';
import { cautionFor } from '../../shared/api/caution';
import { csvRecord } from '../../shared/csv/csv-cell';
import type { Logger } from '../logger';
import type { MissionSurface } from './saved-environment';
import type { SweepPlan } from './sweep-days';
import { drained } from '../http/answer-body';

// About 40 ms of computing on one core per chunk at SWEEP_STEPS with a few surfaces (measured).
const DAYS_PER_CHUNK = 120;

export type SweepFormat = 'ndjson' | 'csv';


export function csvHeader(surfaces: readonly MissionSurface[]): string {
  return csvRecord([
    'date (UTC, sampled 12:00)',
    'beta (deg)',
    'eclipse fraction (0-1)',
    'eclipse duration (s)',
    'solar distance (AU)',
    'solar flux (W/m^2)',
    ...surfaces.map((s) => `${s.label.name} absorbed, orbit average (W)`),
    'phase',
    'longest shadow (s)',
    'longest shadow cast by',
    'caution',
  ]);
}

const csvDay = (day: SweepDay, caution: string): string =>
  csvRecord([
    day.date,
    day.betaDeg,
    day.eclipseFraction,
    day.eclipseDurationS,
    day.solarDistanceAu,
    day.solarFluxWm2,
    ...day.surfaces.map((s) => s.absorbedW),
    day.phase ?? '',
    day.longestShadowS,
    day.longestShadowCastBy.join(' and '),
    caution,
  ]);

const ndjson = (line: SweepLine): string => JSON.stringify(line) + '\n';

/** A file name safe in a Content-Disposition header: letters, digits, dots, dashes. */
export function csvFileName(...parts: string[]): string {
  const base = parts
    .map((p) => p.normalize('NFKD').replace(/[^A-Za-z0-9.]+/g, '-').replace(/^-+|-+$/g, ''))
    .filter((p) => p !== '')
    .join('_');
  return `${base || 'sweep'}.csv`;
}

export interface SweepStream {
  res: Response;
  logger: Logger;
  plan: SweepPlan;
  surfaces: readonly MissionSurface[];
  format: SweepFormat;
  fileName: string;
  /** A crewed vehicle's CSV rows carry the crewed sentence of the caution too. */
  crewed: boolean;
  computeDays: (first: number, count: number) => SweepDay[];
  assumptions: string[];
  /** The mission's phases with their modes, named on the start line. */
  phases?: { name: string; startDate: string; endDate: string; modeName: string }[];
}

const nextTurn = (): Promise<void> => new Promise((resolve) => setImmediate(resolve));

export async function streamSweep({ res, logger, plan, surfaces, format, fileName, crewed, computeDays, assumptions, phases }: SweepStream): Promise<void> {
  // res 'close' fires when the connection ends, finished or not; req 'close' can fire as soon as
  // the (empty) request body has been read, so it would not tell a departed client apart.
  let gone = false;
  const caution = cautionFor(crewed);
  res.on('close', () => {
    if (!res.writableFinished) gone = true;
  });
  res.status(200);
  res.set('Cache-Control', 'no-store');
  if (format === 'csv') {
    res.type('text/csv; charset=utf-8');
    res.attachment(fileName);
    res.write(csvHeader(surfaces));
  } else {
    res.type('application/x-ndjson; charset=utf-8');
    res.write(ndjson({ type: 'start', days: plan.days, from: plan.from, to: plan.to, stepDays: plan.stepDays, assumptions, ...(phases && phases.length > 0 ? { phases } : {}) }));
  }
  res.flush?.();

  for (let start = 0; start < plan.days; start += DAYS_PER_CHUNK) {
    if (gone) {
      logger.debug('mission sweep stopped: the client left', { daysWritten: start, days: plan.days });
      return;
    }
    let chunk = '';
    try {
      for (const day of computeDays(start, Math.min(DAYS_PER_CHUNK, plan.days - start))) {
        chunk += format === 'csv' ? csvDay(day, caution) : ndjson(day);
      }
    } catch (error) {
      // The 200 and part of the answer are out; the failure can only be told in the stream.
      logger.error('mission sweep failed', { error: error instanceof Error ? error : String(error), day: start });
      if (format === 'ndjson') res.end(ndjson({ type: 'error', message: `The sweep failed on the server near day ${start}; the error was logged.` }));
      else res.destroy();
      return;
    }
    const more = res.write(chunk);
    // Under compression (server/http/answer-compression.ts) the chunk leaves now, not when the compressor's buffer fills.
    res.flush?.();
    if (!more) await drained(res, res);
    await nextTurn();
  }
  if (gone) return;
  res.end(format === 'ndjson' ? ndjson({ type: 'end', days: plan.days }) : undefined);
}

/** Every day of a sweep in one list, computed a chunk at a time with a turn of the event loop between chunks. */
export async function collectSweep(plan: SweepPlan, computeDays: (first: number, count: number) => SweepDay[]): Promise<Omit<SweepDay, 'type'>[]> {
  const days: Omit<SweepDay, 'type'>[] = [];
  for (let start = 0; start < plan.days; start += DAYS_PER_CHUNK) {
    for (const { type: _line, ...day } of computeDays(start, Math.min(DAYS_PER_CHUNK, plan.days - start))) days.push(day);
    await nextTurn();
  }
  return days;
}
