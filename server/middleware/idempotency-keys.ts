import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import type { RequestHandler, Response } from 'express';
import { isUniqueViolation } from '../db-errors';
import { AppError, badRequest } from '../errors';
import type { Logger } from '../logger';
import { authOf } from './require-auth';

export const IDEMPOTENCY_HEADER = 'Idempotency-Key';
const KEY = /^[\x21-\x7e]{8,255}$/;
const KEPT_MS = 24 * 3600_000;

interface KeyRow {
  id: number;
  fingerprint: string;
  state: 'started' | 'committed' | 'done';
  response_status: number | null;
  response_body: string | null;
}

const inProgress = () => new AppError(409, 'request_in_progress', 'The same request is still being carried out; wait a moment and look again.', undefined, undefined, 1);

/**
 * `Idempotency-Key` on signed-in POSTs (every create): the first request with a key is carried
 * out and its answer kept for a day; a retry with the same key and the same request gets that
 * answer again (`Idempotent-Replayed: true`) instead of storing twice. A key reused for another
 * request is refused (422). When the first answer was a 5xx, a write that had committed is known
 * (TenantScope marks the key in its transaction): the retry is told so (409 `already_applied`)
 * instead of repeating it; when nothing had committed the retry simply runs.
 */
export function idempotencyKeys(db: Knex, logger: Logger): RequestHandler {
  const inFlight = new Set<number>();
  let lastSweep = 0;
  return async (req, res, next) => {
    const key = req.get(IDEMPOTENCY_HEADER);
    if (req.method !== 'POST' || key === undefined) return next();
    if (!KEY.test(key)) throw badRequest(`The ${IDEMPOTENCY_HEADER} header must be 8–255 visible ASCII characters.`);
    const { user, scope } = authOf(req);
    if (Date.now() - lastSweep > 3600_000) {
      lastSweep = Date.now();
      await db('idempotency_keys').where('created_at', '<', new Date(Date.now() - KEPT_MS)).delete();
    }
    const fingerprint = createHash('sha256')
      .update(JSON.stringify([req.originalUrl, req.get('content-type') ?? '', req.get('content-length') ?? '', req.body ?? null]))
      .digest('hex');
    const row = (await db('idempotency_keys').where({ user_id: user.id, idem_key: key }).first()) as KeyRow | undefined;
    if (row && row.fingerprint !== fingerprint) {
      throw new AppError(422, 'idempotency_key_reused', `This ${IDEMPOTENCY_HEADER} was sent with another request; use a new key for a new request.`);
    }
    if (row?.state === 'done') return replay(res, row);
    if (row && inFlight.has(row.id)) throw inProgress();
    if (row?.state === 'committed') {
      throw new AppError(409, 'already_applied', 'This request was carried out before, but its answer was lost on the way. Nothing was stored twice; reload to see the result.');
    }
    // A key left 'started' by a request that ended without committing anything: run it afresh.
    if (row) await db('idempotency_keys').where({ id: row.id }).delete();
    let id: number;
    try {
      [id] = await db('idempotency_keys').insert({ organisation_id: scope.organisationId, user_id: user.id, idem_key: key, fingerprint });
    } catch (error) {
      if (isUniqueViolation(error)) throw inProgress();
      throw error;
    }
    inFlight.add(id);
    const claim = { id, committed: false };
    scope.claim = claim;
    let body: unknown;
    const json = res.json.bind(res);
    res.json = (value: unknown) => {
      body = value;
      return json(value);
    };
    res.once('close', () => {
      void settle(db, id, res, body, claim.committed)
        .catch((error: unknown) => logger.error({ err: error }, 'idempotency key not settled'))
        .finally(() => inFlight.delete(id));
    });
    next();
  };
}

/** Keeps the answer (anything below 500), or forgets a key whose request failed before committing. */
async function settle(db: Knex, id: number, res: Response, body: unknown, committed: boolean): Promise<void> {
  if (res.statusCode < 500 && res.writableFinished) {
    await db('idempotency_keys').where({ id }).update({ state: 'done', response_status: res.statusCode, response_body: body === undefined ? null : JSON.stringify(body) });
  } else if (!committed) {
    await db('idempotency_keys').where({ id }).delete();
  }
}

function replay(res: Response, row: KeyRow): void {
  res.setHeader('Idempotent-Replayed', 'true');
  res.status(row.response_status ?? 200);
  if (row.response_body === null) res.end();
  else res.type('application/json').send(row.response_body);
}
