// Bundles the server (server/main.ts and what it imports from shared/) into dist/server/main.mjs.
// Packages stay external: they are installed by `npm ci` and better-sqlite3 is a native addon.
import { build } from 'esbuild';

export async function buildServer() {
  await build({
    entryPoints: ['server/main.ts'],
    outfile: 'dist/server/main.mjs',
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    packages: 'external',
    sourcemap: true,
    logLevel: 'warning',
    tsconfig: 'tsconfig.server.json',
  });
}

if (import.meta.url === `file://${process.argv[1]}`) {
  await buildServer();
  console.log('server bundled into dist/server/main.mjs');
}
