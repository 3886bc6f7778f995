import { describe, expect, it } from 'vitest';
import { assumptionShare } from '../../server/workbook/assumptions';
import { handScenario } from './engine/hand-scenario';

describe('workbook cover: share of inputs tagged as assumptions', () => {
  it('counts option inputs whose own or parent source tag is an assumption', () => {
    const untagged = handScenario();
    const { assumed, total } = assumptionShare(untagged);
    expect(assumed).toBe(0);
    expect(total).toBeGreaterThan(40);
    // Tag the candidate's lying time (1 input) and its whole health block (8 inputs: 3 rates,
    // 3 costs per case, extra culls, culls per lameness case) as assumptions → 9 of the same total.
    const tagged = handScenario((input) => {
      const candidate = input.options[1];
      if (candidate) candidate.sources = { lyingHoursPerDay: { kind: 'assumption', note: 'guess' }, health: { kind: 'assumption', note: 'planning figures' }, stockingRate: { kind: 'reference', note: 'a source' } };
    });
    expect(assumptionShare(tagged)).toEqual({ assumed: 9, total });
  });
});
