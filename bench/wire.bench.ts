// What a user or a script receives (issue 16), each figure beside its anchor measured in the same
// run, against one real server process (bench-server.ts) that also serves the built client:
// (a) one orbit of 3600 steps x 20 surfaces through POST /environment/compute end to end over HTTP
//     (request, compute, answer, bytes received, decompressed and read into numbers) as plain JSON,
//     compressed JSON, columnar JSON and Apache Arrow, against the numpy reference computing the same
//     orbit (bench/reference/environment.py; target: columnar or Arrow at most 4x numpy's time);
// (b) the JavaScript the first page load fetches (the scripts index.html names) in bytes on the
//     wire, against the 200 kB target, built from dist/client/browser (`npm run build:client` first);
// (c) a 1,000,000-row ephemeris CSV uploaded and stored, against Python's csv module reading the
//     same file into floats and epochs (bench/reference/csv_floats.py; target: at least 1.0x), with
//     the peak resident memory of a fresh server while ingesting (target: under 300 MB).
import { execFile } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, statSync } from 'node:fs';
import http from 'node:http';
import { cpus, loadavg, tmpdir } from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';
import { tableFromIPC } from 'apache-arrow';
import { ingest, median, openSession, resetPeak, root, startServer, statusMb, writeCsv, type Session } from './bench-server';
import type { BenchRow } from './bench-table';
import { caseA, findNumpy, orbitCaseJob, runNumpy } from './environment.bench';

const REPEATS = Number(process.env['ECLIPTA_BENCH_REPEATS'] ?? 15);
const INGEST_ROWS = 1_000_000;
const INGEST_RUNS = Number(process.env['BENCH_RUNS'] ?? 3);
const ARROW = 'application/vnd.apache.arrow.stream';
const agent = new http.Agent({ keepAlive: true });
const execFileAsync = promisify(execFile);

interface Raw {
  status: number;
  headers: http.IncomingHttpHeaders;
  body: Buffer;
}

/** One request; the body as it came over the wire (still compressed). */
function request(url: string, headers: Record<string, string>, body?: string): Promise<Raw> {
  return new Promise((resolve, reject) => {
    const req = http.request(url, { method: body === undefined ? 'GET' : 'POST', headers, agent }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
      res.on('error', reject);
    });
    req.on('error', reject);
    req.end(body);
  });
}

function decoded(raw: Raw): Buffer {
  const encoding = raw.headers['content-encoding'];
  return encoding === 'br' ? brotliDecompressSync(raw.body) : encoding === 'gzip' ? gunzipSync(raw.body) : raw.body;
}

interface Form {
  name: string;
  query: string;
  accept: string;
  encoding: string;
}

const forms: Form[] = [
  { name: 'JSON (default), not compressed', query: '', accept: 'application/json', encoding: 'identity' },
  { name: 'JSON (default), br', query: '', accept: 'application/json', encoding: 'br, gzip' },
  { name: 'JSON (default), gzip', query: '', accept: 'application/json', encoding: 'gzip' },
  { name: 'columnar JSON, br', query: '?layout=columns', accept: 'application/json', encoding: 'br, gzip' },
  { name: 'Arrow IPC stream, not compressed', query: '', accept: ARROW, encoding: 'identity' },
  { name: 'Arrow IPC stream, br', query: '', accept: ARROW, encoding: 'br, gzip' },
];

/** One compute request end to end: sent, answered, received, decompressed, read into numbers. */
async function computeOnce(session: Session, form: Form): Promise<{ ms: number; raw: Raw; columns: boolean }> {
  const { server, cookie } = session;
  const started = performance.now();
  const raw = await request(`${server.url}/api/v1/environment/compute${form.query}`, {
    'content-type': 'application/json', cookie, origin: server.url, accept: form.accept, 'accept-encoding': form.encoding,
  }, JSON.stringify(caseA));
  if (raw.status !== 200) throw new Error(`compute answered ${raw.status}: ${raw.body.toString().slice(0, 200)}`);
  const bytes = decoded(raw);
  const type = String(raw.headers['content-type'] ?? '');
  let columns = true;
  if (type.startsWith(ARROW)) tableFromIPC(bytes).getChildAt(0)?.toArray();
  else columns = !Array.isArray((JSON.parse(bytes.toString('utf8')) as { profile: unknown }).profile);
  return { ms: performance.now() - started, raw, columns };
}

async function computeRows(session: Session): Promise<BenchRow[]> {
  const python = findNumpy();
  const numpy = python ? runNumpy(python, REPEATS, [orbitCaseJob(REPEATS)]).cases[0] : null;
  const rows: BenchRow[] = [];
  for (const form of forms) {
    for (let i = 0; i < 3; i++) await computeOnce(session, form);
    const times: number[] = [];
    let last: Raw | null = null;
    let columns = false;
    for (let i = 0; i < REPEATS; i++) {
      const once = await computeOnce(session, form);
      times.push(once.ms);
      last = once.raw;
      columns = once.columns;
    }
    const type = String(last?.headers['content-type'] ?? '').split(';')[0];
    const wanted = form.accept === ARROW ? ARROW : 'application/json';
    const layoutHonoured = form.query === '' || columns;
    const offered = type === wanted && layoutHonoured;
    const ms = median(times);
    const isDefault = form.query === '' && form.accept !== ARROW;
    rows.push({
      measure: `(a) compute over HTTP, ${form.name}`,
      eclipta: `${ms.toFixed(1)} ms`,
      anchor: numpy ? `numpy ${numpy.medianMs.toFixed(1)} ms` : 'no numpy',
      ratio: numpy ? `${(ms / numpy.medianMs).toFixed(1)}x numpy's time` : '',
      target: isDefault ? (form.encoding === 'identity' ? '' : 'bytes <= 1/5 of uncompressed') : "<= 4x numpy's time",
      'on the wire': `${((last?.body.length ?? 0) / 1e6).toFixed(3)} MB`,
      note: offered ? `${type}${last?.headers['content-encoding'] ? ` + ${String(last.headers['content-encoding'])}` : ''}` : `not offered (answered ${type})`,
    });
  }
  rows.push({
    measure: python ? `    numpy from ${python}; median of ${REPEATS} after 3 warm-ups, each side` : '    numpy: no python3 with numpy on PATH or at /usr/bin/python3',
  });
  return rows;
}

/** The scripts index.html names (script src, modulepreload), fetched as a browser asks for them. */
async function firstLoadRow(session: Session): Promise<BenchRow> {
  const { url } = session.server;
  const encoding = 'br, gzip';
  const index = await request(`${url}/`, { 'accept-encoding': encoding });
  const html = decoded(index).toString('utf8');
  const scripts = [...html.matchAll(/<script[^>]*\ssrc="([^"]+)"|<link[^>]*rel="modulepreload"[^>]*href="([^"]+)"/g)].map((m) => m[1] ?? m[2]);
  let wire = 0;
  let plain = 0;
  let zod = false;
  for (const script of scripts) {
    const raw = await request(`${url}/${script}`, { 'accept-encoding': encoding });
    wire += raw.body.length;
    const text = decoded(raw);
    plain += text.length;
    zod ||= text.includes('ZodError');
  }
  return {
    measure: `(b) first load: the ${scripts.length} scripts index.html loads`,
    eclipta: `${(wire / 1e3).toFixed(1)} kB`,
    anchor: 'target 200 kB',
    ratio: `${(wire / 200e3).toFixed(2)}x target`,
    target: '<= 1.0x',
    'on the wire': `${(wire / 1e3).toFixed(1)} kB (${(plain / 1e3).toFixed(0)} kB uncompressed)`,
    note: `zod among them: ${zod ? 'yes' : 'no'}; index.html encoding ${String(index.headers['content-encoding'] ?? 'none')}`,
  };
}

/** On a server of its own, so its memory peak is the ingest's alone. */
async function ingestRow(dir: string): Promise<BenchRow> {
  const file = path.join(dir, `orbit-${INGEST_ROWS}.csv`);
  writeCsv(file, INGEST_ROWS);
  const server = await startServer(path.join(dir, 'ingest-data'));
  try {
    return await ingestRuns(await openSession(server), file);
  } finally {
    server.child.removeAllListeners('exit');
    server.child.kill('SIGTERM');
  }
}

async function ingestRuns(session: Session, file: string): Promise<BenchRow> {
  const script = path.join(root, 'bench', 'reference', 'csv_floats.py');
  const pid = session.server.child.pid!;
  const idleMb = statusMb(pid, 'VmRSS');
  const peakReset = resetPeak(pid);
  const python: number[] = [];
  const ours: number[] = [];
  for (let run = 0; run < INGEST_RUNS; run++) {
    // Not spawnSync: a blocked event loop would miss the server closing the idle kept-alive socket,
    // and the upload right after would be written into it (EPIPE).
    const { stdout } = await execFileAsync('python3', [script, file], { encoding: 'utf8' });
    python.push((JSON.parse(stdout) as { seconds: number }).seconds);
    ours.push(await ingest(session, file));
  }
  const peakMb = statusMb(pid, 'VmHWM');
  const [ourS, pyS] = [median(ours), median(python)];
  return {
    measure: `(c) ingest ${INGEST_ROWS.toLocaleString('en')} rows (${(statSync(file).size / 1e6).toFixed(0)} MB CSV), upload+store`,
    eclipta: `${ourS.toFixed(2)} s`,
    anchor: `python csv-to-floats ${pyS.toFixed(2)} s`,
    ratio: `${(pyS / ourS).toFixed(2)}x python's speed`,
    target: '>= 1.0x; peak < 300 MB',
    'on the wire': '',
    note: `median of ${INGEST_RUNS}; server RSS idle ${Math.round(idleMb)} MB, ${peakReset ? 'peak while ingesting' : 'peak since start'} ${Math.round(peakMb)} MB`,
  };
}

export default async function wireBench(): Promise<BenchRow[]> {
  const clientDir = path.join(root, 'dist', 'client', 'browser');
  const dir = mkdtempSync(path.join(tmpdir(), 'eclipta-bench-wire-'));
  const server = await startServer(path.join(dir, 'data'), clientDir);
  try {
    const session = await openSession(server);
    const rows = await computeRows(session);
    rows.push(existsSync(path.join(clientDir, 'index.html'))
      ? await firstLoadRow(session)
      : { measure: '(b) first load: skipped, no built client (npm run build:client)' });
    // The compute server stays up (idle) meanwhile: a new one could otherwise get its port, and
    // fetch a kept-alive socket to the old one.
    if (!process.env['ECLIPTA_BENCH_NO_INGEST']) rows.push(await ingestRow(dir));
    rows.push({ measure: `    node ${process.version}, load average ${loadavg()[0].toFixed(1)} on ${cpus().length} cores` });
    return rows;
  } finally {
    server.child.removeAllListeners('exit');
    server.child.kill('SIGTERM');
    agent.destroy();
    rmSync(dir, { recursive: true, force: true });
  }
}
