/**
 * Lender shares end to end through the API. Expected behaviour comes from docs/product.md (Lender package) (
 * a lender sees only what is shared with them — not other scenarios of the farm, not other
 * farms, not after revocation or expiry; a lender cannot write anything but notes; share links
 * are single-use tokens stored hashed; the workbook for members and for a lender with
 * a live share, the demo lender has a live share on one demo scenario and none on the other) and
 * docs/product.md's role table (the loan officer is read-only on the scenarios shared with them).
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { farmRouteRegistry } from '../../server/auth/middleware.js';
import { hashToken } from '../../server/auth/tokens.js';
import type { Scenario } from '../../shared/schema/index.js';
import { utcDate, utcDatePlusDays } from '../../shared/schema/lender.js';
import { createTestApp, type TestApp } from '../helpers/app.js';
import { demoScenarioFile, farmIdByName, signedIn } from '../helpers/scenarios.js';
import { pdfBytes } from '../helpers/uploads.js';

const BANK_EMAIL = 'credit.desk@bank-of-tessly.test';
const BANK_PASSWORD = 'tessly-credit-2027';

/** supertest parser that keeps a binary body as a Buffer. */
function binary(res: request.Response, done: (error: Error | null, body: Buffer) => void): void {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => done(null, Buffer.concat(chunks)));
}

describe('lender shares', () => {
  let t: TestApp;
  let dataDir: string;
  let owner: request.Agent;
  let partner: request.Agent;
  let demoLender: request.Agent;
  let farmId: number;
  let fiveSystemsId: number;
  let mattressId: number;
  const farm = () => `/api/farms/${farmId}`;
  const scenario = (id: number) => `${farm()}/scenarios/${id}`;

  /** The raw token of the newest share e-mail to `to`, from the captured outbox. */
  function linkTokenFor(to: string): string {
    const mail = t.mailer.outbox!.list().find((m) => m.to === to && m.subject.includes('shared'));
    const link = mail?.links.find((l) => l.includes('/lender-shares/'));
    if (!link) throw new Error(`no share e-mail to ${to}`);
    return decodeURIComponent(link.split('/lender-shares/')[1]!);
  }

  beforeAll(async () => {
    dataDir = mkdtempSync(join(tmpdir(), 'byrecast-lender-'));
    t = await createTestApp({ seedDemo: true, config: { dataDir } });
    owner = await signedIn(t, 'owner@byrecast.test');
    partner = await signedIn(t, 'partner@byrecast.test');
    demoLender = await signedIn(t, 'lender@byrecast.test');
    farmId = await farmIdByName(owner, 'Cairnbrook Farm');
    const list = (await owner.get(`${farm()}/scenarios`)).body as { id: number; name: string }[];
    const five = demoScenarioFile('cairnbrook-five-systems.json').name;
    const mattress = demoScenarioFile('cairnbrook-mattress-or-sand.json').name;
    fiveSystemsId = list.find((s) => s.name === five)!.id;
    mattressId = list.find((s) => s.name === mattress)!.id;
  });
  afterAll(async () => {
    await t.close();
    rmSync(dataDir, { recursive: true, force: true });
  });

  describe('demo data', () => {
    it('gives the demo lender a live share on the five-systems scenario and none on the other', async () => {
      // docs/product.md (Lender package): a live share on one demo scenario and none on the other.
      const list = (await demoLender.get(`${farm()}/scenarios`)).body as { id: number }[];
      expect(list.map((s) => s.id)).toEqual([fiveSystemsId]);
      expect((await demoLender.get(scenario(fiveSystemsId))).status).toBe(200);
      expect((await demoLender.get(scenario(mattressId))).status).toBe(404);
      const mine = (await demoLender.get(`${farm()}/lender-shares/mine`)).body as { scenarioId: number; state: string }[];
      expect(mine).toHaveLength(1);
      expect(mine[0]).toMatchObject({ scenarioId: fiveSystemsId, state: 'live' });
    });

    it('streams the workbook to members and to the lender with a live share, as an XLSX attachment', async () => {
      // docs/product.md (Lender package): GET …/workbook.xlsx for members and for a lender with a live share.
      for (const agent of [owner, demoLender]) {
        const res = await agent.get(`${scenario(fiveSystemsId)}/workbook.xlsx`).buffer(true).parse(binary);
        expect(res.status).toBe(200);
        expect(res.headers['content-type']).toContain('application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
        expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?[a-z0-9_-]+_lender-workbook\.xlsx"?$/);
        // An XLSX file is a ZIP package: it starts with the local file header "PK\x03\x04" (ECMA-376 Part 2; APPNOTE.TXT 4.3.7).
        expect((res.body as Buffer).subarray(0, 4).toString('latin1')).toBe('PK\x03\x04');
      }
      expect((await owner.get(`${scenario(mattressId)}/workbook.xlsx`)).status).toBe(200);
      expect((await demoLender.get(`${scenario(mattressId)}/workbook.xlsx`)).status).toBe(404);
    }, 60_000);
  });

  describe('sharing a version by e-mail', () => {
    let bank: request.Agent;
    let firstShareId: number;
    let token: string;

    it('refuses an expiry that is not after today, naming the field', async () => {
      const res = await owner.post(`${scenario(mattressId)}/lender-shares`).send({ email: BANK_EMAIL, expiresOn: utcDate(new Date()) });
      expect(res.status).toBe(400);
      expect(res.body.error.fields).toHaveProperty('expiresOn');
    });

    it('refuses to share with someone who is already a member in another role', async () => {
      const res = await owner.post(`${scenario(mattressId)}/lender-shares`).send({ email: 'partner@byrecast.test', expiresOn: utcDatePlusDays(new Date(), 30) });
      expect(res.status).toBe(409);
      expect(res.body.error.fields).toHaveProperty('email');
    });

    it('lets a partner not share (the permission table keeps sharing to owner and consultant)', async () => {
      const res = await partner.post(`${scenario(mattressId)}/lender-shares`).send({ email: BANK_EMAIL, expiresOn: utcDatePlusDays(new Date(), 30) });
      expect(res.status).toBe(403);
    });

    it('e-mails a link whose token the database keeps only as a sha-256 hash', async () => {
      const res = await owner.post(`${scenario(mattressId)}/lender-shares`).send({ email: BANK_EMAIL, expiresOn: utcDatePlusDays(new Date(), 30), message: 'For the credit committee' });
      expect(res.status).toBe(201);
      expect(res.body).toMatchObject({ scenarioId: mattressId, version: 1, lenderEmail: BANK_EMAIL, state: 'pending' });
      expect(JSON.stringify(res.body)).not.toMatch(/token/i);
      firstShareId = res.body.id;
      token = linkTokenFor(BANK_EMAIL);

      const [rows] = await t.database.pool.query('SELECT * FROM lender_shares');
      const dump = JSON.stringify(rows);
      // docs/product.md (Lender package): share links are single-use tokens stored hashed — the raw token is nowhere in the table.
      expect(dump).not.toContain(token);
      const [own] = (await t.database.pool.query('SELECT token_hash FROM lender_shares WHERE id = ?', [firstShareId])) as unknown as [{ token_hash: string }[]];
      // sha-256 as hex is 64 characters (FIPS 180-4); the stored value is the hash of the e-mailed token.
      expect(own[0]!.token_hash).toMatch(/^[0-9a-f]{64}$/);
      expect(own[0]!.token_hash).toBe(hashToken(token));
    });

    it('shows the link holder what is shared and signs them up as the farm’s lender', async () => {
      const preview = await request(t.app).get(`/api/lender-shares/${token}`);
      expect(preview.status).toBe(200);
      expect(preview.body).toMatchObject({ farmName: 'Cairnbrook Farm', version: 1, email: BANK_EMAIL, accountExists: false });

      bank = request.agent(t.app);
      const accept = await bank.post(`/api/lender-shares/${token}/accept`).send({ name: 'Ilse Marrow', password: BANK_PASSWORD });
      expect(accept.status).toBe(201);
      expect(accept.body).toMatchObject({ farmId, scenarioId: mattressId, shareId: firstShareId });
      expect(accept.body.memberships).toEqual([{ farmId, role: 'lender' }]);
    });

    it('lets the link work only once', async () => {
      const again = await request(t.app).post(`/api/lender-shares/${token}/accept`).send({ name: 'Someone Else', password: 'another-pass-123' });
      expect(again.status).toBe(400);
      expect(again.body.error.reason).toBe('used');
      expect((await request(t.app).get(`/api/lender-shares/${token}`)).status).toBe(400);
    });

    it('shows the lender only the shared scenario, at the shared version, after the farm saves a newer one', async () => {
      const latest = (await owner.get(scenario(mattressId))).body as { version: number; scenario: Scenario };
      const changed = structuredClone(latest.scenario);
      changed.herd.wagePerHour += 2;
      const saved = await owner.put(scenario(mattressId)).send({ version: latest.version, scenario: changed, note: 'Wage up' });
      expect(saved.status).toBe(200);
      expect(saved.body.version).toBe(2);

      const list = (await bank.get(`${farm()}/scenarios`)).body as { id: number; version: number }[];
      expect(list).toEqual([expect.objectContaining({ id: mattressId, version: 1 })]);
      const seen = await bank.get(scenario(mattressId));
      expect(seen.status).toBe(200);
      expect(seen.body.version).toBe(1);
      expect(seen.body.scenario.herd.wagePerHour).toBe(latest.scenario.herd.wagePerHour);
      expect((await bank.get(`${scenario(mattressId)}/versions`)).body.map((v: { version: number }) => v.version)).toEqual([1]);
      expect((await bank.get(`${scenario(mattressId)}/versions/2`)).status).toBe(404);
      expect((await bank.get(`${scenario(mattressId)}/versions/compare?from=1&to=2`)).status).toBe(404);
      const exported = await bank.get(`${scenario(mattressId)}/export.json`);
      expect(JSON.parse(exported.text).herd.wagePerHour).toBe(latest.scenario.herd.wagePerHour);
      // Not the other scenario of the farm.
      expect((await bank.get(scenario(fiveSystemsId))).status).toBe(404);
      expect((await bank.get(`${scenario(fiveSystemsId)}/workbook.xlsx`)).status).toBe(404);
    });

    it('keeps the old share on its version when a newer version is shared', async () => {
      const res = await owner.post(`${scenario(mattressId)}/lender-shares`).send({ email: BANK_EMAIL, version: 2, expiresOn: utcDatePlusDays(new Date(), 30) });
      expect(res.status).toBe(201);
      const second = linkTokenFor(BANK_EMAIL);
      expect(second).not.toBe(token);
      // Signed in as the address shared with: accepting adds the share to the same account.
      expect((await bank.post(`/api/lender-shares/${second}/accept`).send({})).status).toBe(200);

      const shares = (await owner.get(`${farm()}/lender-shares?scenarioId=${mattressId}`)).body as { id: number; version: number; state: string }[];
      expect(shares.map((s) => [s.version, s.state])).toEqual([
        [2, 'live'],
        [1, 'live'],
      ]);
      expect((await bank.get(scenario(mattressId))).body.version).toBe(2);
      expect((await bank.get(`${scenario(mattressId)}/versions`)).body.map((v: { version: number }) => v.version)).toEqual([2, 1]);

      // Revoking the newer share leaves the older one reading version 1.
      const revoked = await owner.post(`${farm()}/lender-shares/${res.body.id}/revoke`);
      expect(revoked.status).toBe(200);
      expect(revoked.body.state).toBe('revoked');
      expect((await bank.get(scenario(mattressId))).body.version).toBe(1);
    });

    it('lets the lender download documents of the shared scenario only', async () => {
      const onShared = await owner.post(`${farm()}/documents`).field('scenarioId', String(mattressId)).attach('file', pdfBytes(), 'Sand bedding quote.pdf');
      const onOther = await owner.post(`${farm()}/documents`).field('scenarioId', String(fiveSystemsId)).attach('file', pdfBytes(), 'Roof quote.pdf');
      const onFarm = await owner.post(`${farm()}/documents`).attach('file', pdfBytes(), 'Farm accounts.pdf');
      expect([onShared.status, onOther.status, onFarm.status]).toEqual([201, 201, 201]);
      const list = (await bank.get(`${farm()}/documents`)).body as { id: number }[];
      expect(list.map((d) => d.id)).toEqual([onShared.body.id]);
      expect((await bank.get(`${farm()}/documents/${onShared.body.id}/download`)).status).toBe(200);
      expect((await bank.get(`${farm()}/documents/${onOther.body.id}/download`)).status).toBe(404);
      expect((await bank.get(`${farm()}/documents/${onFarm.body.id}/download`)).status).toBe(404);
    });

    it('shows the lender the quotes of the shared scenario, and answers 404 for a scenario not shared', async () => {
      // docs/product.md (Lender package): a lender sees only what is shared; a scenario they cannot see is "not found".
      const seen = (await owner.get(scenario(mattressId))).body as { scenario: Scenario };
      const line = seen.scenario.options.flatMap((o) => o.capitalLines).find((l) => l.kind === 'item');
      expect(line).toBeDefined();
      const quote = await owner
        .post(`${farm()}/documents`)
        .field('scenarioId', String(mattressId))
        .field('capitalLineId', line!.id)
        .attach('file', pdfBytes(), 'Stall quote.pdf');
      expect(quote.status).toBe(201);
      expect((await owner.patch(`${farm()}/documents/${quote.body.id}`).send({ quoteAmount: 41250 })).status).toBe(200);

      const shared = await bank.get(`${scenario(mattressId)}/quotes`);
      expect(shared.status).toBe(200);
      expect(shared.body.lines).toEqual([{ capitalLineId: line!.id, quoted: true, quoteTotal: 41250, documents: [{ id: quote.body.id, fileName: 'Stall quote.pdf', quoteAmount: 41250 }] }]);
      expect((await bank.get(`${scenario(fiveSystemsId)}/quotes`)).status).toBe(404);
      expect((await bank.get(scenario(fiveSystemsId))).status).toBe(404);
    });

    it('ends access at once when the share is revoked', async () => {
      expect((await owner.post(`${farm()}/lender-shares/${firstShareId}/revoke`)).status).toBe(200);
      expect((await bank.get(`${farm()}/scenarios`)).body).toEqual([]);
      expect((await bank.get(scenario(mattressId))).status).toBe(404);
      expect((await bank.get(`${scenario(mattressId)}/quotes`)).status).toBe(404);
      expect((await bank.get(`${scenario(mattressId)}/workbook.xlsx`)).status).toBe(404);
      expect((await bank.get(`${farm()}/documents`)).body).toEqual([]);
      expect((await owner.post(`${farm()}/lender-shares/${firstShareId}/revoke`)).status).toBe(409);
    });

    it('ends access from the expiry date on', async () => {
      const res = await owner.post(`${scenario(mattressId)}/lender-shares`).send({ email: BANK_EMAIL, version: 2, expiresOn: utcDatePlusDays(new Date(), 3) });
      expect(res.status).toBe(201);
      expect((await bank.post(`/api/lender-shares/${linkTokenFor(BANK_EMAIL)}/accept`).send({})).status).toBe(200);
      expect((await bank.get(scenario(mattressId))).status).toBe(200);
      // The expiry date arrives (UTC): the share no longer opens.
      await t.database.pool.query('UPDATE lender_shares SET expires_on = ? WHERE id = ?', [utcDate(new Date()), res.body.id]);
      expect((await bank.get(scenario(mattressId))).status).toBe(404);
      expect((await bank.get(`${farm()}/lender-shares/mine`)).body).toEqual([]);
      const shares = (await owner.get(`${farm()}/lender-shares?scenarioId=${mattressId}`)).body as { id: number; state: string }[];
      expect(shares.find((s) => s.id === res.body.id)?.state).toBe('expired');
    });

    it('never shows a lender another farm', async () => {
      const consultant = await signedIn(t, 'consultant@byrecast.test');
      const other = await consultant.post('/api/farms').send({ name: 'Hollin Ridge (invented)' });
      const imported = await consultant.post(`/api/farms/${other.body.id}/scenarios`).send({ scenario: demoScenarioFile('cairnbrook-mattress-or-sand.json') });
      expect(imported.status).toBe(201);
      for (const agent of [bank, demoLender]) {
        expect((await agent.get(`/api/farms/${other.body.id}/scenarios`)).status).toBe(404);
        expect((await agent.get(`/api/farms/${other.body.id}/scenarios/${imported.body.id}`)).status).toBe(404);
        expect((await agent.get(`/api/farms/${other.body.id}/scenarios/${imported.body.id}/workbook.xlsx`)).status).toBe(404);
        // Another farm's scenario through this farm's path is not found either.
        expect((await agent.get(`${farm()}/scenarios/${imported.body.id}`)).status).toBe(404);
      }
    });
  });

  describe('a lender cannot write', () => {
    it('gets 403 on every state-changing farm route except review notes and status', async () => {
      const before = (await owner.get(scenario(fiveSystemsId))).body as { version: number };
      const writes = farmRouteRegistry.filter((r) => r.method !== 'get');
      expect(writes.length).toBeGreaterThan(10);
      for (const route of writes) {
        const path = route.path
          .replace(':farmId', String(farmId))
          .replace(':scenarioId', String(fiveSystemsId))
          .replace(/:(\w+)/g, '1');
        const res = await demoLender[route.method](path).send({});
        const label = `${route.method} ${route.path}`;
        // docs/product.md: the loan officer writes review notes and sets a review status, nothing else.
        if (route.permission === 'review:write') expect(res.status, label).not.toBe(403);
        else expect(res.status, label).toBe(403);
      }
      expect((await owner.get(scenario(fiveSystemsId))).body.version).toBe(before.version);
    });
  });
});
