/**
 * What can be done to a scenario's list of options — add, duplicate, delete, reorder, mark
 * current — as pure functions: a document in, a new document out (the input is never changed),
 * or an `OptionOperationError` naming what stands in the way. The client's working copy goes
 * through these; the result is saved whole (PUT) and validated there by `scenarioSchema`.
 */
import { freeId, freeName } from './ids';
import type { Option, Scenario, StartingPoint } from './schema';
import { createOption, STARTING_POINT_NAMES, withOptionId } from './starting-points';

/** The schema's limits (`scenarioSchema.options`, `optionSchema.id` and `.name`). */
export const MAX_OPTIONS = 12;
const OPTION_ID_MAX_LENGTH = 60;
const OPTION_NAME_MAX_LENGTH = 120;

export type OptionOperationCode = 'option_not_found' | 'current_option' | 'too_many_options' | 'invalid_order';

/** Why an option operation cannot be done; `field` is the request field it concerns. */
export class OptionOperationError extends Error {
  constructor(
    readonly code: OptionOperationCode,
    readonly field: string,
    message: string,
  ) {
    super(message);
    this.name = 'OptionOperationError';
  }
}

/** A document with a new option in it, and that option. */
export interface OptionAdded {
  scenario: Scenario;
  option: Option;
}

function indexOf(scenario: Scenario, optionId: string): number {
  const index = scenario.options.findIndex((option) => option.id === optionId);
  if (index < 0) throw new OptionOperationError('option_not_found', 'optionId', `Option "${optionId}" is not in this scenario`);
  return index;
}

function assertRoom(scenario: Scenario): void {
  if (scenario.options.length >= MAX_OPTIONS) {
    throw new OptionOperationError('too_many_options', 'options', `A scenario holds at most ${MAX_OPTIONS} options: delete one first`);
  }
}

const ids = (scenario: Scenario): string[] => scenario.options.map((option) => option.id);
const names = (scenario: Scenario): string[] => scenario.options.map((option) => option.name);

/** Adds a candidate option from a starting point, sized for the scenario's herd, at the end. */
export function addOption(scenario: Scenario, startingPoint: StartingPoint, name?: string): OptionAdded {
  assertRoom(scenario);
  const option = createOption(startingPoint, scenario.herd, {
    id: freeId(startingPoint, ids(scenario), OPTION_ID_MAX_LENGTH),
    name: freeName(name?.trim() || STARTING_POINT_NAMES[startingPoint], names(scenario), OPTION_NAME_MAX_LENGTH),
  });
  return { scenario: { ...scenario, options: [...scenario.options, option] }, option };
}

/**
 * Copies an option right after the original, never as current. The copy's lines get ids of their
 * own (documents attach to scenario id + capital line id), and the copy a name of its own.
 */
export function duplicateOption(scenario: Scenario, optionId: string, name?: string): OptionAdded {
  const index = indexOf(scenario, optionId);
  assertRoom(scenario);
  const original = scenario.options[index] as Option;
  const renamed = withOptionId(structuredClone(original), freeId(original.id, ids(scenario), OPTION_ID_MAX_LENGTH));
  const option: Option = { ...renamed, current: false, name: freeName(name?.trim() || `${original.name} (copy)`, names(scenario), OPTION_NAME_MAX_LENGTH) };
  const options = [...scenario.options];
  options.splice(index + 1, 0, option);
  return { scenario: { ...scenario, options }, option };
}

/** Removes a candidate option. The current option is refused: another must be marked current first. */
export function deleteOption(scenario: Scenario, optionId: string): Scenario {
  const option = scenario.options[indexOf(scenario, optionId)] as Option;
  if (option.current) {
    throw new OptionOperationError('current_option', 'optionId', 'The current option cannot be deleted: mark another option as current first');
  }
  return { ...scenario, options: scenario.options.filter((o) => o.id !== optionId) };
}

/** Puts the options in the given order; `order` must name every option exactly once. */
export function reorderOptions(scenario: Scenario, order: readonly string[]): Scenario {
  const byId = new Map(scenario.options.map((option) => [option.id, option]));
  if (new Set(order).size !== order.length || order.length !== byId.size || order.some((id) => !byId.has(id))) {
    throw new OptionOperationError('invalid_order', 'order', `Order must list each option id exactly once: ${[...byId.keys()].join(', ')}`);
  }
  return { ...scenario, options: order.map((id) => byId.get(id) as Option) };
}

/** Moves an option one place up (-1) or down (+1); at either end the document is returned as it is. */
export function moveOption(scenario: Scenario, optionId: string, by: -1 | 1): Scenario {
  const index = indexOf(scenario, optionId);
  const target = index + by;
  if (target < 0 || target >= scenario.options.length) return scenario;
  const order = ids(scenario);
  [order[index], order[target]] = [order[target] as string, order[index] as string];
  return reorderOptions(scenario, order);
}

/** Makes one option the current option (the baseline the others are measured against), and no other. */
export function markCurrent(scenario: Scenario, optionId: string): Scenario {
  indexOf(scenario, optionId);
  return { ...scenario, options: scenario.options.map((option) => ({ ...option, current: option.id === optionId })) };
}
