// @vitest-environment jsdom
/**
 * The scenario store over a stubbed `fetch`: the path a screen takes (load → edit → save) with the
 * server's answers written out here. Behaviour from docs/product.md (Scenarios and versions: a save
 * based on an older version gets 409 and nothing is lost; bad input is refused with a field path).
 */
import { readFileSync } from 'node:fs';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { scenarioSchema, type Scenario } from '@shared/schema';
import { useScenarioStore } from '@/stores/scenario';

const demo: Scenario = scenarioSchema.parse(JSON.parse(readFileSync('scenarios/cairnbrook-mattress-or-sand.json', 'utf8')));

interface Call {
  method: string;
  url: string;
  body: unknown;
}

/** Answers each request with the next queued reply and records what was asked. */
function stubServer(replies: { status: number; body?: unknown }[]): Call[] {
  const calls: Call[] = [];
  vi.stubGlobal('fetch', (url: string, init: RequestInit) => {
    calls.push({ method: init.method ?? 'GET', url, body: init.body ? JSON.parse(String(init.body)) : undefined });
    const reply = url.endsWith('/quotes') ? { status: 200, body: { lines: [] } } : replies.shift();
    if (!reply) throw new Error(`unexpected request ${url}`);
    return Promise.resolve(new Response(reply.body === undefined ? null : JSON.stringify(reply.body), { status: reply.status }));
  });
  return calls;
}

const loaded = (version: number, scenario: Scenario = demo) => ({ status: 200, body: { scenario, version, results: null, meta: {} } });

beforeEach(() => setActivePinia(createPinia()));
afterEach(() => vi.unstubAllGlobals());

describe('scenario store', () => {
  it('is clean after loading and dirty after an edit, and revert brings the saved copy back', async () => {
    stubServer([loaded(3)]);
    const store = useScenarioStore();
    await store.load(1, 7);
    expect(store.savedVersion).toBe(3);
    expect(store.dirty).toBe(false);
    store.working!.herd.milkPricePerKg += 0.01;
    expect(store.dirty).toBe(true);
    store.revert();
    expect(store.dirty).toBe(false);
  });

  it('saves against the version it loaded and adopts the next one', async () => {
    const calls = stubServer([loaded(3), loaded(4, { ...demo, name: 'Mattress or sand, revised' })]);
    const store = useScenarioStore();
    await store.load(1, 7);
    store.working!.name = 'Mattress or sand, revised';
    expect(await store.save('new name')).toBe(true);
    const put = calls.find((call) => call.method === 'PUT');
    expect(put?.url).toBe('/api/farms/1/scenarios/7');
    expect(put?.body).toMatchObject({ version: 3, note: 'new name', scenario: { name: 'Mattress or sand, revised' } });
    expect(store.savedVersion).toBe(4);
    expect(store.saveState).toBe('saved');
  });

  it('keeps the local edits and reports who saved first when the server answers 409', async () => {
    const latest = { version: 4, updatedBy: 'Partner', updatedAt: '2026-03-01T10:00:00.000Z' };
    stubServer([loaded(3), { status: 409, body: { error: { code: 'version_conflict', message: 'Saved by someone else', latest } } }]);
    const store = useScenarioStore();
    await store.load(1, 7);
    store.working!.name = 'My edit';
    expect(await store.save()).toBe(false);
    expect(store.saveState).toBe('conflict');
    expect(store.conflict).toEqual(latest);
    expect(store.working!.name).toBe('My edit');
    expect(store.dirty).toBe(true);
  });

  it('puts a 400 message beside the field by its document path, until that field changes', async () => {
    const fields = { 'scenario.finance.interestRate': 'Interest rate must be at most 100 %' };
    stubServer([loaded(3), { status: 400, body: { error: { code: 'invalid_input', message: 'Check the highlighted fields', fields } } }]);
    const store = useScenarioStore();
    await store.load(1, 7);
    store.working!.name = 'Edited';
    await store.save();
    expect(store.saveState).toBe('invalid');
    expect(store.fieldErrors['finance.interestRate']).toBe('Interest rate must be at most 100 %');
    store.working!.finance.interestRate = 0.05;
    await vi.waitFor(() => expect(store.fieldErrors['finance.interestRate']).toBeUndefined());
  });
});
