import type { Knex } from 'knex';
import type Stripe from 'stripe';
import type { AppConfig } from '../config';
import type { AuthService } from './auth/auth-service';
import { BillingService } from './billing/billing-service';
import { createPaymentsClient } from './billing/payments-client';
import { WebhookService } from './billing/webhook-service';
import type { MailInbox } from './mail/mail-catcher';
import { MailService } from './mail/mail-service';
import { InvitationService } from './members/invitation-service';
import { MembersService } from './members/members-service';
import { PasswordResetService } from './members/password-reset-service';

/** Seats, billing, members, invitations, password resets and mail: the part of the context they need. */
export interface TeamServices {
  payments: Stripe;
  billing: BillingService;
  webhooks: WebhookService;
  mail: MailService;
  members: MembersService;
  invitations: InvitationService;
  passwordResets: PasswordResetService;
  /** The local mail catcher read by the development inbox; always null in production. */
  devInbox: MailInbox | null;
}

export interface TeamServicesOptions {
  /** The local mail catcher, when one runs beside the app (development and tests). */
  inbox?: MailInbox;
}

export function createTeamServices(config: AppConfig, db: Knex, auth: AuthService, options: TeamServicesOptions = {}): TeamServices {
  const payments = createPaymentsClient(config.billing);
  const mail = new MailService(db, config.mail);
  const members = new MembersService();
  // Read at call time: tests learn their own address only once listening.
  const publicUrl = () => config.publicUrl;
  return {
    payments,
    billing: new BillingService(db, payments, config),
    webhooks: new WebhookService(db, payments, config.billing.webhookSecret),
    mail,
    members,
    invitations: new InvitationService(db, auth, mail, members, publicUrl),
    passwordResets: new PasswordResetService(db, auth, mail, publicUrl),
    devInbox: config.env === 'production' ? null : (options.inbox ?? null),
  };
}
