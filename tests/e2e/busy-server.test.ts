import { createServer, type Server, type Socket, connect } from 'node:net';
import type { AddressInfo } from 'node:net';
import type { Server as HttpServer } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type DrillSpec, generateDrill } from '../../shared/engine';
import { type BrowserSession, openBrowser, signInThroughPage } from '../helpers/browser';
import { playFromOrigin, startTake, takeDone } from '../helpers/practice-page';
import { createUser, type TestUser } from '../helpers/factories';
import { createTestApp } from '../helpers/test-server';

const SPEC: DrillSpec = {
  pair: ['Bbm', 'Ab'],
  pattern: 'stack',
  direction: 'up',
  instrument: 'piano',
  tempo: 120,
  range: { low: 55, high: 79 },
};

/**
 * A TCP relay in front of the test database that can be cut: while it is down, every
 * connection the server has to PostgreSQL breaks and new ones are refused, as in an outage.
 */
async function databaseRelay(target: URL) {
  const sockets = new Set<Socket>();
  let up = true;
  const server: Server = createServer((client) => {
    if (!up) return client.destroy();
    const upstream = connect(Number(target.port || 5432), target.hostname);
    for (const s of [client, upstream]) {
      sockets.add(s);
      s.on('close', () => sockets.delete(s));
      s.on('error', () => s.destroy());
    }
    client.pipe(upstream).pipe(client);
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', () => resolve()));
  const url = new URL(target);
  url.port = String((server.address() as AddressInfo).port);
  url.hostname = '127.0.0.1';
  return {
    url: url.toString(),
    down() {
      up = false;
      for (const s of sockets) s.destroy();
    },
    up() {
      up = true;
    },
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

describe('a take finished while the database is out of reach', () => {
  let relay: Awaited<ReturnType<typeof databaseRelay>>;
  let ctx: ReturnType<typeof createTestApp>;
  let http: HttpServer;
  let url = '';
  let b: BrowserSession;
  let player: TestUser;

  beforeAll(async () => {
    const direct = process.env.TEST_DATABASE_URL!;
    relay = await databaseRelay(new URL(direct));
    process.env.TEST_DATABASE_URL = relay.url;
    try {
      ctx = createTestApp();
    } finally {
      process.env.TEST_DATABASE_URL = direct;
    }
    http = ctx.app.listen(0, '127.0.0.1');
    await new Promise<void>((resolve) => http.once('listening', () => resolve()));
    url = `http://127.0.0.1:${(http.address() as AddressInfo).port}`;
    player = await createUser(ctx.db, { role: 'player' });
    b = await openBrowser(url, {
      fakeMidi: true,
      midiOptions: { inputs: [{ id: 'kb', name: 'Fake Keyboard' }], outputs: [] },
    });
    await signInThroughPage(b.page, url, player);
  });
  afterAll(async () => {
    relay?.up();
    await b?.close();
    await new Promise<void>((resolve) => (http ? http.close(() => resolve()) : resolve()));
    http?.closeAllConnections();
    await ctx?.close();
    await relay?.close();
  });

  it('says the server is busy, keeps the take, and sends it once the database is back', {
    timeout: 90_000,
  }, async () => {
    const { page } = b;
    await page.goto(`${url}/practice?spec=${encodeURIComponent(JSON.stringify(SPEC))}`, { waitUntil: 'networkidle' });
    await page.getByTestId('drill-staff').waitFor();
    await page.getByLabel('Count-in').selectOption('0');
    await page.waitForFunction(() =>
      document.querySelector('[data-testid="input-status"]')?.textContent?.includes('Listening'),
    );
    const answers: number[] = [];
    const busy: string[] = [];
    page.on('response', (res) => {
      const path = new URL(res.url()).pathname;
      if (res.status() === 503 && path.startsWith('/api/')) busy.push(path);
      if (res.request().method() === 'POST' && path === '/api/takes') answers.push(res.status());
    });

    relay.down();
    await startTake(page);
    await playFromOrigin(
      page,
      generateDrill(SPEC).notes.map((n) => ({ midi: n.midi, t: n.beat * 500 })),
    );
    await takeDone(page);
    // The server answered 503 with Retry-After (its database is down), and the page says so in plain words.
    await page.waitForFunction(() =>
      document.querySelector('[data-testid="queue-waiting"]')?.textContent?.includes('server is busy'),
    );
    expect(await page.getByTestId('queue-waiting').textContent()).toBe(
      'The server is busy, your take is kept and will be sent',
    );
    // (the token fetch before the post, or the post itself, met the outage)
    expect(busy.length).toBeGreaterThan(0);
    expect(answers.filter((s) => s !== 503)).toEqual([]);

    // Back: the queue's retry delivers it, once.
    relay.up();
    await page.getByTestId('queue-waiting').waitFor({ state: 'detached', timeout: 45_000 });
    const stored = await ctx.pool.query('SELECT count(*)::int AS n FROM takes WHERE player_id = $1', [player.id]);
    expect(stored.rows[0].n).toBe(1);
    await expect.poll(() => answers.at(-1)).toBe(201);
  });
});
