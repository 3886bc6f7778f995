/**
 * JSON may carry a lone UTF-16 surrogate ("\ud800"), which is no character at all: MariaDB's
 * utf8mb4 refuses it mid-save. Every request body is checked once, before any route, and such
 * text is refused with 400 naming the field.
 */
import type { RequestHandler } from 'express';
import { AppError } from './errors.js';

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/** The path ("scenario.options.0.name") of the first string or key with a lone surrogate, or null. */
export function findMalformedText(value: unknown, path: string[] = []): string | null {
  if (typeof value === 'string') return LONE_SURROGATE.test(value) ? path.join('.') || 'body' : null;
  if (value === null || typeof value !== 'object') return null;
  for (const [key, inner] of Object.entries(value)) {
    if (LONE_SURROGATE.test(key)) return [...path, key.replace(LONE_SURROGATE, '\uFFFD')].join('.');
    const found = findMalformedText(inner, [...path, key]);
    if (found !== null) return found;
  }
  return null;
}

export const refuseMalformedText: RequestHandler = (req, _res, next) => {
  const field = findMalformedText(req.body);
  if (field === null) return next();
  const message = 'Contains a broken character (a lone UTF-16 surrogate): retype it';
  next(new AppError(400, 'invalid_input', `${field}: ${message}`, { [field]: message }));
};
