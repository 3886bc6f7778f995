/** What each capital-line category is called on screen (tables, charts). */
import type { capitalCategories } from './schema';

export const CAPITAL_CATEGORY_LABELS: Record<(typeof capitalCategories)[number], string> = {
  'building-shell': 'Building shell',
  'stall-dividers': 'Stall dividers',
  beds: 'Beds',
  'alley-floor': 'Alley floor',
  'manure-removal': 'Manure removal',
  'manure-storage': 'Manure storage',
  water: 'Water',
  'ventilation-lighting': 'Ventilation and lighting',
  'site-works': 'Site works',
  fees: 'Fees',
  equipment: 'Equipment',
  other: 'Other',
};
