import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { newMailToken } from '../../server/services/mail/mail-tokens';
import { unique } from '../support/factories';
import { withOrganisation } from '../support/test-org';

const f = withOrganisation({ SIGNUPS_PER_IP_PER_HOUR: '100' });

/** Well-known passwords of 12+ characters (keyboard walks, digit runs, phrases near the top of published frequency lists). */
const WELL_KNOWN = [
  '1qaz2wsx3edc', 'qwertyuiop123', '123456789012', 'q1w2e3r4t5y6', 'qazwsxedcrfv', 'passwordpassword', 'iloveyou1234',
  '123qweasdzxc', '1q2w3e4r5t6y', 'qwerty123456', 'qwertyqwerty', '123456654321', 'Q1W2E3R4T5Y6',
];

describe('common passwords are refused wherever a password is set', () => {
  it('at sign-up, each with a message on the password field', async () => {
    for (const password of WELL_KNOWN) {
      const res = await request(f.t.app).post('/api/auth/sign-up').send({ organisationName: unique('Org '), name: 'Ada', email: `${unique('p')}@test.example`, password });
      expect(res.status, password).toBe(422);
      expect(res.body.error.field, password).toBe('password');
    }
  });

  it('when a reset link is used', async () => {
    const { token, hash } = newMailToken();
    await f.t.db('password_reset_tokens').insert({ user_id: f.org.users.scientist.id, token_hash: hash, expires_at: new Date(Date.now() + 3600_000) });
    const res = await request(f.t.app).post('/api/password-reset/complete').send({ token, password: '1qaz2wsx3edc' });
    expect(res.status).toBe(422);
    expect(res.body.error.field).toBe('password');
    // The link still works for a good password.
    expect((await request(f.t.app).post('/api/password-reset/complete').send({ token, password: 'moraine lichen quartz 1987' })).status).toBe(200);
  });

  it('when an invitation is accepted', async () => {
    const [userId] = await f.t.db('users').insert({ organisation_id: f.org.organisationId, email: `${unique('inv')}@test.example`, name: 'New', role: 'client', status: 'invited' });
    const { token, hash } = newMailToken();
    await f.t.db('invitations').insert({ organisation_id: f.org.organisationId, user_id: userId, invited_by: f.org.users.admin.id, token_hash: hash, expires_at: new Date(Date.now() + 3600_000) });
    const res = await request(f.t.app).post('/api/invitations/accept').send({ token, name: 'New member', password: 'qwertyuiop123' });
    expect(res.status).toBe(422);
    expect(res.body.error.field).toBe('password');
  });
});
