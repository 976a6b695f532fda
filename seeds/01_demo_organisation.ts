import bcrypt from 'bcryptjs';
import type { Knex } from 'knex';
import { DEMO_ACCOUNTS, DEMO_ORGANISATION } from './data/demo-accounts';

/** The demo consultancy with one user per role. Safe to re-run: finds or updates by name and e-mail. */
export async function seed(knex: Knex): Promise<void> {
  await knex.transaction(async (trx) => {
    const existing = await trx('organisations').where({ name: DEMO_ORGANISATION.name }).first('id');
    const organisationId = existing ? existing.id : (await trx('organisations').insert({ name: DEMO_ORGANISATION.name }))[0];
    for (const account of DEMO_ACCOUNTS) {
      const row = {
        organisation_id: organisationId,
        email: account.email,
        name: account.name,
        role: account.role,
        status: 'active',
        password_hash: bcrypt.hashSync(account.password, 10),
      };
      await trx('users').insert(row).onConflict('email').merge(['organisation_id', 'name', 'role', 'status', 'password_hash']);
    }
  });
}
