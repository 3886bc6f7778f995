/**
 * The scenario being edited: the working copy (the form's model — edits go straight into it),
 * the version it was loaded at, a dirty flag, live results recomputed in the browser with the
 * same engine the server uses, and a save that never overwrites someone else's newer version.
 */
import { defineStore } from 'pinia';
import { computed, readonly, ref, shallowRef, toRaw, watch } from 'vue';
import { scenarioSchema, type Option, type Scenario, type StartingPoint } from '@shared/schema';
import { evaluateScenario, type ScenarioResults } from '@shared/engine';
import * as optionOperations from '@shared/option-operations';
import { ApiError } from '@/api/client';
import { messageFor } from '@/api/messages';
import { scenariosApi, type ScenarioMeta, type VersionConflict } from '@/api/scenarios';
import { documentsApi } from '@/api/documents';
import type { CapitalLineQuotes } from '@shared/schema/documents';

/** Delay after the last edit before the browser re-evaluates (ms): fast enough to feel live, slow enough not to run per keystroke. */
export const LIVE_DELAY_MS = 150;

export type SaveState = 'idle' | 'saving' | 'saved' | 'conflict' | 'invalid' | 'failed';

function clone<T>(value: T): T {
  return JSON.parse(JSON.stringify(value)) as T;
}

/** The server names fields inside the request body ("scenario.options.0.name"); the form knows them by document path. */
function documentPaths(fields: Record<string, string>): Record<string, string> {
  return Object.fromEntries(Object.entries(fields).map(([path, message]) => [path.replace(/^scenario\./, ''), message]));
}

/** Messages of a failed parse keyed by dotted path (first message per path). */
function issuesByPath(error: { issues: readonly { path: readonly PropertyKey[]; message: string }[] }): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const path = issue.path.map(String).join('.');
    fields[path] ??= issue.message;
  }
  return fields;
}

export const useScenarioStore = defineStore('scenario', () => {
  const farmId = ref<number | null>(null);
  const scenarioId = ref<number | null>(null);
  /** The working copy; null until loaded. Components bind their inputs to it. */
  const working = ref<Scenario | null>(null);
  const savedJson = ref('');
  const savedVersion = ref(0);
  const meta = ref<Partial<ScenarioMeta>>({});
  const loadError = ref<string | null>(null);
  const loading = ref(false);

  const live = shallowRef<ScenarioResults | null>(null);
  /** Why there are no live results (invalid fields, an engine error), or null when there are. */
  const liveReason = ref<string | null>(null);
  /** Messages from the shared schema on the working copy, keyed by dotted path. */
  const clientErrors = ref<Record<string, string>>({});
  /** Messages the server sent with its last 400, until the field changes. */
  const serverErrors = ref<Record<string, string>>({});
  const fieldErrors = computed<Record<string, string>>(() => ({ ...clientErrors.value, ...serverErrors.value }));

  const saveState = ref<SaveState>('idle');
  const saveMessage = ref<string | null>(null);
  const conflict = ref<VersionConflict | null>(null);
  const selectedOptionId = ref<string | null>(null);
  /** Why the last option operation was refused (e.g. deleting the current option), until the next one or a load. */
  const optionError = ref<string | null>(null);

  const dirty = computed(() => working.value !== null && JSON.stringify(working.value) !== savedJson.value);
  const options = computed<Option[]>(() => working.value?.options ?? []);
  const selectedOption = computed<Option | null>(
    () => options.value.find((option) => option.id === selectedOptionId.value) ?? options.value[0] ?? null,
  );
  const selectedIndex = computed(() => (selectedOption.value ? options.value.indexOf(selectedOption.value) : -1));

  /** The live evaluation waits LIVE_DELAY_MS after the last edit; `lastJson` is the copy last seen. */
  let timer: ReturnType<typeof setTimeout> | undefined;
  let lastJson = '';

  function adopt(scenario: Scenario, version: number, nextMeta: ScenarioMeta | undefined): void {
    working.value = clone(scenario);
    savedJson.value = JSON.stringify(working.value);
    savedVersion.value = version;
    meta.value = nextMeta ?? {};
    serverErrors.value = {};
    conflict.value = null;
    optionError.value = null;
    if (!scenario.options.some((option) => option.id === selectedOptionId.value)) {
      selectedOptionId.value = scenario.options.find((option) => !option.current)?.id ?? scenario.options[0]?.id ?? null;
    }
    // Evaluated here, once: the edit watcher is told this copy is not an edit, so it does not evaluate it again.
    clearTimeout(timer);
    lastJson = savedJson.value;
    evaluateNow();
  }

  /** Loads a scenario of a farm, replacing the working copy (unsaved edits are the caller's to guard). */
  async function load(nextFarmId: number, nextScenarioId: number): Promise<void> {
    loading.value = true;
    loadError.value = null;
    if (scenarioId.value !== nextScenarioId) {
      working.value = null;
      selectedOptionId.value = null;
    }
    farmId.value = nextFarmId;
    scenarioId.value = nextScenarioId;
    saveState.value = 'idle';
    try {
      const document = await scenariosApi.get(nextFarmId, nextScenarioId);
      adopt(document.scenario, document.version, document.meta);
      void loadQuotes(nextFarmId, nextScenarioId);
    } catch (error) {
      loadError.value = messageFor(error, 'Could not load this scenario');
    } finally {
      loading.value = false;
    }
  }

  /** Which capital lines a contractor's quote backs (documents on the line with an amount). */
  const quotes = shallowRef<ReadonlyMap<string, CapitalLineQuotes>>(new Map());

  async function loadQuotes(forFarm: number, forScenario: number): Promise<void> {
    try {
      const { lines } = await documentsApi.quotes(forFarm, forScenario);
      if (scenarioId.value === forScenario) quotes.value = new Map(lines.map((l) => [l.capitalLineId, l]));
    } catch {
      // Without the quotes every line simply reads as an estimate.
      quotes.value = new Map();
    }
  }

  /** Validates the working copy with the shared schema and evaluates it; never throws. */
  function evaluateNow(): void {
    const scenario = working.value;
    if (!scenario) return;
    const parsed = scenarioSchema.safeParse(scenario);
    if (!parsed.success) {
      clientErrors.value = issuesByPath(parsed.error);
      const count = Object.keys(clientErrors.value).length;
      live.value = null;
      liveReason.value = `Fix ${count === 1 ? 'the highlighted field' : `${count} highlighted fields`} to see results`;
      return;
    }
    clientErrors.value = {};
    try {
      live.value = evaluateScenario(parsed.data);
      liveReason.value = null;
    } catch (error) {
      live.value = null;
      liveReason.value = `The figures could not be evaluated: ${error instanceof Error ? error.message : String(error)}`;
    }
  }

  watch(
    working,
    (scenario) => {
      const json = JSON.stringify(scenario);
      if (json === lastJson) return;
      const before = lastJson ? (JSON.parse(lastJson) as Scenario) : null;
      lastJson = json;
      if (before && scenario) dropAnsweredServerErrors(before, scenario);
      if (saveState.value === 'saved' || saveState.value === 'invalid') saveState.value = 'idle';
      clearTimeout(timer);
      timer = setTimeout(evaluateNow, LIVE_DELAY_MS);
    },
    { deep: true },
  );

  /** A server message stays beside its field until the user changes that field. */
  function dropAnsweredServerErrors(before: Scenario, after: Scenario): void {
    const remaining: Record<string, string> = {};
    for (const [path, message] of Object.entries(serverErrors.value)) {
      if (valueAt(before, path) === valueAt(after, path)) remaining[path] = message;
    }
    serverErrors.value = remaining;
  }

  function valueAt(document: unknown, path: string): string {
    let node: unknown = document;
    for (const segment of path.split('.')) {
      node = node !== null && typeof node === 'object' ? (node as Record<string, unknown>)[segment] : undefined;
    }
    return JSON.stringify(node) ?? 'undefined';
  }

  /**
   * Saves the working copy as a new version. A 409 (someone saved since we loaded) keeps the
   * working copy and sets `conflict`; a 400 puts each field's message beside that field.
   */
  async function save(note?: string): Promise<boolean> {
    if (!working.value || farmId.value === null || scenarioId.value === null) return false;
    saveState.value = 'saving';
    saveMessage.value = null;
    try {
      const body = note ? { version: savedVersion.value, scenario: working.value, note } : { version: savedVersion.value, scenario: working.value };
      const document = await scenariosApi.save(farmId.value, scenarioId.value, body);
      adopt(document.scenario, document.version, document.meta);
      saveState.value = 'saved';
      return true;
    } catch (error) {
      if (error instanceof ApiError && error.status === 409) {
        const latest = (error.body as { latest?: VersionConflict }).latest;
        conflict.value = latest ?? { version: savedVersion.value + 1, updatedBy: null, updatedAt: '' };
        saveState.value = 'conflict';
      } else if (error instanceof ApiError && error.status === 400 && Object.keys(error.fields).length > 0) {
        serverErrors.value = documentPaths(error.fields);
        saveState.value = 'invalid';
        saveMessage.value = messageFor(error, 'Some figures are not right.', working.value);
      } else {
        saveState.value = 'failed';
        saveMessage.value = messageFor(error, 'Saving failed. Try again.');
      }
      return false;
    }
  }

  /** After a conflict: drop the local edits and load the newer version. */
  async function reloadLatest(): Promise<void> {
    if (farmId.value === null || scenarioId.value === null) return;
    await load(farmId.value, scenarioId.value);
  }

  /** After a conflict: keep the local edits as a new scenario; returns its id. */
  async function keepAsNewScenario(): Promise<number | null> {
    if (!working.value || farmId.value === null) return null;
    saveState.value = 'saving';
    try {
      const name = `${working.value.name} (my copy)`.slice(0, 120);
      const created = await scenariosApi.createFrom(farmId.value, { ...working.value, name }, name);
      // The copy is saved now, so leaving this scenario loses nothing.
      savedJson.value = JSON.stringify(working.value);
      conflict.value = null;
      saveState.value = 'saved';
      return created.id;
    } catch (error) {
      saveState.value = 'failed';
      saveMessage.value = messageFor(error, 'Could not keep your copy. Try again.');
      return null;
    }
  }

  /** Discards the local edits (back to the saved version). */
  function revert(): void {
    if (!savedJson.value) return;
    working.value = JSON.parse(savedJson.value) as Scenario;
    serverErrors.value = {};
  }

  /**
   * Applies an option operation of `shared/option-operations` to the working copy (its raw
   * object: the operations copy what they change and never touch their input). A refusal
   * leaves the working copy as it was and says why in `optionError`.
   */
  function applyOption<T>(operation: (scenario: Scenario) => T, adoptResult: (result: T) => Scenario): T | null {
    const scenario = working.value;
    if (!scenario) return null;
    try {
      const result = operation(toRaw(scenario));
      working.value = adoptResult(result);
      optionError.value = null;
      return result;
    } catch (refusal) {
      // A refusal is worded by the shared module itself, not by the server: no ApiError reaches here.
      if (!(refusal instanceof optionOperations.OptionOperationError)) throw refusal;
      optionError.value = refusal.message;
      return null;
    }
  }

  /** Adds an option from a starting point for the scenario's herd and selects it. */
  function addOption(startingPoint: StartingPoint, name?: string): Option | null {
    const added = applyOption((s) => optionOperations.addOption(s, startingPoint, name), (r) => r.scenario);
    if (added) selectedOptionId.value = added.option.id;
    return added?.option ?? null;
  }

  function duplicateOption(id: string): void {
    const added = applyOption((s) => optionOperations.duplicateOption(s, id), (r) => r.scenario);
    if (added) selectedOptionId.value = added.option.id;
  }

  /** Removes a candidate option; the current option is refused (mark another current first). */
  function removeOption(id: string): void {
    const index = options.value.findIndex((option) => option.id === id);
    const removed = applyOption((s) => optionOperations.deleteOption(s, id), (r) => r);
    if (removed && selectedOptionId.value === id) selectedOptionId.value = removed.options[Math.max(0, index - 1)]?.id ?? null;
  }

  function markCurrent(id: string): void {
    applyOption((s) => optionOperations.markCurrent(s, id), (r) => r);
  }

  function moveOption(id: string, by: -1 | 1): void {
    applyOption((s) => optionOperations.moveOption(s, id, by), (r) => r);
  }

  function selectOption(id: string): void {
    selectedOptionId.value = id;
  }

  return {
    quotes,
    farmId: readonly(farmId),
    scenarioId: readonly(scenarioId),
    working,
    savedVersion: readonly(savedVersion),
    meta: readonly(meta),
    loading: readonly(loading),
    loadError: readonly(loadError),
    live: computed(() => live.value),
    liveReason: readonly(liveReason),
    fieldErrors,
    saveState: readonly(saveState),
    saveMessage: readonly(saveMessage),
    conflict: readonly(conflict),
    optionError: readonly(optionError),
    dirty,
    options,
    selectedOption,
    selectedIndex,
    load,
    save,
    reloadLatest,
    keepAsNewScenario,
    revert,
    evaluateNow,
    addOption,
    duplicateOption,
    removeOption,
    markCurrent,
    moveOption,
    selectOption,
  };
});
