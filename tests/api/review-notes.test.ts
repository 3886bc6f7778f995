/**
 * Review notes, review status and the audit log through the API. Expected behaviour comes from
 * docs/product.md (Lender package) ("Review notes": the lender writes notes, optionally tied to an option or a line, and
 * sets the review status open / questions / supported / not supported; members see notes and
 * status, answer in a thread and get an e-mail when the status changes; every share, note and
 * status change is in an audit log visible to the owner) and docs/product.md's role table.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Scenario } from '../../shared/schema/index.js';
import { utcDatePlusDays } from '../../shared/schema/lender.js';
import { createTestApp, type TestApp } from '../helpers/app.js';
import { farmIdByName, signedIn } from '../helpers/scenarios.js';

interface Note {
  id: number;
  author: string | null;
  authorRole: string;
  optionId: string | null;
  optionName: string | null;
  lineRef: string | null;
  body: string;
  replies: Note[];
}
interface Review {
  share: { id: number; reviewStatus: string; reviewStatusBy: string | null; version: number };
  notes: Note[];
}

describe('review notes and status', () => {
  let t: TestApp;
  let owner: request.Agent;
  let partner: request.Agent;
  let lender: request.Agent;
  let farmId: number;
  let scenarioId: number;
  let otherScenarioId: number;
  let shareId: number;
  let optionId: string;
  const farm = () => `/api/farms/${farmId}`;

  beforeAll(async () => {
    t = await createTestApp({ seedDemo: true });
    owner = await signedIn(t, 'owner@byrecast.test');
    partner = await signedIn(t, 'partner@byrecast.test');
    lender = await signedIn(t, 'lender@byrecast.test');
    farmId = await farmIdByName(owner, 'Cairnbrook Farm');
    const mine = (await lender.get(`${farm()}/lender-shares/mine`)).body as { id: number; scenarioId: number }[];
    shareId = mine[0]!.id;
    scenarioId = mine[0]!.scenarioId;
    const list = (await owner.get(`${farm()}/scenarios`)).body as { id: number }[];
    otherScenarioId = list.find((s) => s.id !== scenarioId)!.id;
    const seen = (await lender.get(`${farm()}/scenarios/${scenarioId}`)).body as { scenario: Scenario };
    optionId = seen.scenario.options.find((o) => !o.current)!.id;
  });
  afterAll(async () => {
    await t.close();
  });

  const reviews = async (agent: request.Agent, id = scenarioId): Promise<Review[]> => {
    const res = await agent.get(`${farm()}/scenarios/${id}/reviews`);
    expect(res.status).toBe(200);
    return res.body as Review[];
  };

  it('lets the lender write a note tied to an option and a line', async () => {
    const res = await lender.post(`${farm()}/lender-shares/${shareId}/notes`).send({ body: 'Where does the roof price come from?', optionId, lineRef: 'Capital: roof and frame' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ authorRole: 'lender', optionId, lineRef: 'Capital: roof and frame', author: 'Oren Vasquel' });
    expect(res.body.optionName).toEqual(expect.any(String));
  });

  it('refuses a note on an option the shared version does not have, or a line without its option, naming the field', async () => {
    const badOption = await lender.post(`${farm()}/lender-shares/${shareId}/notes`).send({ body: 'Hm', optionId: 'no-such-option' });
    expect(badOption.status).toBe(400);
    expect(badOption.body.error.fields).toHaveProperty('optionId');
    const lineOnly = await lender.post(`${farm()}/lender-shares/${shareId}/notes`).send({ body: 'Hm', lineRef: 'Milk income' });
    expect(lineOnly.status).toBe(400);
    expect(lineOnly.body.error.fields).toHaveProperty('optionId');
    const empty = await lender.post(`${farm()}/lender-shares/${shareId}/notes`).send({ body: '   ' });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields).toHaveProperty('body');
  });

  it('lets members answer in the thread but not write notes or set the status', async () => {
    const [review] = await reviews(owner);
    const note = review!.notes[0]!;
    const reply = await partner.post(`${farm()}/lender-shares/${shareId}/notes/${note.id}/replies`).send({ body: 'From the contractor quote, attached to the capital line.' });
    expect(reply.status).toBe(201);
    expect(reply.body.authorRole).toBe('partner');
    // A reply to a reply joins the same thread.
    const nested = await owner.post(`${farm()}/lender-shares/${shareId}/notes/${reply.body.id}/replies`).send({ body: 'The quote is dated this month.' });
    expect(nested.status).toBe(201);

    // docs/product.md: review notes and status are the lender's; members answer.
    expect((await owner.post(`${farm()}/lender-shares/${shareId}/notes`).send({ body: 'Owner note' })).status).toBe(403);
    expect((await owner.put(`${farm()}/lender-shares/${shareId}/status`).send({ status: 'supported' })).status).toBe(403);
    expect((await lender.post(`${farm()}/lender-shares/${shareId}/notes/${note.id}/replies`).send({ body: 'Lender reply' })).status).toBe(403);
    // The lender answers in the thread through a note with a parent.
    const answer = await lender.post(`${farm()}/lender-shares/${shareId}/notes`).send({ body: 'Thank you.', parentId: reply.body.id });
    expect(answer.status).toBe(201);

    const [after] = await reviews(partner);
    expect(after!.notes).toHaveLength(1);
    expect(after!.notes[0]!.replies.map((r) => r.authorRole)).toEqual(['partner', 'owner', 'lender']);
  });

  it('e-mails the members, not the lender, when the status changes, and only when it changes', async () => {
    t.mailer.outbox!.clear();
    const res = await lender.put(`${farm()}/lender-shares/${shareId}/status`).send({ status: 'questions' });
    expect(res.status).toBe(200);
    expect(res.body.reviewStatus).toBe('questions');
    const recipients = t.mailer.outbox!.list().map((m) => m.to).sort();
    expect(recipients).toEqual(['consultant@byrecast.test', 'owner@byrecast.test', 'partner@byrecast.test']);
    expect(t.mailer.outbox!.list()[0]!.subject).toContain('Questions');

    expect((await lender.put(`${farm()}/lender-shares/${shareId}/status`).send({ status: 'questions' })).status).toBe(200);
    expect(t.mailer.outbox!.list()).toHaveLength(3);

    const [review] = await reviews(owner);
    expect(review!.share).toMatchObject({ reviewStatus: 'questions', reviewStatusBy: 'Oren Vasquel' });
  });

  it('refuses a status outside open, questions, supported, not supported', async () => {
    const res = await lender.put(`${farm()}/lender-shares/${shareId}/status`).send({ status: 'approved' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty('status');
  });

  it('shows a lender the reviews only of scenarios shared with them', async () => {
    expect((await lender.get(`${farm()}/scenarios/${otherScenarioId}/reviews`)).status).toBe(404);
    // A share on the other scenario to another lender stays out of this lender's sight.
    const other = await owner.post(`${farm()}/scenarios/${otherScenarioId}/lender-shares`).send({ email: 'second.bank@example.test', expiresOn: utcDatePlusDays(new Date(), 10) });
    expect(other.status).toBe(201);
    expect((await lender.post(`${farm()}/lender-shares/${other.body.id}/notes`).send({ body: 'Not mine' })).status).toBe(404);
    expect((await lender.put(`${farm()}/lender-shares/${other.body.id}/status`).send({ status: 'supported' })).status).toBe(404);
    const ownerView = await reviews(owner, otherScenarioId);
    expect(ownerView.map((r) => r.share.id)).toEqual([other.body.id]);
  });

  it('records every share, note and status change in the audit log, for the owner only', async () => {
    const res = await owner.get(`${farm()}/audit-log`);
    expect(res.status).toBe(200);
    const actions = (res.body.entries as { action: string; actor: string }[]).map((e) => `${e.action} by ${e.actor}`);
    // Newest first; refused attempts (403, 400, 404) leave no entry.
    expect(actions).toEqual([
      'share.created by Maren Holt',
      'review.status by Oren Vasquel',
      'note.replied by Oren Vasquel',
      'note.replied by Maren Holt',
      'note.replied by Ivo Holt',
      'note.added by Oren Vasquel',
    ]);
    const status = (res.body.entries as { action: string; detail: Record<string, unknown> }[]).find((e) => e.action === 'review.status');
    expect(status?.detail).toMatchObject({ from: 'open', to: 'questions', shareId });
    expect((await partner.get(`${farm()}/audit-log`)).status).toBe(403);
    expect((await lender.get(`${farm()}/audit-log`)).status).toBe(403);
    const page = await owner.get(`${farm()}/audit-log?limit=2`);
    expect(page.body.entries).toHaveLength(2);
    const next = await owner.get(`${farm()}/audit-log?limit=2&before=${page.body.nextBefore}`);
    expect(next.body.entries[0].id).toBeLessThan(page.body.entries[1].id);
  });

  it('stops the lender writing once the share is revoked', async () => {
    expect((await owner.post(`${farm()}/lender-shares/${shareId}/revoke`)).status).toBe(200);
    expect((await lender.post(`${farm()}/lender-shares/${shareId}/notes`).send({ body: 'Still here?' })).status).toBe(404);
    expect((await lender.put(`${farm()}/lender-shares/${shareId}/status`).send({ status: 'supported' })).status).toBe(404);
    expect((await lender.get(`${farm()}/scenarios/${scenarioId}/reviews`)).status).toBe(404);
    // Members keep the record.
    expect((await reviews(owner))[0]!.notes).toHaveLength(1);
  });
});

describe('a new lender note', () => {
  let t: TestApp;
  let lender: request.Agent;
  let farmId: number;
  let scenarioId: number;
  let shareId: number;
  let optionId: string;

  beforeAll(async () => {
    t = await createTestApp({ seedDemo: true });
    lender = await signedIn(t, 'lender@byrecast.test');
    farmId = await farmIdByName(lender, 'Cairnbrook Farm');
    const mine = (await lender.get(`/api/farms/${farmId}/lender-shares/mine`)).body as { id: number; scenarioId: number }[];
    shareId = mine[0]!.id;
    scenarioId = mine[0]!.scenarioId;
    const seen = (await lender.get(`/api/farms/${farmId}/scenarios/${scenarioId}`)).body as { scenario: Scenario };
    optionId = seen.scenario.options.find((o) => !o.current)!.id;
  });
  afterAll(async () => {
    await t.close();
  });

  it('e-mails the members, not the lender, a new lender note with what it is about and a link to answer it', async () => {
    t.mailer.outbox!.clear();
    const body = 'Is the sand contractor rate fixed for the first five years?';
    const res = await lender.post(`/api/farms/${farmId}/lender-shares/${shareId}/notes`).send({ body, optionId, lineRef: 'Running cost: sand haulage' });
    expect(res.status).toBe(201);
    // docs/product.md (Lender package): members answer in a thread, so they must hear of a note as of a status change.
    const mails = t.mailer.outbox!.list();
    expect(mails.map((m) => m.to).sort()).toEqual(['consultant@byrecast.test', 'owner@byrecast.test', 'partner@byrecast.test']);
    for (const mail of mails) {
      expect(mail.subject).toContain('New lender note');
      expect(mail.text).toContain(body);
      expect(mail.text).toContain(`${res.body.optionName as string} › Running cost: sand haulage`);
      expect(mail.links).toContain(`${t.config.appOrigin}/farms/${farmId}/scenarios/${scenarioId}/lender`);
    }
  });
});
