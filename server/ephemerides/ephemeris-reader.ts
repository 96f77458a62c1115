// Reads an ephemeris from its bytes as they come, whichever way they come: written to while multer
// receives the upload (so parsing and checking overlap the transfer) or from the stored file
// afterwards. It hashes every byte, sniffs the first 8 KiB, then feeds the CSV or OEM reader,
// which checks each row and spools the points. It never fails a write: whatever goes wrong is in
// `result`, so the upload beside it always completes and is cleaned up by its owner.
import { createHash } from 'node:crypto';
import { PassThrough, Writable } from 'node:stream';
import type { Body } from '../../shared/physics/bodies';
import { readCsvEphemeris } from './csv-ephemeris';
import { EphemerisChecker } from './ephemeris-checker';
import { SNIFF_BYTES, sniffBytes, type Sniffed } from './file-sniff';
import { readOemEphemeris } from './oem-ephemeris';
import { PointSpool } from './point-spool';

/** What the reading depends on besides the bytes: the mission's body and two upload fields. */
export interface ReadSetup {
  body: Body;
  /** The frame sent with the upload, checked against the body; null when none was sent. */
  declaredFrame: string | null;
  /** The origin of a CSV's `t` column (ms since 1970, UTC); null when none was sent. */
  epochMs: number | null;
}

export const sameSetup = (a: ReadSetup, b: ReadSetup): boolean =>
  a.body.id === b.body.id && a.declaredFrame === b.declaredFrame && a.epochMs === b.epochMs;

export interface ReadOutcome {
  sniffed: Sniffed;
  /** Absent when the file was not parsed: refused by its first bytes, or a CSV without a frame. */
  checker?: EphemerisChecker;
  objectName: string | null;
  /** The frame the file declares (OEM), else the declared one. */
  frame: string | null;
  sha256: string;
  spool: PointSpool;
}

export class EphemerisReader extends Writable {
  readonly result: Promise<ReadOutcome>;
  readonly spool: PointSpool;
  private readonly hash = createHash('sha256');
  private head: Buffer[] = [];
  private headBytes = 0;
  private feed: PassThrough | null = null;
  /** True once the format reader has stopped taking bytes (done, refused early or failed). */
  private parsed = false;
  private onParsed: (() => void) | null = null;
  private settle!: (parse: Promise<Omit<ReadOutcome, 'sha256' | 'spool'>>) => void;
  private received!: () => void;

  constructor(readonly setup: ReadSetup, spoolPath: string) {
    super();
    this.spool = new PointSpool(spoolPath);
    const parsed = new Promise<Omit<ReadOutcome, 'sha256' | 'spool'>>((resolve) => {
      this.settle = (parse) => resolve(parse);
    });
    // The digest waits for the last byte, even when the format reader stopped early.
    const received = new Promise<void>((resolve) => {
      this.received = resolve;
    });
    this.result = Promise.all([parsed, received]).then(([outcome]) => ({ ...outcome, sha256: this.hash.digest('hex'), spool: this.spool }));
    // A reader whose upload failed is never awaited: its failure must not go unhandled.
    this.result.catch(() => undefined);
  }

  override _write(chunk: Buffer, _encoding: BufferEncoding, done: (error?: Error | null) => void): void {
    this.hash.update(chunk);
    if (this.feed === null && !this.parsed) {
      this.head.push(chunk);
      this.headBytes += chunk.length;
      if (this.headBytes < SNIFF_BYTES) {
        done();
        return;
      }
      this.begin();
      done();
      return;
    }
    this.forward(chunk, done);
  }

  override _final(done: (error?: Error | null) => void): void {
    if (this.feed === null && !this.parsed) this.begin();
    this.feed?.end();
    this.received();
    done();
  }

  /** The first bytes are in: decide the format and start its reader on everything so far. */
  private begin(): void {
    const head = Buffer.concat(this.head);
    this.head = [];
    const sniffed = sniffBytes(head);
    const { body, declaredFrame, epochMs } = this.setup;
    if ('refused' in sniffed || (sniffed.format === 'csv' && declaredFrame === null)) {
      this.stop();
      this.settle(Promise.resolve({ sniffed, objectName: null, frame: declaredFrame }));
      return;
    }
    const feed = new PassThrough();
    this.feed = feed;
    const checker = new EphemerisChecker(body, this.spool);
    const parse = sniffed.format === 'csv'
      ? readCsvEphemeris(feed, checker, epochMs).then(() => ({ objectName: null, frame: declaredFrame }))
      : readOemEphemeris(feed, checker, body, declaredFrame).then((meta) => ({ objectName: meta.objectName, frame: meta.frame ?? declaredFrame }));
    this.settle(parse.then((meta) => ({ sniffed, checker, ...meta })).finally(() => this.stop()));
    feed.write(head);
  }

  /** Passes a chunk on, holding the upload back while the format reader is behind. */
  private forward(chunk: Buffer, done: () => void): void {
    if (this.parsed || this.feed === null || this.feed.write(chunk)) {
      done();
      return;
    }
    const resume = () => {
      this.feed?.off('drain', resume);
      this.onParsed = null;
      done();
    };
    this.feed.once('drain', resume);
    this.onParsed = resume;
  }

  private stop(): void {
    if (this.parsed) return;
    this.parsed = true;
    this.feed?.destroy();
    this.onParsed?.();
  }

  /** Closes the spool file (its owner deletes it). */
  close(): void {
    this.stop();
    this.spool.close();
  }
}
