// How long the server waits for a client (issue 12, item 7: a stalled upload, half a body then
// silence, held its connection, its multer stream and its upload file for Node's default of five
// minutes). Two settings (README "Configuration"):
//   ECLIPTA_IDLE_TIMEOUT_S     the headers must arrive, and the body must keep arriving, within this
//                              many seconds of silence; otherwise 408 and the connection is closed
//   ECLIPTA_REQUEST_TIMEOUT_S  a whole request (an upload included) must arrive within this
// The idle timeout is the socket's own timer, armed while a body is read and cleared once it is
// in or the answer is sent, so a long computation after the body is never cut short.
import { createServer, type Server } from 'node:http';
import type { Express, RequestHandler } from 'express';
import type { Config } from './config';
import { ApiError } from './errors';

const hasBody = (headers: Record<string, unknown>): boolean =>
  headers['transfer-encoding'] !== undefined || (headers['content-length'] !== undefined && headers['content-length'] !== '0');

/** Drops a request whose body stops arriving for config.idleTimeoutS: 408 if nothing was answered yet, then the connection closes. */
export function bodyIdleTimeout(config: Config): RequestHandler {
  const ms = config.idleTimeoutS * 1000;
  return (req, res, next) => {
    if (!hasBody(req.headers)) {
      next();
      return;
    }
    const onIdle = () => {
      const error = new ApiError(408, 'request_timeout', `The request body stopped arriving for ${config.idleTimeoutS} s (ECLIPTA_IDLE_TIMEOUT_S); the connection is closed.`);
      // Destroying the request (not just its socket) ends whoever reads the body (multer, the JSON
      // parser) with an error, so the upload's files are removed: once the answer is sent, Node no
      // longer tells the request that its socket closed.
      if (res.headersSent) {
        req.destroy();
        return;
      }
      res.once('finish', () => req.destroy());
      res.status(408).set('Connection', 'close').json(error.toBody());
    };
    const disarm = () => {
      req.off('timeout', onIdle);
      req.socket.setTimeout(0);
    };
    req.setTimeout(ms, onIdle);
    req.once('end', disarm);
    res.once('finish', disarm);
    res.once('close', disarm);
    next();
  };
}

/** The HTTP server for the app, with the headers and whole-request timeouts of the config. */
export function createHttpServer(app: Express, config: Config): Server {
  const requestTimeout = config.requestTimeoutS * 1000;
  const headersTimeout = Math.min(config.idleTimeoutS * 1000, requestTimeout);
  return createServer({
    requestTimeout,
    headersTimeout,
    // Node checks the two above this often (30 s by default, longer than a short idle timeout).
    connectionsCheckingInterval: Math.min(30_000, Math.max(250, headersTimeout / 4)),
  }, app);
}
