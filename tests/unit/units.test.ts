import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  CM_PER_IN,
  KG_PER_CWT,
  KG_PER_LB,
  KG_PER_US_TON,
  L_PER_US_GAL,
  M2_PER_FT2,
  M3_PER_FT3,
  M_PER_FT,
  QUANTITIES,
  cmToIn,
  fromDisplay,
  ftToM,
  kgToLb,
  lbToKg,
  litreToUsGal,
  m2ToFt2,
  m3ToFt3,
  m3ToUsGal,
  perCwtToPerKg,
  perKgToPerCwt,
  perTonneToPerUsTon,
  perUsTonToPerTonne,
  toDisplay,
  unitLabel,
  usGalToLitre,
} from '../../shared/units';

describe('conversion constants', () => {
  it('use the exact definitions of the pound, foot, inch and US gallon', () => {
    // NIST Handbook 44, Appendix C: 1 lb = 0.453 592 37 kg, 1 ft = 0.3048 m, 1 in = 2.54 cm,
    // 1 US gal = 231 in³ = 3.785 411 784 L (definitions, from memory).
    expect(KG_PER_LB).toBe(0.45359237);
    expect(M_PER_FT).toBe(0.3048);
    expect(CM_PER_IN).toBe(2.54);
    expect(L_PER_US_GAL).toBe(3.785411784);
  });

  it('derive area, volume, gallon, cwt and US ton from those definitions', () => {
    // ft² = 0.3048² m², ft³ = 0.3048³ m³; 231 in³ per gallon; cwt = 100 lb; US ton = 2000 lb
    // (NIST Handbook 44 definitions, from memory).
    expect(M2_PER_FT2).toBeCloseTo(0.3048 ** 2, 15);
    expect(M3_PER_FT3).toBeCloseTo(0.3048 ** 3, 15);
    expect(231 * 2.54 ** 3 / 1000).toBeCloseTo(L_PER_US_GAL, 12);
    expect(KG_PER_CWT).toBeCloseTo(100 * 0.45359237, 12);
    expect(KG_PER_US_TON).toBeCloseTo(2000 * 0.45359237, 10);
  });
});

describe('conversion functions', () => {
  it('convert the reference examples', () => {
    // docs/references.md: manure 68 kg ≈ 150 lb per cow per day (ASABE D384.2, memory; Weiss 2007, read).
    expect(kgToLb(68)).toBeCloseTo(149.9, 1);
    expect(lbToKg(150)).toBeCloseTo(68.04, 2);
    // docs/references.md: 3 in = 7.6 cm of trough perimeter; 10 US gal/min = 38 L/min (Penn State Extension, read).
    expect(cmToIn(7.62)).toBeCloseTo(3, 10);
    expect(usGalToLitre(10)).toBeCloseTo(37.85, 2);
    expect(litreToUsGal(3.785411784)).toBeCloseTo(1, 12);
    // docs/references.md: stall length 10 ft against a wall ≈ 3.05 m (university housing guidance, read).
    expect(ftToM(10)).toBeCloseTo(3.048, 12);
    // 1 m² = 10.7639 ft², 1 m³ = 35.3147 ft³ = 264.172 US gal (NIST Handbook 44 tables, from memory).
    expect(m2ToFt2(1)).toBeCloseTo(10.7639, 4);
    expect(m3ToFt3(1)).toBeCloseTo(35.3147, 4);
    expect(m3ToUsGal(1)).toBeCloseTo(264.172, 3);
  });

  it('convert milk and commodity prices per cwt and per US ton', () => {
    // 1 cwt = 100 lb = 45.359237 kg, so 0.40 per kg = 18.14 per cwt (definition, from memory).
    expect(perKgToPerCwt(0.4)).toBeCloseTo(18.1437, 4);
    expect(perCwtToPerKg(18.1436948)).toBeCloseTo(0.4, 8);
    // 1 US ton = 907.18474 kg: 100 per tonne = 90.72 per US ton (definition, from memory).
    expect(perTonneToPerUsTon(100)).toBeCloseTo(90.718474, 9);
    expect(perUsTonToPerTonne(90.718474)).toBeCloseTo(100, 9);
  });
});

describe('toDisplay / fromDisplay', () => {
  it('leave metric values unchanged', () => {
    for (const quantity of QUANTITIES) expect(toDisplay(12.5, quantity, 'metric')).toBe(12.5);
  });

  it('show a yield of 40 kg/cow/day as 88.18 lb/cow/day and a milk price in cwt', () => {
    // 40 / 0.45359237 = 88.1849 lb (definition of the pound, from memory).
    expect(toDisplay(40, 'yield', 'us')).toBeCloseTo(88.1849, 4);
    expect(unitLabel('yield', 'us')).toBe('lb/cow/day');
    expect(toDisplay(0.4, 'milkPrice', 'us')).toBeCloseTo(18.1437, 4);
    expect(unitLabel('milkPrice', 'us')).toBe('per cwt');
    expect(unitLabel('milkPrice', 'metric')).toBe('per kg');
  });

  it('move a price the opposite way to its amount', () => {
    // A price per lb is a price per kg × kg/lb, while a mass in lb is kg ÷ kg/lb (dimensional analysis).
    expect(toDisplay(1, 'pricePerKg', 'us')).toBeCloseTo(KG_PER_LB, 15);
    expect(toDisplay(1, 'mass', 'us')).toBeCloseTo(1 / KG_PER_LB, 15);
  });

  it('round-trip within four ulps for every quantity', () => {
    fc.assert(
      fc.property(fc.constantFrom(...QUANTITIES), fc.double({ min: -1e9, max: 1e9, noNaN: true }), (quantity, x) => {
        const back = fromDisplay(toDisplay(x, quantity, 'us'), quantity, 'us');
        // Subnormal inputs have no relative precision to keep, hence the absolute floor.
        expect(Math.abs(back - x)).toBeLessThanOrEqual(Math.max(4 * Number.EPSILON * Math.abs(x), 1e-300));
      }),
    );
  });

  it('round-trip exactly to the stored precision', () => {
    // A value stored to d decimals comes back bit-for-bit once rounded to d decimals.
    fc.assert(
      fc.property(
        fc.constantFrom(...QUANTITIES),
        fc.integer({ min: -1e9, max: 1e9 }),
        fc.integer({ min: 0, max: 6 }),
        (quantity, scaled, decimals) => {
          const stored = Number((scaled / 10 ** decimals).toFixed(decimals));
          const shown = toDisplay(stored, quantity, 'us');
          expect(fromDisplay(shown, quantity, 'us', decimals)).toBe(stored);
        },
      ),
    );
  });

  it('has a label for every quantity in both systems', () => {
    for (const quantity of QUANTITIES) {
      expect(unitLabel(quantity, 'metric')).not.toBe('');
      expect(unitLabel(quantity, 'us')).not.toBe(unitLabel(quantity, 'metric'));
    }
  });
});
