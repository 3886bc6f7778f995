import { computed, inject, provide, type ComputedRef, type InjectionKey } from 'vue';
import type { UnitSystem } from '@shared/units';

/** How a farm shows figures: unit system for quantities, locale and currency for numbers and money. */
export interface DisplaySettings {
  units: UnitSystem;
  locale: string;
  currency: string;
}

const KEY: InjectionKey<ComputedRef<DisplaySettings>> = Symbol('display');
const FALLBACK: DisplaySettings = { units: 'metric', locale: 'en-IE', currency: 'EUR' };

/** Gives every input and figure below this component the farm's (or scenario's) display settings. */
export function provideDisplay(settings: () => DisplaySettings): ComputedRef<DisplaySettings> {
  const value = computed(settings);
  provide(KEY, value);
  return value;
}

/** The display settings provided above, or metric/en-IE/EUR outside any farm. */
export function useDisplay(): ComputedRef<DisplaySettings> {
  return inject(KEY, computed(() => FALLBACK));
}
