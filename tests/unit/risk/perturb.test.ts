import { describe, expect, it } from 'vitest';
import { riskInputKeys, type Scenario } from '../../../shared/schema';
import { applyMultipliers, perturb } from '../../../shared/engine/risk/perturb';
import { riskScenario } from '../engine/fixtures';
import { evaluateNpvOnly } from '../../../shared/engine/evaluate';

function deepFreeze<T>(value: T): T {
  if (value && typeof value === 'object') {
    for (const child of Object.values(value)) deepFreeze(child);
    Object.freeze(value);
  }
  return value;
}

const capitalItems = (scenario: Scenario) =>
  scenario.options.flatMap((option) => option.capitalLines.filter((line) => line.kind === 'item'));

// docs/model.md, Risk: every sensitivity or Monte Carlo value is a multiplier on the base value.
describe('perturb', () => {
  it('never mutates the scenario it is given', () => {
    const scenario = deepFreeze(riskScenario());
    const snapshot = structuredClone(scenario);
    for (const key of riskInputKeys) perturb(scenario, key, 1.3);
    applyMultipliers(scenario, { milkPrice: 0.7, herdSize: 1.1, capitalCost: 1.2 });
    expect(scenario).toEqual(snapshot);
  });

  it('scales the herd-level prices and the lying-time response', () => {
    const base = riskScenario();
    expect(perturb(base, 'milkPrice', 1.1).herd.milkPricePerKg).toBeCloseTo(base.herd.milkPricePerKg * 1.1, 12);
    expect(perturb(base, 'wage', 0.9).herd.wagePerHour).toBeCloseTo(base.herd.wagePerHour * 0.9, 12);
    expect(perturb(base, 'yieldResponse', 1.5).herd.lyingResponseKgPerHour).toBeCloseTo(base.herd.lyingResponseKgPerHour * 1.5, 12);
    const fertiliser = perturb(base, 'fertiliserPrice', 1.2).herd.fertiliserPrices;
    expect(fertiliser.nitrogenPerKg).toBeCloseTo(base.herd.fertiliserPrices.nitrogenPerKg * 1.2, 12);
    expect(fertiliser.phosphatePerKg).toBeCloseTo(base.herd.fertiliserPrices.phosphatePerKg * 1.2, 12);
    expect(fertiliser.potashPerKg).toBeCloseTo(base.herd.fertiliserPrices.potashPerKg * 1.2, 12);
  });

  it('scales the loan interest rate but not the discount rate', () => {
    const base = riskScenario();
    const moved = perturb(base, 'interestRate', 1.2);
    expect(moved.finance.interestRate).toBeCloseTo(base.finance.interestRate * 1.2, 12);
    expect(moved.finance.discountRate).toBe(base.finance.discountRate);
  });

  it('scales every capital item of every option and leaves contingency rates alone', () => {
    const base = riskScenario();
    const moved = perturb(base, 'capitalCost', 1.25);
    const before = capitalItems(base);
    const after = capitalItems(moved);
    expect(before.length).toBeGreaterThan(0);
    after.forEach((line, i) => expect(line.unitCost).toBeCloseTo((before[i]?.unitCost ?? Number.NaN) * 1.25, 9));
    const contingencies = (s: Scenario) => s.options.flatMap((o) => o.capitalLines.filter((l) => l.kind === 'contingency').map((l) => l.rate));
    expect(contingencies(moved)).toEqual(contingencies(base));
  });

  it('scales the bedding price of every option', () => {
    const base = riskScenario();
    const moved = perturb(base, 'beddingPrice', 0.8);
    moved.options.forEach((option, i) => expect(option.bedding.pricePerTonne).toBeCloseTo((base.options[i]?.bedding.pricePerTonne ?? Number.NaN) * 0.8, 9));
  });

  it('scales the herd and each option\'s own herd change together', () => {
    const base = riskScenario();
    const withChange = {
      ...base,
      options: base.options.map((o, i) => (i === 1 ? { ...o, herdChange: { ...o.herdChange, cowsByYear: [160, 180] } } : o)),
    };
    const moved = perturb(withChange, 'herdSize', 1.1);
    expect(moved.herd.cows).toBeCloseTo(base.herd.cows * 1.1, 9);
    expect(moved.options[1]?.herdChange.cowsByYear).toEqual([160 * 1.1, 180 * 1.1]);
  });

  it('composes multipliers: applying two keys equals applying them one after the other', () => {
    const base = riskScenario();
    const both = applyMultipliers(base, { milkPrice: 1.1, wage: 0.9 });
    expect(both).toEqual(perturb(perturb(base, 'milkPrice', 1.1), 'wage', 0.9));
    expect(applyMultipliers(base, {})).toEqual(base);
  });
});

describe('risk inputs that move the barn case (docs: shared/engine/README.md, "Risk")', () => {
  it('scales feed costs, the system yield adjustment, health costs per case and slurry handling in every option', () => {
    const base = riskScenario();
    const option = base.options[1];
    if (!option) throw new Error('no second option');
    const at = (key: Parameters<typeof perturb>[1], m: number) => perturb(base, key, m).options[1];
    // Multipliers on the base value: housed feed 5.00 × 1.2 = 6.00 etc. (hand arithmetic on whatever the fixture holds).
    expect(at('housedFeedCost', 1.2)?.feedCostPerCowDay.housed).toBeCloseTo(option.feedCostPerCowDay.housed * 1.2, 12);
    expect(perturb(base, 'housedFeedCost', 1.2).herd.feedCostPerCowDay.housed).toBeCloseTo(base.herd.feedCostPerCowDay.housed * 1.2, 12);
    expect(at('grazingFeedCost', 0.8)?.feedCostPerCowDay.grazing).toBeCloseTo(option.feedCostPerCowDay.grazing * 0.8, 12);
    expect(perturb(base, 'marginalFeedCost', 1.5).herd.marginalFeedCostPerKgMilk).toBeCloseTo(base.herd.marginalFeedCostPerKgMilk * 1.5, 12);
    expect(at('healthCostPerCase', 2)?.health.lamenessCostPerCase).toBeCloseTo(option.health.lamenessCostPerCase * 2, 12);
    expect(at('healthCostPerCase', 2)?.health.mastitisCostPerCase).toBeCloseTo(option.health.mastitisCostPerCase * 2, 12);
    expect(at('manureHandlingCost', 1.3)?.manure.handlingCostPerM3).toBeCloseTo(option.manure.handlingCostPerM3 * 1.3, 12);
    const gained = { ...base, options: base.options.map((o) => (o.current ? o : { ...o, systemYieldAdjustment: 4 })) };
    // 4 kg × 0.5 = 2 kg: half the barn's feeding gain holds.
    expect(perturb(gained, 'systemYield', 0.5).options[1]?.systemYieldAdjustment).toBe(2);
  });

  it('moves the change’s NPV the way a practitioner expects', () => {
    // Dearer housed feed hurts a year-round barn against grazing; a smaller feeding gain too.
    const s = riskScenario();
    const gained = { ...s, options: s.options.map((o) => (o.current ? o : { ...o, systemYieldAdjustment: 4 })) };
    const npv = (scenario: Scenario) => evaluateNpvOnly(scenario)[1]?.incrementalNpv ?? NaN;
    expect(npv(perturb(gained, 'housedFeedCost', 1.2))).toBeLessThan(npv(gained));
    expect(npv(perturb(gained, 'systemYield', 0.5))).toBeLessThan(npv(gained));
  });
});
