import { z } from 'zod';
import { roleChangeSchema } from '../../shared/schemas/members';
import type { AppContext } from '../context';
import { idOf, memberArea, type ApiArea } from './route-table';

const memberParams = z.object({ id: idOf('Member') });

/** /api/members: the organisation's people and its seats, for its admins. */
export function memberRoutes(ctx: AppContext): ApiArea {
  const { members, passwordResets } = ctx;
  return memberArea('/members', (route) => {
    route.get('/', 'manageMembers', {}, async ({ auth: { scope } }, res) => {
      res.json(await members.list(scope));
    });

    route.get('/:id', 'manageMembers', { params: memberParams }, async ({ auth: { scope }, params }, res) => {
      res.json({ member: await members.get(scope, params.id) });
    });

    route.patch('/:id', 'manageMembers', { params: memberParams, body: roleChangeSchema }, async ({ auth: { user, scope }, params, body }, res) => {
      res.json({ member: await members.changeRole(scope, user, params.id, body.role) });
    });

    route.post('/:id/password-reset', 'manageMembers', { params: memberParams }, async ({ auth: { user, scope }, params }, res) => {
      res.json(await passwordResets.sendFor(scope, user, params.id));
    });

    route.delete('/:id', 'manageMembers', { params: memberParams }, async ({ auth: { user, scope }, params }, res) => {
      await members.remove(scope, user, params.id);
      res.status(204).end();
    });
  });
}
