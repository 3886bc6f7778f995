/**
 * Request bodies of the farm baseline and scenario API, shared by the server (which parses
 * them) and the client (which sends them). The scenario document itself is `scenarioSchema`.
 */
import { z } from 'zod';
import { herdSchema, scenarioSchema, startingPoints } from './schema';
import { choice, quantity, text } from './schema/fields';

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

/** Option operations: every one is a save based on `version`. */
export const addOptionBodySchema = z.object({
  version: versionNumber,
  startingPoint,
  name: text('Option name', 'Name shown to users', 120).optional(),
});
export const optionChangeBodySchema = z.object({ version: versionNumber });
export const duplicateOptionBodySchema = z.object({
  version: versionNumber,
  name: text('Option name', 'Name of the copy', 120).optional(),
});
export const reorderOptionsBodySchema = z.object({
  version: versionNumber,
  order: z.array(text('Option id', 'An option id', 60), { error: 'Order must be a list of option ids' }),
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

/** Path and query numbers: a scenario id, a version, a compare pair. */
export const idParamSchema = (label: string) =>
  z
    .coerce.number({ error: `${label} must be a number` })
    .int(`${label} must be a whole number`)
    .min(1, `${label} must be at least 1`)
    .max(4_294_967_295, `${label} is too large`);
export const compareQuerySchema = z.object({
  from: idParamSchema('From version'),
  to: idParamSchema('To version'),
  units: choice('Units', ['metric', 'us'], 'Display units of the comparison; default the farm units').optional(),
});
export const versionQuerySchema = z.object({ version: idParamSchema('Version') });
/** GET S/results/detail: the version to read; default the one the caller sees. */
export const resultsDetailQuerySchema = z.object({ version: idParamSchema('Version').optional() });
