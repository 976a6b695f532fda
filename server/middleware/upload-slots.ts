import type { RequestHandler } from 'express';
import { tooManyRequests } from '../errors';
import { authOf } from './require-auth';

/**
 * At most `perOrganisation` uploads (reading a file, storing a preview) of one organisation at
 * a time, so one team's large files cannot take every worker thread and database connection.
 * A slot is held from the start of the request until its answer is sent or the client goes away.
 */
export class UploadSlots {
  private readonly inUse = new Map<number, number>();

  constructor(readonly perOrganisation: number) {}

  /** Middleware (behind requireAuth, before the file is read): 429 with Retry-After when every slot is taken. */
  hold(): RequestHandler {
    return (req, res, next) => {
      const organisationId = authOf(req).scope.organisationId;
      const held = this.inUse.get(organisationId) ?? 0;
      if (held >= this.perOrganisation) {
        throw tooManyRequests('too_many_uploads', `Your organisation already has ${held} uploads in progress; wait for one to finish, then try again.`, 5);
      }
      this.inUse.set(organisationId, held + 1);
      res.once('close', () => {
        const left = (this.inUse.get(organisationId) ?? 1) - 1;
        if (left > 0) this.inUse.set(organisationId, left);
        else this.inUse.delete(organisationId);
      });
      next();
    };
  }
}
