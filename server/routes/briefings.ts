import { z } from 'zod';
import { commentSchema, createBriefingSchema, saveDraftSchema, shareSchema } from '../../shared/schemas/briefings';
import type { AppContext } from '../context';
import { sendDownload } from './download';
import { idOf, memberArea, type ApiArea } from './route-table';

const briefingParams = z.object({ id: idOf('Briefing') });
const shareParams = briefingParams.extend({ userId: idOf('Share') });
/** A version number in the path; "latest" (or 0) is the latest published version. */
const versionParams = briefingParams.extend({
  version: z.string().regex(/^(latest|\d{1,6})$/, { error: 'Briefing version' }).transform((v) => (v === 'latest' ? 0 : Number(v))),
});

/**
 * /api/briefings: consultants and admins write; clients read what is shared with them (everything
 * else answers 404); scientists have no briefings.
 */
export function briefingRoutes(ctx: AppContext): ApiArea {
  const { briefings, briefingSharing: sharing, briefingExports: exports } = ctx;
  return memberArea('/briefings', (route) => {
    route.get('/', 'readBriefings', {}, async ({ auth: { scope, user } }, res) => {
      res.json({ briefings: await briefings.list(scope, user) });
    });

    route.post('/', 'writeBriefings', { body: createBriefingSchema }, async ({ auth: { scope, user }, body }, res) => {
      res.status(201).json({ briefing: await briefings.create(scope, user, body) });
    });

    route.get('/:id/draft', 'writeBriefings', { params: briefingParams }, async ({ auth: { scope }, params }, res) => {
      res.json({ briefing: await briefings.draft(scope, params.id) });
    });

    route.put('/:id/draft', 'writeBriefings', { params: briefingParams, body: saveDraftSchema }, async ({ auth: { scope, user }, params, body }, res) => {
      res.json({ briefing: await briefings.saveDraft(scope, user, params.id, body) });
    });

    route.get('/:id/preview', 'writeBriefings', { params: briefingParams }, async ({ auth: { scope, user }, params }, res) => {
      res.json(await briefings.preview(scope, user, params.id));
    });

    route.post('/:id/publish', 'writeBriefings', { params: briefingParams }, async ({ auth: { scope, user }, params }, res) => {
      const published = await briefings.publish(scope, user, params.id);
      if (published.version > 1) await ctx.briefingNotices.published(scope, user, params.id, published.version);
      res.status(201).json(published);
    });

    route.post('/:id/shares', 'writeBriefings', { params: briefingParams, body: shareSchema }, async ({ auth: { scope, user }, params, body }, res) => {
      await sharing.share(scope, user, params.id, body.emails);
      res.json({ briefing: await briefings.draft(scope, params.id) });
    });

    route.delete('/:id/shares/:userId', 'writeBriefings', { params: shareParams }, async ({ auth: { scope, user }, params }, res) => {
      await sharing.unshare(scope, user, params.id, params.userId);
      res.status(204).end();
    });

    route.get('/:id/audit', 'writeBriefings', { params: briefingParams }, async ({ auth: { scope }, params }, res) => {
      res.json({ events: await briefings.audit(scope, params.id) });
    });

    route.get('/:id/versions/:version', 'readBriefings', { params: versionParams }, async ({ auth: { scope, user }, params }, res) => {
      res.json(await briefings.read(scope, user, params.id, params.version));
    });

    route.get('/:id/versions/:version/pdf', 'readBriefings', { params: versionParams }, async ({ auth: { scope, user }, params }, res) => {
      sendDownload(res, await exports.pdf(scope, user, params.id, params.version));
    });

    route.get('/:id/versions/:version/csv', 'readBriefings', { params: versionParams }, async ({ auth: { scope, user }, params }, res) => {
      sendDownload(res, await exports.csv(scope, user, params.id, params.version));
    });

    route.get('/:id/comments', 'readBriefings', { params: briefingParams }, async ({ auth: { scope, user }, params }, res) => {
      res.json({ comments: await sharing.comments(scope, user, params.id) });
    });

    route.post('/:id/comments', 'readBriefings', { params: briefingParams, body: commentSchema }, async ({ auth: { scope, user }, params, body }, res) => {
      await sharing.comment(scope, user, params.id, body.body);
      res.status(201).json({ comments: await sharing.comments(scope, user, params.id) });
    });
  });
}
