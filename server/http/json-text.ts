/** Sends JSON the services wrote as text (kept results) without parsing and re-serialising it. */
import type { Response } from 'express';
import type { JsonText } from '../../shared/responses.js';

export function sendJsonText<T>(res: Response, text: JsonText<T>, status = 200): void {
  res.status(status).type('application/json').send(text);
}
