import Decimal from 'decimal.js';

/**
 * Decimal constructor for ledger money: 40 significant digits, half-up rounding.
 * A clone, so the global decimal.js configuration other modules rely on stays untouched.
 */
export const Money = Decimal.clone({ precision: 40, rounding: Decimal.ROUND_HALF_UP });

/**
 * Rounds a decimal amount to cents (0.01), half-up; decimal.js "half-up" means ties go away
 * from zero, so −1.005 becomes −1.01 just as 1.005 becomes 1.01.
 */
export function roundCents(amount: Decimal.Value): Decimal {
  return new Money(amount).toDecimalPlaces(2, Decimal.ROUND_HALF_UP);
}

/** Throws a RangeError naming `field` unless `value` is a finite number. */
export function requireFinite(field: string, value: number): void {
  if (!Number.isFinite(value)) {
    throw new RangeError(`${field} must be a finite number (got ${String(value)})`);
  }
}

/** Throws a RangeError naming `field` unless `value` is a finite number ≥ 0. */
export function requireNonNegative(field: string, value: number): void {
  requireFinite(field, value);
  if (value < 0) throw new RangeError(`${field} must be ≥ 0 (got ${value})`);
}

/** Throws a RangeError naming `field` unless `value` is an integer ≥ 1. */
export function requirePositiveInteger(field: string, value: number): void {
  if (!Number.isInteger(value) || value < 1) {
    throw new RangeError(`${field} must be a whole number ≥ 1 (got ${String(value)})`);
  }
}

/** Throws a RangeError naming `field` unless `value` is a finite rate above −100 %. */
export function requireRate(field: string, value: number): void {
  requireFinite(field, value);
  if (value <= -1) throw new RangeError(`${field} must be greater than −1 (−100 %) (got ${value})`);
}
