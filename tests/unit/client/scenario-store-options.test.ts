// @vitest-environment jsdom
/**
 * The scenario store's option actions over a stubbed `fetch`: each goes through
 * shared/option-operations.ts on the working copy and is saved whole with the next PUT.
 * Behaviour from docs/product.md (Scenario builder: one current option and candidates).
 */
import { readFileSync } from 'node:fs';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { scenarioSchema, type Scenario } from '@shared/schema';
import { useScenarioStore } from '@/stores/scenario';

/** Current "mattress", candidate "sand". */
const demo: Scenario = scenarioSchema.parse(JSON.parse(readFileSync('scenarios/cairnbrook-mattress-or-sand.json', 'utf8')));

/** Answers the load, then echoes a PUT back as the next version; records the methods asked. */
function stubServer(): { method: string; url: string }[] {
  const calls: { method: string; url: string }[] = [];
  vi.stubGlobal('fetch', (url: string, init: RequestInit) => {
    const method = init.method ?? 'GET';
    calls.push({ method, url });
    const sent = init.body ? (JSON.parse(String(init.body)) as { version: number; scenario: Scenario }) : null;
    const body = url.endsWith('/quotes')
      ? { lines: [] }
      : { scenario: sent?.scenario ?? demo, version: sent ? sent.version + 1 : 1, results: null, meta: {} };
    return Promise.resolve(new Response(JSON.stringify(body), { status: 200 }));
  });
  return calls;
}

beforeEach(() => setActivePinia(createPinia()));
afterEach(() => vi.unstubAllGlobals());

describe('scenario store option actions', () => {
  it('adds, duplicates, moves and marks current on the working copy, then saves them in one PUT', async () => {
    const calls = stubServer();
    const store = useScenarioStore();
    await store.load(1, 7);
    const added = store.addOption('sand-freestall');
    expect(added?.id).toBe('sand-freestall');
    expect(store.selectedOption?.id).toBe('sand-freestall');
    store.duplicateOption('sand');
    expect(store.options.map((o) => o.id)).toEqual(['mattress', 'sand', 'sand-2', 'sand-freestall']);
    store.moveOption('sand-freestall', -1);
    store.markCurrent('sand');
    expect(store.options.map((o) => [o.id, o.current])).toEqual([
      ['mattress', false],
      ['sand', true],
      ['sand-freestall', false],
      ['sand-2', false],
    ]);
    expect(store.dirty).toBe(true);
    expect(calls.filter((c) => c.method !== 'GET')).toEqual([]);
    expect(await store.save()).toBe(true);
    expect(calls.filter((c) => c.method !== 'GET').map((c) => c.method)).toEqual(['PUT']);
    expect(store.savedVersion).toBe(2);
    expect(store.working?.options).toHaveLength(4);
  });

  it('refuses to remove the current option and says why, then removes a candidate', async () => {
    stubServer();
    const store = useScenarioStore();
    await store.load(1, 7);
    store.removeOption('mattress');
    expect(store.options.map((o) => o.id)).toEqual(['mattress', 'sand']);
    expect(store.optionError).toMatch(/current option cannot be deleted/);
    store.removeOption('sand');
    expect(store.options.map((o) => o.id)).toEqual(['mattress']);
    expect(store.optionError).toBeNull();
    expect(store.dirty).toBe(true);
  });
});
