/**
 * Request bodies, queries and path parameters of the farm baseline and scenario API, shared by
 * the server (which parses them) and the client (which sends them). The scenario document
 * itself is `scenarioSchema`; other areas keep theirs beside their documents (`lender.ts`,
 * `documents.ts`, `accounts.ts`, `milk-records.ts`).
 */
import { z } from 'zod';
import { emailTokenSchema } from './accounts';
import { choice, quantity, text } from './fields';
import { herdSchema } from './herd';
import { startingPoints } from './option';
import { scenarioSchema } from './scenario';

const versionNumber = quantity('Version', '', 1, 2147483647, 'The scenario version this change is based on', { int: true });
const note = z.string({ error: 'Note must be text' }).trim().max(200, 'Note must be at most 200 characters');
const startingPoint = choice('Starting point', startingPoints, 'The preset that fills the option');

/** PUT /baseline: the farm's herd and markets (SI units) and how the farm shows figures. */
export const baselineBodySchema = z.object({
  herd: herdSchema,
  currency: z
    .string({ error: 'Currency must be text' })
    .regex(/^[A-Z]{3}$/, 'Currency must be a three-letter ISO 4217 code such as EUR'),
  locale: scenarioSchema.shape.locale,
  units: choice('Units', ['metric', 'us'], 'Display units; stored values stay SI'),
});
export type BaselineBody = z.input<typeof baselineBodySchema>;

/** POST /scenarios from the farm baseline: one current option from a starting point. */
export const createScenarioBodySchema = z.object({
  name: text('Scenario name', 'Name of the decision study', 120),
  startingPoint: startingPoint.default('grazing'),
  currentOptionName: text('Current option name', 'Name of the current option', 120).optional(),
});

/** POST /scenarios with a whole scenario document: an import (or "keep my copy" after a conflict). */
export const importScenarioBodySchema = z.object({
  scenario: scenarioSchema,
  name: text('Scenario name', 'Replaces the name in the document', 120).optional(),
});

/** PUT /scenarios/:id: the whole document, based on `version`. */
export const saveScenarioBodySchema = z.object({
  version: versionNumber,
  scenario: scenarioSchema,
  note: note.optional(),
});

/** POST /scenarios/:id/duplicate. */
export const duplicateScenarioBodySchema = z.object({
  name: text('Scenario name', 'Name of the copy', 120).optional(),
});

/** POST /versions/:version/restore: `version` (the scenario's latest, when sent) guards against restoring over a save not seen. */
export const restoreVersionBodySchema = z.object({
  version: versionNumber.optional(),
  note: note.optional(),
});

/**
 * Path and query numbers: a scenario id, a version, a compare pair. They arrive as text, and only
 * plain digits are an id: "1e3", "0x10" or " 7" would coerce to a number but name no row.
 */
export const idParamSchema = (label: string) =>
  z
    .string({ error: `${label} must be a number` })
    .regex(/^\d+$/, `${label} must be a whole number`)
    .transform(Number)
    .pipe(z.number().min(1, `${label} must be at least 1`).max(4_294_967_295, `${label} is too large`));
export const compareQuerySchema = z.object({
  from: idParamSchema('From version'),
  to: idParamSchema('To version'),
  units: choice('Units', ['metric', 'us'], 'Display units of the comparison; default the farm units').optional(),
});
/** GET S/results/detail: the version to read; default the one the caller sees. */
export const resultsDetailQuerySchema = z.object({ version: idParamSchema('Version').optional() });

const optionId = z.string({ error: 'Option must be text' }).trim().min(1, 'Option must be chosen').max(60, 'Option id must be at most 60 characters');

/** PUT S/preferences/me: the member's preferred option and why. */
export const preferenceBodySchema = z.object({
  optionId,
  reason: z.string({ error: 'Reason must be text' }).trim().max(500, 'Reason must be at most 500 characters').default(''),
});

/** POST S/decision: the option the farm decided on. */
export const decisionBodySchema = z.object({
  optionId,
  note: z.string({ error: 'Note must be text' }).trim().max(500, 'Note must be at most 500 characters').default(''),
});

const finite = (label: string) => z.number({ error: `${label} must be a number` }).finite(`${label} must be a finite number`);

/** PUT S/risk-result: a Monte Carlo result as the engine returns it; checked for shape, kept whole. */
export const riskResultBodySchema = z.object({
  scenarioVersion: z.number({ error: 'Scenario version must be a number' }).int('Scenario version must be a whole number').min(1, 'Scenario version must be at least 1'),
  result: z.looseObject({
    seed: finite('Result seed'),
    drawsRequested: finite('Result draws requested'),
    drawsDone: finite('Result draws done'),
    cancelled: z.boolean({ error: 'Result cancelled must be true or false' }),
    coverageThreshold: finite('Result coverage threshold'),
    options: z.array(z.looseObject({ optionId: z.string({ error: 'Result option id must be text' }) })).min(1, 'Result options must not be empty').max(12, 'Result options: at most 12'),
  }),
});

/** Links sent by e-mail (invitations, lender shares): the token in the path. */
export const tokenParamsSchema = z.object({ token: emailTokenSchema });

/** GET /lender-shares: optionally the shares of one scenario. */
export const shareFilterQuerySchema = z.object({ scenarioId: idParamSchema('Scenario id').optional() });
