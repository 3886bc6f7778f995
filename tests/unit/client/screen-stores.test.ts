/**
 * The stores the screens read through, over a mocked API module: what each keeps, what it asks
 * the server for (and how often), what it drops when the screen has moved on, and the words it
 * gives a failure. Behaviour from docs/product.md (versions are immutable and restored as a new
 * version; a confirmed milk-record import sets the herd baseline) and docs/design.md (loading
 * indicators appear only after a short delay).
 */
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createPinia, setActivePinia } from 'pinia';
import { effectScope } from 'vue';
import type { AuditPage, FarmDetail, Session, VersionListItem } from '@shared/responses';
import { ApiError } from '@/api/client';
import { documentsApi } from '@/api/documents';
import { farmsApi } from '@/api/farms';
import { baselineApi } from '@/api/baseline';
import { lenderApi } from '@/api/lender';
import { invitationsApi } from '@/api/members';
import { milkRecordsApi } from '@/api/milk-records';
import { scenariosApi } from '@/api/scenarios';
import { SPINNER_DELAY_MS, useLoading } from '@/composables/useLoading';
import { useAuditLogStore } from '@/stores/audit-log';
import { useDocumentsStore } from '@/stores/documents';
import { useFarmStore } from '@/stores/farm';
import { useInvitationLinkStore, useShareLinkStore } from '@/stores/links';
import { useMilkRecordsStore } from '@/stores/milk-records';
import { useSessionStore } from '@/stores/session';
import { useVersionsStore } from '@/stores/versions';

vi.mock('@/api/scenarios', () => ({
  scenariosApi: { versions: vi.fn(), version: vi.fn(), compare: vi.fn(), restore: vi.fn(), list: vi.fn(), duplicate: vi.fn(), archive: vi.fn(), remove: vi.fn(), exportUrl: vi.fn() },
}));
vi.mock('@/api/lender', () => ({ lenderApi: { auditLog: vi.fn(), preview: vi.fn(), accept: vi.fn() } }));
vi.mock('@/api/members', () => ({ invitationsApi: { preview: vi.fn(), accept: vi.fn() } }));
vi.mock('@/api/documents', () => ({
  documentsApi: { list: vi.fn(), quotes: vi.fn(), upload: vi.fn(), setQuoteAmount: vi.fn(), remove: vi.fn(), downloadUrl: vi.fn() },
}));
vi.mock('@/api/milk-records', () => ({ milkRecordsApi: { history: vi.fn(), preview: vi.fn(), confirm: vi.fn() } }));
vi.mock('@/api/farms', () => ({ farmsApi: { get: vi.fn(), list: vi.fn(), create: vi.fn() } }));
vi.mock('@/api/baseline', () => ({ baselineApi: { get: vi.fn(), save: vi.fn() } }));

const api = {
  scenarios: vi.mocked(scenariosApi),
  lender: vi.mocked(lenderApi),
  invitations: vi.mocked(invitationsApi),
  documents: vi.mocked(documentsApi),
  milk: vi.mocked(milkRecordsApi),
  farms: vi.mocked(farmsApi),
  baseline: vi.mocked(baselineApi),
};

/** A promise the test settles when it chooses, to play answers out of order. */
function deferred<T>() {
  let resolve!: (value: T) => void;
  const promise = new Promise<T>((r) => (resolve = r));
  return { promise, resolve };
}

const notFound = () => new ApiError(404, { code: 'not_found', message: 'Scenario not found' });
const item = (version: number): VersionListItem => ({ version, note: '', author: 'Owner', createdAt: '2026-11-0' + version + 'T10:00:00Z' });
// Only the fields the stores read; the rest of a version document is the screen's business.
const versionDoc = (version: number) => ({ version }) as unknown as Awaited<ReturnType<typeof scenariosApi.version>>;

beforeEach(() => {
  setActivePinia(createPinia());
  vi.resetAllMocks();
});
afterEach(() => vi.useRealTimers());

describe('the loading state', () => {
  it('is active at once but shows the spinner only after the delay', async () => {
    vi.useFakeTimers();
    const loading = useLoading();
    const answer = deferred<string>();
    const tracked = loading.track(answer.promise);
    expect(loading.active).toBe(true);
    expect(loading.slow).toBe(false);
    vi.advanceTimersByTime(SPINNER_DELAY_MS - 1);
    expect(loading.slow).toBe(false);
    vi.advanceTimersByTime(1);
    expect(loading.slow).toBe(true);
    answer.resolve('done');
    await expect(tracked).resolves.toBe('done');
    expect(loading.active).toBe(false);
    expect(loading.slow).toBe(false);
  });

  it('never shows the spinner for a load quicker than the delay', async () => {
    vi.useFakeTimers();
    const loading = useLoading();
    await loading.track(Promise.resolve(1));
    vi.advanceTimersByTime(SPINNER_DELAY_MS * 2);
    expect(loading.slow).toBe(false);
  });

  it('stays active until the last of several loads ends, and passes a failure on', async () => {
    const loading = useLoading();
    const first = deferred<void>();
    const failing = loading.track(() => Promise.reject(new Error('refused')));
    const waiting = loading.track(first.promise);
    await expect(failing).rejects.toThrow('refused');
    expect(loading.active).toBe(true);
    first.resolve();
    await waiting;
    expect(loading.active).toBe(false);
  });

  it('stops its timer when the screen goes away', () => {
    vi.useFakeTimers();
    const scope = effectScope();
    const loading = scope.run(() => useLoading())!;
    void loading.track(new Promise(() => undefined));
    scope.stop();
    vi.advanceTimersByTime(SPINNER_DELAY_MS * 2);
    expect(loading.slow).toBe(false);
  });
});

describe('versions store', () => {
  it('lists versions newest first', async () => {
    api.scenarios.versions.mockResolvedValue([item(1), item(3), item(2)]);
    const store = useVersionsStore();
    await store.load(7, 11);
    expect(store.versions.map((v) => v.version)).toEqual([3, 2, 1]);
    expect(store.latestVersion).toBe(3);
  });

  it('reads a saved version once, however often it is viewed or compared', async () => {
    api.scenarios.versions.mockResolvedValue([item(2), item(1)]);
    api.scenarios.version.mockImplementation((_f, _s, version) => Promise.resolve(versionDoc(version)));
    api.scenarios.compare.mockResolvedValue({ from: 1, to: 2, units: 'metric', changes: [] });
    const store = useVersionsStore();
    await store.load(7, 11);
    await store.view(2);
    await store.view(2);
    await store.compare(2, 1);
    expect(api.scenarios.version.mock.calls.map((call) => call[2]).sort()).toEqual([1, 2]);
    expect(store.viewing).toBeNull();
  });

  it('compares the older version to the newer whichever is picked first', async () => {
    api.scenarios.versions.mockResolvedValue([item(5), item(2)]);
    api.scenarios.version.mockImplementation((_f, _s, version) => Promise.resolve(versionDoc(version)));
    api.scenarios.compare.mockResolvedValue({ from: 2, to: 5, units: 'metric', changes: [] });
    const store = useVersionsStore();
    await store.load(7, 11);
    await store.compare(5, 2);
    expect(api.scenarios.compare).toHaveBeenCalledWith(7, 11, 2, 5);
    expect(store.comparison?.older.version).toBe(2);
    expect(store.comparison?.newer.version).toBe(5);
  });

  it('restores a version as a new one and lists it', async () => {
    api.scenarios.versions.mockResolvedValueOnce([item(2), item(1)]).mockResolvedValueOnce([item(3), item(2), item(1)]);
    api.scenarios.restore.mockResolvedValue({ version: 3 } as Awaited<ReturnType<typeof scenariosApi.restore>>);
    const store = useVersionsStore();
    await store.load(7, 11);
    await expect(store.restore(1)).resolves.toBe(3);
    expect(api.scenarios.restore).toHaveBeenCalledWith(7, 11, 1);
    expect(store.latestVersion).toBe(3);
  });

  it('forgets what it read of one scenario when another is opened', async () => {
    api.scenarios.versions.mockResolvedValue([item(1)]);
    api.scenarios.version.mockImplementation((_f, _s, version) => Promise.resolve(versionDoc(version)));
    const store = useVersionsStore();
    await store.load(7, 11);
    await store.view(1);
    await store.load(7, 12);
    expect(store.viewing).toBeNull();
    await store.view(1);
    expect(api.scenarios.version.mock.calls.map((call) => call[1])).toEqual([11, 12]);
  });

  it('asks again for a version whose read failed', async () => {
    api.scenarios.versions.mockResolvedValue([item(1)]);
    api.scenarios.version.mockRejectedValueOnce(new ApiError(0, { code: 'network', message: '' })).mockResolvedValueOnce(versionDoc(1));
    const store = useVersionsStore();
    await store.load(7, 11);
    await expect(store.view(1)).rejects.toBeInstanceOf(ApiError);
    await store.view(1);
    expect(store.viewing?.version).toBe(1);
  });

  it('words a failed list by the server code', async () => {
    api.scenarios.versions.mockRejectedValue(notFound());
    const store = useVersionsStore();
    await store.load(7, 11);
    expect(store.loadError).toMatch(/not here any more/);
  });
});

describe('audit log store', () => {
  const page = (ids: number[], nextBefore: number | null): AuditPage => ({
    entries: ids.map((id) => ({ id, actor: 'Owner', action: 'share.created', description: 'Shared', subject: 'v1', detail: {}, createdAt: '2026-11-01T10:00:00Z' })),
    nextBefore,
  });

  it('adds older pages after the entries shown, until there are no more', async () => {
    api.lender.auditLog.mockResolvedValueOnce(page([9, 8], 8)).mockResolvedValueOnce(page([7], null));
    const store = useAuditLogStore();
    await store.load(3);
    expect(store.hasMore).toBe(true);
    await store.loadMore();
    expect(api.lender.auditLog).toHaveBeenLastCalledWith(3, 8);
    expect(store.entries.map((e) => e.id)).toEqual([9, 8, 7]);
    expect(store.hasMore).toBe(false);
  });

  it('drops the answer for a farm no longer on screen', async () => {
    const slow = deferred<AuditPage>();
    api.lender.auditLog.mockReturnValueOnce(slow.promise).mockResolvedValueOnce(page([2], null));
    const store = useAuditLogStore();
    const first = store.load(3);
    await store.load(4);
    slow.resolve(page([99], null));
    await first;
    expect(store.entries.map((e) => e.id)).toEqual([2]);
  });

  it('keeps the entries shown when an older page fails, and says so', async () => {
    api.lender.auditLog.mockResolvedValueOnce(page([9], 9)).mockRejectedValueOnce(new ApiError(503, { code: 'database_unavailable', message: 'down' }));
    const store = useAuditLogStore();
    await store.load(3);
    await store.loadMore();
    expect(store.entries).toHaveLength(1);
    expect(store.error).toMatch(/cannot reach its database/);
  });
});

describe('documents store', () => {
  const doc = (id: number, quoteAmount: number | null = null) => ({ id, quoteAmount }) as unknown as Awaited<ReturnType<typeof documentsApi.list>>[number];

  it('asks for quotes only when the documents are a scenario’s', async () => {
    api.documents.list.mockResolvedValue([doc(1)]);
    api.documents.quotes.mockResolvedValue({ lines: [{ capitalLineId: 'shell', quoted: true, quoteTotal: 5000, documents: [] }] } as never);
    const store = useDocumentsStore();
    await store.load(3);
    expect(api.documents.quotes).not.toHaveBeenCalled();
    await store.load(3, { scenarioId: 11 });
    expect(api.documents.quotes).toHaveBeenCalledWith(3, 11);
    expect(store.quotes).toHaveLength(1);
  });

  it('drops the answer for a target no longer on screen', async () => {
    const slow = deferred<Awaited<ReturnType<typeof documentsApi.list>>>();
    api.documents.list.mockReturnValueOnce(slow.promise).mockResolvedValueOnce([doc(2)]);
    api.documents.quotes.mockResolvedValue({ lines: [] });
    const store = useDocumentsStore();
    const first = store.load(3);
    await store.load(3, { scenarioId: 11 });
    slow.resolve([doc(1)]);
    await first;
    expect(store.documents.map((d) => d.id)).toEqual([2]);
  });

  it('reports upload progress, then lists the new file', async () => {
    api.documents.list.mockResolvedValueOnce([]).mockResolvedValueOnce([doc(5)]);
    const seen: (number | undefined)[] = [];
    const store = useDocumentsStore();
    api.documents.upload.mockImplementation((_farm, _file, _target, onProgress) => {
      onProgress?.(50, 200);
      seen.push(store.uploading?.percent);
      return Promise.resolve(doc(5));
    });
    await store.load(3);
    await store.upload({ name: 'quote.pdf', size: 200 } as File);
    expect(seen).toEqual([25]);
    expect(store.uploading).toBeNull();
    expect(store.documents.map((d) => d.id)).toEqual([5]);
  });

  it('clears the upload state when the upload is refused', async () => {
    api.documents.list.mockResolvedValue([]);
    api.documents.upload.mockRejectedValue(new ApiError(415, { code: 'unsupported_type', message: 'This kind of file cannot be uploaded.' }));
    const store = useDocumentsStore();
    await store.load(3);
    await expect(store.upload({ name: 'a.exe', size: 10 } as File)).rejects.toBeInstanceOf(ApiError);
    expect(store.uploading).toBeNull();
  });

  it('puts the saved quote amount on its document and reads the line quotes again', async () => {
    api.documents.list.mockResolvedValue([doc(1), doc(2)]);
    api.documents.quotes.mockResolvedValueOnce({ lines: [] }).mockResolvedValueOnce({ lines: [{ capitalLineId: 'shell', quoted: true, quoteTotal: 900, documents: [] }] } as never);
    api.documents.setQuoteAmount.mockResolvedValue(doc(2, 900));
    const store = useDocumentsStore();
    await store.load(3, { scenarioId: 11 });
    await store.setQuoteAmount(2, 900);
    expect(store.documents.map((d) => d.quoteAmount)).toEqual([null, 900]);
    expect(store.quotes[0]?.quoteTotal).toBe(900);
  });
});

describe('milk-records store', () => {
  const farmDetail = { id: 3, role: 'owner', units: 'metric', locale: 'en-IE', currency: 'EUR' } as FarmDetail;

  it('confirms the read file by its token, then reads the history and the farm baseline again', async () => {
    api.milk.history.mockResolvedValue({ baseline: { cows: 120, yieldKgPerCowDay: 28 }, imports: [] });
    api.milk.preview.mockResolvedValue({ token: 'tok-1' } as Awaited<ReturnType<typeof milkRecordsApi.preview>>);
    api.milk.confirm.mockResolvedValue({ id: 4, herdSize: 124 } as Awaited<ReturnType<typeof milkRecordsApi.confirm>>);
    api.farms.get.mockResolvedValue(farmDetail);
    api.baseline.get.mockResolvedValue({ herd: null, currency: 'EUR', locale: 'en-IE', units: 'metric' });
    api.scenarios.list.mockResolvedValue([]);
    const store = useMilkRecordsStore();
    await store.load(3);
    await store.read({ name: 'records.csv', size: 10 } as File);
    const record = await store.confirm();
    expect(api.milk.confirm).toHaveBeenCalledWith(3, 'tok-1');
    expect(record.herdSize).toBe(124);
    expect(api.milk.history).toHaveBeenCalledTimes(2);
    expect(api.farms.get).toHaveBeenCalledWith(3);
    expect(useFarmStore().loaded).toBe(true);
  });

  it('starts afresh on the upload step when the screen opens again', async () => {
    api.milk.history.mockResolvedValue({ baseline: { cows: null, yieldKgPerCowDay: null }, imports: [] });
    api.milk.preview.mockResolvedValue({ token: 't' } as Awaited<ReturnType<typeof milkRecordsApi.preview>>);
    const store = useMilkRecordsStore();
    await store.load(3);
    await store.read({ name: 'records.csv', size: 10 } as File);
    expect(store.preview).not.toBeNull();
    await store.load(3);
    expect(store.preview).toBeNull();
  });

  it('keeps no upload percentage once a file is refused', async () => {
    api.milk.history.mockResolvedValue({ baseline: { cows: null, yieldKgPerCowDay: null }, imports: [] });
    api.milk.preview.mockRejectedValue(new ApiError(400, { code: 'invalid_input', message: 'The file has no milk column.' }));
    const store = useMilkRecordsStore();
    await store.load(3);
    await expect(store.read({ name: 'x.csv', size: 1 } as File)).rejects.toBeInstanceOf(ApiError);
    expect(store.uploadPercent).toBeNull();
    expect(store.preview).toBeNull();
  });
});

describe('link stores', () => {
  const session: Session = { user: { id: 8, email: 'lender@example.test', name: 'Lender', isAdmin: false }, memberships: [{ farmId: 3, role: 'lender' }] };

  it('opens a share link and, once accepted, signs in with the session it answered', async () => {
    api.lender.preview.mockResolvedValue({ farmName: 'Farm', scenarioName: 'Barn', version: 2, email: session.user.email, sharedBy: null, expiresOn: '2027-01-31', accountExists: false });
    api.lender.accept.mockResolvedValue({ ...session, farmId: 3, scenarioId: 11, shareId: 5 });
    const link = useShareLinkStore();
    await link.open('abc');
    expect(link.preview?.scenarioName).toBe('Barn');
    const accepted = await link.accept({ name: 'Lender', password: 'long enough pass' });
    expect(api.lender.accept).toHaveBeenCalledWith('abc', { name: 'Lender', password: 'long enough pass' });
    expect(accepted.scenarioId).toBe(11);
    const signedIn = useSessionStore();
    expect(signedIn.user?.email).toBe(session.user.email);
    expect(signedIn.session?.memberships).toEqual(session.memberships);
  });

  it('says why a used invitation does not open, in the server’s words', async () => {
    api.invitations.preview.mockRejectedValue(new ApiError(400, { code: 'invalid_token', message: 'This invitation was already used.' }));
    const link = useInvitationLinkStore();
    await link.open('used');
    expect(link.preview).toBeNull();
    expect(link.loadError).toBe('This invitation was already used.');
  });

  it('drops the preview of a link opened before the one on screen', async () => {
    const slow = deferred<Awaited<ReturnType<typeof invitationsApi.preview>>>();
    const preview = (farmName: string) => ({ farmName, role: 'partner' as const, email: 'p@example.test', inviterName: null, expiresAt: '2026-12-10T00:00:00Z', accountExists: true });
    api.invitations.preview.mockReturnValueOnce(slow.promise).mockResolvedValueOnce(preview('Second'));
    const link = useInvitationLinkStore();
    const first = link.open('one');
    await link.open('two');
    slow.resolve(preview('First'));
    await first;
    expect(link.preview?.farmName).toBe('Second');
  });
});

describe('farm store scenario actions', () => {
  it('copies a scenario, names the copy and lists it', async () => {
    api.farms.get.mockResolvedValue({ id: 3, role: 'owner' } as FarmDetail);
    api.baseline.get.mockResolvedValue({ herd: null, currency: 'EUR', locale: 'en-IE', units: 'metric' });
    api.scenarios.list.mockResolvedValueOnce([]).mockResolvedValueOnce([{ id: 12 } as Awaited<ReturnType<typeof scenariosApi.list>>[number]]);
    api.scenarios.duplicate.mockResolvedValue({ id: 12, scenario: { name: 'Barn (copy)' } } as Awaited<ReturnType<typeof scenariosApi.duplicate>>);
    const farm = useFarmStore();
    await farm.load(3);
    await expect(farm.duplicateScenario(11)).resolves.toBe('Barn (copy)');
    expect(api.scenarios.duplicate).toHaveBeenCalledWith(3, 11);
    expect(farm.scenarios.map((s) => s.id)).toEqual([12]);
  });
});
