// The three forms of a per-step answer (API.md "Answer formats"): the JSON each route has always
// answered (the default); columnar JSON with ?layout=columns, where a list of per-step objects
// becomes one array per quantity and a per-surface list inside each step becomes one entry per
// surface holding an array per quantity, names and units unchanged; and an Apache Arrow IPC stream
// when the request's Accept names application/vnd.apache.arrow.stream: the same columns as a table
// (a per-surface quantity is the column "<surface name>.<quantity>"), every other field of the
// answer as schema metadata (text as it is, anything else as JSON).
import type { Request, Response } from 'express';
import { answerLayoutQuery } from '../../shared/api/answer-formats';
import { parse } from '../errors';
import { sendJson } from '../json-stream';
import { sendAnswerBytes } from './answer-body';
import { arrowStream, type ArrowPieces } from './arrow-stream';

export const ARROW_STREAM = 'application/vnd.apache.arrow.stream';

export type AnswerForm = 'json' | 'columns' | 'arrow';

/** The form a request asks for; a layout other than "columns" is a 400 naming it. */
export function answerForm(req: Request, layout?: 'columns'): AnswerForm {
  const accepted = req.headers.accept ? req.accepts(['application/json', ARROW_STREAM]) : 'application/json';
  if (accepted === ARROW_STREAM) return 'arrow';
  const asked = layout ?? parse(answerLayoutQuery, req.query).layout;
  return asked === 'columns' ? 'columns' : 'json';
}

type Plain = Record<string, unknown>;
const isPlain = (v: unknown): v is Plain => typeof v === 'object' && v !== null && !Array.isArray(v);
/** A list of objects each naming what it is (a surface, a node): its entries are kept apart by name. */
const isNamedList = (v: unknown): v is Plain[] => Array.isArray(v) && v.length > 0 && v.every((e) => isPlain(e) && typeof e['name'] === 'string');

/**
 * One array per field of a list of like objects. A field that is a named list in each object (the
 * surfaces of a step) becomes that list once, each entry keeping its text fields (name, ids) and
 * holding an array per other field.
 */
export function rowsToColumns(rows: readonly Plain[]): Plain {
  const out: Plain = {};
  if (rows.length === 0) return out;
  for (const key of Object.keys(rows[0])) {
    const first = rows[0][key];
    if (isNamedList(first)) {
      out[key] = first.map((entry, j) => {
        const column: Plain = {};
        for (const [field, value] of Object.entries(entry)) {
          column[field] = typeof value === 'string' ? value : rows.map((r) => (r[key] as Plain[])[j]?.[field] ?? null);
        }
        return column;
      });
    } else {
      out[key] = rows.map((r) => r[key] ?? null);
    }
  }
  return out;
}

/** The answer with its per-step list at `key` in columns (an answer already in columns stays as it is). */
export function columnarAnswer<T extends object>(answer: T, key: keyof T & string): Plain {
  const rows = answer[key];
  return Array.isArray(rows) ? { ...answer, [key]: rowsToColumns(rows as Plain[]) } : { ...(answer as Plain) };
}

interface Extracted {
  columns: Map<string, unknown[] | Float64Array>;
  /** What is left of the container once its columns are taken out. */
  rest: unknown;
}

const isColumn = (v: unknown, steps: number): v is unknown[] | Float64Array =>
  (Array.isArray(v) || v instanceof Float64Array) && v.length === steps && (v.length === 0 || typeof v[0] !== 'object' || v[0] === null);

/**
 * The step columns of a columnar container: its own arrays of `steps` values, and those of its
 * named lists (directly in an entry, or one object down: a case export's `series`) as "<name>.<field>".
 */
function extractColumns(container: Plain, steps: number): Extracted {
  const columns = new Map<string, unknown[] | Float64Array>();
  const rest: Plain = {};
  for (const [key, value] of Object.entries(container)) {
    if (isColumn(value, steps)) {
      columns.set(key, value);
    } else if (isNamedList(value)) {
      rest[key] = value.map((entry) => {
        const left: Plain = {};
        for (const [field, inner] of Object.entries(entry)) {
          if (isColumn(inner, steps)) {
            columns.set(`${String(entry['name'])}.${field}`, inner);
          } else if (isPlain(inner) && Object.values(inner).some((v) => isColumn(v, steps))) {
            const innerLeft: Plain = {};
            for (const [k, v] of Object.entries(inner)) {
              if (isColumn(v, steps)) columns.set(`${String(entry['name'])}.${k}`, v);
              else innerLeft[k] = v;
            }
            if (Object.keys(innerLeft).length > 0) left[field] = innerLeft;
          } else {
            left[field] = inner;
          }
        }
        return left;
      });
    } else {
      rest[key] = value;
    }
  }
  return { columns, rest };
}

const metadataText = (value: unknown): string => (typeof value === 'string' ? value : JSON.stringify(value));

/**
 * An Arrow IPC stream of a columnar answer: the columns of `answer[key]` (as many rows as its
 * `stepKey` array) as the table, every other field as schema metadata under its own name, and what
 * is left of `answer[key]` (e.g. the surfaces' ids) as JSON under `key`.
 */
export function arrowAnswer(answer: Plain, key: string, stepKey: string): ArrowPieces {
  const container = answer[key];
  if (!isPlain(container)) throw new Error(`the answer has no columns at ${key}`);
  const steps = (container[stepKey] as unknown[] | undefined)?.length ?? 0;
  const { columns, rest } = extractColumns(container, steps);
  const metadata = new Map<string, string>();
  for (const [field, value] of Object.entries(answer)) if (field !== key) metadata.set(field, metadataText(value));
  if (isPlain(rest) && Object.keys(rest).length > 0) metadata.set(key, JSON.stringify(rest));
  return arrowStream(columns, metadata, steps);
}

export interface PerStepAnswer<T extends object> {
  /** The default JSON in pieces (and about how many bytes), when the route can write them faster than JSON.stringify of the object. */
  json?: () => { pieces: Iterable<Uint8Array>; byteLength: number };
  /** The answer in its default shape (built only when needed). */
  answer: () => T;
  /** The columnar form straight from the route's own columns (Float64Arrays welcome), instead of from `answer`. */
  columns?: () => Plain;
  /** The per-step list (or, for an answer already in columns, the object holding the columns). */
  key: keyof T & string;
  /** The field of the columns counting the steps (tS, epoch, date). */
  stepKey: string;
}

/**
 * Sends a per-step answer in the form the request asks for, piece by piece and compressed as the
 * request accepts (answer-body.ts): JSON built from objects a batch of steps at a time
 * (json-stream.ts), so a large answer never becomes one string in memory.
 */
export async function sendPerStep<T extends object>(res: Response, form: AnswerForm, spec: PerStepAnswer<T>, status = 200): Promise<void> {
  res.status(status);
  if (form === 'json') {
    if (spec.json) await sendAnswerBytes(res, { type: 'application/json; charset=utf-8', ...spec.json(), exact: false });
    else await sendJson(res, spec.answer());
    return;
  }
  const columnar = spec.columns?.() ?? columnarAnswer(spec.answer(), spec.key);
  if (form === 'columns') {
    await sendJson(res, columnar);
    return;
  }
  const stream = arrowAnswer(columnar, spec.key, spec.stepKey);
  await sendAnswerBytes(res, { type: ARROW_STREAM, pieces: stream.pieces, byteLength: stream.byteLength, exact: true });
}
