/**
 * Rate limits for sign-in and password-reset requests: one counter per client IP and one per
 * normalised e-mail address, so neither many addresses from one place nor one address from many
 * places gets unlimited tries. Both counters answer the same way for known and unknown addresses.
 */
import type { RequestHandler } from 'express';
import { rateLimit, type AugmentedRequest } from 'express-rate-limit';
import { emailSchema } from '../../shared/schema/accounts.js';
import type { AppConfig } from '../config.js';

/** The e-mail in the body as the accounts table stores it, or a shared key for a missing/invalid one. */
export function emailKey(body: unknown): string {
  const parsed = emailSchema.safeParse((body as { email?: unknown } | undefined)?.email);
  return parsed.success ? `email:${parsed.data}` : 'email:(invalid)';
}

/** Whole minutes until `resetTime`, at least 1. */
export function minutesUntil(resetTime: Date | undefined, now = Date.now()): number {
  if (!resetTime) return 1;
  return Math.max(1, Math.ceil((resetTime.getTime() - now) / 60_000));
}

/**
 * Two limiters (per IP, then per e-mail) for one action. `countFailuresOnly` leaves successful
 * requests uncounted (sign-in: a user who gets in is not punished for earlier typos).
 */
export function attemptLimits(limits: AppConfig['rateLimit'], options: { countFailuresOnly: boolean }): RequestHandler[] {
  const common = {
    windowMs: limits.windowMinutes * 60_000,
    standardHeaders: 'draft-8' as const,
    legacyHeaders: false,
    skipSuccessfulRequests: options.countFailuresOnly,
    handler: ((req, res) => {
      const minutes = minutesUntil((req as AugmentedRequest).rateLimit?.resetTime);
      res.status(429).json({
        error: {
          code: 'rate_limited',
          message: `Too many attempts. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`,
        },
      });
    }) satisfies RequestHandler,
  };
  return [
    rateLimit({ ...common, limit: limits.perIp }),
    rateLimit({ ...common, limit: limits.perEmail, keyGenerator: (req) => emailKey(req.body) }),
  ];
}
