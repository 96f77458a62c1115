// The JavaScript a first page load needs: the scripts index.html names (script src, modulepreload)
// and everything they import statically, followed through the built chunks (`import"./x.js"`,
// `from"./x.js"`; a dynamic `import("./x.js")` is a lazy route's and is left out). Used after
// `ng build` to name every one of them in index.html (Angular's builder writes at most 10
// modulepreload links, so the browser found the rest, Angular's core among them, only after
// parsing the module importing it, a round trip later), and by the bench to count the first
// load's bytes.
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

const named = /<script[^>]*\ssrc="([^"]+)"|<link[^>]*rel="modulepreload"[^>]*href="([^"]+)"/g;
const staticImport = /(?:\bimport|\bfrom)\s*"\.\/([^"]+\.js)"/g;

/** The scripts index.html names, in its order. */
export function namedScripts(html) {
  return [...html.matchAll(named)].map((m) => m[1] ?? m[2]);
}

/** Every module the named scripts import statically, the named ones first (file names relative to dir). */
export function initialModules(dir, html) {
  const seen = new Set(namedScripts(html));
  const queue = [...seen].filter((f) => f.endsWith('.js'));
  while (queue.length > 0) {
    const file = queue.shift();
    const text = readFileSync(join(dir, file), 'utf8');
    for (const m of text.matchAll(staticImport)) {
      if (!seen.has(m[1])) {
        seen.add(m[1]);
        queue.push(m[1]);
      }
    }
  }
  return [...seen];
}

/** Adds a modulepreload link to index.html for every initial module it does not name yet. */
export function completeModulePreloads(dir = 'dist/client/browser') {
  const file = join(dir, 'index.html');
  const html = readFileSync(file, 'utf8');
  const present = new Set(namedScripts(html));
  const missing = initialModules(dir, html).filter((f) => !present.has(f) && f.endsWith('.js'));
  if (missing.length === 0) return 0;
  const links = missing.map((f) => `<link rel="modulepreload" href="${f}">`).join('');
  const at = html.search(/<script[^>]*type="module"/);
  writeFileSync(file, at < 0 ? html.replace('</body>', `${links}</body>`) : html.slice(0, at) + links + html.slice(at));
  return missing.length;
}
