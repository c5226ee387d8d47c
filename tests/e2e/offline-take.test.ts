import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
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

describe('a take finished while the server is down', () => {
  const ctx = createTestApp();
  let http: Server;
  let port = 0;
  let url = '';
  let b: BrowserSession;
  let player: TestUser;

  const listen = () =>
    new Promise<void>((resolve) => {
      http = ctx.app.listen(port, '127.0.0.1', () => resolve());
    });
  const halt = () =>
    new Promise<void>((resolve) => {
      http.close(() => resolve());
      http.closeAllConnections();
    });

  beforeAll(async () => {
    await listen();
    port = (http.address() as AddressInfo).port;
    url = `http://127.0.0.1:${port}`;
    player = await createUser(ctx.db, { role: 'player' });
    b = await openBrowser(url, {
      fakeMidi: true,
      midiOptions: { inputs: [{ id: 'kb', name: 'Fake Keyboard' }], outputs: [] },
    });
    await signInThroughPage(b.page, url, player);
  });
  afterAll(async () => {
    await b?.close();
    if (http?.listening) await halt();
    await ctx.close();
  });

  it('keeps it on the device, sends it when the server is back, and stores it once', { timeout: 90_000 }, async () => {
    const { page } = b;
    await page.goto(`${url}/practice?spec=${encodeURIComponent(JSON.stringify(SPEC))}`, { waitUntil: 'networkidle' });
    await page.getByTestId('drill-staff').waitFor();
    await page.getByLabel('Count-in').selectOption('0');
    await page.waitForFunction(() =>
      document.querySelector('[data-testid="input-status"]')?.textContent?.includes('Listening'),
    );

    await halt();
    await startTake(page);
    await playFromOrigin(
      page,
      generateDrill(SPEC).notes.map((n) => ({ midi: n.midi, t: n.beat * 500 })),
    );
    await takeDone(page);
    await page.getByTestId('queue-waiting').waitFor();
    expect(await page.getByTestId('queue-waiting').textContent()).toMatch(/1 take waiting/);
    const before = await ctx.pool.query('SELECT count(*)::int AS n FROM takes WHERE player_id = $1', [player.id]);
    expect(before.rows[0].n).toBe(0);

    // Back up: the retry (with backoff) delivers it; the page says nothing waits any more.
    // Count what the page sends: the server would store a repeated id once, so the database
    // alone cannot tell a queue that sends twice from one that sends once.
    const answers: number[] = [];
    page.on('response', (res) => {
      if (res.request().method() === 'POST' && new URL(res.url()).pathname === '/api/takes') answers.push(res.status());
    });
    await listen();
    await page.getByTestId('queue-waiting').waitFor({ state: 'detached', timeout: 30_000 });
    const after = await ctx.pool.query(
      'SELECT count(*)::int AS n, min(accuracy) AS acc FROM takes WHERE player_id = $1',
      [player.id],
    );
    expect(after.rows[0]).toEqual({ n: 1, acc: 1 });
    expect(answers).toEqual([201]);

    // A reload sends nothing twice: the queue is empty and the id would be stored once anyway.
    await page.reload({ waitUntil: 'networkidle' });
    await page.waitForTimeout(500);
    const again = await ctx.pool.query('SELECT count(*)::int AS n FROM takes WHERE player_id = $1', [player.id]);
    expect(again.rows[0].n).toBe(1);
    // Nothing was sent again after the reload (a second answer would be the server's 200).
    expect(answers).toEqual([201]);
  });

  it('shows a take the server refused for good until the player dismisses it', async () => {
    const { page } = b;
    await page.goto(`${url}/home`, { waitUntil: 'networkidle' });
    // A take the device kept whose drill cannot be played (C and Am share two notes): the
    // server answers 400, so it is refused for good rather than retried.
    const id = crypto.randomUUID();
    await page.evaluate(
      ({ id, spec }) =>
        new Promise<void>((resolve, reject) => {
          const open = indexedDB.open('sixfold-takes');
          open.onupgradeneeded = () => open.result.createObjectStore('pending');
          open.onerror = () => reject(open.error);
          open.onsuccess = () => {
            const tx = open.result.transaction('pending', 'readwrite');
            tx.objectStore('pending').put(
              {
                take: {
                  id,
                  spec,
                  played: [{ midi: 60, timeMs: 0 }],
                  options: { tempo: 120, mode: 'timed' },
                  startedAt: new Date().toISOString(),
                },
                attempts: 0,
                nextAt: 0,
              },
              id,
            );
            tx.oncomplete = () => {
              open.result.close();
              resolve();
            };
            tx.onerror = () => reject(tx.error);
          };
        }),
      { id, spec: { ...SPEC, pair: ['C', 'Am'] } },
    );
    await page.goto(`${url}/practice?spec=${encodeURIComponent(JSON.stringify(SPEC))}`, { waitUntil: 'networkidle' });
    const alert = page.getByRole('alert').filter({ hasText: 'A take was refused by the server' });
    await alert.waitFor({ timeout: 20_000 });
    expect(await alert.textContent()).toMatch(/share/);
    await alert.getByRole('button', { name: 'Dismiss' }).click();
    await alert.waitFor({ state: 'detached' });
    // It left the device: a reload shows nothing.
    await page.reload({ waitUntil: 'networkidle' });
    await page.getByTestId('drill-staff').waitFor();
    expect(await page.getByRole('alert').filter({ hasText: 'refused' }).count()).toBe(0);
  });
});
