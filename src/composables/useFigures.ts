/**
 * Null-safe figures for the builder screens, on top of useMoney's formatters: a value that
 * cannot be shown (null, undefined, NaN, ±Infinity) becomes '—' instead of a broken number.
 */
import { computed } from 'vue';
import { formatMoney, formatNumber, formatPercent } from '@/composables/useMoney';
import { useDisplay } from '@/composables/useDisplay';

/** Placeholder for a figure that cannot be computed; the reason goes beside it. */
export const NO_VALUE = '—';

/** True for a number that can be shown. */
export function isShowable(value: number | null | undefined): value is number {
  return typeof value === 'number' && Number.isFinite(value);
}

/** The farm's money and number formats from the provided display settings, '—' for what cannot be shown. */
export function useFigures() {
  const display = useDisplay();
  const format = computed(() => ({ locale: display.value.locale, currency: display.value.currency }));
  const symbol = computed(() => {
    const parts = new Intl.NumberFormat(format.value.locale, { style: 'currency', currency: format.value.currency }).formatToParts(0);
    return parts.find((part) => part.type === 'currency')?.value ?? format.value.currency;
  });
  return {
    display,
    symbol,
    /** Money, whole units unless `digits` says otherwise. */
    money: (value: number | null | undefined, digits = 0) => (isShowable(value) ? formatMoney(value, format.value, digits) : NO_VALUE),
    /** A number with exactly `digits` decimals. */
    number: (value: number | null | undefined, digits = 0) => (isShowable(value) ? formatNumber(value, format.value.locale, digits, true) : NO_VALUE),
    /** A fraction as percent. */
    percent: (value: number | null | undefined, digits = 1) => (isShowable(value) ? formatPercent(value, format.value.locale, digits) : NO_VALUE),
  };
}
