// Waiting for a streamed answer to drain, behind the compression middleware: the middleware moves a
// response's 'drain' listeners onto its compressor stream, where removing them from the response
// does not reach, so a long stream that waited once per chunk piled up listeners (Node warns past
// ten: MaxListenersExceededWarning). Found while running the sweep; common practice, no source.
import { randomBytes } from 'node:crypto';
import { request as httpRequest } from 'node:http';
import type { AddressInfo } from 'node:net';
import express from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { drained } from './answer-body';
import { compressAnswers } from './answer-compression';

const WAITS = 30;
let base = '';
let close: () => void = () => undefined;

beforeAll(async () => {
  const app = express();
  app.use(compressAnswers);
  app.get('/stream', async (_req, res) => {
    res.setHeader('Content-Type', 'application/x-ndjson');
    let waits = 0;
    // incompressible chunks larger than the compressor's buffer: each write asks us to wait
    while (waits < WAITS) {
      if (!res.write(randomBytes(256 * 1024).toString('base64'))) {
        waits += 1;
        await drained(res, res);
      }
    }
    res.end();
  });
  const server = app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  close = () => server.close();
});
afterAll(() => close());

describe('drained', () => {
  it('waits for a compressed answer thirty times without piling up listeners (no MaxListenersExceededWarning)', async () => {
    const warnings: string[] = [];
    const onWarning = (w: Error) => warnings.push(w.name);
    process.on('warning', onWarning);
    try {
      const bytes = await new Promise<number>((resolve, reject) => {
        httpRequest(`${base}/stream`, { headers: { 'accept-encoding': 'br' } }, (res) => {
          expect(res.headers['content-encoding']).toBe('br');
          let n = 0;
          res.on('data', (c: Buffer) => (n += c.length));
          res.on('end', () => resolve(n));
        }).on('error', reject).end();
      });
      expect(bytes).toBeGreaterThan(0);
      // the warning is emitted on the next tick after the eleventh listener
      await new Promise((resolve) => setImmediate(resolve));
      expect(warnings).not.toContain('MaxListenersExceededWarning');
    } finally {
      process.off('warning', onWarning);
    }
  });
});
