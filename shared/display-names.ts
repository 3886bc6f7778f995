/**
 * Plain names for the codes a farm's settings hold, for screens and the workbook alike: a number
 * style by the country it is used in with a sample ("Ireland — 1,234.5"), a currency by its name
 * and symbol ("Euro (€)"), never a BCP 47 or ISO 4217 code on its own.
 */

/** The country each offered number style is known from. */
export const LOCALE_COUNTRIES: Readonly<Record<string, string>> = {
  'en-IE': 'Ireland',
  'en-GB': 'United Kingdom',
  'en-US': 'United States',
  'en-CA': 'Canada',
  'en-AU': 'Australia',
  'en-NZ': 'New Zealand',
  'de-DE': 'Germany',
  'fr-FR': 'France',
  'nl-NL': 'Netherlands',
  'da-DK': 'Denmark',
  'pl-PL': 'Poland',
};

/** "Ireland — 1,234.5": the country and 1234.5 written in that style. */
export function numberStyleName(locale: string): string {
  const sample = new Intl.NumberFormat(locale, { maximumFractionDigits: 1 }).format(1234.5);
  return `${LOCALE_COUNTRIES[locale] ?? 'Numbers'} — ${sample}`;
}

/** "Euro (€)"; the code only where the locale has no symbol of its own for it ("Swiss Franc (CHF)"). */
export function currencyName(currency: string, locale: string): string {
  let name = currency;
  let symbol = currency;
  try {
    name = new Intl.DisplayNames([locale, 'en'], { type: 'currency' }).of(currency) ?? currency;
    symbol = new Intl.NumberFormat(locale, { style: 'currency', currency }).formatToParts(0).find((part) => part.type === 'currency')?.value ?? currency;
  } catch {
    // An unknown code: show it as it is rather than fail an export.
  }
  return `${name} (${symbol})`;
}
