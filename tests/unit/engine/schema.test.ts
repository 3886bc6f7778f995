import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { DEFAULT_FINANCE, DEFAULT_FINANCE_SOURCES, financeSchema, optionSchema, scenarioSchema } from '../../../shared/schema';
import { demoScenarioInput } from './fixtures';

type Mutable = Record<string, unknown> & { herd: Record<string, unknown>; finance: Record<string, unknown>; options: Record<string, unknown>[] };

function withChange(change: (input: Mutable) => void) {
  const input = structuredClone(demoScenarioInput()) as unknown as Mutable;
  change(input);
  return scenarioSchema.safeParse(input);
}

function messages(result: ReturnType<typeof withChange>): string[] {
  return result.success ? [] : result.error.issues.map((issue) => issue.message);
}

describe('scenario schema', () => {
  it('accepts the demo scenario and fills defaults', () => {
    const parsed = scenarioSchema.parse(demoScenarioInput());
    // docs/model.md: horizon defaults to 20 years; docs/references.md: g default 1.0 kg/h (common practice), ramp 50 % in year 1.
    expect(parsed.horizonYears).toBe(20);
    expect(parsed.herd.lyingResponseKgPerHour).toBe(1);
    expect(parsed.herd.lyingResponseYear1Fraction).toBe(0.5);
    // docs/references.md: default lender threshold 1.25 (common practice, no source).
    expect(parsed.finance.coverageThreshold).toBe(1.25);
    // docs/references.md: ASABE D384.2 lactating cow 68 kg manure, 0.45 kg N per day (from memory).
    expect(parsed.herd.manureExcretion.massKgPerCowDay).toBe(68);
    expect(parsed.herd.manureExcretion.nitrogenKgPerCowDay).toBe(0.45);
    // docs/references.md: Cornell CSS 412, 35 % of organic N available in the year applied (< 18 % DM).
    expect(parsed.herd.nutrientAvailability.nitrogen).toBe(0.35);
    expect(parsed.risk.monteCarlo.draws).toBe(5000);
    expect(parsed.risk.sensitivity.milkPrice).toEqual({ low: -0.2, high: 0.2 });
  });

  // docs/model.md "Validation": each of these is refused with a message naming the field.
  it('refuses a negative herd, naming the herd size', () => {
    const result = withChange((s) => (s.herd.cows = -5));
    expect(result.success).toBe(false);
    expect(messages(result)).toContain('Herd size must be at least 1 cow');
  });

  it('refuses a 300 % interest rate, naming the interest rate', () => {
    const result = withChange((s) => (s.finance.interestRate = 3));
    expect(messages(result)).toContain('Interest rate must be at most 30 % (0.3)');
  });

  it('refuses a horizon of 0, naming the horizon', () => {
    const result = withChange((s) => (s.horizonYears = 0));
    expect(messages(result)).toContain('Horizon must be at least 1 year');
  });

  it('refuses a loan term over 40 years, naming the loan term', () => {
    const result = withChange((s) => (s.finance.termYears = 41));
    expect(messages(result)).toContain('Loan term must be at most 40 years');
  });

  it('refuses lying time over 24 h, naming the lying time', () => {
    const result = withChange((s) => ((s.options[1] as Record<string, unknown>).lyingHoursPerDay = 25));
    expect(messages(result)).toContain('Lying time must be at most 24 h/day');
    const issue = result.success ? undefined : result.error.issues[0];
    expect(issue?.path).toEqual(['options', 1, 'lyingHoursPerDay']);
  });

  it('refuses a herd size that is not a number', () => {
    const result = withChange((s) => (s.herd.cows = 'many'));
    expect(messages(result)).toContain('Herd size must be a number');
  });

  it('names a missing group of fields', () => {
    expect(messages(withChange((s) => delete (s as Record<string, unknown>).herd))).toContain('Herd and markets must be an object with its fields');
    expect(messages(withChange((s) => delete (s.options[1] as Record<string, unknown>).labour))).toContain('Labour must be an object with its fields');
  });

  it('refuses a scenario without exactly one current option', () => {
    const none = withChange((s) => s.options.forEach((o) => (o.current = false)));
    expect(messages(none)).toContain('Options: exactly one option must be the current option (found 0)');
    const two = withChange((s) => s.options.forEach((o) => (o.current = true)));
    expect(messages(two)).toContain('Options: exactly one option must be the current option (found 5)');
  });

  it('refuses duplicate option ids and more than 12 options', () => {
    const duplicate = withChange((s) => ((s.options[2] as Record<string, unknown>).id = 'steel'));
    expect(messages(duplicate)).toContain('Option id "steel" is used twice');
    const many = withChange((s) => {
      const extra = s.options[1];
      for (let i = 0; i < 8; i++) s.options.push({ ...extra, id: `extra-${i}` });
    });
    expect(messages(many)).toContain('Options: a scenario holds at most 12 options');
  });

  it('refuses a capital line id used in two options, naming both paths', () => {
    // Documents attach to scenarioId + capital line id (README, documents API), so a line id must name one line.
    const result = withChange((s) => {
      const lines = (s.options[2] as { capitalLines: { id: string }[] }).capitalLines;
      const first = (s.options[1] as { capitalLines: { id: string }[] }).capitalLines[0];
      if (lines[0] && first) lines[0].id = first.id;
    });
    expect(result.success).toBe(false);
    const issue = result.success ? undefined : result.error.issues.find((i) => i.message.includes('unique in the scenario'));
    expect(issue?.path).toEqual(['options', 2, 'capitalLines', 0, 'id']);
    expect(issue?.message).toBe('Capital line id "steel.shell" at options.2.capitalLines.0.id is already used at options.1.capitalLines.0.id: capital line ids must be unique in the scenario');
  });

  it('holds default finance terms that validate, each with its source', () => {
    expect(financeSchema.parse(DEFAULT_FINANCE)).toEqual(DEFAULT_FINANCE);
    // docs/references.md: the lender's 1.25 coverage threshold is common practice, no source.
    expect(DEFAULT_FINANCE.coverageThreshold).toBe(1.25);
    expect(DEFAULT_FINANCE_SOURCES.coverageThreshold.kind).toBe('common-practice');
    expect(financeSchema.parse({ interestRate: 0.05, termYears: 10, discountRate: 0.05 }).coverageThreshold).toBe(DEFAULT_FINANCE.coverageThreshold);
    for (const key of Object.keys(DEFAULT_FINANCE) as (keyof typeof DEFAULT_FINANCE)[]) {
      expect(DEFAULT_FINANCE_SOURCES[key].note.length, key).toBeGreaterThan(0);
      if (key !== 'coverageThreshold') expect(DEFAULT_FINANCE_SOURCES[key].kind, key).toBe('assumption');
    }
  });

  it('refuses an interest-only period that leaves no repayment', () => {
    const result = withChange((s) => {
      s.finance.termYears = 1;
      s.finance.paymentsPerYear = 1;
      s.finance.interestOnlyMonths = 11;
    });
    expect(messages(result)).toContain('Interest-only period must leave at least one repayment in the 1-year loan term');
  });

  it('refuses a currency that is not an ISO 4217 code and a malformed locale', () => {
    expect(messages(withChange((s) => (s.currency = 'euro')))).toContain('Currency must be a three-letter ISO 4217 code such as EUR');
    expect(messages(withChange((s) => (s.locale = 'not a locale!')))).toContain('Locale must be a BCP 47 tag such as en-IE');
  });

  it('refuses payments per year other than 1, 2, 4 or 12', () => {
    expect(messages(withChange((s) => (s.finance.paymentsPerYear = 6)))).toContain('Payments per year must be 1, 2, 4 or 12');
  });

  it('refuses a tax rate above 60 % and a stocking rate above 2', () => {
    expect(messages(withChange((s) => (s.finance.taxRate = 0.7)))).toContain('Tax rate must be at most 60 % (0.6)');
    expect(messages(withChange((s) => ((s.options[1] as Record<string, unknown>).stockingRate = 2.5)))).toContain(
      'Stocking rate must be at most 2 cows per stall',
    );
  });

  it('refuses a triangular distribution whose mode lies outside min..max', () => {
    const result = withChange((s) => {
      s.risk = { monteCarlo: { inputs: [{ key: 'milkPrice', distribution: 'triangular', min: 0.9, mode: 1.3, max: 1.2 }] } };
    });
    expect(messages(result)).toContain('Triangular distribution needs minimum ≤ mode ≤ maximum');
  });

  it('refuses Monte Carlo draws outside 100..100000', () => {
    expect(messages(withChange((s) => (s.risk = { monteCarlo: { draws: 10 } })))).toContain('Monte Carlo draws must be at least 100 draws');
  });

  it('requires a quantity on capital lines the sizing helpers cannot fill', () => {
    const option = structuredClone(demoScenarioInput().options[1]) as Record<string, unknown>;
    option.capitalLines = [
      { kind: 'item', id: 'floor', description: 'Alley floor', category: 'alley-floor', unit: 'per-m2', quantity: null, unitCost: 40, lifeYears: 30 },
    ];
    const result = optionSchema.safeParse(option);
    expect(result.success).toBe(false);
    expect(result.success ? '' : result.error.issues[0]?.message).toMatch(/Capital line "Alley floor" needs a quantity/);
  });

  it('generates a JSON Schema that carries each field description and unit', () => {
    const json = z.toJSONSchema(scenarioSchema, { io: 'input' }) as { properties: Record<string, { description?: string; properties?: Record<string, { description?: string }> }> };
    expect(json.properties.horizonYears?.description).toMatch(/years/);
    expect(json.properties.herd?.properties?.yieldKgPerCowDay?.description).toMatch(/kg per cow per day/);
  });

  it('describes every field of the generated JSON Schema', () => {
    const undescribed: string[] = [];
    const walk = (node: unknown, path: string): void => {
      if (!node || typeof node !== 'object') return;
      const schema = node as Record<string, unknown>;
      for (const [key, child] of Object.entries((schema.properties ?? {}) as Record<string, Record<string, unknown>>)) {
        if (!child.description) undescribed.push(`${path}.${key}`);
        walk(child, `${path}.${key}`);
      }
      for (const key of ['items', 'anyOf', 'oneOf', 'additionalProperties']) {
        const child = schema[key];
        if (Array.isArray(child)) child.forEach((c, i) => walk(c, `${path}.${key}[${i}]`));
        else walk(child, `${path}.${key}`);
      }
    };
    walk(z.toJSONSchema(scenarioSchema, { io: 'input' }), '');
    expect(undescribed).toEqual([]);
  });
});
