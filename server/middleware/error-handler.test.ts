import express from 'express';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { validationFailed } from '../errors';
import { errorHandler } from './error-handler';

/** An app whose one route fails with `error`, answered by the real error handler. */
function failingWith(error: unknown) {
  const app = express();
  app.get('/', () => {
    throw error;
  });
  app.use(errorHandler);
  return app;
}

describe('error handler', () => {
  it('answers an AppError with its status, code, message and field', async () => {
    const res = await request(failingWith(validationFailed('areaKm2: must be positive', 'areaKm2'))).get('/');
    expect(res.status).toBe(422);
    expect(res.body).toEqual({ error: { code: 'validation_failed', message: 'areaKm2: must be positive', field: 'areaKm2' } });
  });

  it('answers a database deadlock with 503 "busy" (the transaction was rolled back)', async () => {
    const deadlock = Object.assign(new Error('Deadlock found when trying to get lock'), { code: 'ER_LOCK_DEADLOCK', errno: 1213 });
    const res = await request(failingWith(deadlock)).get('/');
    expect(res.status).toBe(503);
    expect(res.body.error.code).toBe('busy');
    expect(JSON.stringify(res.body)).not.toMatch(/Deadlock found/);
  });

  it('never sends internals of an unexpected error', async () => {
    const res = await request(failingWith(new Error('select * from users -- secret detail'))).get('/');
    expect(res.status).toBe(500);
    expect(res.body).toEqual({ error: { code: 'internal', message: 'Something went wrong on our side. Please try again.' } });
  });
});
