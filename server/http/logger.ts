import { randomUUID } from 'node:crypto';
import pino, { type Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import type { Config } from '../config';

const safeRequestId = /^[A-Za-z0-9._:-]{1,128}$/;

export function createLogger(config: Pick<Config, 'logLevel'>): Logger {
  return pino({ level: config.logLevel, base: undefined });
}

/** Structured request logs: one line per request, no cookies or bodies. */
export function requestLogger(logger: Logger) {
  return pinoHttp({
    logger,
    genReqId: (req, res) => {
      const given = req.headers['x-request-id'];
      // A caller's id is kept only when short and plain; anything else could forge log lines.
      const id = typeof given === 'string' && safeRequestId.test(given) ? given : randomUUID();
      res.setHeader('x-request-id', id);
      return id;
    },
    customLogLevel: (_req, res, err) =>
      err || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info',
    serializers: {
      req: (req: { id: string; method: string; url: string }) => ({
        id: req.id,
        method: req.method,
        url: req.url,
      }),
      res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
    },
  });
}
