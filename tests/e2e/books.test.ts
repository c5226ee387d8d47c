import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DrillSpec } from '../../shared/schemas/drills';
import { type BrowserSession, openBrowser, signInThroughPage } from '../helpers/browser';
import { createUser, signedIn, type TestUser } from '../helpers/factories';
import { seriousViolations } from '../helpers/axe';
import { startPaymentsFake, startTestServer } from '../helpers/test-server';

const artifacts = fileURLToPath(new URL('../.artifacts/', import.meta.url));

const DC: DrillSpec = { pair: ['D', 'C'], pattern: 'four-three', direction: 'up', tempo: 100, chord: 'D7' };
const CD: DrillSpec = { pair: ['C', 'D'], pattern: 'stack', direction: 'up-down', chord: 'Cmaj7#11' };

/**
 * A drill book in Chromium: Mara makes and publishes a priced book in the editor, Theo buys it
 * through the local checkout fake's page, comes back to the whole book, practises a drill from
 * it, and Mara's sales page shows the sale.
 */
// Its own title: other test files publish the demo book in the same database.
const BOOK_TITLE = `Tuesday pairs, e2e ${Date.now().toString(36)}`;

describe('drill books in Chromium: publish, buy, practise, see the sale', () => {
  let fake: Awaited<ReturnType<typeof startPaymentsFake>>;
  let server: Awaited<ReturnType<typeof startTestServer>>;
  let teacherBrowser: BrowserSession;
  let playerBrowser: BrowserSession;
  let mara: TestUser;
  let theo: TestUser;
  let bookId = '';

  beforeAll(async () => {
    mkdirSync(artifacts, { recursive: true });
    fake = await startPaymentsFake();
    server = await startTestServer({ PAYMENTS_API_PORT: String(fake.port) });
    fake.setWebhookUrl(`${server.url}/api/payments/webhook`);
    mara = await createUser(server.db, { role: 'teacher', name: 'Mara Quill' });
    theo = await createUser(server.db, { role: 'player', name: 'Theo Park' });
    const teacher = await signedIn(server.app, mara);
    await teacher.post('/api/drills', { name: 'Starter on C/D', spec: CD, keyOrder: null }).expect(201);
    await teacher.post('/api/drills', { name: 'Four-three on D/C', spec: DC, keyOrder: 'chromatic' }).expect(201);
    teacherBrowser = await openBrowser(server.url);
    playerBrowser = await openBrowser(server.url);
  });
  afterAll(async () => {
    await teacherBrowser?.close();
    await playerBrowser?.close();
    await server?.stop();
    await fake?.close();
  });

  it('the teacher starts a book, prices it, adds drills with notes and publishes it', async () => {
    const { page } = teacherBrowser;
    await signInThroughPage(page, server.url, mara);
    await page.goto(`${server.url}/books`, { waitUntil: 'networkidle' });
    await page.getByLabel('New book title').fill(BOOK_TITLE);
    await page.getByRole('button', { name: 'Start a book' }).click();
    await page.waitForURL(/\/books\/[0-9a-f-]+\/edit$/);
    bookId = page.url().split('/').at(-2)!;

    await page.getByLabel('Price').fill('12.00');
    await page.getByLabel('Currency').selectOption('EUR');
    await page.getByRole('radio', { name: 'ink' }).check();
    await page.getByRole('button', { name: 'Save details' }).click();
    await page.getByText('Saved.').waitFor();

    for (const [name, note] of [
      ['Starter on C/D', 'Sing the D triad over the chord first.'],
      ['Four-three on D/C', 'Even eighths across the bar line.'],
    ]) {
      await page.getByLabel('Saved drill').selectOption({ label: name });
      await page.getByRole('textbox', { name: 'Teaching note' }).last().fill(note);
      await page.getByRole('button', { name: 'Add to the book' }).click();
      await page.waitForFunction(
        (n) => document.querySelectorAll('[data-testid="edit-drill"]').length === n,
        name === 'Starter on C/D' ? 1 : 2,
      );
    }
    // Reorder with the keyboard-reachable buttons: the four-three first, then back.
    await page.getByRole('button', { name: 'Move Four-three on D/C up' }).click();
    await page.waitForFunction(
      () =>
        (document.querySelector('[data-testid="edit-drill"] input') as HTMLInputElement | null)?.value ===
        'Four-three on D/C',
    );
    const down = page.getByRole('button', { name: 'Move Four-three on D/C down' });
    await page.waitForFunction(
      () => !(document.querySelector('[aria-label="Move Four-three on D/C down"]') as HTMLButtonElement).disabled,
    );
    await down.focus();
    await page.keyboard.press('Enter');
    await page.waitForFunction(
      () =>
        (document.querySelector('[data-testid="edit-drill"] input') as HTMLInputElement | null)?.value ===
        'Starter on C/D',
    );

    await page.getByRole('button', { name: 'Publish' }).click();
    await page.getByText('Published: players see it in the catalogue.').waitFor();
    // Publishing made the first drill the free one.
    await page.getByText('free to try').first().waitFor();
    expect(teacherBrowser.errors).toEqual([]);
  }, 90_000);

  it('the player buys it through the checkout page and practises a drill from it', async () => {
    const { page } = playerBrowser;
    await signInThroughPage(page, server.url, theo);
    await page.goto(`${server.url}/books`, { waitUntil: 'networkidle' });
    const card = page.getByTestId('book-card').filter({ hasText: BOOK_TITLE });
    await card.getByText('12.00 EUR').waitFor();
    await card.getByRole('link', { name: BOOK_TITLE }).click();
    await page.waitForURL(new RegExp(`/books/${bookId}$`));
    // Before buying: the free drill can be tried, the other is in the full book only.
    await page.getByRole('button', { name: 'Practise Starter on C/D' }).waitFor();
    expect(await page.getByRole('button', { name: 'Practise Four-three on D/C' }).count()).toBe(0);

    await page.getByRole('button', { name: 'Buy the book' }).click();
    await page.waitForURL(new RegExp(`^${fake.url}/pay/`));
    expect(await page.getByTestId('checkout-amount').textContent()).toBe('12.00 EUR');
    await page.screenshot({ path: join(artifacts, 'books-checkout.png') });
    await page.getByRole('button', { name: /^Pay/ }).click();
    await page.waitForURL(new RegExp(`/books/${bookId}\\?checkout=done$`));
    await page.getByText('Payment received. The whole book is yours').waitFor({ timeout: 15_000 });
    await page.screenshot({ path: join(artifacts, 'books-bought.png'), fullPage: true });

    await page.getByRole('button', { name: 'Practise Four-three on D/C' }).click();
    await page.waitForURL(/\/practice\?/);
    const url = new URL(page.url());
    expect(JSON.parse(url.searchParams.get('spec')!)).toEqual(DC);
    expect(url.searchParams.get('order')).toBe('chromatic');
    await page.getByTestId('practice').waitFor();
    await page.waitForFunction(
      () => document.querySelectorAll('[data-testid="drill-staff"] [data-note-index]').length > 0,
      undefined,
      { timeout: 20_000 },
    );
    expect(playerBrowser.errors.filter((e) => !/MIDI/i.test(e))).toEqual([]);
  }, 90_000);

  it('the teacher sees the sale', async () => {
    const { page } = teacherBrowser;
    await page.goto(`${server.url}/books/sales`, { waitUntil: 'networkidle' });
    const row = page.getByTestId('sales-table').getByRole('row', { name: new RegExp(BOOK_TITLE) });
    await row.waitFor();
    const cells = await row.locator('td').allTextContents();
    expect(cells).toEqual(['12.00 EUR', '1', '0', '12.00 EUR']);
    await page.getByLabel('Books sold per day').getByText('Sold per day, last 90 days').waitFor();
    expect(await page.locator('.recharts-bar-rectangle').count()).toBeGreaterThan(0);
    await page.screenshot({ path: join(artifacts, 'books-sales.png'), fullPage: true });
  });

  it('the printable edition shows every drill with its notation and teaching note', async () => {
    const { page } = playerBrowser;
    await page.goto(`${server.url}/books/${bookId}/print`, { waitUntil: 'networkidle' });
    await page.getByRole('heading', { name: BOOK_TITLE }).first().waitFor();
    await page.getByText('Sing the D triad over the chord first.').waitFor();
    await page.getByText('Even eighths across the bar line.').waitFor();
    await page.waitForFunction(() => document.querySelectorAll('svg [data-note-index], svg [data-index]').length > 0);
    expect(await seriousViolations(page)).toEqual([]);
    await page.emulateMedia({ media: 'print' });
    await page.screenshot({ path: join(artifacts, 'books-print.png'), fullPage: true });
    await page.emulateMedia({ media: 'screen' });
  });

  it('an admin refunds the purchase after confirming, and the player loses the full book', async () => {
    const admin = await createUser(server.db, { role: 'admin', name: 'Desk' });
    const adminBrowser = await openBrowser(server.url);
    try {
      const { page } = adminBrowser;
      await signInThroughPage(page, server.url, admin);
      await page.goto(`${server.url}/admin/purchases`, { waitUntil: 'networkidle' });
      const row = page.getByRole('row').filter({ hasText: BOOK_TITLE });
      await row.waitFor();
      expect(await seriousViolations(page)).toEqual([]);
      // A dismissed confirmation changes nothing.
      page.once('dialog', (d) => d.dismiss());
      await row.getByRole('button', { name: 'Refund' }).click();
      expect(await row.getByRole('button', { name: 'Refund' }).count()).toBe(1);
      page.once('dialog', (d) => d.accept());
      await row.getByRole('button', { name: 'Refund' }).click();
      await row.getByText('refunded').waitFor();
      await page.goto(`${server.url}/admin/audit`, { waitUntil: 'networkidle' });
      await page
        .getByText(/refund/i)
        .first()
        .waitFor();
      expect(await seriousViolations(page)).toEqual([]);
      expect(adminBrowser.errors).toEqual([]);
    } finally {
      await adminBrowser.close();
    }
    const { page } = playerBrowser;
    await page.goto(`${server.url}/books/${bookId}`, { waitUntil: 'networkidle' });
    await page.getByRole('button', { name: 'Practise Starter on C/D' }).waitFor();
    expect(await page.getByRole('button', { name: 'Practise Four-three on D/C' }).count()).toBe(0);
  }, 90_000);
});
