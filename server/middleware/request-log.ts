import crypto from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import type { Logger } from 'pino';

/** A request's path for the log: link tokens in the query and calendar feeds' secret addresses cut out. */
export function logUrl(url: string): string {
  return url.replace(/token=[^&#]*/gi, 'token=…').replace(/\/feeds\/[^/?#]*/gi, '/feeds/…');
}

/** What a log line says about its request: the id, method and address with tokens masked. */
export function requestFields(req: Request) {
  return { id: req.id, method: req.method, url: logUrl(String(req.originalUrl ?? req.url)) };
}

/**
 * Gives each request an id (a safe incoming X-Request-Id, else a new UUID), echoes it in the
 * response, and writes one short line when the response is finished: the id, method and address
 * (tokens masked) and the status, never headers, cookies or bodies. `req.log` is the app's logger
 * itself (lines about a request name its `requestId`): pino-http made and serialised a child logger
 * per request, about a quarter of a small read's time on this machine.
 */
export function requestLog(logger: Logger): RequestHandler {
  const logsRequests = logger.isLevelEnabled('info');
  return (req, res, next) => {
    const incoming = req.headers['x-request-id'];
    const id = typeof incoming === 'string' && /^[\w-]{1,64}$/.test(incoming) ? incoming : crypto.randomUUID();
    req.id = id;
    res.setHeader('X-Request-Id', id);
    req.log = logger;
    if (logsRequests) {
      const started = performance.now();
      res.once('finish', () => {
        logger.info(
          {
            reqId: id,
            req: requestFields(req),
            res: { statusCode: res.statusCode },
            responseTime: Math.round(performance.now() - started),
          },
          'request completed',
        );
      });
    }
    next();
  };
}
