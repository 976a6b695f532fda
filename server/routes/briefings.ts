import { Router, type Response } from 'express';
import { commentSchema, createBriefingSchema, saveDraftSchema, shareSchema } from '../../shared/schemas/briefings';
import type { AppContext } from '../context';
import { authOf, requireAuth } from '../middleware/require-auth';
import { requireRole } from '../middleware/require-role';
import { idParam, validateBody } from '../middleware/validate';
import { listEvents } from '../services/briefings/briefing-audit';
import type { ExportFile } from '../services/briefings/briefing-exports';

const WRITERS = requireRole('admin', 'consultant');
const READERS = requireRole('admin', 'consultant', 'client');

function sendFile(res: Response, file: ExportFile): void {
  res.setHeader('Content-Type', file.contentType);
  res.setHeader('Content-Disposition', `attachment; filename="${file.fileName}"`);
  res.setHeader('Cache-Control', 'private, no-store');
  res.send(file.body);
}

/** A version number in the path; 0 (or "latest") is the latest published version. */
const versionParam = (raw: unknown) => (raw === 'latest' ? 0 : typeof raw === 'string' && /^\d{1,6}$/.test(raw) ? Number(raw) : -1);

/**
 * /api/briefings: consultants and admins write; clients read what is shared with them (everything
 * else answers 404); scientists have no briefings.
 */
export function briefingRoutes(ctx: AppContext): Router {
  const router = Router();
  router.use('/briefings', requireAuth(ctx), READERS);

  router.get('/briefings', async (req, res) => {
    const { scope, user } = authOf(req);
    res.json({ briefings: await ctx.briefings.list(scope, user) });
  });

  router.post('/briefings', WRITERS, validateBody(createBriefingSchema), async (req, res) => {
    const { scope, user } = authOf(req);
    res.status(201).json({ briefing: await ctx.briefings.create(scope, user, req.body) });
  });

  router.get('/briefings/:id/draft', WRITERS, async (req, res) => {
    res.json({ briefing: await ctx.briefings.draft(authOf(req).scope, idParam(req)) });
  });

  router.put('/briefings/:id/draft', WRITERS, validateBody(saveDraftSchema), async (req, res) => {
    const { scope, user } = authOf(req);
    res.json({ briefing: await ctx.briefings.saveDraft(scope, user, idParam(req), req.body) });
  });

  router.get('/briefings/:id/preview', WRITERS, async (req, res) => {
    const { scope, user } = authOf(req);
    res.json(await ctx.briefings.preview(scope, user, idParam(req)));
  });

  router.post('/briefings/:id/publish', WRITERS, async (req, res) => {
    const { scope, user } = authOf(req);
    res.status(201).json(await ctx.briefings.publish(scope, user, idParam(req)));
  });

  router.post('/briefings/:id/shares', WRITERS, validateBody(shareSchema), async (req, res) => {
    const { scope, user } = authOf(req);
    await ctx.briefingSharing.share(scope, user, idParam(req), req.body.emails);
    res.json({ briefing: await ctx.briefings.draft(scope, idParam(req)) });
  });

  router.delete('/briefings/:id/shares/:userId', WRITERS, async (req, res) => {
    const { scope, user } = authOf(req);
    await ctx.briefingSharing.unshare(scope, user, idParam(req), idParam(req, 'userId'));
    res.status(204).end();
  });

  router.get('/briefings/:id/audit', WRITERS, async (req, res) => {
    const { scope } = authOf(req);
    await scope.findOr404('briefings', idParam(req), 'Briefing');
    res.json({ events: await listEvents(scope, idParam(req)) });
  });

  router.get('/briefings/:id/versions/:version', async (req, res) => {
    const { scope, user } = authOf(req);
    res.json(await ctx.briefings.read(scope, user, idParam(req), versionParam(req.params.version)));
  });

  router.get('/briefings/:id/versions/:version/pdf', async (req, res) => {
    const { scope, user } = authOf(req);
    sendFile(res, await ctx.briefingExports.pdf(scope, user, idParam(req), versionParam(req.params.version)));
  });

  router.get('/briefings/:id/versions/:version/csv', async (req, res) => {
    const { scope, user } = authOf(req);
    sendFile(res, await ctx.briefingExports.csv(scope, user, idParam(req), versionParam(req.params.version)));
  });

  router.get('/briefings/:id/comments', async (req, res) => {
    const { scope, user } = authOf(req);
    res.json({ comments: await ctx.briefingSharing.comments(scope, user, idParam(req)) });
  });

  router.post('/briefings/:id/comments', validateBody(commentSchema), async (req, res) => {
    const { scope, user } = authOf(req);
    await ctx.briefingSharing.comment(scope, user, idParam(req), req.body.body);
    res.status(201).json({ comments: await ctx.briefingSharing.comments(scope, user, idParam(req)) });
  });

  return router;
}
