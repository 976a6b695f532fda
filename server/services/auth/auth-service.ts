import bcrypt from 'bcryptjs';
import type { Knex } from 'knex';
import type { MeResponse, Role, SignInRequest, SignUpRequest } from '../../../shared/schemas/auth';
import { AppError, conflict, unauthorized } from '../../errors';

export interface UserRow {
  id: number;
  organisation_id: number;
  email: string;
  name: string;
  password_hash: string | null;
  role: Role;
  status: 'active' | 'invited' | 'disabled';
  token_version: number;
  last_sign_in_at: Date | null;
}

const INVALID_CREDENTIALS = 'E-mail or password is not right.';

/** Sign-up, sign-in, sign-out and the signed-in user's profile. */
export class AuthService {
  // Compared against when the e-mail is unknown, so both answers take the same time.
  private readonly dummyHash: string;

  constructor(
    private readonly db: Knex,
    private readonly bcryptCost: number,
  ) {
    this.dummyHash = bcrypt.hashSync('not-a-real-password-used-for-timing', bcryptCost);
  }

  hashPassword(password: string): Promise<string> {
    return bcrypt.hash(password, this.bcryptCost);
  }

  /** Creates an organisation and its first admin in one transaction. */
  async signUp(input: SignUpRequest): Promise<UserRow> {
    const hash = await this.hashPassword(input.password);
    return this.db.transaction(async (trx) => {
      const taken = await trx('users').where({ email: input.email }).first('id');
      if (taken) throw conflict('An account with this e-mail already exists.', 'email');
      const [organisationId] = await trx('organisations').insert({ name: input.organisationName });
      const [userId] = await trx('users').insert({
        organisation_id: organisationId,
        email: input.email,
        name: input.name,
        password_hash: hash,
        role: 'admin',
        status: 'active',
      });
      return (await trx<UserRow>('users').where({ id: userId }).first())!;
    });
  }

  /** The user for these credentials; the same error for an unknown e-mail and a wrong password. */
  async signIn(input: SignInRequest): Promise<UserRow> {
    const user = await this.db<UserRow>('users').where({ email: input.email }).first();
    const matches = await bcrypt.compare(input.password, user?.password_hash ?? this.dummyHash);
    if (!user || !user.password_hash || !matches || user.status !== 'active') {
      throw new AppError(401, 'invalid_credentials', INVALID_CREDENTIALS);
    }
    await this.db('users').where({ id: user.id }).update({ last_sign_in_at: this.db.fn.now() });
    return user;
  }

  /** Invalidates every token issued so far to this user. */
  async signOut(userId: number): Promise<void> {
    await this.db('users').where({ id: userId }).increment('token_version', 1);
  }

  /** The active user a token refers to, or null when it has been revoked. */
  async activeUser(userId: number, organisationId: number, tokenVersion: number): Promise<UserRow | null> {
    const user = await this.db<UserRow>('users').where({ id: userId, organisation_id: organisationId }).first();
    if (!user || user.status !== 'active' || user.token_version !== tokenVersion) return null;
    return user;
  }

  async me(user: UserRow): Promise<MeResponse> {
    const organisation = await this.db('organisations').where({ id: user.organisation_id }).first('id', 'name');
    if (!organisation) throw unauthorized();
    return {
      user: { id: user.id, name: user.name, email: user.email, role: user.role, status: user.status },
      organisation: { id: organisation.id, name: organisation.name },
    };
  }
}
