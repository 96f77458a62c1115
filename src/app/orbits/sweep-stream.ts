// The mission sweep arrives as application/x-ndjson, one JSON object a line, while the server is
// still computing later days; reading it as a stream lets the page show progress and stop early.
import { Observable } from 'rxjs';
import type { SweepLine } from '../../../shared/api/missions';

/** Cuts a text stream into lines; a line split across two chunks comes out once, whole. */
export class NdjsonSplitter {
  private rest = '';

  /** The complete lines in `chunk` (with what was left over before); blank lines are skipped. */
  push(chunk: string): string[] {
    const text = this.rest + chunk;
    const lines = text.split('\n');
    this.rest = lines.pop() ?? '';
    return lines.map((l) => l.trim()).filter((l) => l !== '');
  }

  /** The last line when the stream ended without a newline after it. */
  flush(): string[] {
    const last = this.rest.trim();
    this.rest = '';
    return last === '' ? [] : [last];
  }
}

const LINE_TYPES = new Set(['start', 'day', 'end', 'error']);

/** One line as a SweepLine; the type guard is light (zod stays out of the client bundle). */
export function parseSweepLine(line: string): SweepLine {
  let value: unknown;
  try {
    value = JSON.parse(line);
  } catch {
    throw new Error(`The sweep sent a line that is not JSON: ${line.slice(0, 80)}`);
  }
  if (typeof value !== 'object' || value === null || !('type' in value) || typeof value.type !== 'string' || !LINE_TYPES.has(value.type)) {
    throw new Error(`The sweep sent a line of no known type: ${line.slice(0, 80)}`);
  }
  return value as SweepLine; // shape per shared/api/missions.ts sweepLine; the server validates what it writes
}

async function failureMessage(response: Response): Promise<string> {
  try {
    const body: unknown = await response.json();
    if (typeof body === 'object' && body !== null && 'error' in body) {
      const error = body.error;
      if (typeof error === 'object' && error !== null && 'message' in error && typeof error.message === 'string') return error.message;
    }
  } catch {
    // not the error shape; fall through to the status
  }
  return `The server answered ${response.status}.`;
}

export type FetchLike = (url: string, init: RequestInit) => Promise<Response>;

/**
 * The sweep's lines as they arrive. Unsubscribing aborts the request, so the server stops too.
 * An 'error' line from the server ends the stream with that message.
 */
export function streamSweep(url: string, fetchFn: FetchLike = (u, init) => fetch(u, init)): Observable<SweepLine> {
  return streamNdjson(url, {}, parseSweepLine, fetchFn);
}

/**
 * Any NDJSON answer's lines as they arrive (the sweep, the thermal distance study): `parse` checks
 * each line; a line of type 'error' ends the stream with its message. Unsubscribing aborts the request.
 */
export function streamNdjson<L extends { type: string }>(url: string, init: RequestInit, parse: (line: string) => L, fetchFn: FetchLike = (u, i) => fetch(u, i)): Observable<L> {
  return new Observable<L>((subscriber) => {
    const abort = new AbortController();
    const splitter = new NdjsonSplitter();
    const emit = (lines: readonly string[]): boolean => {
      for (const text of lines) {
        const line = parse(text);
        if (line.type === 'error') {
          subscriber.error(new Error('message' in line && typeof line.message === 'string' ? line.message : 'The server stopped with an error.'));
          return false;
        }
        subscriber.next(line);
      }
      return true;
    };
    const run = async (): Promise<void> => {
      const response = await fetchFn(url, { ...init, signal: abort.signal, headers: { Accept: 'application/x-ndjson', ...(init.headers as Record<string, string> | undefined) }, credentials: 'same-origin' });
      if (!response.ok) throw new Error(await failureMessage(response));
      if (response.body === null) throw new Error('The server answered with no body.');
      const reader = response.body.getReader();
      // stream: true keeps a multi-byte character split between chunks ("²") whole.
      const decoder = new TextDecoder();
      for (;;) {
        const { done, value } = await reader.read();
        if (done) break;
        if (!emit(splitter.push(decoder.decode(value, { stream: true })))) return;
      }
      if (emit(splitter.push(decoder.decode()).concat(splitter.flush()))) subscriber.complete();
    };
    run().catch((failure: unknown) => {
      if (abort.signal.aborted) return; // the subscriber left; nobody to tell
      subscriber.error(failure instanceof Error ? failure : new Error(String(failure)));
    });
    return () => abort.abort();
  });
}
