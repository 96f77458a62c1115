// One log line per answered request: method, path (never the query string, a body, cookies or
// headers: they may carry secrets), status and milliseconds. The logger writes its lines in
// batches (server/logger.ts), so the log costs a request no write of its own.
import type { RequestHandler } from 'express';
import type { Logger } from '../logger';

export function requestLog(logger: Logger): RequestHandler {
  return (req, res, next) => {
    const started = performance.now();
    res.once('finish', () => {
      const url = req.originalUrl;
      const query = url.indexOf('?');
      logger.info('request', {
        method: req.method,
        path: query === -1 ? url : url.slice(0, query),
        status: res.statusCode,
        ms: Math.round((performance.now() - started) * 10) / 10,
      });
    });
    next();
  };
}
