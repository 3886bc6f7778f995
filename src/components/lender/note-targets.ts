/** What a lender's note can point at in a shared scenario: each option and its lines, by name. Pure. */
import type { Scenario } from '@shared/schema';
import { projectionRows } from '@/components/results/projection-rows';

export interface NoteTarget {
  id: string;
  name: string;
  /** Lines of the option a note can point at: capital, running-cost and energy lines, then the projection rows. */
  lines: string[];
}

/** The yearly projection's line names: the same for every option, so no yearly figures are needed to list them. */
const PROJECTION_LINES = projectionRows([]).filter((row) => row.kind === 'line').map((row) => `Yearly: ${row.label}`);

/** The options of `scenario` with the names of their capital, running-cost and energy lines and projection rows. */
export function noteTargets(scenario: Scenario): NoteTarget[] {
  return scenario.options.map((option) => {
    const projection = PROJECTION_LINES;
    const lines = [
      ...option.capitalLines.map((l) => `Capital: ${l.description}`),
      ...option.runningCosts.map((l) => `Running cost: ${l.description}`),
      ...option.energyLines.map((l) => `Energy: ${l.description}`),
      ...projection,
    ];
    return { id: option.id, name: option.name, lines: [...new Set(lines)].map((l) => l.slice(0, 120)) };
  });
}
