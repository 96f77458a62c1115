// Eclipta as a separate process (node + tsx running server/main.ts) on a random port with a data
// dir of its own: for the crash-safety test, which kills it, and the load bench, which measures it.
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';

export const repoRoot = path.resolve(import.meta.dirname, '..', '..');

export interface ChildServer {
  url: string;
  child: ChildProcess;
  /** The first 500 lines the server wrote to stdout and stderr (every request is logged). */
  output: string[];
  /** Resolves when the process has exited. */
  exited: Promise<number | null>;
}

export function startChildServer(dataDir: string, env: Record<string, string> = {}, timeoutMs = 60_000): Promise<ChildServer> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/main.ts'], {
    cwd: repoRoot,
    env: {
      ...process.env,
      NODE_ENV: 'test',
      PORT: '0',
      ECLIPTA_DATA_DIR: dataDir,
      ECLIPTA_DB_PATH: path.join(dataDir, 'eclipta.db'),
      ECLIPTA_PUBLIC_URL: 'http://eclipta.test',
      ECLIPTA_LOG_LEVEL: 'info',
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const output: string[] = [];
  const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`the server did not start within ${timeoutMs} ms:\n${output.join('\n')}`)), timeoutMs);
    let listening = false;
    const onLine = (chunk: Buffer) => {
      // Once the server listens and 500 lines are kept, the rest is only drained: under a load
      // bench the request log is thousands of lines a second, read by the process making the load.
      if (listening && output.length >= 500) return;
      for (const line of chunk.toString('utf8').split('\n').filter(Boolean)) {
        if (output.length < 500) output.push(line);
        if (listening) continue;
        const match = /"url":"(http:\/\/localhost:\d+)"/.exec(line);
        if (match?.[1] && /Eclipta is listening/.test(line)) {
          listening = true;
          clearTimeout(timer);
          resolve({ url: match[1], child, output, exited });
        }
      }
    };
    child.stdout?.on('data', onLine);
    child.stderr?.on('data', onLine);
    void exited.then((code) => {
      clearTimeout(timer);
      reject(new Error(`the server exited (${code}) before listening:\n${output.join('\n')}`));
    });
  });
}

/** A session cookie header for a demo user of the child server. */
export async function childSignIn(url: string, email: string, password = 'eclipta-demo'): Promise<string> {
  const res = await fetch(`${url}/api/v1/auth/sign-in`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password }) });
  const cookie = res.headers.getSetCookie().find((c) => c.startsWith('eclipta_session='))?.split(';')[0];
  if (res.status !== 200 || !cookie) throw new Error(`sign-in of ${email} answered ${res.status}`);
  return cookie;
}
