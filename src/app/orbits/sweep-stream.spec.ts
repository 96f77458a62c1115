import { firstValueFrom, toArray } from 'rxjs';
import type { SweepLine } from '../../../shared/api/missions';
import { NdjsonSplitter, parseSweepLine, streamSweep, type FetchLike } from './sweep-stream';

const start = { type: 'start', days: 2, from: '2027-03-20', to: '2027-03-21', stepDays: 1 };
const day = (index: number) => ({
  type: 'day',
  index,
  date: `2027-03-2${index}`,
  betaDeg: 10 + index,
  eclipseFraction: 0.35,
  eclipseDurationS: 2100,
  solarDistanceAu: 0.996,
  solarFluxWm2: 1370,
  surfaces: [{ surfaceId: 's-1', name: 'nadir panel', absorbedW: 97.6 }],
});

/** A fetch that answers `status` with a body delivered in the given byte chunks. */
function fakeFetch(chunks: readonly Uint8Array[], status = 200): { fetchFn: FetchLike; signals: AbortSignal[] } {
  const signals: AbortSignal[] = [];
  const fetchFn: FetchLike = (_url, init) => {
    if (init.signal) signals.push(init.signal);
    const body = new ReadableStream<Uint8Array>({
      start(controller) {
        for (const c of chunks) controller.enqueue(c);
        controller.close();
      },
    });
    return Promise.resolve(new Response(body, { status, headers: { 'Content-Type': 'application/x-ndjson' } }));
  };
  return { fetchFn, signals };
}

const bytes = (text: string) => new TextEncoder().encode(text);

describe('NdjsonSplitter', () => {
  it('joins a line split across chunks and skips blank lines', () => {
    const splitter = new NdjsonSplitter();
    expect(splitter.push('{"a":1}\n{"b"')).toEqual(['{"a":1}']);
    expect(splitter.push(':2}\n\n{"c":3}')).toEqual(['{"b":2}']);
    expect(splitter.flush()).toEqual(['{"c":3}']);
    expect(splitter.flush()).toEqual([]);
  });
});

describe('parseSweepLine', () => {
  it('reads each line type and refuses what is not a sweep line', () => {
    expect(parseSweepLine(JSON.stringify(start)).type).toBe('start');
    expect(() => parseSweepLine('{"type":"nonsense"}')).toThrow(/no known type/);
    expect(() => parseSweepLine('not json')).toThrow(/not JSON/);
  });
});

describe('streamSweep', () => {
  it('emits start, days and end, whatever the chunk boundaries (split inside a line and inside "²")', async () => {
    const text = [start, day(0), day(1), { type: 'end', days: 2 }].map((l) => JSON.stringify(l)).join('\n') + '\n';
    const all = bytes(text.replaceAll('nadir panel', 'panel m²'));
    // Cut at every 37th byte, which lands inside lines and, for some offsets, inside the 2-byte "²".
    const chunks: Uint8Array[] = [];
    for (let i = 0; i < all.length; i += 37) chunks.push(all.slice(i, i + 37));
    const { fetchFn } = fakeFetch(chunks);
    const lines: SweepLine[] = await firstValueFrom(streamSweep('/sweep', fetchFn).pipe(toArray()));
    expect(lines.map((l) => l.type)).toEqual(['start', 'day', 'day', 'end']);
    const second = lines[2];
    expect(second.type === 'day' && second.surfaces[0].name).toBe('panel m²');
  });

  it("ends with the server's message on an error line", async () => {
    const { fetchFn } = fakeFetch([bytes(`${JSON.stringify(start)}\n{"type":"error","message":"day 3: orbit decayed"}\n`)]);
    await expect(firstValueFrom(streamSweep('/sweep', fetchFn).pipe(toArray()))).rejects.toThrow('day 3: orbit decayed');
  });

  it("shows the error shape's message when the request is refused", async () => {
    const { fetchFn } = fakeFetch([bytes('{"error":{"code":"invalid","message":"stepDays is 1..365"}}')], 400);
    await expect(firstValueFrom(streamSweep('/sweep', fetchFn))).rejects.toThrow('stepDays is 1..365');
  });

  it('aborts the request when the subscriber leaves', () => {
    const signals: AbortSignal[] = [];
    const never: FetchLike = (_url, init) => {
      if (init.signal) signals.push(init.signal);
      return new Promise<Response>(() => undefined);
    };
    const subscription = streamSweep('/sweep', never).subscribe();
    expect(signals[0].aborted).toBe(false);
    subscription.unsubscribe();
    expect(signals[0].aborted).toBe(true);
  });
});
