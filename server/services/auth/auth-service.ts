import bcrypt from 'bcryptjs';
import type { Knex } from 'knex';
import type { MeResponse, PasswordChange, Role, SignInRequest } from '../../../shared/schemas/auth';
import { AppError, unauthorized, validationFailed } from '../../errors';
import { isCommonPassword } from './common-passwords';

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
/** A wrong current password: not 401, which would end the session in the client; counted by the sign-in back-off. */
export const WRONG_PASSWORD_STATUS = 403;
const COMMON_PASSWORD = 'This password appears in published lists of breached passwords; choose another (a few unrelated words make a good one).';

/** Sign-in, sign-out, password changes and the signed-in user's profile (sign-up: members/sign-up-service.ts). */
export class AuthService {
  // Compared against when the e-mail is unknown, so both answers take the same time.
  private readonly dummyHash: string;
  /** User rows being read for a session check, by user id (see activeUser). */
  private readonly usersBeingRead = new Map<number, Promise<UserRow | undefined>>();

  constructor(
    private readonly db: Knex,
    private readonly bcryptCost: number,
  ) {
    this.dummyHash = bcrypt.hashSync('not-a-real-password-used-for-timing', bcryptCost);
  }

  /**
   * The hash of a password being set (sign-up, invitation, reset, change), refused with a 422 on
   * `field` when it is among the breach corpus's common passwords (ASVS 6.2.4).
   */
  hashNewPassword(password: string, field = 'password'): Promise<string> {
    if (isCommonPassword(password)) throw validationFailed(COMMON_PASSWORD, field);
    return bcrypt.hash(password, this.bcryptCost);
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

  /**
   * Sets a new password when the current one is given, and ends every session of the user
   * (the caller starts a new one for the request that asked). Returns the updated user.
   */
  async changePassword(user: UserRow, input: PasswordChange): Promise<UserRow> {
    const stored = await this.db<UserRow>('users').where({ id: user.id }).first('password_hash');
    if (!stored?.password_hash || !(await bcrypt.compare(input.currentPassword, stored.password_hash))) {
      throw new AppError(WRONG_PASSWORD_STATUS, 'wrong_password', 'This is not your current password.', 'currentPassword');
    }
    if (input.newPassword === input.currentPassword) throw validationFailed('Choose a password other than your current one.', 'newPassword');
    const hash = await this.hashNewPassword(input.newPassword, 'newPassword');
    await this.db('users').where({ id: user.id }).update({ password_hash: hash, token_version: this.db.raw('token_version + 1'), updated_at: new Date() });
    return (await this.db<UserRow>('users').where({ id: user.id }).first())!;
  }

  /** Invalidates every token issued so far to this user. */
  async signOut(userId: number): Promise<void> {
    await this.db('users').where({ id: userId }).increment('token_version', 1);
  }

  /** The active user a token refers to, or null when it has been revoked. */
  /**
   * The session's user when the session still holds: same organisation, active, token not revoked.
   * Requests of one user that arrive while the user's row is being read share that read (a page
   * load sends several at once): each answer is at most one query's time old, as any read is.
   */
  async activeUser(userId: number, organisationId: number, tokenVersion: number): Promise<UserRow | null> {
    let reading = this.usersBeingRead.get(userId);
    if (!reading) {
      reading = this.db<UserRow>('users').where({ id: userId }).first().finally(() => this.usersBeingRead.delete(userId));
      this.usersBeingRead.set(userId, reading);
    }
    const user = await reading;
    if (!user || user.organisation_id !== organisationId || user.status !== 'active' || user.token_version !== tokenVersion) return null;
    // Each request gets its own copy of the shared row.
    return { ...user };
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
