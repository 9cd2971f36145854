import { randomUUID } from 'node:crypto';
import type { IncomingMessage } from 'node:http';
import type { NextFunction, Request, Response } from 'express';
import pino, { type DestinationStream, type Logger } from 'pino';
import type { Config } from '../config';

/**
 * One JSON line per API request with a request id that the response repeats in
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

/** The level of a finished request's line: errors stand out, a refusal for too many tries is a warning. */
function levelOf(statusCode: number, failed: boolean): 'error' | 'warn' | 'info' {
  if (failed || statusCode >= 500) return 'error';
  if (statusCode === 429) return 'warn';
  return 'info';
}

/**
 * One line per API request, written when the answer is finished. Written here on pino rather than
 * through pino-http, which made two child loggers for every request (its `req` binding serialised up
 * front) whether or not a line would be written: about a tenth of a small request's time on the server.
 * A handler that logs a line of its own (`req.log`) names the request id in it.
 */
export function requestLog(logger: Logger) {
  return (req: Request, res: Response, next: NextFunction) => {
    const incoming = req.headers['x-request-id'];
    const id = typeof incoming === 'string' && SAFE_REQUEST_ID.test(incoming) ? incoming : randomUUID();
    req.id = id;
    res.setHeader('X-Request-Id', id);
    req.log = logger;
    // The API only: static files and the single-page app's paths are noise, and an app path may be a
    // one-time link whose token belongs in no log.
    if (!req.originalUrl.startsWith('/api/')) return next();
    const started = Date.now();
    const done = () => {
      res.removeListener('finish', done);
      res.removeListener('close', done);
      const level = levelOf(res.statusCode, res.err !== undefined);
      if (!logger.isLevelEnabled(level)) return;
      const line = {
        // No headers at all (bearer tokens); the path with its query keys but not their values.
        req: {
          id,
          method: req.method,
          url: withoutQueryValues(req.originalUrl),
          remoteAddress: req.socket.remoteAddress,
        },
        res: { statusCode: res.statusCode },
        ...(res.err ? { err: res.err } : {}),
        responseTime: Date.now() - started,
      };
      logger[level](line, res.err ? 'request errored' : res.writableFinished ? 'request completed' : 'request aborted');
    };
    res.on('finish', done);
    res.on('close', done);
    next();
  };
}
