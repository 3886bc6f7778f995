import { describe, expect, it } from 'vitest';
import { missingScope } from '../../shared/capital-scope';
import { evaluateScenario } from '../../shared/engine/evaluate';
import { createOption } from '../../shared/starting-points';
import { parsedHerd } from './engine/fixtures';
import { handScenario } from './engine/hand-scenario';

describe('capital scope check (common practice, no source: what a first barn budget forgets)', () => {
  const herd = parsedHerd();

  it('finds nothing missing in the starting points, sand lane included for deep sand', () => {
    const sand = { ...createOption('sand-freestall', herd, { id: 'sand' }), herdChange: { cowsByYear: null, addedCows: 20, addedCowCost: null } };
    expect(missingScope(sand)).toEqual([]);
  });

  it('lists the categories no line names for a housed option', () => {
    const bare = createOption('mattress-freestall', herd, { id: 'm' });
    const keep = ['Building shell', 'Stall mattresses', 'Manure storage'];
    const trimmed = { ...bare, capitalLines: bare.capitalLines.filter((line) => keep.includes(line.description)), herdChange: { cowsByYear: null, addedCows: 30, addedCowCost: null } };
    expect(missingScope(trimmed).map((gap) => gap.key)).toEqual(['feed-barrier', 'feeding-equipment', 'feed-storage', 'special-needs-pens', 'milking-capacity', 'services']);
    // Without added cows the parlour is not asked for; a deep-sand bed asks for sand handling.
    expect(missingScope({ ...trimmed, herdChange: { cowsByYear: null, addedCows: 0, addedCowCost: null }, bed: 'deep-sand' }).map((gap) => gap.key)).toContain('sand-handling');
    expect(missingScope({ ...trimmed, herdChange: { cowsByYear: null, addedCows: 0, addedCowCost: null } }).map((gap) => gap.key)).not.toContain('milking-capacity');
    // Grazing and the current option are not checked.
    expect(missingScope({ ...trimmed, current: true })).toEqual([]);
    expect(missingScope(createOption('grazing', herd, { id: 'g' }))).toEqual([]);
  });
});

describe('insurance and existing housing in the maintenance line', () => {
  it('charges maintenance and insurance rates on the new capital plus the housing kept', () => {
    // Hand case candidate: 100 000 barn; maintenance 1 % + insurance 0.3 % on (100 000 + 50 000 kept)
    // = 1.3 % × 150 000 = 1 950.00 a year with no growth.
    const scenario = handScenario((input) => {
      const candidate = input.options[1];
      if (candidate) Object.assign(candidate, { maintenanceRate: 0.01, insuranceRate: 0.003, existingHousingValue: 50_000 });
    });
    expect(evaluateScenario(scenario).options.find((o) => o.id === 'candidate')?.years[1]?.maintenance).toBe(1950);
  });
});
