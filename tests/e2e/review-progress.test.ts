import { randomUUID } from 'node:crypto';
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { and, eq } from 'drizzle-orm';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type DrillSpec, generateDrill, type PlayedNote } from '../../shared/engine';
import { books, purchases, studios, users } from '../../server/db/schema';
import { DEMO_PASSWORD, DEMO_STUDIO, seedDemo } from '../../server/db/seed';
import { createTake } from '../../server/services/takes/create';
import { seriousViolations, setTheme } from '../helpers/axe';
import { type BrowserSession, openBrowser } from '../helpers/browser';
import { createUser } from '../helpers/factories';
import { startTestServer } from '../helpers/test-server';

/**
 * Review and progress as a teacher and a player use them, on the demo studio: a take's notes
 * as played over the staff, slips in words, a remark pinned by clicking a note; assignment
 * credit from any take of the drill; week-over-week bars; the practice log against a weekly
 * goal; the range map's "no notes yet"; the admin's role change; at desktop and phone width in
 * both themes, each page checked with axe-core. Screenshots go to SHOTS_DIR when it is set.
 */
const SHOTS = process.env.SHOTS_DIR;
if (SHOTS) mkdirSync(SHOTS, { recursive: true });

const PHONE = { width: 390, height: 844 };
const DESKTOP = { width: 1280, height: 900 };

/** Four-three on D/C: a short drill whose notes we play by hand. */
const SPEC: DrillSpec = {
  pair: ['D', 'C'],
  pattern: 'four-three',
  direction: 'up',
  instrument: 'piano',
  tempo: 100,
  range: { low: 60, high: 79 },
};

describe('review and progress in Chromium', () => {
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let browser: BrowserSession;
  let theoId: string;
  let studioId: string;
  let takeId: string;
  /** the drill note played a whole tone too high, and the one played late */
  const WRONG = 3;
  const LATE = 5;

  beforeAll(async () => {
    server = await startTestServer();
    await seedDemo(server.db);
    const [theo] = await server.db.select().from(users).where(eq(users.email, 'player@sixfold.test'));
    theoId = theo.id;
    const [mara] = await server.db.select().from(users).where(eq(users.email, 'teacher@sixfold.test'));
    const [studio] = await server.db
      .select()
      .from(studios)
      .where(and(eq(studios.name, DEMO_STUDIO), eq(studios.teacherId, mara.id)));
    studioId = studio.id;
    // One take of Theo's with known slips: note 3 a whole tone high, note 5 110 ms late, the last missed.
    const drill = generateDrill(SPEC);
    const played: PlayedNote[] = drill.notes.slice(0, -1).map((n, i) => ({
      midi: n.midi + (i === WRONG ? 2 : 0),
      timeMs: (n.beat * 60000) / 100 + (i === LATE ? 110 : 0),
      velocity: 80,
    }));
    const { take } = await createTake(server.db, {
      playerId: theoId,
      id: randomUUID(),
      spec: SPEC,
      played,
      options: { tempo: 100, mode: 'timed' },
      startedAt: new Date(),
    });
    takeId = take.id;
    // One paid copy of Mara's book three days ago, for the sales chart.
    const [book] = await server.db.select().from(books).where(eq(books.teacherId, mara.id)).limit(1);
    if (book)
      await server.db.insert(purchases).values({
        bookId: book.id,
        playerId: theoId,
        sessionId: `cs_test_${randomUUID()}`,
        amountMinor: book.priceMinor,
        currency: book.currency,
        status: 'paid',
        paidAt: new Date(Date.now() - 3 * 86_400_000),
      });
    browser = await openBrowser(server.url);
  }, 240_000);
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  async function signIn(email: string, password = DEMO_PASSWORD) {
    const { page } = browser;
    await page.setViewportSize(DESKTOP);
    // Through the API, in the page's own cookie jar: the sign-in form has its own tests.
    await browser.context.clearCookies();
    const csrf = ((await (await page.request.get(`${server.url}/api/auth/csrf`)).json()) as { token: string }).token;
    const res = await page.request.post(`${server.url}/api/auth/sign-in`, {
      data: { email, password },
      headers: { 'X-CSRF-Token': csrf },
    });
    expect(res.status(), `sign-in as ${email}`).toBe(200);
    await page.goto(`${server.url}/home`, { waitUntil: 'networkidle' });
  }

  async function open(path: string, ready: (p: Page) => Promise<unknown>) {
    const { page } = browser;
    await page.goto(`${server.url}${path}`, { waitUntil: 'networkidle' });
    await ready(page);
  }

  /**
   * The page in both themes at desktop and phone width: a screenshot of each, no serious axe
   * violation in either theme, and no sideways scrolling of the page itself on the phone.
   */
  async function checkEverywhere(name: string, ready: (p: Page) => Promise<unknown>) {
    const { page } = browser;
    for (const theme of ['light', 'dark'] as const) {
      await page.setViewportSize(DESKTOP);
      await setTheme(page, theme);
      await ready(page);
      expect(await seriousViolations(page), `${name}, ${theme}, desktop`).toEqual([]);
      if (SHOTS) await page.screenshot({ path: join(SHOTS, `${name}-${theme}-desktop.png`), fullPage: true });
      await page.setViewportSize(PHONE);
      await ready(page);
      await page.waitForTimeout(300); // let the resize observers settle before the picture
      expect(await seriousViolations(page), `${name}, ${theme}, phone`).toEqual([]);
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
      // What is wider than it shows, without a scroller of its own (named when the check fails).
      const wide = await page.evaluate(() =>
        [...document.querySelectorAll('body *')]
          .filter((el) => el.scrollWidth > el.clientWidth + 1 && getComputedStyle(el).overflowX === 'visible')
          .slice(-3)
          .map((el) => `${el.tagName}.${String(el.className).slice(0, 50)} ${el.scrollWidth}/${el.clientWidth}`),
      );
      expect(overflow, `${name} scrolls sideways on a phone: ${wide.join(' | ')}`).toBeLessThanOrEqual(0);
      if (SHOTS) await page.screenshot({ path: join(SHOTS, `${name}-${theme}-phone.png`), fullPage: true });
    }
    await setTheme(page, 'light');
    await page.setViewportSize(DESKTOP);
  }

  it('greets a brand-new player without "Welcome back", and a returning one with it', async () => {
    const fresh = await createUser(server.db, { role: 'player', name: 'Ada New' });
    await signIn(fresh.email, fresh.password);
    const greeting = browser.page.getByTestId('home-greeting');
    await expect.poll(() => greeting.textContent()).toBe('Welcome to Sixfold, Ada.');
    await signIn('player@sixfold.test');
    await expect.poll(() => greeting.textContent()).toBe('Welcome back, Theo.');
  }, 240_000);

  it("the player's take: what was played over the written notes, the slips in words, a note chosen by click or keys", async () => {
    await signIn('player@sixfold.test');
    await open(`/history/${takeId}`, (p) => p.getByTestId('played-layer').locator('[data-played-for]').waitFor());
    const { page } = browser;
    const drill = generateDrill(SPEC);
    // the wrong note shows the pitch played instead, in written pitch: a whole tone above
    const wrongAbove = page.locator(`[data-played-for="${WRONG}"]`);
    expect(await wrongAbove.textContent()).toMatch(/^[A-G](#|b)?\d$/);
    expect(await page.locator(`[data-tick-for="${LATE}"]`).count()).toBe(1);
    const slips = page.getByTestId('slip-list');
    await slips
      .getByText(new RegExp(`^Note ${WRONG + 1}, ${drill.notes[WRONG].written} .*: played \\S+ instead`))
      .waitFor();
    await slips.getByText(new RegExp(`^Note ${LATE + 1}, .*: late, 110 ms behind`)).waitFor();
    await slips.getByText(new RegExp(`^Note ${drill.notes.length}, .*: missed`)).waitFor();
    // the strip has one button per written note; arrows move along it, Enter chooses
    const strip = page.getByTestId('note-strip');
    expect(await strip.getByRole('button').count()).toBe(drill.notes.length);
    await strip.getByRole('button').first().focus();
    await page.keyboard.press('ArrowRight');
    await page.keyboard.press('ArrowRight');
    await page.keyboard.press('Enter');
    expect(await strip.locator('[aria-pressed="true"]').getAttribute('data-note-index')).toBe('2');
    // a click on a drawn note chooses it too
    await page.getByTestId('review-staff').locator(`[data-index="${WRONG}"]`).first().click();
    expect(await strip.locator('[aria-pressed="true"]').getAttribute('data-note-index')).toBe(String(WRONG));
    await checkEverywhere('take-player', (p) => p.getByTestId('played-layer').locator('[data-played-for]').waitFor());
  }, 240_000);

  it('the history table scrolls on a phone and says so', async () => {
    await signIn('player@sixfold.test');
    await open('/history', (p) => p.getByTestId('history-table').locator('tbody tr').first().waitFor());
    const { page } = browser;
    await page.setViewportSize(PHONE);
    await page.getByTestId('scroll-cue').first().waitFor();
    // the navigation folds into a menu
    const nav = page.getByRole('navigation', { name: 'Main' });
    expect(await nav.isVisible()).toBe(false);
    await page.getByRole('button', { name: 'Menu' }).click();
    expect(await nav.getByRole('link', { name: 'Progress' }).isVisible()).toBe(true);
    await page.setViewportSize(DESKTOP);
    await checkEverywhere('history', (p) => p.getByTestId('history-table').locator('tbody tr').first().waitFor());
  }, 240_000);

  it('the history sorts by a heading: the server orders the rows, the heading says which way', async () => {
    await signIn('player@sixfold.test');
    await open('/history', (p) => p.getByTestId('history-table').locator('tbody tr').first().waitFor());
    const { page } = browser;
    const table = page.getByTestId('history-table');
    const heading = (name: string) => table.getByRole('columnheader', { name });
    // newest first by default
    expect(await heading('Date').getAttribute('aria-sort')).toBe('descending');
    expect(await heading('Accuracy').getAttribute('aria-sort')).toBeNull();
    await heading('Accuracy').getByRole('button', { name: 'Accuracy' }).click();
    await page.waitForURL(/sort=accuracy/);
    await expect.poll(() => heading('Accuracy').getAttribute('aria-sort')).toBe('descending');
    expect(await heading('Date').getAttribute('aria-sort')).toBeNull();
    // the accuracy column (the seventh) reads highest first down the page the server sent
    await expect
      .poll(async () => {
        const shown = (await table.locator('tbody tr td:nth-child(7)').allTextContents()).map((t) => parseInt(t, 10));
        return shown.length > 1 && shown.every((v, i) => i === 0 || shown[i - 1] >= v);
      })
      .toBe(true);
    await heading('Accuracy').getByRole('button').click();
    await page.waitForURL(/dir=asc/);
    await expect.poll(() => heading('Accuracy').getAttribute('aria-sort')).toBe('ascending');
  }, 240_000);

  it('the keyboard diagram keeps keys a finger can find on a phone, and scrolls to the rest', async () => {
    const { page } = browser;
    await page.setViewportSize(PHONE);
    await open('/input', (p) => p.getByRole('group', { name: /On-screen keyboard/ }).waitFor());
    const keyboard = page.getByRole('group', { name: /On-screen keyboard/ });
    const c4 = (await keyboard.locator('rect[data-midi="60"]').boundingBox())!;
    expect(c4.width).toBeGreaterThanOrEqual(18);
    // three octaves do not fit 390 px at that size: the drawing scrolls, starting near middle C
    expect(c4.x).toBeGreaterThanOrEqual(0);
    expect(c4.x + c4.width).toBeLessThanOrEqual(PHONE.width);
    await page.setViewportSize(DESKTOP);
  }, 240_000);

  it('progress: week over week per drill, the practice log against a goal the player sets, no-data keys hatched', async () => {
    await signIn('player@sixfold.test');
    await open('/progress', (p) => p.getByTestId('practice-log').waitFor());
    const { page } = browser;
    await page.getByTestId('weekly-by-drill').getByRole('listitem').first().waitFor();
    // a trend bar shows its figure on focus
    const bar = page.getByTestId('weekly-by-drill').getByRole('button').last();
    await bar.focus();
    expect(await bar.getAttribute('aria-label')).toMatch(/week of .*: (\d+%|no takes)/);
    // the weekly goal
    await page.getByLabel('Your weekly goal, in minutes').fill('150');
    await page.getByRole('button', { name: 'Set the goal' }).click();
    await expect
      .poll(() => page.getByTestId('log-summary').textContent())
      .toMatch(/of a 150 min goal|150 min goal is met/);
    // the range map: keys without notes are hatched, and the legend says what that means
    await page.getByTestId('range-map').waitFor();
    expect(await page.getByTestId('range-map').locator('rect.sf-nodata').count()).toBeGreaterThan(0);
    await page.getByText('no notes yet (no score)').first().waitFor();
    await checkEverywhere('progress', (p) => p.getByTestId('practice-log').waitFor());
  }, 240_000);

  it('the teacher: credit from any take of the drill, trend bars scaled to the studio, a remark pinned by clicking a note', async () => {
    await signIn('teacher@sixfold.test');
    await open(`/studio/${studioId}`, (p) => p.getByTestId('studio-board').waitFor());
    const { page } = browser;
    // the demo takes were made from the practice page, not the assignment's button, and count
    const mine = await page.request.get(`${server.url}/api/studios/${studioId}/players/${theoId}`);
    const keysMet = ((await mine.json()) as { assignments: { keysMet: string[] }[] }).assignments.map(
      (a) => a.keysMet.length,
    );
    expect(Math.max(...keysMet)).toBeGreaterThan(0);
    await page.getByTestId('credit-rule').first().waitFor();
    expect(await page.getByTestId('credit-rule').first().textContent()).toMatch(/whichever button started it/);
    await checkEverywhere('studio', (p) => p.getByTestId('studio-board').waitFor());
    await open(`/studio/${studioId}/players/${theoId}`, (p) => p.getByTestId('assignment-trend').first().waitFor());
    await checkEverywhere('studio-player', (p) => p.getByTestId('assignment-trend').first().waitFor());

    // the teacher's take review: click a note on the staff, the remark is pinned to it
    await open(`/takes/${takeId}`, (p) => p.getByTestId('played-layer').locator('[data-played-for]').waitFor());
    await page.getByTestId('review-staff').locator(`[data-index="${LATE}"]`).first().click();
    expect(await page.getByLabel(/Pin to a note/).inputValue()).toBe(String(LATE));
    await page.getByRole('textbox', { name: 'Remark' }).fill('Sit back on this one: it came in late.');
    await page.getByRole('button', { name: 'Leave the remark' }).click();
    const thread = page.getByTestId('remarks');
    await thread.locator(`[data-note-index="${LATE}"]`).getByText('Sit back on this one').waitFor();
    // the strip marks the note that now has a remark
    expect(await page.getByTestId('note-strip').locator(`[data-note-index="${LATE}"]`).textContent()).toMatch(
      /has a remark/,
    );
    await checkEverywhere('take-teacher', (p) => p.getByTestId('played-layer').locator('[data-played-for]').waitFor());
  }, 240_000);

  it("the teacher's book: price and currency side by side, sales drawn one bar per day", async () => {
    await signIn('teacher@sixfold.test');
    const [mara] = await server.db.select().from(users).where(eq(users.email, 'teacher@sixfold.test'));
    const [book] = await server.db.select().from(books).where(eq(books.teacherId, mara.id)).limit(1);
    const { page } = browser;
    for (const size of [DESKTOP, PHONE]) {
      await page.setViewportSize(size);
      await open(`/books/${book.id}/edit`, (p) => p.getByLabel('Price').waitFor());
      const price = (await page.getByLabel('Price').boundingBox())!;
      const currency = (await page.getByLabel('Currency').boundingBox())!;
      const overlaps =
        price.x < currency.x + currency.width &&
        currency.x < price.x + price.width &&
        price.y < currency.y + currency.height &&
        currency.y < price.y + price.height;
      expect(overlaps, `price and currency overlap at ${size.width} px`).toBe(false);
    }
    await page.setViewportSize(DESKTOP);
    await open('/books/sales', (p) =>
      p.getByTestId('sales-chart').locator('.recharts-bar-rectangle').first().waitFor(),
    );
    const chart = (await page.getByTestId('sales-chart').boundingBox())!;
    const barBox = (await page.getByTestId('sales-chart').locator('.recharts-bar-rectangle').first().boundingBox())!;
    expect(barBox.width).toBeLessThan(chart.width / 30);
    if (SHOTS) await page.screenshot({ path: join(SHOTS, 'book-sales-light-desktop.png'), fullPage: true });
  }, 240_000);

  it('the admin: a role change asks first, and Cancel keeps the role', async () => {
    const sam = 'wind@sixfold.test';
    await signIn('admin@sixfold.test');
    await open('/admin/users', (p) =>
      p
        .getByRole('row', { name: /wind@sixfold\.test/ })
        .getByLabel('Role of Sam Okafor')
        .waitFor(),
    );
    const { page } = browser;
    const select = page.getByRole('row', { name: /wind@sixfold\.test/ }).getByLabel('Role of Sam Okafor');
    await select.selectOption('teacher');
    const dialog = page.getByRole('dialog', { name: 'Make Sam Okafor a teacher?' });
    await dialog.waitFor();
    if (SHOTS) await page.screenshot({ path: join(SHOTS, 'admin-confirm-light-desktop.png') });
    await dialog.getByRole('button', { name: 'Keep player' }).click();
    expect(await select.inputValue()).toBe('player');
    const [before] = await server.db.select().from(users).where(eq(users.email, sam));
    expect(before.role).toBe('player');
    await select.selectOption('teacher');
    await page.getByRole('dialog').getByRole('button', { name: 'Change the role' }).click();
    await expect
      .poll(async () => (await server.db.select().from(users).where(eq(users.email, sam)))[0].role)
      .toBe('teacher');
    await checkEverywhere('admin-users', (p) =>
      p
        .getByRole('row', { name: /wind@sixfold\.test/ })
        .getByLabel('Role of Sam Okafor')
        .waitFor(),
    );
    // The demo account is shared with other test files (the seed's own checks): give it back.
    await server.db.update(users).set({ role: 'player' }).where(eq(users.email, sam));
  }, 240_000);
});
