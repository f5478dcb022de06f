import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { AppError } from '../lib/errors';

/** Turns a ZodError into one message per field path ("steps.2.targetTempC"). */
export function fieldsFromZod(error: ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

/** 404 JSON for any /api route nobody answered. */
export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json({
    error: { code: 'ROUTE_NOT_FOUND', message: `No API route for ${req.method} ${req.path}.` },
  });
};

const CONNECTION_CODES = new Set([
  'ECONNREFUSED',
  'PROTOCOL_CONNECTION_LOST',
  'ETIMEDOUT',
  'ECONNRESET',
  'ER_CON_COUNT_ERROR',
  'EPIPE',
  'ENOTFOUND',
  'ER_SERVER_SHUTDOWN',
  'ER_CONNECTION_KILLED',
]);

/**
 * True when the database connection itself failed. Drizzle wraps the driver's error in
 * `cause`; a transaction whose connection died reports the failed ROLLBACK, whose cause is
 * mysql2's "connection is in closed state" error, marked `fatal` and without a code.
 */
const isDbConnectionError = (error: unknown): boolean => {
  let current: unknown = error;
  for (let depth = 0; depth < 4 && current && typeof current === 'object'; depth++) {
    const { code, fatal, cause } = current as { code?: unknown; fatal?: unknown; cause?: unknown };
    if (typeof code === 'string' && CONNECTION_CODES.has(code)) return true;
    if (fatal === true) return true;
    current = cause;
  }
  return false;
};

/**
 * The one error middleware, registered last: AppErrors keep their status and code, bad JSON
 * and zod failures become 400 with per-field messages, a lost database becomes 503, anything
 * else is a 500 whose details stay in the log (and in the answer only in development).
 */
export function errorHandler(showDetails: boolean): ErrorRequestHandler {
  return (error, req, res, _next) => {
    void _next;
    if (res.headersSent) {
      req.log?.error({ err: error }, 'error after the response started');
      res.end();
      return;
    }
    if (error instanceof AppError) {
      if (error.status === 429 && 'retryAfterSeconds' in error) {
        res.setHeader('Retry-After', String(error.retryAfterSeconds));
      }
      res.status(error.status).json({
        error: {
          ...error.extra,
          code: error.code,
          message: error.message,
          ...(error.fields ? { fields: error.fields } : {}),
        },
      });
      return;
    }
    if (error instanceof ZodError) {
      res.status(400).json({
        error: {
          code: 'VALIDATION_FAILED',
          message: 'Some fields need attention.',
          fields: fieldsFromZod(error),
        },
      });
      return;
    }
    const status =
      (error as { status?: number; statusCode?: number }).status ??
      (error as { statusCode?: number }).statusCode;
    const type = (error as { type?: string }).type;
    if (type === 'entity.parse.failed') {
      res
        .status(400)
        .json({ error: { code: 'BAD_JSON', message: 'The request body is not valid JSON.' } });
      return;
    }
    if (type === 'entity.too.large') {
      res
        .status(413)
        .json({ error: { code: 'BODY_TOO_LARGE', message: 'The request body is too large.' } });
      return;
    }
    if (status && status >= 400 && status < 500) {
      res
        .status(status)
        .json({ error: { code: 'BAD_REQUEST', message: 'The request could not be understood.' } });
      return;
    }
    if (isDbConnectionError(error)) {
      req.log?.warn({ err: error }, 'database unavailable');
      res.status(503).json({
        error: {
          code: 'DB_UNAVAILABLE',
          message: 'The database is not reachable right now. Please try again in a moment.',
        },
      });
      return;
    }
    req.log?.error({ err: error }, 'unhandled error');
    res.status(500).json({
      error: {
        code: 'INTERNAL',
        message: 'Something went wrong on our side. Please try again.',
        ...(showDetails && error instanceof Error
          ? { detail: error.message, stack: error.stack }
          : {}),
      },
    });
  };
}
