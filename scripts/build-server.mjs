// Bundles the server (server/main.ts and what it imports from shared/) into dist/server/main.mjs,
// and the thermal pool's worker (server/thermal/thermal-worker.ts) into dist/server/thermal-worker.mjs
// beside it, where server/thermal/thermal-pool.ts looks for it when it runs bundled.
// Packages stay external: they are installed by `npm ci` and better-sqlite3 is a native addon.
import { build } from 'esbuild';

export async function buildServer() {
  await build({
    entryPoints: { main: 'server/main.ts', 'thermal-worker': 'server/thermal/thermal-worker.ts' },
    outdir: 'dist/server',
    outExtension: { '.js': '.mjs' },
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
