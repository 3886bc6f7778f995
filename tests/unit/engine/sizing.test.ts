import { describe, expect, it } from 'vitest';
import {
  checkStallDimensions,
  checkWater,
  manureStorageVolumeM3,
  MIN_FILL_RATE_L_PER_MIN,
  MIN_TROUGH_PERIMETER_PER_COW_M,
  STALL_GUIDANCE,
  stallsFor,
} from '../../../shared/engine/sizing';

const IN = 0.0254; // 1 in = 2.54 cm (NIST Handbook 44, from memory of a definition)

describe('stalls from herd and stocking rate', () => {
  it('gives one stall per cow at a stocking rate of 1 and rounds up otherwise', () => {
    // Common practice, no source: one cow per stall is the welfare target.
    expect(stallsFor(120, 1)).toBe(120);
    // 120 ÷ 1.2 = 100 exactly; 121 ÷ 1.2 = 100.83 → 101 stalls.
    expect(stallsFor(120, 1.2)).toBe(100);
    expect(stallsFor(121, 1.2)).toBe(101);
    expect(stallsFor(0, 1)).toBe(0);
  });
});

describe('stall dimension guidance table', () => {
  // Dairy cattle extension, "Design considerations for dairy cattle free stalls" (read).
  it('holds the published inches for 1300–1500 lb cows', () => {
    const small = STALL_GUIDANCE.small;
    expect(small.widthM.min / IN).toBeCloseTo(45, 9);
    expect(small.widthM.max / IN).toBeCloseTo(48, 9);
    expect(small.lengthClosedFrontM.min / IN).toBeCloseTo(102, 9);
    expect(small.lengthClosedFrontM.max / IN).toBeCloseTo(108, 9);
    expect(small.lengthOpenFrontM.min / IN).toBeCloseTo(90, 9);
    expect(small.lengthOpenFrontM.max / IN).toBeCloseTo(96, 9);
    expect(small.neckRailHeightM.min / IN).toBeCloseTo(46, 9);
    expect(small.neckRailHeightM.max / IN).toBeCloseTo(48, 9);
    expect(small.neckRailFromCurbM.min / IN).toBeCloseTo(66, 9);
    expect(small.neckRailFromCurbM.max / IN).toBeCloseTo(68, 9);
    expect(small.brisketLocatorFromCurbM.min / IN).toBeCloseTo(68, 9);
    expect(small.brisketLocatorFromCurbM.max / IN).toBeCloseTo(70, 9);
    expect(small.brisketLocatorHeightM.min / IN).toBeCloseTo(4, 9);
    expect(small.brisketLocatorHeightM.max / IN).toBeCloseTo(6, 9);
    // 1300–1500 lb = 590–680 kg (docs/references.md).
    expect(small.bodyWeightKg).toEqual({ min: 590, max: 680 });
  });

  it('holds the published inches for 1500–1700 lb cows', () => {
    const large = STALL_GUIDANCE.large;
    expect(large.widthM.min / IN).toBeCloseTo(48, 9);
    expect(large.widthM.max / IN).toBeCloseTo(52, 9);
    expect(large.lengthClosedFrontM.min / IN).toBeCloseTo(108, 9);
    expect(large.lengthClosedFrontM.max / IN).toBeCloseTo(114, 9);
    expect(large.lengthOpenFrontM.min / IN).toBeCloseTo(96, 9);
    expect(large.lengthOpenFrontM.max / IN).toBeCloseTo(102, 9);
    expect(large.neckRailHeightM.min / IN).toBeCloseTo(48, 9);
    expect(large.neckRailHeightM.max / IN).toBeCloseTo(52, 9);
    expect(large.neckRailFromCurbM.min / IN).toBeCloseTo(68, 9);
    expect(large.neckRailFromCurbM.max / IN).toBeCloseTo(70, 9);
    expect(large.brisketLocatorFromCurbM.min / IN).toBeCloseTo(70, 9);
    expect(large.brisketLocatorFromCurbM.max / IN).toBeCloseTo(72, 9);
    expect(large.brisketLocatorHeightM.max / IN).toBeCloseTo(6, 9);
  });
});

describe('stall dimension check', () => {
  it('passes a large-cow stall inside every range', () => {
    // 50 in wide (1.27 m), 110 in closed front (2.794 m), neck rail 50 in high (1.27 m) 69 in from curb (1.7526 m),
    // brisket locator 71 in (1.8034 m) from curb, 5 in (0.127 m) high: all inside the 1500–1700 lb row.
    const check = checkStallDimensions(
      { front: 'closed', widthM: 1.27, lengthM: 2.794, neckRailHeightM: 1.27, neckRailFromCurbM: 1.7526, brisketLocatorFromCurbM: 1.8034, brisketLocatorHeightM: 0.127 },
      'large',
    );
    expect(check.status).toBe('within');
    expect(check.reasons).toEqual([]);
    expect(check.checks).toHaveLength(6);
  });

  it('flags a stall that is too narrow for large cows with a reason naming the width', () => {
    // 1.20 m = 47.2 in < 48 in minimum for 1500–1700 lb cows; but within 45–48 in for smaller cows.
    const large = checkStallDimensions({ widthM: 1.2 }, 'large');
    expect(large.status).toBe('outside');
    expect(large.reasons[0]).toMatch(/^Stall width 120\.0 cm is below the 121\.9 cm–132\.1 cm guidance for large cows/);
    expect(checkStallDimensions({ widthM: 1.2 }, 'small').status).toBe('within');
  });

  it('checks length against the open-front range when the front is open', () => {
    // 2.50 m = 98.4 in: inside 96–102 in for an open front, below 108 in for a closed front (large cows).
    expect(checkStallDimensions({ front: 'open', lengthM: 2.5 }, 'large').status).toBe('within');
    const closed = checkStallDimensions({ front: 'closed', lengthM: 2.5 }, 'large');
    expect(closed.status).toBe('outside');
    expect(closed.reasons[0]).toMatch(/Stall length \(closed front\)/);
  });

  it('reports not-given when no dimensions are entered', () => {
    expect(checkStallDimensions(undefined, 'small').status).toBe('not-given');
  });
});

describe('water troughs', () => {
  it('uses the Penn State minimums', () => {
    // Penn State Extension, watering system design (read): ≥ 3 in (7.6 cm) per cow; fill ≥ 10 US gal/min = 37.85 L/min.
    expect(MIN_TROUGH_PERIMETER_PER_COW_M).toBe(0.076);
    expect(MIN_FILL_RATE_L_PER_MIN).toBeCloseTo(37.854, 3);
  });

  it('needs 7.6 cm of perimeter per cow', () => {
    // 120 cows × 0.076 m = 9.12 m needed; 3 troughs × 3 m = 9 m is short, 4 × 3 = 12 m is enough.
    const short = checkWater(120, 3, 3, 40);
    expect(short.status).toBe('outside');
    expect(short.requiredPerimeterM).toBeCloseTo(9.12, 9);
    expect(short.reasons[0]).toMatch(/Trough perimeter 9\.00 m is below the 9\.12 m/);
    expect(checkWater(120, 4, 3, 40).status).toBe('within');
  });

  it('needs a fill rate of 10 US gal/min and two waterers per group', () => {
    // 30 L/min < 37.85 L/min (Penn State); one trough < two per group (Penn State).
    expect(checkWater(20, 2, 3, 30).reasons[0]).toMatch(/fill rate 30\.0 L\/min is below 37\.9 L\/min/);
    expect(checkWater(20, 1, 3, 40).reasons).toContain('Water troughs: 1 given, at least 2 per group');
  });
});

describe('manure storage volume (docs/model.md: (manure + wash water + bedding + net rain) × storage days + freeboard)', () => {
  it('sizes a store for 150 days', () => {
    // manure 120 cows × 68 kg × 0.95 ÷ 1000 kg/m³ = 7.752 m³/day (ASABE D384.2 from memory; density from memory)
    // wash water 0.05 × 120 = 6 m³/day; sand 23 kg × 120 ÷ 1000 × 0.9 ÷ 1.6 t/m³ = 1.5525 m³/day
    // rain 0.4 m × 1000 m² ÷ 365 = 1.0958904 m³/day; sum 16.4003904 × 150 = 2460.05856; freeboard 0.3 × 1000 = 300
    // → 2760.05856 m³.
    const volume = manureStorageVolumeM3({
      manureM3PerDay: 7.752,
      washWaterM3PerDay: 6,
      beddingM3PerDay: 1.5525,
      netRainMPerYear: 0.4,
      openStorageAreaM2: 1000,
      storageDays: 150,
      freeboardM: 0.3,
    });
    expect(volume).toBeCloseTo(2760.05856, 4);
  });
});
