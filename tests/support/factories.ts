import bcrypt from 'bcryptjs';
import type { Express } from 'express';
import type { Knex } from 'knex';
import request from 'supertest';
import { ROLES, type Role } from '../../shared/schemas/auth';
import { CLIENT_HEADER } from '../../server/middleware/same-origin-writes';

let counter = 0;
/** A unique suffix so test data never collides between files or runs. */
export function unique(prefix = 't'): string {
  counter += 1;
  return `${prefix}${Date.now().toString(36)}${process.pid.toString(36)}${counter}`;
}

export const TEST_PASSWORD = 'correct horse battery staple';
const TEST_HASH = bcrypt.hashSync(TEST_PASSWORD, 4);

export interface TestOrg {
  organisationId: number;
  users: Record<Role, { id: number; email: string }>;
}

/** An organisation with one active user per role, all with TEST_PASSWORD. */
export async function createOrganisation(db: Knex, name = unique('Org ')): Promise<TestOrg> {
  const [organisationId] = await db('organisations').insert({ name });
  const tag = unique('u');
  const users = {} as TestOrg['users'];
  for (const role of ROLES) {
    const email = `${role}.${tag}@test.example`;
    const [id] = await db('users').insert({
      organisation_id: organisationId,
      email,
      name: `${role} ${tag}`,
      role,
      status: 'active',
      password_hash: TEST_HASH,
    });
    users[role] = { id, email };
  }
  return { organisationId, users };
}

/** A supertest agent holding the session cookie of this user and sending our client's header, as the web client does. */
export async function signedInAgent(app: Express, email: string, password = TEST_PASSWORD) {
  const agent = request.agent(app).set(CLIENT_HEADER, 'tarnish');
  const res = await agent.post('/api/auth/sign-in').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}

/** The id of the account with this address (invitations answer without naming the member). */
export async function userIdOf(db: Knex, email: string): Promise<number> {
  const row = await db('users').where({ email }).first('id');
  if (!row) throw new Error(`no account for ${email}`);
  return row.id as number;
}
