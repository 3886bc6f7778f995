import { z } from 'zod';
import { choice, quantity, text } from './fields';
import { financeSchema } from './finance';
import { herdSchema } from './herd';
import { optionSchema } from './option';
import { riskSchema } from './risk';

function isLocale(value: string): boolean {
  try {
    return Intl.getCanonicalLocales(value).length === 1;
  } catch {
    return false;
  }
}

export const scenarioSchema = z
  .object({
    schemaVersion: z.literal(1, { error: 'Schema version must be 1' }).describe('Version of this scenario format'),
    name: text('Scenario name', 'Name of the decision study', 120),
    description: z.string({ error: 'Scenario description must be text' }).max(2000, 'Scenario description must be at most 2000 characters').optional().describe('Free text'),
    horizonYears: quantity('Horizon', 'years', 1, 40, 'Operating years evaluated after year 0 (years)', { int: true }).default(20),
    currency: z
      .string({ error: 'Currency must be text' })
      .regex(/^[A-Z]{3}$/, 'Currency must be a three-letter ISO 4217 code such as EUR')
      .describe('ISO 4217 currency code of every money figure'),
    locale: z
      .string({ error: 'Locale must be text' })
      .refine(isLocale, 'Locale must be a BCP 47 tag such as en-IE')
      .describe('BCP 47 locale for number formatting'),
    units: choice('Units', ['metric', 'us'], 'Display units only; stored values are SI').default('metric'),
    herd: herdSchema,
    options: z
      .array(optionSchema, { error: 'Options must be a list of options' })
      .min(1, 'Options: a scenario needs at least one option')
      .max(12, 'Options: a scenario holds at most 12 options')
      .describe('Housing options (1..12), exactly one of them current'),
    finance: financeSchema,
    risk: riskSchema.prefault({}),
  })
  .superRefine((scenario, ctx) => {
    const currents = scenario.options.filter((option) => option.current).length;
    if (currents !== 1) {
      ctx.addIssue({
        code: 'custom',
        path: ['options'],
        message: `Options: exactly one option must be the current option (found ${currents})`,
      });
    }
    // Documents are attached to scenarioId + capital line id, so a line id names one line in the whole scenario.
    const lineAt = new Map<string, string>();
    scenario.options.forEach((option, index) => {
      option.capitalLines.forEach((line, lineIndex) => {
        const path = `options.${index}.capitalLines.${lineIndex}.id`;
        const first = lineAt.get(line.id);
        if (first === undefined) lineAt.set(line.id, path);
        else if (!first.startsWith(`options.${index}.`)) {
          ctx.addIssue({
            code: 'custom',
            path: ['options', index, 'capitalLines', lineIndex, 'id'],
            message: `Capital line id "${line.id}" at ${path} is already used at ${first}: capital line ids must be unique in the scenario`,
          });
        }
      });
    });
    const ids = new Set<string>();
    scenario.options.forEach((option, index) => {
      if (ids.has(option.id)) {
        ctx.addIssue({ code: 'custom', path: ['options', index, 'id'], message: `Option id "${option.id}" is used twice` });
      }
      ids.add(option.id);
      const years = option.herdChange.cowsByYear;
      if (years && years.length === 0) {
        ctx.addIssue({ code: 'custom', path: ['options', index, 'herdChange', 'cowsByYear'], message: 'Cows by year must list at least year 1, or be null' });
      }
    });
  })
  .describe('A Byrecast scenario: herd, options, finance and risk settings');

export type Scenario = z.infer<typeof scenarioSchema>;
/** What a client may send: defaults not yet filled. */
export type ScenarioInput = z.input<typeof scenarioSchema>;
