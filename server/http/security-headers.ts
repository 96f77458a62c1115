// The security headers of every answer (helmet): a Content-Security-Policy for the built client,
// no sniffing, no framing, no referrer across origins, HSTS only behind https. Helmet's headers do
// not depend on the request (no nonces), so they are worked out once when the app is built and
// then set as a list: helmet's chain of a dozen middlewares ran on every request.
import type { IncomingMessage, ServerResponse } from 'node:http';
import type { RequestHandler } from 'express';
import helmet from 'helmet';

export function securityHeaders(publicUrl: string): RequestHandler {
  const https = publicUrl.startsWith('https:');
  const middleware = helmet({
    contentSecurityPolicy: {
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        // Angular inserts component styles as <style> elements at run time.
        styleSrc: ["'self'", "'unsafe-inline'"],
        fontSrc: ["'self'", 'data:'],
        imgSrc: ["'self'", 'data:', 'blob:'],
        connectSrc: ["'self'"],
        objectSrc: ["'none'"],
        frameAncestors: ["'none'"],
        baseUri: ["'self'"],
        formAction: ["'self'"],
        upgradeInsecureRequests: https ? [] : null,
      },
    },
    // Plain-http local use must not be told to switch to https for a year.
    strictTransportSecurity: https,
  });
  const set: [string, string][] = [];
  const removed: string[] = [];
  const recorder = {
    setHeader: (name: string, value: unknown) => set.push([name, String(value)]),
    removeHeader: (name: string) => removed.push(name),
  };
  let called = false;
  middleware({} as IncomingMessage, recorder as unknown as ServerResponse, () => {
    called = true;
  });
  if (!called || set.length === 0) throw new Error('helmet did not set its headers synchronously');
  return (_req, res, next) => {
    for (const [name, value] of set) res.setHeader(name, value);
    for (const name of removed) res.removeHeader(name);
    next();
  };
}
