import { Router } from 'express';
import { z } from 'zod';
import type { FakeContext } from '../context';
import { present } from '../expand';
import { listParams, toList } from '../listing';
import { expandParam, parseParams } from '../params';

const retrieveParams = z.strictObject({ expand: expandParam });
const listEventParams = z.strictObject({ ...listParams, type: z.string().optional() });

export function eventRoutes(ctx: FakeContext): Router {
  const router = Router();

  router.get('/events', (req, res) => {
    const { type, expand, ...page } = parseParams(listEventParams, req.query);
    const events = ctx.state.events.newestFirst((event) => !type || event.type === type);
    res.json(present(ctx.state, toList(events, page, '/v1/events'), expand));
  });

  router.get('/events/:id', (req, res) => {
    const { expand } = parseParams(retrieveParams, req.query);
    res.json(present(ctx.state, ctx.state.events.find(req.params.id), expand));
  });

  return router;
}
