// Serves the built client (dist/client/browser): the .br and .gz files the client build writes
// beside each text file (scripts/compress-client.mjs) go out with Content-Encoding when the browser
// accepts them, Vary: Accept-Encoding always. A file whose name carries the build's content hash
// (main-C4XRZOFV.js) never changes, so it is cached for a year as immutable; every other file, and
// index.html that names the hashed ones, is revalidated on each load (no-cache). Any other path
// that is not a file loads index.html: the client's own routes (/missions/…, /invite/<token>).
import { existsSync, statSync } from 'node:fs';
import path from 'node:path';
import { Router, type NextFunction, type Request, type Response } from 'express';

export const IMMUTABLE = 'public, max-age=31536000, immutable';
const hashed = /-[A-Z0-9]{8}\.[a-z0-9]+$/;
/** The extensions the client build precompresses (fonts and images are compressed already). */
export const precompressedExtensions = ['.js', '.css', '.html', '.svg', '.json', '.txt', '.map'];
const encodings = [['br', '.br'], ['gzip', '.gz']] as const;

/** The file under `root` that a request path names, or null (outside it, a dot file, a folder, none). */
function fileAt(root: string, requestPath: string): string | null {
  let decoded: string;
  try {
    decoded = decodeURIComponent(requestPath);
  } catch {
    return null;
  }
  const file = path.join(root, decoded);
  if (!file.startsWith(root + path.sep) || decoded.split('/').some((part) => part.startsWith('.'))) return null;
  try {
    return statSync(file).isFile() ? file : null;
  } catch {
    return null;
  }
}

function sendClientFile(req: Request, res: Response, next: NextFunction, file: string): void {
  const extension = path.extname(file);
  res.set('Cache-Control', hashed.test(path.basename(file)) ? IMMUTABLE : 'no-cache');
  res.type(extension);
  let sent = file;
  if (precompressedExtensions.includes(extension)) {
    res.vary('Accept-Encoding');
    // brotli first whenever it is accepted at all: browsers list gzip before br at equal weight.
    const variant = encodings.find(([name, suffix]) => req.acceptsEncodings(name) === name && existsSync(file + suffix));
    if (variant) {
      res.set('Content-Encoding', variant[0]);
      sent = file + variant[1];
    }
  }
  res.sendFile(sent, { cacheControl: false, acceptRanges: sent === file }, (error) => {
    if (error && !res.headersSent) next(error);
  });
}

export function clientFiles(clientDir: string): Router {
  const root = path.resolve(clientDir);
  const indexHtml = path.join(root, 'index.html');
  const router = Router();
  router.get('/{*splat}', (req, res, next) => {
    sendClientFile(req, res, next, fileAt(root, req.path) ?? indexHtml);
  });
  return router;
}

export const hasClient = (clientDir: string): boolean => existsSync(path.join(clientDir, 'index.html'));
