import { readFileSync } from 'node:fs';
import type { AxeResults, ImpactValue } from 'axe-core';
import type { Page } from 'playwright-core';

/**
 * Accessibility check with axe-core (Deque Systems, MPL-2.0), the rules engine many browser test
 * tools build on. Its source is injected into the page through playwright-core and run on the whole
 * document with the WCAG 2.0 and 2.1 level A and AA rule sets (tags wcag2a, wcag2aa, wcag21a,
 * wcag21aa). The journeys fail on violations axe rates serious or critical.
 */
const AXE_SOURCE = readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');

export const WCAG_21_AA = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'];
const BLOCKING: readonly ImpactValue[] = ['serious', 'critical'];

/** One violation in a line a person can act on: rule, impact, help text and the first elements. */
export interface AxeFinding {
  rule: string;
  impact: string;
  help: string;
  targets: string[];
}

/** Runs axe-core on the page and returns its serious and critical WCAG 2.1 A/AA violations. */
export async function seriousViolations(page: Page): Promise<AxeFinding[]> {
  const injected = await page.evaluate(() => typeof (window as { axe?: unknown }).axe !== 'undefined');
  // Evaluated through the DevTools protocol, which the app's Content-Security-Policy (no inline
  // scripts) does not block, unlike a <script> element.
  if (!injected) await page.evaluate(AXE_SOURCE);
  const results = (await page.evaluate(
    (tags) =>
      (window as unknown as { axe: { run: (ctx: object, o: object) => Promise<unknown> } }).axe.run(
        // Fluent UI's focus manager (tabster) puts aria-hidden focus sentinels (<i data-tabster-dummy>)
        // around focus groups; they pass focus on at once and are a known false positive of the
        // aria-hidden-focus rule (microsoft/tabster#288, microsoft/fluentui#25133). Only they are left out.
        { include: [['html']], exclude: [['[data-tabster-dummy]']] },
        { runOnly: { type: 'tag', values: tags }, resultTypes: ['violations'] },
      ),
    WCAG_21_AA,
  )) as AxeResults;
  return results.violations
    .filter((v) => v.impact && BLOCKING.includes(v.impact))
    .map((v) => ({
      rule: v.id,
      impact: v.impact ?? '',
      help: v.help,
      targets: v.nodes.slice(0, 5).map((n) => n.target.join(' ')),
    }));
}
