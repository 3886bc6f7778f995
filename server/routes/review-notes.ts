/** Review notes and status of lender shares, under /api/farms/:farmId: parse → service → respond. */
import { createNoteSchema, replySchema, reviewStatusSchema } from '../../shared/schema/lender.js';
import type { AppDeps } from '../app.js';
import { type FarmRoute } from '../auth/middleware.js';
import { parseOrThrow } from '../errors.js';
import { addLenderNote, replyToNote, scenarioReviews, setShareStatus } from '../services/review-notes.js';
import { actorOf, idParam } from '../http/params.js';

export function reviewNoteRoutes({ db, mailer, config }: AppDeps, route: FarmRoute): void {
  const ctx = { db, mailer, appOrigin: config.appOrigin };

  route('get', '/scenarios/:scenarioId/reviews', 'scenario:read', async (req, res) => {
    res.json(await scenarioReviews(db, actorOf(req), idParam(req, 'scenarioId', 'Scenario id')));
  });
  route('post', '/lender-shares/:shareId/notes', 'review:write', async (req, res) => {
    const shareId = idParam(req, 'shareId', 'Share id');
    const input = parseOrThrow(createNoteSchema, req.body);
    res.status(201).json(await addLenderNote(ctx, actorOf(req), shareId, input));
  });
  route('post', '/lender-shares/:shareId/notes/:noteId/replies', 'review:reply', async (req, res) => {
    const shareId = idParam(req, 'shareId', 'Share id');
    const noteId = idParam(req, 'noteId', 'Note id');
    const input = parseOrThrow(replySchema, req.body);
    res.status(201).json(await replyToNote(db, actorOf(req), shareId, noteId, input.body));
  });
  route('put', '/lender-shares/:shareId/status', 'review:write', async (req, res) => {
    const shareId = idParam(req, 'shareId', 'Share id');
    const input = parseOrThrow(reviewStatusSchema, req.body);
    res.json(await setShareStatus(ctx, actorOf(req), shareId, input.status));
  });
}
