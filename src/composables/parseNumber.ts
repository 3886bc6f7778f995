/**
 * Reads a number as a person types it in `locale`: the locale's decimal mark, group separators
 * and spaces ignored, a leading minus (or the Unicode minus). Null when it is not a number.
 */
export function parseLocaleNumber(text: string, locale: string): number | null {
  const parts = new Intl.NumberFormat(locale).formatToParts(12345.6);
  const group = parts.find((part) => part.type === 'group')?.value ?? ',';
  const decimal = parts.find((part) => part.type === 'decimal')?.value ?? '.';
  let cleaned = text.replace(/[\s\u00a0\u202f]/g, '').replace(/\u2212/g, '-');
  // A lone point typed in a comma-decimal locale is still meant as a decimal mark.
  const lonePoint = group === '.' && !cleaned.includes(decimal) && cleaned.split('.').length === 2;
  if (!lonePoint) cleaned = cleaned.split(group).join('').replace(decimal, '.');
  if (!/^-?(\d+\.?\d*|\.\d+)(e-?\d+)?$/i.test(cleaned)) return null;
  const value = Number(cleaned);
  return Number.isFinite(value) ? value : null;
}
