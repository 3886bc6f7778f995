import { z } from 'zod';

/** Trims trailing zeros so messages read "30 %" rather than "30.000000000000004 %". */
function show(value: number): string {
  return String(Number(value.toPrecision(10)));
}

/** " 1 cow", " 20 cows": a plain plural unit loses its "s" after exactly 1. */
function unitAfter(value: number, unit: string): string {
  if (!unit) return '';
  const singular = value === 1 && /^[a-z]+s$/.test(unit) ? unit.slice(0, -1) : unit;
  return ` ${singular}`;
}

interface QuantityOptions {
  /** Whole numbers only (counts, years, months). */
  int?: boolean;
}

/**
 * A number with a unit, a range and messages that name the field,
 * e.g. quantity('Herd size', 'cows', 1, 20000, 'Cows in the herd (head)').
 */
export function quantity(
  label: string,
  unit: string,
  min: number,
  max: number,
  description: string,
  options: QuantityOptions = {},
) {
  let schema = z.number({ error: `${label} must be a number` });
  if (options.int) schema = schema.int(`${label} must be a whole number`);
  return schema
    .min(min, `${label} must be at least ${show(min)}${unitAfter(min, unit)}`)
    .max(max, `${label} must be at most ${show(max)}${unitAfter(max, unit)}`)
    .describe(description);
}

/** A rate stored as a fraction (0.05 = 5 %), with its messages in percent. */
export function rate(label: string, min: number, max: number, description: string) {
  return z
    .number({ error: `${label} must be a number` })
    .min(min, `${label} must be at least ${show(min * 100)} % (${show(min)})`)
    .max(max, `${label} must be at most ${show(max * 100)} % (${show(max)})`)
    .describe(description);
}

/** Money in the farm's currency, never negative unless `min` says so. */
export function money(label: string, description: string, min = 0, max = 1e10) {
  return quantity(label, '', min, max, description);
}

/** A short non-empty text such as a name or an id. */
export function text(label: string, description: string, max = 200) {
  return z
    .string({ error: `${label} must be text` })
    .trim()
    .min(1, `${label} must not be empty`)
    .max(max, `${label} must be at most ${max} characters`)
    .describe(description);
}

/** An enumeration whose message lists the allowed values. */
export function choice<const T extends readonly [string, ...string[]]>(
  label: string,
  values: T,
  description: string,
) {
  return z
    .enum(values, { error: `${label} must be one of: ${values.join(', ')}` })
    .describe(description);
}

/** A yes/no flag whose message names the field. */
export function flag(label: string, description: string) {
  return z.boolean({ error: `${label} must be true or false` }).describe(description);
}
