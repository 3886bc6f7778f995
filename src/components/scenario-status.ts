/** A scenario's state in the words of a family deciding on a barn (the API keeps draft/decided/archived). */
export const SCENARIO_STATUS: Record<string, { label: string; severity: 'secondary' | 'success' | 'warn' }> = {
  draft: { label: 'Still deciding', severity: 'secondary' },
  decided: { label: 'Decided', severity: 'success' },
  archived: { label: 'Put aside', severity: 'warn' },
};
