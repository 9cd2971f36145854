import { randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';
import pino, { type DestinationStream, type Logger } from 'pino';
import { pinoHttp } from 'pino-http';
import type { Config } from '../config';

/**
 * One JSON line per API request (pino-http) with a request id that the response repeats in
 * `X-Request-Id` and every error body repeats as `error.requestId`: a person's report of an error
 * leads straight to its log line.
 */
export function createLogger(config: Pick<Config, 'logLevel'>, destination?: DestinationStream): Logger {
  return pino(
    {
      level: config.logLevel,
      // Belt and braces: the serializers below leave headers out, but a handler's own log call might not.
      redact: {
        paths: ['req.headers.authorization', 'req.headers.cookie', 'headers.authorization', 'password', '*.password'],
        censor: '[redacted]',
      },
    },
    destination,
  );
}

/** An incoming id is kept only when it is a short plain token; anything else could forge or flood log lines. */
const SAFE_REQUEST_ID = /^[A-Za-z0-9._-]{1,64}$/;

export function requestIdOf(req: IncomingMessage): string | undefined {
  return req.id === undefined ? undefined : String(req.id);
}

/** Query values go as [redacted]: signed photo links carry their signature there, and logs outlive links. */
function withoutQueryValues(url: string | undefined): string | undefined {
  if (!url) return url;
  const q = url.indexOf('?');
  if (q < 0) return url;
  const keys = url
    .slice(q + 1)
    .split('&')
    .filter(Boolean)
    .map((pair) => `${pair.split('=')[0]}=[redacted]`);
  return `${url.slice(0, q)}?${keys.join('&')}`;
}

export function requestLog(logger: Logger) {
  return pinoHttp<IncomingMessage, ServerResponse>({
    logger,
    genReqId(req, res) {
      const incoming = req.headers['x-request-id'];
      const id = typeof incoming === 'string' && SAFE_REQUEST_ID.test(incoming) ? incoming : randomUUID();
      res.setHeader('X-Request-Id', id);
      return id;
    },
    // The API only: static files and the single-page app's paths are noise, and an app path may be a
    // one-time link whose token belongs in no log.
    autoLogging: { ignore: (req) => !(req.url ?? '').startsWith('/api/') },
    customLogLevel(_req, res, err) {
      if (err || res.statusCode >= 500) return 'error';
      if (res.statusCode === 429) return 'warn';
      return 'info';
    },
    serializers: {
      // No headers at all (bearer tokens); the path with its query keys but not their values.
      req: (req: { id: unknown; method: string; url: string; remoteAddress?: string }) => ({
        id: req.id,
        method: req.method,
        url: withoutQueryValues(req.url),
        remoteAddress: req.remoteAddress,
      }),
      res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
    },
  });
}
