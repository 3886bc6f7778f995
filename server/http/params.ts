/**
 * What every route reads from the request the same way. Id path parameters: a value that is not
 * a positive whole number is bad input, 400 `invalid_input` naming the parameter, on every route
 * alike (:farmId too), and it is read before the body; a well-formed id of a row the caller may
 * not see is 404. The actor: who is asking, on which farm.
 */
import type { Request } from 'express';
import { idParamSchema } from '../../shared/schema/requests.js';
import { farmAccess, requireUser } from '../auth/middleware.js';
import { AppError } from '../errors.js';
import type { Actor } from '../services/access.js';

/** One schema per label, built once: building a zod schema costs far more than using it, on every request. */
const schemas = new Map<string, ReturnType<typeof idParamSchema>>();

function schemaFor(label: string): ReturnType<typeof idParamSchema> {
  let schema = schemas.get(label);
  if (!schema) {
    schema = idParamSchema(label);
    schemas.set(label, schema);
  }
  return schema;
}

/** A positive whole-number path parameter, or 400 `invalid_input` naming it. */
export function idParam(req: Request, name: string, label: string): number {
  const result = schemaFor(label).safeParse(req.params[name]);
  if (result.success) return result.data;
  const message = result.error.issues[0]?.message ?? `${label} must be a whole number`;
  throw new AppError(400, 'invalid_input', `${name}: ${message}`, { [name]: message });
}

/** Who is asking, on which farm, with their role there. */
export function actorOf(req: Request): Actor {
  const { farmId, role } = farmAccess(req);
  const user = requireUser(req);
  return { farmId, role, userId: user.id, name: user.name };
}
