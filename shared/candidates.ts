/**
 * The current option is the reference the others are measured against, not a candidate
 * (docs/product.md, glossary; docs/model.md): only the options with a change against it are
 * ranked or named the best, and never by an option's own whole-herd flows.
 */
interface WithChange {
  /** The change against the current option; null for the current option itself. */
  incremental: { npv: number } | null;
}

type Candidate<T extends WithChange> = T & { incremental: NonNullable<T['incremental']> };

/** True for an option measured against the current option, false for the current option itself. */
export function isCandidate<T extends WithChange>(option: T): option is Candidate<T> {
  return option.incremental !== null;
}

/**
 * The candidates, best first by the NPV of their change against the current option (currency);
 * when none pays, the first is still the least bad change. Equal NPVs keep the given order.
 */
export function candidatesByChange<T extends WithChange>(options: readonly T[]): Candidate<T>[] {
  return options.filter(isCandidate).sort((a, b) => b.incremental.npv - a.incremental.npv);
}
