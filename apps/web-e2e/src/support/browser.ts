import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
export const DEMO_PASSWORD = 'rotaplex-demo';

export function baseUrl(): string {
  const url = process.env.ROTAPLEX_E2E_BASE_URL;
  if (!url) throw new Error('ROTAPLEX_E2E_BASE_URL is not set: run through apps/web-e2e/jest.config.js');
  return url;
}

export interface Session {
  context: BrowserContext;
  page: Page;
  close: () => Promise<void>;
}

/**
 * A fresh browser with its own profile directory (no cookies, no cache): Debian's Chromium,
 * headless, with everything that would reach the network on its own switched off. The browser's
 * clocks are in Europe/London unless `timezoneId` (an IANA zone name) says otherwise.
 */
export async function openBrowser(options: { timezoneId?: string } = {}): Promise<Session> {
  const profile = mkdtempSync(join(tmpdir(), 'rotaplex-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM_PATH,
    headless: true,
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
    ],
    viewport: { width: 1360, height: 860 },
    locale: 'en-GB',
    timezoneId: options.timezoneId ?? 'Europe/London',
    baseURL: baseUrl(),
  });
  context.setDefaultTimeout(15_000);
  const page = context.pages()[0] ?? (await context.newPage());
  return {
    context,
    page,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** Signs in through the form, as a person would, and waits for the signed-in shell. */
export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto('/sign-in');
  await page.getByRole('textbox', { name: 'E-mail address', exact: true }).fill(email);
  await page.getByRole('textbox', { name: 'Password', exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  // The signed-in shell: the menu, or on a narrow window the button that opens it.
  await page
    .getByRole('navigation', { name: 'Main' })
    .or(page.getByRole('button', { name: 'Menu', exact: true }))
    .first()
    .waitFor();
}

export async function signOut(page: Page): Promise<void> {
  await page.getByRole('button', { name: /^Account menu for / }).click();
  await page.getByRole('menuitem', { name: 'Sign out' }).click();
  await page.getByRole('heading', { name: 'Sign in to Rotaplex' }).waitFor();
}

/**
 * Opens the demo's four-week draft period of the signed-in planner's unit from the roster periods
 * list and waits for its planning board heading. The period is named by id (support/api.ts
 * `demoPeriod`): other journeys add periods of their own, drafts among them, in Jest's order.
 */
export async function openDemoDraft(page: Page, heading: RegExp, periodId: string): Promise<void> {
  await page.goto('/planning/periods');
  await page
    .getByRole('table', { name: /Roster periods of / })
    .locator(`a[href$="/planning/periods/${encodeURIComponent(periodId)}/board"]`)
    .click();
  await page.getByRole('heading', { name: heading }).waitFor();
}

/** Polls until the check returns a value other than undefined (for text that appears later). */
export async function eventually<T>(
  check: () => Promise<T | undefined>,
  what: string,
  timeoutMs = 15_000,
): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await check();
    if (value !== undefined) return value;
    if (Date.now() > deadline) throw new Error(`Timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** The names of the links in the main navigation, in order. */
export async function navLinks(page: Page): Promise<string[]> {
  const nav = page.getByRole('navigation', { name: 'Main' });
  return (await nav.getByRole('link').allInnerTexts()).map((t) => t.trim());
}

const CONTROL_ROLES = new Set([
  'button',
  'checkbox',
  'combobox',
  'link',
  'listbox',
  'menuitem',
  'radio',
  'searchbox',
  'slider',
  'spinbutton',
  'switch',
  'tab',
  'textbox',
]);

/**
 * Every interactive element on the page whose accessible name is empty, as Chromium's own
 * accessibility tree computes it (the name a screen reader announces; WAI-ARIA "Accessible Name
 * and Description Computation 1.2"). Hidden and ignored nodes are left out.
 */
export async function unnamedControls(page: Page): Promise<string[]> {
  const cdp = await page.context().newCDPSession(page);
  try {
    const { nodes } = (await cdp.send('Accessibility.getFullAXTree')) as {
      nodes: {
        ignored: boolean;
        role?: { value?: string };
        name?: { value?: string };
        backendDOMNodeId?: number;
      }[];
    };
    const problems: string[] = [];
    for (const node of nodes) {
      const role = String(node.role?.value ?? '');
      if (node.ignored || !CONTROL_ROLES.has(role)) continue;
      if (!String(node.name?.value ?? '').trim()) {
        const html = node.backendDOMNodeId
          ? ((await cdp
              .send('DOM.resolveNode', { backendNodeId: node.backendDOMNodeId })
              .then(({ object }) =>
                cdp.send('Runtime.callFunctionOn', {
                  objectId: object.objectId,
                  functionDeclaration: 'function () { return this.outerHTML.slice(0, 160); }',
                  returnByValue: true,
                }),
              )
              .then((r) => String((r as { result: { value?: unknown } }).result.value))
              .catch(() => '?')) as string)
          : '?';
        problems.push(`${role}: ${html}`);
      }
    }
    return problems;
  } finally {
    await cdp.detach();
  }
}

/**
 * Saves a screenshot for people to look at (tmp/ at the repository root, git-ignored): the whole
 * page, or with `{ fullPage: false }` what the window shows (a dialog over a long page).
 */
export async function screenshot(
  page: Page,
  name: string,
  options: { fullPage?: boolean } = {},
): Promise<void> {
  const dir = process.env.ROTAPLEX_E2E_SCREENSHOTS;
  if (dir) await page.screenshot({ path: join(dir, `${name}.png`), fullPage: options.fullPage ?? true });
}

/**
 * Presses Generate on the planning board. A draft that already has shifts first asks whether to
 * replace them (the journey in planning-board.e2e.ts checks that dialog); this confirms it when it
 * comes, for journeys whose draft may have been generated by another journey on the shared server.
 */
export async function pressGenerate(page: Page): Promise<void> {
  await page.getByRole('button', { name: 'Generate', exact: true }).click();
  const confirm = page.getByRole('alertdialog', { name: 'Replace the draft?' });
  const started = page.getByRole('button', { name: 'Stop' });
  await confirm.or(started).first().waitFor();
  if (await confirm.isVisible()) {
    await confirm.getByRole('button', { name: 'Replace and generate' }).click();
    await confirm.waitFor({ state: 'detached' });
  }
}
