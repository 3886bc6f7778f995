/**
 * The option operations of the scenario builder (docs/product.md, Scenario builder: one current
 * option and candidates from starting points) as pure document-in, document-out functions, with
 * the new-id and name rule of shared/ids.ts. Expected values follow from the demo document's own
 * option ids and names.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { freeId, freeName } from '../../shared/ids.js';
import {
  addOption,
  deleteOption,
  duplicateOption,
  markCurrent,
  MAX_OPTIONS,
  moveOption,
  OptionOperationError,
  reorderOptions,
} from '../../shared/option-operations.js';
import { scenarioSchema, type Scenario } from '../../shared/schema/index.js';
import { readScenarioDocument } from '../../shared/schema/stored-scenario.js';

/** Current "mattress" (New barn, mattresses) and candidate "sand" (New barn, deep sand). */
function demo(): Scenario {
  return readScenarioDocument(JSON.parse(readFileSync('scenarios/cairnbrook-mattress-or-sand.json', 'utf8')));
}

const ids = (scenario: Scenario) => scenario.options.map((option) => option.id);

function refusal(run: () => unknown): OptionOperationError {
  try {
    run();
  } catch (error) {
    if (error instanceof OptionOperationError) return error;
    throw error;
  }
  throw new Error('expected the operation to be refused');
}

describe('freeId and freeName', () => {
  it('keeps a free id or name and numbers a taken one from 2', () => {
    expect(freeId('sand', ['mattress'])).toBe('sand');
    expect(freeId('sand', ['sand', 'sand-2'])).toBe('sand-3');
    expect(freeName('Deep sand', ['Deep sand'])).toBe('Deep sand 2');
  });

  it('shortens the base so the numbered id stays within the limit', () => {
    const long = 'x'.repeat(60);
    const id = freeId(long, [long], 60);
    expect(id).toBe(`${'x'.repeat(58)}-2`);
    expect(id).toHaveLength(60);
  });
});

describe('option operations', () => {
  it('adds a candidate from a starting point under the first free id and name, leaving the input as it was', () => {
    const before = demo();
    const snapshot = structuredClone(before);
    const once = addOption(before, 'sand-freestall');
    const twice = addOption(once.scenario, 'sand-freestall');
    expect(ids(twice.scenario)).toEqual(['mattress', 'sand', 'sand-freestall', 'sand-freestall-2']);
    expect(twice.option.name).toBe(`${once.option.name} 2`);
    expect(twice.option.current).toBe(false);
    expect(before).toEqual(snapshot);
    expect(scenarioSchema.safeParse(twice.scenario).success).toBe(true);
  });

  it('duplicates right after the original, never as current, with line ids of its own', () => {
    const { scenario, option } = duplicateOption(demo(), 'mattress');
    expect(ids(scenario)).toEqual(['mattress', 'mattress-2', 'sand']);
    expect(option).toMatchObject({ id: 'mattress-2', name: 'New barn, mattresses (copy)', current: false });
    expect(option.capitalLines.map((line) => line.id)).toContain('mattress-2.shell');
    // Capital line ids must stay unique in the scenario: documents attach to them.
    expect(scenarioSchema.safeParse(scenario).success).toBe(true);
    expect(duplicateOption(scenario, 'mattress').option.name).toBe('New barn, mattresses (copy) 2');
  });

  it('refuses to delete the current option, and deletes a candidate', () => {
    const refused = refusal(() => deleteOption(demo(), 'mattress'));
    expect(refused.code).toBe('current_option');
    expect(refused.field).toBe('optionId');
    expect(ids(deleteOption(demo(), 'sand'))).toEqual(['mattress']);
  });

  it('marks exactly one option current, so the current one can then be deleted', () => {
    const marked = markCurrent(demo(), 'sand');
    expect(marked.options.map((option) => option.current)).toEqual([false, true]);
    expect(ids(deleteOption(marked, 'mattress'))).toEqual(['sand']);
  });

  it('reorders when every id is named once and refuses any other order', () => {
    expect(ids(reorderOptions(demo(), ['sand', 'mattress']))).toEqual(['sand', 'mattress']);
    expect(refusal(() => reorderOptions(demo(), ['sand'])).code).toBe('invalid_order');
    expect(refusal(() => reorderOptions(demo(), ['sand', 'sand'])).code).toBe('invalid_order');
    expect(refusal(() => reorderOptions(demo(), ['sand', 'barn'])).code).toBe('invalid_order');
  });

  it('moves an option one place and leaves the order alone at either end', () => {
    expect(ids(moveOption(demo(), 'sand', -1))).toEqual(['sand', 'mattress']);
    expect(ids(moveOption(demo(), 'sand', 1))).toEqual(['mattress', 'sand']);
  });

  it('names a missing option and refuses a thirteenth', () => {
    expect(refusal(() => markCurrent(demo(), 'igloo')).code).toBe('option_not_found');
    expect(refusal(() => duplicateOption(demo(), 'igloo')).code).toBe('option_not_found');
    let scenario = demo();
    while (scenario.options.length < MAX_OPTIONS) scenario = addOption(scenario, 'grazing').scenario;
    expect(scenarioSchema.safeParse(scenario).success).toBe(true);
    expect(refusal(() => addOption(scenario, 'grazing')).code).toBe('too_many_options');
    expect(refusal(() => duplicateOption(scenario, 'sand')).code).toBe('too_many_options');
  });
});
