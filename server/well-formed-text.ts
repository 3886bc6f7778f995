/**
 * JSON may carry a lone UTF-16 surrogate ("\ud800"), which is no character at all: MariaDB's
 * utf8mb4 refuses it mid-save. Every request body is checked once, before any route, and such
 * text is refused with 400 naming the field.
 */
import type { RequestHandler } from 'express';
import { AppError } from './errors.js';

const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/**
 * The keys from `value` down to the first string or key with a lone surrogate, innermost first,
 * or null. The path is built only for a hit: a saved document has thousands of strings and keys.
 */
function malformedPath(value: unknown): string[] | null {
  if (typeof value === 'string') return LONE_SURROGATE.test(value) ? [] : null;
  if (value === null || typeof value !== 'object') return null;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i += 1) {
      const found = malformedPath(value[i]);
      if (found) return [...found, String(i)];
    }
    return null;
  }
  for (const key of Object.keys(value)) {
    if (LONE_SURROGATE.test(key)) return [key.replace(LONE_SURROGATE, '\uFFFD')];
    const found = malformedPath((value as Record<string, unknown>)[key]);
    if (found) return [...found, key];
  }
  return null;
}

/** The path ("scenario.options.0.name") of the first string or key with a lone surrogate, or null. */
export function findMalformedText(value: unknown): string | null {
  const found = malformedPath(value);
  return found && (found.reverse().join('.') || 'body');
}

export const refuseMalformedText: RequestHandler = (req, _res, next) => {
  const field = findMalformedText(req.body);
  if (field === null) return next();
  const message = 'Contains a broken character (a lone UTF-16 surrogate): retype it';
  next(new AppError(400, 'invalid_input', `${field}: ${message}`, { [field]: message }));
};
