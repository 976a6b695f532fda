import type { Knex } from 'knex';
import type { AppConfig } from '../../config';
import type { MailInbox } from './mail-catcher';
import { MailService } from './mail-service';

export interface MailServices {
  mail: MailService;
  /** The local mail catcher read by the development inbox; always null in production. */
  devInbox: MailInbox | null;
}

export function createMailServices(deps: { config: AppConfig; db: Knex; inbox?: MailInbox }): MailServices {
  return {
    mail: new MailService(deps.db, deps.config.mail),
    devInbox: deps.config.env === 'production' ? null : (deps.inbox ?? null),
  };
}
