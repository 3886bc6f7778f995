/** One error type for the API: an HTTP status, a stable code the client maps to a message. */
import type { ErrorRequestHandler } from 'express';
import type { Logger } from 'pino';
import { z } from 'zod';
import type { ErrorCode } from '../shared/responses.js';

export type FieldErrors = Record<string, string>;

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly fields?: FieldErrors,
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
  }
}

export const notFound = (what = 'Not found') => new AppError(404, 'not_found', what);
export const forbidden = (what = 'You do not have access to this') => new AppError(403, 'forbidden', what);
export const unauthorized = (what = 'Please sign in') => new AppError(401, 'unauthorized', what);
export const conflict = (message: string, details?: Record<string, unknown>) =>
  new AppError(409, 'conflict', message, undefined, details);

/** Turns a zod error into field paths (`options.0.capitalLines.2.unitCost`) and messages. */
export function fieldErrors(error: z.ZodError): FieldErrors {
  const fields: FieldErrors = {};
  for (const issue of error.issues) {
    const path = issue.path.map(String).join('.') || '(body)';
    fields[path] ??= issue.message;
  }
  return fields;
}

export function validationError(error: z.ZodError): AppError {
  const fields = fieldErrors(error);
  const first = Object.entries(fields)[0];
  const message = first ? `${first[0]}: ${first[1]}` : 'Invalid input';
  return new AppError(400, 'invalid_input', message, fields);
}

/** Parses with a schema or throws a 400 that names each bad field. */
export function parseOrThrow<T extends z.ZodType>(schema: T, value: unknown): z.infer<T> {
  const result = schema.safeParse(value);
  if (!result.success) throw validationError(result.error);
  return result.data;
}

interface HttpishError {
  status?: number;
  statusCode?: number;
  type?: string;
  expose?: boolean;
  message?: string;
}

const CONNECTION_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'ENOTFOUND', 'PROTOCOL_CONNECTION_LOST', 'ER_CON_COUNT_ERROR', 'ER_SERVER_SHUTDOWN']);

/** True when the error (or one it wraps, as Drizzle does) says the database cannot be reached, not that a query was wrong. */
export function isDatabaseUnavailable(err: unknown): boolean {
  for (let e = err, depth = 0; e && typeof e === 'object' && depth < 5; e = (e as { cause?: unknown }).cause, depth++) {
    const { code, fatal, message } = e as { code?: unknown; fatal?: unknown; message?: unknown };
    if (fatal === true || (typeof code === 'string' && CONNECTION_CODES.has(code)) || message === 'Pool is closed.') return true;
  }
  return false;
}

/** The one error middleware: known errors keep their status, the rest become 500 without a stack. */
export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err: unknown, _req, res, _next) => {
    if (err instanceof AppError) {
      res.status(err.status).json({
        error: { code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}), ...err.details },
      });
      return;
    }
    if (err instanceof z.ZodError) {
      const app = validationError(err);
      res.status(400).json({ error: { code: app.code, message: app.message, fields: app.fields } });
      return;
    }
    const httpish = err as HttpishError;
    const status = httpish.status ?? httpish.statusCode;
    if (status && status >= 400 && status < 500) {
      const code =
        httpish.type === 'entity.too.large'
          ? 'payload_too_large'
          : httpish.type === 'entity.parse.failed'
            ? 'invalid_json'
            : 'bad_request';
      const message =
        code === 'payload_too_large'
          ? 'The request is too large'
          : code === 'invalid_json'
            ? 'The request body is not valid JSON'
            : httpish.expose && httpish.message
              ? httpish.message
              : 'Bad request';
      res.status(status).json({ error: { code, message } });
      return;
    }
    if (isDatabaseUnavailable(err)) {
      logger.warn({ err }, 'database unavailable');
      res.status(503).json({ error: { code: 'database_unavailable', message: 'Byrecast cannot reach its database just now. Try again in a moment.' } });
      return;
    }
    logger.error({ err }, 'unhandled error');
    res.status(500).json({ error: { code: 'internal', message: 'Something went wrong on our side. Please try again.' } });
  };
}
