// The three forms of a per-step answer (API.md "Answer formats"): the JSON each route has always
// answered (the default); columnar JSON with ?layout=columns, where a list of per-step objects
// becomes one array per quantity and a per-surface list inside each step becomes one entry per
// surface holding an array per quantity, names and units unchanged; and an Apache Arrow IPC stream
// when the request's Accept names application/vnd.apache.arrow.stream: the same columns as a table
// (a per-surface quantity is the column "<surface name>.<quantity>"), every other field of the
// answer as schema metadata (text as it is, anything else as JSON).
import type { Request, Response } from 'express';
import { Float64, RecordBatch, Schema, Table, Utf8, makeVector, tableToIPC, vectorFromArray, type Vector } from 'apache-arrow';
import { answerLayoutQuery } from '../../shared/api/answer-formats';
import { parse } from '../errors';
import { sendJson } from '../json-stream';

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

function arrowVector(values: unknown[] | Float64Array): Vector {
  // A copy of its own: the IPC writer is markedly slower on views into one large buffer (measured).
  if (values instanceof Float64Array) return makeVector(values.slice());
  if (values.some((v) => typeof v === 'string')) return vectorFromArray(values.map((v) => (v === null ? null : String(v))), new Utf8());
  return vectorFromArray(values.map((v) => (typeof v === 'number' ? v : typeof v === 'boolean' ? Number(v) : null)), new Float64());
}

const metadataText = (value: unknown): string => (typeof value === 'string' ? value : JSON.stringify(value));

/**
 * An Arrow IPC stream of a columnar answer: the columns of `answer[key]` (as many rows as its
 * `stepKey` array) as the table, every other field as schema metadata under its own name, and what
 * is left of `answer[key]` (e.g. the surfaces' ids) as JSON under `key`.
 */
export function arrowAnswer(answer: Plain, key: string, stepKey: string): Uint8Array {
  const container = answer[key];
  if (!isPlain(container)) throw new Error(`the answer has no columns at ${key}`);
  const steps = (container[stepKey] as unknown[] | undefined)?.length ?? 0;
  const { columns, rest } = extractColumns(container, steps);
  const metadata = new Map<string, string>();
  for (const [field, value] of Object.entries(answer)) if (field !== key) metadata.set(field, metadataText(value));
  if (isPlain(rest) && Object.keys(rest).length > 0) metadata.set(key, JSON.stringify(rest));
  const vectors: Record<string, Vector> = {};
  for (const [name, values] of columns) vectors[name] = arrowVector(values);
  const built = new Table(vectors);
  const schema = new Schema(built.schema.fields, metadata);
  return tableToIPC(new Table(schema, built.batches.map((b) => new RecordBatch(schema, b.data))), 'stream');
}

/** A copy with every Float64Array as a plain array, for JSON.stringify (which would write an object). */
function plainArrays(value: unknown): unknown {
  if (value instanceof Float64Array) return Array.from(value);
  if (Array.isArray(value)) return value.map(plainArrays);
  if (isPlain(value)) return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, plainArrays(v)]));
  return value;
}

export interface PerStepAnswer<T extends object> {
  /** The default JSON as bytes, when the route can write them faster than JSON.stringify of the object. */
  json?: () => Buffer;
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
 * Sends a per-step answer in the form the request asks for. JSON built from objects is written a
 * batch at a time (`sendJson`), so a large answer never becomes one string in memory.
 */
export async function sendPerStep<T extends object>(res: Response, form: AnswerForm, spec: PerStepAnswer<T>, status = 200): Promise<void> {
  res.status(status);
  if (form === 'json') {
    if (spec.json) res.type('application/json; charset=utf-8').send(spec.json());
    else await sendJson(res, spec.answer());
    return;
  }
  const columnar = spec.columns?.() ?? columnarAnswer(spec.answer(), spec.key);
  if (form === 'columns') {
    await sendJson(res, plainArrays(columnar));
    return;
  }
  const stream = arrowAnswer(columnar, spec.key, spec.stepKey);
  res.type(ARROW_STREAM).send(Buffer.from(stream.buffer, stream.byteOffset, stream.byteLength));
}
