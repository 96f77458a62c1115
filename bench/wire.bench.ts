// What a user or a script receives (issue 16), each figure beside its anchor measured in the same
// run, against one real server process (bench-server.ts) that also serves the built client:
// (a) one orbit of 3600 steps x 20 surfaces through POST /environment/compute end to end over HTTP
//     (request, compute, answer, bytes received and decompressed as they arrive, read into numbers) as plain JSON,
//     compressed JSON, columnar JSON and Apache Arrow, against the numpy reference computing the same
//     orbit (bench/reference/environment.py; target: columnar or Arrow at most 4x numpy's time); the
//     compressed default JSON against the answer as it was when issue 16 was filed, timed alike in
//     the same run (bench/issue16-anchor-route.ts: the issue's "today", whose bytes the compressed
//     JSON must cut to a fifth and whose time it must not exceed);
// (b) the JavaScript the first page load fetches (the scripts index.html names and all they import
//     statically, scripts/initial-modules.mjs) in bytes on the
//     wire, against the 200 kB target, built from dist/client/browser (built first when stale), and
// (b') the first contentful paint of the sign-in page in Chromium (Playwright), against 0.5 s;
// (c) a 1,000,000-row ephemeris CSV uploaded and stored, against Python's csv module reading the
//     same file into floats and epochs (bench/reference/csv_floats.py; target: at least 1.0x), with
//     the peak resident memory of a fresh server while ingesting (target: under 300 MB).
import { execFile } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, statSync } from 'node:fs';
import http from 'node:http';
import { cpus, loadavg, tmpdir } from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import type { Readable } from 'node:stream';
import { brotliDecompressSync, createBrotliDecompress, createGunzip, gunzipSync } from 'node:zlib';
import { tableFromIPC } from 'apache-arrow';
// @ts-expect-error -- a plain .mjs script of the build, without types
import { buildClientIfStale } from '../scripts/client-build.mjs';
// @ts-expect-error -- a plain .mjs script of the build, without types
import { initialModules } from '../scripts/initial-modules.mjs';
import { ingest, ISSUE16_ANCHOR_PATH, median, openSession, processCpuMs, resetPeak, root, startServer, statusMb, writeCsv, type Session } from './bench-server';
import type { BenchRow } from './bench-table';
import { caseA, findNumpy, orbitCaseJob, runNumpy } from './environment.bench';

const REPEATS = Number(process.env['ECLIPTA_BENCH_REPEATS'] ?? 15);
const INGEST_ROWS = 1_000_000;
const INGEST_RUNS = Number(process.env['BENCH_RUNS'] ?? 3);
const PAINT_RUNS = 5;
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
  /** Accept-Encoding; '' sends none. */
  encoding: string;
  /** Another path than the compute route's (the bench-only anchor's). */
  path?: string;
  /** The compressed JSON's anchor: the answer as before issue 16. */
  anchor?: true;
}

/**
 * The anchor of the compressed default JSON, in the issue's own words: "JSON default: at most one
 * fifth of today's bytes on the wire when the client accepts compression, and no slower end to end
 * than today (serialise without building 72,000 objects first)". "Today" is the route as the issue
 * found it (8.46 MB of uncompressed JSON): the same compute, the 72,000 per-step objects built and
 * sent as one JSON.stringify, uncompressed. The bench-only route of bench/issue16-anchor-route.ts
 * answers exactly that on the same server, through the same dispatcher, sign-in and body parsing,
 * asked with no Accept-Encoding as nothing then compressed; it is timed like every other form (end
 * to end, request to numbers read, the forms taking turns).
 */
export const anchorForm: Form = {
  name: 'JSON as before issue 16 (72,000 objects, one JSON.stringify, not compressed)', query: '', accept: 'application/json', encoding: '',
  path: ISSUE16_ANCHOR_PATH, anchor: true,
};

export const forms: Form[] = [
  anchorForm,
  { name: 'JSON (default), not compressed', query: '', accept: 'application/json', encoding: 'identity' },
  { name: 'JSON (default), br', query: '', accept: 'application/json', encoding: 'br, gzip' },
  { name: 'JSON (default), gzip', query: '', accept: 'application/json', encoding: 'gzip' },
  { name: 'columnar JSON, not compressed', query: '?layout=columns', accept: 'application/json', encoding: 'identity' },
  { name: 'columnar JSON, br', query: '?layout=columns', accept: 'application/json', encoding: 'br, gzip' },
  { name: 'Arrow IPC stream, not compressed', query: '', accept: ARROW, encoding: 'identity' },
  { name: 'Arrow IPC stream, br', query: '', accept: ARROW, encoding: 'br, gzip' },
];

interface Once {
  ms: number;
  wireBytes: number;
  headers: http.IncomingHttpHeaders;
  columns: boolean;
}

/**
 * One compute request end to end as a script's HTTP client would do it: sent, answered, received
 * and decompressed as the bytes arrive (as fetch and browsers do), then read into numbers
 * (JSON.parse, or apache-arrow's tableFromIPC with every column as a Float64Array).
 */
function computeOnce(session: Session, form: Form): Promise<Once> {
  const { server, cookie } = session;
  const started = performance.now();
  return new Promise((resolve, reject) => {
    const req = http.request(`${server.url}${form.path ?? '/api/v1/environment/compute'}${form.query}`, {
      method: 'POST', agent,
      headers: { 'content-type': 'application/json', cookie, origin: server.url, accept: form.accept, ...(form.encoding ? { 'accept-encoding': form.encoding } : {}) },
    }, (res) => {
      let wireBytes = 0;
      res.on('data', (c: Buffer) => (wireBytes += c.length));
      const encoding = res.headers['content-encoding'];
      const body: Readable = encoding === 'br' ? res.pipe(createBrotliDecompress({ chunkSize: 256 * 1024 }))
        : encoding === 'gzip' ? res.pipe(createGunzip({ chunkSize: 256 * 1024 })) : res;
      const chunks: Buffer[] = [];
      body.on('data', (c: Buffer) => chunks.push(c));
      body.on('error', reject);
      body.on('end', () => {
        const bytes = Buffer.concat(chunks);
        if (res.statusCode !== 200) {
          reject(new Error(`compute answered ${res.statusCode}: ${bytes.toString().slice(0, 200)}`));
          return;
        }
        let columns = true;
        if (String(res.headers['content-type'] ?? '').startsWith(ARROW)) {
          const table = tableFromIPC(bytes);
          for (const field of table.schema.fields) table.getChild(field.name)?.toArray();
        } else {
          columns = !Array.isArray((JSON.parse(bytes.toString('utf8')) as { profile: unknown }).profile);
        }
        resolve({ ms: performance.now() - started, wireBytes, headers: res.headers, columns });
      });
    });
    req.on('error', reject);
    req.end(JSON.stringify(caseA));
  });
}

export interface ComputeFigure {
  form: Form;
  ms: number;
  wireBytes: number;
  /** The media type and coding answered, and whether they are what was asked for. */
  answered: string;
  offered: boolean;
  /**
   * CPU time per request, the server's (every thread: formatting, compressing) and this client's
   * (receiving, decompressing, reading), over the timed requests: on this shared machine the wall
   * clock stretches with the other users' load, the CPU time much less.
   */
  serverCpuMs: number;
  clientCpuMs: number;
}

export interface ComputeFigures {
  python: string | null;
  numpyMs: number | null;
  figures: ComputeFigure[];
}

/** Requests of one form in a row before the next form's turn. */
const BLOCK = 5;

/** Requests of each form before timing: a long-running server's JIT has compiled the path (numpy needs none). */
const WARM_UPS = 10;

/**
 * Every form, REPEATS times each after WARM_UPS warm-ups, the forms taking turns in blocks of BLOCK so
 * drift hits them alike while a form is not timed among the garbage of another's 8 MB answers at
 * every request (as a script asking for one form over and over would not be).
 */
export async function measureCompute(session: Session): Promise<ComputeFigures> {
  const python = findNumpy();
  const numpy = python ? runNumpy(python, REPEATS, [orbitCaseJob(REPEATS)]).cases[0] : null;
  for (let i = 0; i < WARM_UPS; i++) for (const form of forms) await computeOnce(session, form);
  const times = forms.map(() => [] as number[]);
  const last: (Once | null)[] = forms.map(() => null);
  const serverCpu = forms.map(() => 0);
  const clientCpu = forms.map(() => 0);
  const pid = session.server.child.pid!;
  for (let done = 0; done < REPEATS; done += BLOCK) {
    for (const [f, form] of forms.entries()) {
      const [server, client] = [processCpuMs(pid), process.cpuUsage()];
      for (let i = done; i < Math.min(REPEATS, done + BLOCK); i++) {
        const once = await computeOnce(session, form);
        times[f].push(once.ms);
        last[f] = once;
      }
      serverCpu[f] += processCpuMs(pid) - server;
      const used = process.cpuUsage(client);
      clientCpu[f] += (used.user + used.system) / 1000;
    }
  }
  const figures = forms.map((form, f): ComputeFigure => {
    const once = last[f]!;
    const type = String(once.headers['content-type'] ?? '').split(';')[0];
    const wanted = form.accept === ARROW ? ARROW : 'application/json';
    const coding = once.headers['content-encoding'];
    const codingOk = form.encoding === 'identity' || form.encoding === '' ? !coding : coding === form.encoding.split(',')[0];
    return {
      form, ms: median(times[f]), wireBytes: once.wireBytes,
      answered: `${type}${coding ? ` + ${String(coding)}` : ''}`,
      offered: type === wanted && (form.query === '' || once.columns) && codingOk,
      serverCpuMs: serverCpu[f] / REPEATS, clientCpuMs: clientCpu[f] / REPEATS,
    };
  });
  return { python, numpyMs: numpy?.medianMs ?? null, figures };
}

/** The default JSON's figures beside their anchors: the answer as before issue 16, and today's plain JSON. */
export function defaultJsonFigures(figures: ComputeFigure[]): { anchor: ComputeFigure; plain: ComputeFigure } {
  const anchor = figures.find((f) => f.form.anchor)!;
  const plain = figures.find((f) => isDefaultJson(f.form) && f.form.encoding === 'identity')!;
  return { anchor, plain };
}

/** The default JSON of the compute route (not the anchor's). */
export const isDefaultJson = (form: Form): boolean => !form.anchor && form.query === '' && form.accept !== ARROW;

function computeRows({ python, numpyMs, figures }: ComputeFigures): BenchRow[] {
  const { anchor, plain } = defaultJsonFigures(figures);
  const rows: BenchRow[] = figures.map(({ form, ms, wireBytes, answered, offered, serverCpuMs, clientCpuMs }) => {
    const compressedDefault = isDefaultJson(form) && form.encoding !== 'identity';
    const target = form.anchor ? "the compressed JSON's anchor"
      : compressedDefault ? `bytes <= 0.20x, time <= 1.0x the anchor's (${(wireBytes / anchor.wireBytes).toFixed(2)}x, ${(ms / anchor.ms).toFixed(2)}x; ${(ms / plain.ms).toFixed(2)}x plain JSON's time)`
        : isDefaultJson(form) ? `(${(ms / anchor.ms).toFixed(2)}x the anchor's time)` : "<= 4x numpy's time";
    return {
      measure: `(a) compute over HTTP, ${form.name}`,
      eclipta: `${ms.toFixed(1)} ms`,
      anchor: numpyMs ? `numpy ${numpyMs.toFixed(1)} ms` : 'no numpy',
      ratio: numpyMs ? `${(ms / numpyMs).toFixed(1)}x numpy's time` : '',
      target,
      'on the wire': `${(wireBytes / 1e6).toFixed(3)} MB`,
      note: `${offered ? answered : `not offered (answered ${answered})`}; CPU per request: server ${serverCpuMs.toFixed(0)} ms, client ${clientCpuMs.toFixed(0)} ms`,
    };
  });
  rows.push({
    measure: python ? `    numpy from ${python}; median of ${REPEATS} after ${WARM_UPS} warm-ups (numpy 3), each side, the forms taking turns in blocks of ${BLOCK}` : '    numpy: no python3 with numpy on PATH or at /usr/bin/python3',
  });
  return rows;
}

export interface FirstLoad {
  scripts: number;
  wireBytes: number;
  plainBytes: number;
  zod: boolean;
  indexEncoding: string;
}

/**
 * The first load's JavaScript: the scripts index.html names and every module they import
 * statically (scripts/initial-modules.mjs), fetched as a browser asks for them.
 */
export async function measureFirstLoad(url: string, clientDir: string): Promise<FirstLoad> {
  const encoding = 'br, gzip';
  const index = await request(`${url}/`, { 'accept-encoding': encoding });
  const html = decoded(index).toString('utf8');
  const scripts = (initialModules(clientDir, html) as string[]).filter((f) => f.endsWith('.js'));
  let wireBytes = 0;
  let plainBytes = 0;
  let zod = false;
  for (const script of scripts) {
    const raw = await request(`${url}/${script}`, { 'accept-encoding': encoding });
    wireBytes += raw.body.length;
    const text = decoded(raw);
    plainBytes += text.length;
    zod ||= text.includes('ZodError');
  }
  return { scripts: scripts.length, wireBytes, plainBytes, zod, indexEncoding: String(index.headers['content-encoding'] ?? 'none') };
}

function firstLoadRow(f: FirstLoad): BenchRow {
  return {
    measure: `(b) first load: the ${f.scripts} scripts index.html loads, with all they import`,
    eclipta: `${(f.wireBytes / 1e3).toFixed(1)} kB`,
    anchor: 'target 200 kB',
    ratio: `${(f.wireBytes / 200e3).toFixed(2)}x target`,
    target: '<= 1.0x',
    'on the wire': `${(f.wireBytes / 1e3).toFixed(1)} kB (${(f.plainBytes / 1e3).toFixed(0)} kB uncompressed)`,
    note: `zod among them: ${f.zod ? 'yes' : 'no'}; index.html encoding ${f.indexEncoding}`,
  };
}

export interface Paint {
  medianMs: number;
  runs: number[];
  /** When the sign-in form's e-mail field was on screen (Playwright polls each frame), median. */
  formMs: number;
}

/**
 * First contentful paint of the sign-in page in Debian's Chromium (headless, the browser tests'
 * flags), from the page's own performance paint entry: each load in a fresh browser context (an
 * empty cache, so every script and font comes over the wire), one load first to warm the server.
 */
export async function measureSignInPaint(url: string): Promise<Paint> {
  const { chromium } = await import('@playwright/test');
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  try {
    const runs: number[] = [];
    const formTimes: number[] = [];
    for (let i = 0; i <= PAINT_RUNS; i++) {
      const context = await browser.newContext();
      const page = await context.newPage();
      await page.goto(`${url}/sign-in`, { waitUntil: 'commit' });
      await page.locator('input[type=email]').waitFor({ state: 'visible', timeout: 10_000 });
      const formMs = await page.evaluate(() => performance.now());
      const paint = await page.waitForFunction(() => performance.getEntriesByName('first-contentful-paint')[0]?.startTime, null, { timeout: 10_000 });
      const ms = (await paint.jsonValue()) as number;
      await context.close();
      if (i > 0) {
        runs.push(ms);
        formTimes.push(formMs);
      }
    }
    return { medianMs: median(runs), runs, formMs: median(formTimes) };
  } finally {
    await browser.close();
  }
}

function paintRow(p: Paint): BenchRow {
  return {
    measure: '(b\') first contentful paint, sign-in page, Chromium, empty cache',
    eclipta: `${p.medianMs.toFixed(0)} ms`,
    anchor: 'target 500 ms',
    ratio: `${(p.medianMs / 500).toFixed(2)}x target`,
    target: '< 1.0x',
    'on the wire': '',
    note: `median of ${p.runs.length} loads (${p.runs.map((r) => r.toFixed(0)).join(', ')} ms); the form on screen at ${p.formMs.toFixed(0)} ms`,
  };
}

export interface Ingest {
  rows: number;
  fileMb: number;
  seconds: number;
  pythonSeconds: number;
  runs: number;
  idleMb: number;
  peakMb: number;
  peakReset: boolean;
}

/** On a server of its own, so its memory peak is the ingest's alone. */
export async function measureIngest(dir: string): Promise<Ingest> {
  const file = path.join(dir, `orbit-${INGEST_ROWS}.csv`);
  writeCsv(file, INGEST_ROWS);
  const server = await startServer(path.join(dir, 'ingest-data'));
  try {
    const session = await openSession(server);
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
    return {
      rows: INGEST_ROWS, fileMb: statSync(file).size / 1e6, seconds: median(ours), pythonSeconds: median(python), runs: INGEST_RUNS,
      idleMb, peakMb: statusMb(pid, 'VmHWM'), peakReset,
    };
  } finally {
    server.child.removeAllListeners('exit');
    server.child.kill('SIGTERM');
  }
}

function ingestRow(i: Ingest): BenchRow {
  return {
    measure: `(c) ingest ${i.rows.toLocaleString('en')} rows (${i.fileMb.toFixed(0)} MB CSV), upload+store`,
    eclipta: `${i.seconds.toFixed(2)} s`,
    anchor: `python csv-to-floats ${i.pythonSeconds.toFixed(2)} s`,
    ratio: `${(i.pythonSeconds / i.seconds).toFixed(2)}x python's speed`,
    target: '>= 1.0x; peak < 300 MB',
    'on the wire': '',
    note: `median of ${i.runs}; server RSS idle ${Math.round(i.idleMb)} MB, ${i.peakReset ? 'peak while ingesting' : 'peak since start'} ${Math.round(i.peakMb)} MB`,
  };
}

export interface WireFigures {
  compute: ComputeFigures;
  firstLoad: FirstLoad | null;
  paint: Paint | null;
  ingest: Ingest | null;
}

/**
 * Every figure of this file against one server that also serves the built client (built first when
 * older than its sources, as npm start does), and the ingest on a server of its own.
 */
export async function measureWire(options: { ingest: boolean }): Promise<WireFigures> {
  await buildClientIfStale();
  const clientDir = path.join(root, 'dist', 'client', 'browser');
  const dir = mkdtempSync(path.join(tmpdir(), 'eclipta-bench-wire-'));
  const server = await startServer(path.join(dir, 'data'), clientDir, { anchorRoute: true });
  try {
    const session = await openSession(server);
    const compute = await measureCompute(session);
    const built = existsSync(path.join(clientDir, 'index.html'));
    const firstLoad = built ? await measureFirstLoad(server.url, clientDir) : null;
    const paint = built ? await measureSignInPaint(server.url) : null;
    // The compute server stays up (idle) meanwhile: a new one could otherwise get its port, and
    // fetch a kept-alive socket to the old one.
    const ingested = options.ingest ? await measureIngest(dir) : null;
    return { compute, firstLoad, paint, ingest: ingested };
  } finally {
    server.child.removeAllListeners('exit');
    server.child.kill('SIGTERM');
    agent.destroy();
    rmSync(dir, { recursive: true, force: true });
  }
}

export default async function wireBench(): Promise<BenchRow[]> {
  const figures = await measureWire({ ingest: !process.env['ECLIPTA_BENCH_NO_INGEST'] });
  const skipped = { measure: '(b) first load and paint: skipped, no built client (npm run build:client)' };
  return [
    ...computeRows(figures.compute),
    ...(figures.firstLoad && figures.paint ? [firstLoadRow(figures.firstLoad), paintRow(figures.paint)] : [skipped]),
    ...(figures.ingest ? [ingestRow(figures.ingest)] : []),
    { measure: `    node ${process.version}, load average ${loadavg()[0].toFixed(1)} on ${cpus().length} cores` },
  ];
}
