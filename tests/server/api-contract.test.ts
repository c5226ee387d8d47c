import express from 'express';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { apiResponses } from '../../shared/schemas/api';
import { checkResponseContracts, takeContractFailures } from '../helpers/response-contract';
import { listRoutes } from '../helpers/routes';
import { createTestApp } from '../helpers/test-server';

const ctx = createTestApp();
afterAll(() => ctx.close());

describe('the registry of responses', () => {
  const mounted = listRoutes(ctx.app)
    .filter((r) => r.path.startsWith('/api'))
    .map((r) => `${r.method} ${r.path}`);
  const registered = Object.keys(apiResponses);

  it('reads the routes from the app', () => {
    expect(mounted.length).toBeGreaterThan(50);
    expect(mounted).toContain('GET /api/takes/:takeId/remarks');
    expect(mounted).toContain('POST /api/payments/webhook');
  });

  it('has an entry for every route the app mounts', () => {
    expect(mounted.filter((r) => !registered.includes(r))).toEqual([]);
  });

  it('has no entry for a route the app does not mount', () => {
    expect(registered.filter((r) => !mounted.includes(r))).toEqual([]);
  });

  it('names each route once', () => {
    expect(new Set(mounted).size).toBe(mounted.length);
  });
});

describe('the response check', () => {
  // A small app of its own with routes at the API's paths, standing in for presenters that drifted.
  const app = express();
  app.get('/api/health', (_req, res) => {
    res.json({ ok: 'yes', db: 'up' });
  });
  app.get('/api/auth/csrf', (_req, res) => {
    res.json({ token: 'abc' });
  });
  app.get('/api/not-registered', (_req, res) => {
    res.json({ hello: 'there' });
  });
  app.get('/api/settings', (_req, res) => {
    res.status(404).json({ error: { code: 'not_found', message: 'no such thing' } });
  });
  checkResponseContracts(app);

  it('notes an answer its schema refuses, with the route, the field and the reason', async () => {
    await request(app).get('/api/health').expect(200);
    const [failure, ...more] = takeContractFailures();
    expect(more).toEqual([]);
    expect(failure).toContain('GET /api/health answered 200 with a body its schema refuses');
    expect(failure).toMatch(/expected boolean[\s\S]*at ok/);
  });

  it('notes a route with no entry in the registry', async () => {
    await request(app).get('/api/not-registered').expect(200);
    expect(takeContractFailures()).toEqual(['GET /api/not-registered has no entry in the registry of responses']);
  });

  it('passes an answer that fits, and leaves error answers to the error contract', async () => {
    await request(app).get('/api/auth/csrf').expect(200);
    await request(app).get('/api/settings').expect(404);
    expect(takeContractFailures()).toEqual([]);
  });
});
