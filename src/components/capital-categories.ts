/** The capital-category labels live in shared/ (the engine's sources and uses reads them too). */
export { CAPITAL_CATEGORY_LABELS } from '@shared/capital-categories';
