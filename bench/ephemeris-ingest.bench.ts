// Ephemeris upload (issue 6): 100,000 and 1,000,000 rows of CSV through POST /missions/:id/ephemerides
// of a real server process, against csv-parse alone reading the same file (target: at least half its
// throughput), with the server's peak resident memory (target: under 300 MB, no larger for the
// bigger file). Each size gets a fresh server (node --import tsx server/main.ts, temp data dir), so
// its peak is its own. Uploads and csv-parse-alone runs alternate, RUNS of each, and the medians
// are compared (this machine's speed drifts between runs; a single pair can mislead either way).
// Memory is from /proc (Linux): the server's resident size when idle before the first upload, and
// its peak (VmHWM, reset through clear_refs just before the uploads) while they run.
import { createReadStream, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { parse } from 'csv-parse';
import { csvParseOptions } from '../server/ephemerides/csv-ephemeris';
import { ingest, median, openSession, resetPeak, startServer, statusMb, writeCsv } from './bench-server';
import type { BenchRow } from './bench-table';

const sizes = [100_000, 1_000_000];
const RUNS = Number(process.env['BENCH_RUNS'] ?? 3);

/** csv-parse with the server's own options and read size, counting records in 'data' callbacks as the server does. */
async function csvParseAlone(file: string): Promise<number> {
  const started = performance.now();
  let rows = 0;
  const parser = createReadStream(file, { highWaterMark: 256 * 1024 }).pipe(parse(csvParseOptions));
  await new Promise<void>((resolve, reject) => {
    parser.on('data', (record: unknown) => {
      if (Array.isArray(record)) rows++;
    });
    parser.on('end', resolve);
    parser.on('error', reject);
  });
  return (rows - 1) / ((performance.now() - started) / 1000);
}

export default async function ephemerisIngestBench(): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  for (const size of sizes) {
    const dir = mkdtempSync(path.join(tmpdir(), 'eclipta-bench-ephemeris-'));
    const file = path.join(dir, `orbit-${size}.csv`);
    try {
      writeCsv(file, size);
      const server = await startServer(path.join(dir, 'data'));
      try {
        const session = await openSession(server);
        const pid = server.child.pid!;
        const idleMb = statusMb(pid, 'VmRSS');
        const peakReset = resetPeak(pid);
        const alone: number[] = [];
        const seconds: number[] = [];
        for (let run = 0; run < RUNS; run++) {
          alone.push(await csvParseAlone(file));
          seconds.push(await ingest(session, file));
        }
        const shares = seconds.map((s, i) => (100 * size) / s / alone[i]);
        const throughput = size / median(seconds);
        const peakMb = statusMb(pid, 'VmHWM');
        rows.push({
          rows: size,
          'file MB': readFileSync(file).length / 1e6,
          'upload+ingest s': median(seconds),
          'ingest rows/s': Math.round(throughput),
          'csv-parse alone rows/s': Math.round(median(alone)),
          'share of csv-parse': `${Math.round((100 * throughput) / median(alone))} % (runs ${Math.round(Math.min(...shares))}-${Math.round(Math.max(...shares))} %; target >= 50 %)`,
          'server idle RSS MB': Math.round(idleMb),
          [peakReset ? 'peak RSS while ingesting MB' : 'peak RSS since start MB']: Math.round(peakMb),
          'rise MB': Math.round(peakMb - idleMb),
        });
      } finally {
        server.child.removeAllListeners('exit');
        server.child.kill('SIGTERM');
      }
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  }
  return rows;
}
