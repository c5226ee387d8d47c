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
  app.get('/api/health', (req, res) => {
    if (req.query.down === '1') res.status(503).json({ ok: false, db: 'down' });
    else res.json({ ok: 'yes', db: 'up' });
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
  app.delete('/api/drills/:id', (_req, res) => {
    res.status(200).end();
  });
  app.delete('/api/patterns/:id', (_req, res) => {
    res.status(204).end();
  });
  app.get('/api/takes/:id/midi', (req, res) => {
    if (req.params.id === 'right') res.type('audio/midi').send(Buffer.from('MThd'));
    else res.type('text/plain').send('MThd');
  });
  app.get('/api/settings/latency-sheet', (_req, res) => {
    res.type('text/plain').send('no entry');
  });
  app.post('/api/books', (_req, res) => {
    res.status(400).json({ message: 'a bare message' });
  });
  app.post('/api/studios', (_req, res) => {
    res.status(400).json({
      error: { code: 'validation', message: 'Check these fields: name', fields: { name: ['Name the studio'] } },
    });
  });
  app.get('/api/maps/keys', (_req, res) => {
    res.status(503).json({ ok: false, db: 'down' });
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

  it('holds a route marked "no body" to 204 and a file route to its content type', async () => {
    await request(app).delete('/api/drills/d1').expect(200);
    await request(app).delete('/api/patterns/p1').expect(204);
    await request(app).get('/api/takes/right/midi').expect(200);
    await request(app).get('/api/takes/wrong/midi').expect(200);
    await request(app).get('/api/settings/latency-sheet').expect(200);
    expect(takeContractFailures()).toEqual([
      'DELETE /api/drills/:id (DELETE /api/drills/d1) answered 200, but the registry says 204 with no body',
      'GET /api/takes/:id/midi (GET /api/takes/wrong/midi) answered a file of type "text/plain; charset=utf-8", not audio/midi',
      'GET /api/settings/latency-sheet (GET /api/settings/latency-sheet) has no entry in the registry of responses',
    ]);
  });

  it('passes answers that fit, errors included', async () => {
    await request(app).get('/api/auth/csrf').expect(200);
    await request(app).get('/api/settings').expect(404);
    await request(app).post('/api/studios').expect(400);
    await request(app).get('/api/health?down=1').expect(503);
    expect(takeContractFailures()).toEqual([]);
  });

  it('holds every failure to the one error shape, except where the route itself describes it', async () => {
    await request(app).post('/api/books').expect(400);
    await request(app).get('/api/maps/keys').expect(503);
    const [bare, mapDown, ...more] = takeContractFailures();
    expect(more).toEqual([]);
    expect(bare).toMatch(/^POST \/api\/books answered 400 with a body the error schema refuses:[\s\S]*at error/);
    expect(mapDown).toContain('GET /api/maps/keys answered 503 with a body the error schema refuses');
  });
});
