import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import type { Page } from 'playwright-core';

const require = createRequire(import.meta.url);
const axeSource = readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');

export interface AxeViolation {
  id: string;
  impact: string | null;
  nodes: string[];
}

/**
 * Runs axe-core (the open accessibility rules engine) on the page as it is now and returns the
 * serious and critical violations, each with the selectors of the elements it found.
 */
export async function seriousViolations(page: Page): Promise<AxeViolation[]> {
  // A theme switch fades colours over a moment; contrast is judged once they have settled.
  await page.waitForFunction(
    () => document.getAnimations().every((a) => !(a instanceof CSSTransition) || a.playState !== 'running'),
    null,
    {
      timeout: 5000,
    },
  );
  const hasAxe = await page.evaluate(() => 'axe' in window);
  // Evaluated through the browser's debugging protocol, so the page's CSP (no inline scripts)
  // does not stand in the way.
  if (!hasAxe) await page.evaluate(axeSource);
  const violations = await page.evaluate(async () => {
    const axe = (
      window as unknown as {
        axe: {
          run(
            ctx: Document,
            o: object,
          ): Promise<{ violations: Array<{ id: string; impact: string | null; nodes: Array<{ target: unknown[] }> }> }>;
        };
      }
    ).axe;
    const result = await axe.run(document, { resultTypes: ['violations'] });
    return result.violations.map((v) => ({
      id: v.id,
      impact: v.impact,
      nodes: v.nodes.map((n) => n.target.map(String).join(' ')),
    }));
  });
  return violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
}

/** Sets the theme the way the page remembers it, then reloads so the first paint uses it. */
export async function setTheme(page: Page, theme: 'light' | 'dark') {
  await page.evaluate((t) => localStorage.setItem('sixfold.theme', t), theme);
  await page.reload({ waitUntil: 'networkidle' });
}

/** The serious violations of the page in the light theme and then the dark one. */
export async function violationsInBothThemes(page: Page): Promise<Record<'light' | 'dark', AxeViolation[]>> {
  await setTheme(page, 'light');
  const light = await seriousViolations(page);
  await setTheme(page, 'dark');
  const dark = await seriousViolations(page);
  await setTheme(page, 'light');
  return { light, dark };
}
