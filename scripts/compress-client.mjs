// Writes a brotli (.br, quality 11) and a gzip (.gz, level 9) copy beside every text file of the
// built client, where it is smaller, so the server sends compressed bytes without compressing on
// each request (server/http/client-files.ts picks the copy the browser accepts).
import { readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { extname, join } from 'node:path';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';
import { completeModulePreloads } from './initial-modules.mjs';

// The same list as server/http/client-files.ts precompressedExtensions.
const extensions = ['.js', '.css', '.html', '.svg', '.json', '.txt', '.map'];

function* files(dir) {
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const file = join(dir, entry.name);
    if (entry.isDirectory()) yield* files(file);
    else yield file;
  }
}

export function compressClient(dir = 'dist/client/browser') {
  // index.html first, so its compressed copies name every module of the first load.
  const preloads = completeModulePreloads(dir);
  if (preloads > 0) console.log(`index.html: ${preloads} more modulepreload links (the first load's whole static import graph)`);
  let plain = 0;
  let brotli = 0;
  for (const file of files(dir)) {
    if (!extensions.includes(extname(file))) continue;
    const bytes = readFileSync(file);
    const copies = [
      ['.br', brotliCompressSync(bytes, { params: { [constants.BROTLI_PARAM_QUALITY]: 11, [constants.BROTLI_PARAM_SIZE_HINT]: bytes.length } })],
      ['.gz', gzipSync(bytes, { level: 9 })],
    ];
    for (const [suffix, packed] of copies) {
      if (packed.length < bytes.length) writeFileSync(file + suffix, packed);
      else rmSync(file + suffix, { force: true });
    }
    plain += bytes.length;
    brotli += Math.min(bytes.length, copies[0][1].length);
  }
  console.log(`client files precompressed: ${(plain / 1e3).toFixed(0)} kB of text, ${(brotli / 1e3).toFixed(0)} kB as brotli`);
}

if (import.meta.url === `file://${process.argv[1]}`) compressClient();
