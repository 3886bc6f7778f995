import { describe, expect, it } from 'vitest';
import { beddingCostPerYear, beddingToStorageM3PerYear, beddingTonnesPerYear } from '../../../shared/engine/bedding';
import { conditionCostPerYear, cullingCostPerYear, healthCostPerYear } from '../../../shared/engine/health';
import {
  bedCareHoursPerYear,
  beddingTopUpHoursPerYear,
  grazingHoursPerYear,
  labourCost,
  scrapingHoursPerYear,
  troughHoursPerYear,
} from '../../../shared/engine/labour';

describe('labour hours (docs/model.md "Labour hours per year")', () => {
  it('scraping: passes per day × minutes per pass ÷ 60 × housed days', () => {
    // 2 passes a day (common practice, no source: scraping two to three times a day) × 15 min ÷ 60
    // = 0.5 h/day × 365 = 182.5 h/yr.
    expect(scrapingHoursPerYear(2, 15, 365)).toBeCloseTo(182.5, 12);
    // An automatic scraper: 0 passes → 0 h (docs/model.md: ~0 labour).
    expect(scrapingHoursPerYear(0, 15, 365)).toBe(0);
  });

  it('bed care: cleanings per day × seconds per stall × stalls ÷ 3600 × housed days', () => {
    // 2 cleanings (common practice: once or twice a day) × 10 s × 120 stalls = 2400 s = 0.6667 h/day × 365 = 243.33 h.
    expect(bedCareHoursPerYear(2, 10, 120, 365)).toBeCloseTo((2400 / 3600) * 365, 9);
  });

  it('bedding top-up: tonnes per year ÷ tonnes handled per hour', () => {
    // Sand 23 kg/stall/day (docs/references.md university guidance, ≥ 50 lb) × 120 stalls × 365 = 1007.4 t ÷ 4 t/h = 251.85 h.
    const tonnes = beddingTonnesPerYear(23, 120, 365);
    expect(tonnes).toBeCloseTo(1007.4, 9);
    expect(beddingTopUpHoursPerYear(tonnes, 4)).toBeCloseTo(251.85, 9);
    expect(beddingTopUpHoursPerYear(0, 4)).toBe(0);
  });

  it('water troughs: cleanings per day × minutes per trough × troughs ÷ 60 × housed days', () => {
    // 1 cleaning a day (common practice: daily or more often) × 5 min × 4 troughs ÷ 60 = 0.3333 h × 365 = 121.67 h.
    expect(troughHoursPerYear(1, 5, 4, 365)).toBeCloseTo((20 / 60) * 365, 9);
  });

  it('grazing work: hours per grazing day × grazing days', () => {
    // 2.5 h (fetching cows, fencing, water) × 215 grazing days = 537.5 h.
    expect(grazingHoursPerYear(2.5, 215)).toBe(537.5);
  });

  it('labour cost: hours × wage grown to the year', () => {
    // 182.5 h × 16.00/h × 1.03^2 = 2920 × 1.0609 = 3097.828.
    expect(labourCost(182.5, 16, 1.03 ** 2)).toBeCloseTo(3097.828, 9);
  });
});

describe('bedding (docs/model.md: kg per stall per day × stalls × housed days × price per tonne)', () => {
  it('prices the tonnes and sends a share to the manure store', () => {
    // 1007.4 t × 15.00/t = 15 111; 90 % of it at 1.6 t/m³ → 906.66 t ÷ 1.6 = 566.6625 m³.
    expect(beddingCostPerYear(1007.4, 15)).toBeCloseTo(15_111, 9);
    expect(beddingToStorageM3PerYear(1007.4, 0.9, 1.6)).toBeCloseTo(566.6625, 9);
  });

  it('costs nothing for a bare mattress', () => {
    // docs/model.md: none for bare mattresses.
    expect(beddingCostPerYear(beddingTonnesPerYear(0, 120, 365), 60)).toBe(0);
  });
});

describe('health and culling (docs/model.md: cases per 100 cows × N/100 × cost per case; extra culls × (replacement − cull value))', () => {
  it('costs each condition by its rate per 100 cows', () => {
    // Lameness 24 cases per 100 cows (Cook et al. 2004: 24.0 % prevalence in mattress herds, used as a yearly rate)
    // × 120/100 = 28.8 cases × 300 = 8640.
    expect(conditionCostPerYear(24, 120, 300)).toBeCloseTo(8640, 9);
    // + mastitis 30 × 1.2 × 250 = 9000 + injuries 10 × 1.2 × 150 = 1800 → 19 440.
    const total = healthCostPerYear(120, {
      lamenessCasesPer100Cows: 24,
      lamenessCostPerCase: 300,
      mastitisCasesPer100Cows: 30,
      mastitisCostPerCase: 250,
      injuriesPer100Cows: 10,
      injuryCostPerCase: 150,
    });
    expect(total).toBeCloseTo(19_440, 9);
  });

  it('costs extra culls at replacement cost less cull value', () => {
    // 3 extra culls per 100 × 1.2 = 3.6 cows × (2000 − 800) = 4320.
    expect(cullingCostPerYear(3, 120, 2000, 800)).toBeCloseTo(4320, 9);
  });
});
