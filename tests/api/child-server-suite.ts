// A child server (child-server.ts) for one vitest file, kept apart so benches can import child-server.ts without vitest.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll } from 'vitest';
import { childSignIn, startChildServer, type ChildServer } from './child-server';

/**
 * A child server for one test file, with a signed-in user: started before its tests (in a temporary
 * dir), stopped and removed after. The fields are filled once `beforeAll` has run.
 */
export function childServerForSuite(prefix: string, email: string, env: Record<string, string> = {}): { dir: string; server: ChildServer; cookie: string } {
  const suite = {} as { dir: string; server: ChildServer; cookie: string };
  beforeAll(async () => {
    suite.dir = mkdtempSync(path.join(tmpdir(), prefix));
    suite.server = await startChildServer(path.join(suite.dir, 'data'), env);
    suite.cookie = await childSignIn(suite.server.url, email);
  }, 90_000);
  afterAll(async () => {
    suite.server.child.kill('SIGTERM');
    await suite.server.exited;
    rmSync(suite.dir, { recursive: true, force: true });
  });
  return suite;
}
