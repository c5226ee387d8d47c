import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { createDb } from '../../server/db/client';
import { parseEnv } from '../../server/env';
import { createTestApp } from '../helpers/test-server';

describe('GET /api/health', () => {
  const ctx = createTestApp();
  afterAll(() => ctx.close());

  it('says the database is up', async () => {
    const res = await request(ctx.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, db: 'up' });
  });

  it('answers 503 with db "down" when the database cannot be reached', async () => {
    // A port nothing listens on: the pool fails to connect.
    const url = 'postgres://sixfold@127.0.0.1:1/none';
    const env = parseEnv({ NODE_ENV: 'test', DATABASE_URL: url });
    const { db, pool } = createDb(url, 1);
    const res = await request(createApp({ db, pool, env })).get('/api/health');
    await pool.end();
    expect(res.status).toBe(503);
    expect(res.body).toEqual({ ok: false, db: 'down' });
  });

  it('answers unknown API paths with a JSON error', async () => {
    const res = await request(ctx.app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
    expect(typeof res.body.error.message).toBe('string');
  });

  it('answers a broken JSON body with a 400 that says so', async () => {
    const res = await request(ctx.app).post('/api/health').set('Content-Type', 'application/json').send('{"oops');
    expect(res.status).toBe(400);
    expect(res.body.error.message).toMatch(/JSON/);
  });
});

describe('environment', () => {
  it('names each bad variable', () => {
    expect(() => parseEnv({ NODE_ENV: 'staging', PORT: 'abc', DATABASE_URL: 'mysql://x' })).toThrow(
      /NODE_ENV[\s\S]*PORT[\s\S]*DATABASE_URL/,
    );
  });

  it('asks for a session secret in production', () => {
    expect(() => parseEnv({ NODE_ENV: 'production', DATABASE_URL: 'postgres://a@b/c' })).toThrow(/SESSION_SECRET/);
  });
});
