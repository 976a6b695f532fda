import type { Knex } from 'knex';
import type { AppConfig } from '../../config';
import type { Logger } from '../../logger';
import type { AuthService } from '../auth/auth-service';
import type { MailService } from '../mail/mail-service';
import { InvitationService } from './invitation-service';
import { MembersService } from './members-service';
import { PasswordResetService } from './password-reset-service';
import { SignUpService } from './sign-up-service';

export interface MemberServices {
  members: MembersService;
  invitations: InvitationService;
  passwordResets: PasswordResetService;
  signUps: SignUpService;
}

/** The organisation's people: members and roles, invitations and password resets by mail. */
export function createMemberServices(deps: { config: AppConfig; db: Knex; logger: Logger; auth: AuthService; mail: MailService }): MemberServices {
  const { config, db, logger, auth, mail } = deps;
  const members = new MembersService();
  // Read at call time: tests learn their own address only once listening.
  const publicUrl = () => config.publicUrl;
  return {
    members,
    invitations: new InvitationService(db, auth, mail, members, publicUrl),
    passwordResets: new PasswordResetService(db, auth, mail, publicUrl, logger),
    signUps: new SignUpService(db, auth, mail, publicUrl, logger),
  };
}
