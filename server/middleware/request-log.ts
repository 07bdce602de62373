// One JSON log line per API request, written when its answer has gone out. pino-http did this
// before, but it built a child logger with the whole serialised request (headers included) at the
// start of every request, whatever the level: a tenth of a signed-in read's CPU in the bench profile.
import type { Request, RequestHandler } from 'express';
import type { Logger } from 'pino';

export function requestLog(logger: Logger): RequestHandler {
  return (req, res, next) => {
    if (!logger.isLevelEnabled('info')) return next();
    const started = process.hrtime.bigint();
    const done = () => {
      res.removeListener('finish', done);
      res.removeListener('close', done);
      const ms = Number(process.hrtime.bigint() - started) / 1e6;
      const line = {
        method: req.method,
        url: req.originalUrl,
        status: res.statusCode,
        ms: Math.round(ms * 10) / 10,
        aborted: !res.writableFinished || undefined,
      };
      if (res.statusCode >= 500) logger.error(line, 'request failed');
      else logger.info(line, 'request');
    };
    res.on('finish', done);
    res.on('close', done);
    next();
  };
}

/** What the error handler logs about the request that failed: never the cookie or the CSRF token. */
export function requestContext(req: Request): Record<string, unknown> {
  return { method: req.method, url: req.originalUrl, personId: (req.user as { id?: number } | undefined)?.id };
}
