import { PLANNING_ROUTES as P, type RosterPeriodDto } from '@rotaplex/contracts';
import { apiCall, managerPeriod } from './support/api';
import {
  eventually,
  openBrowser,
  screenshot,
  signIn,
  signOut,
  unnamedControls,
  type Session,
} from './support/browser';

// Issue 4, item 3 and PRODUCT.md flow 6: the manager generates a one-week roster, publishes it after
// a confirmation, and the board becomes read-only; everyone on it is e-mailed their shifts through
// the outbox, and the admin sees the messages arrive in the local mailbox. The week lies in the past
// of its own (no overlap with other journeys' periods) and is archived at the end.
describe('publishing a roster as the demo manager', () => {
  const START = '2024-09-02'; // a Monday
  const SUBJECT = 'Your roster for Ward 7 Acute Medicine, 2024-09-02 to 2024-09-08';
  let token: string;
  let period: RosterPeriodDto;
  let browser: Session;

  beforeAll(async () => {
    ({ token, period } = await managerPeriod(START));
    browser = await openBrowser();
    await signIn(browser.page, 'manager@example.com');
  });
  afterAll(async () => {
    await browser?.close();
    if (period) await apiCall(token, 'POST', P.rosterPeriodArchive(period.id)).catch(() => undefined);
  });

  it('generates the week with a short time limit', async () => {
    const { page } = browser;
    await page.goto(`/planning/periods/${period.id}/board`);
    await page.getByRole('heading', { name: /^Planning board: / }).waitFor();
    await page.getByRole('textbox', { name: 'Time limit (seconds)' }).fill('20');
    await page.getByRole('button', { name: 'Generate' }).click();
    await page.getByTestId('quality-statement').waitFor({ timeout: 110_000 });
    expect(await page.getByRole('button', { name: 'Publish' }).isEnabled()).toBe(true);
  }, 150_000);

  it('publishes after confirmation; the board is then read-only', async () => {
    const { page } = browser;
    await page.getByRole('button', { name: 'Publish' }).click();
    const dialog = page.getByRole('alertdialog', { name: 'Publish this roster?' });
    await dialog.waitFor();
    await dialog.getByText(/gets their own shifts by e-mail/).waitFor();
    expect(await unnamedControls(page)).toEqual([]);
    await screenshot(page, 'publish-confirm');
    // Cancel first: nothing happens.
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await dialog.waitFor({ state: 'detached' });
    await page.getByRole('button', { name: 'Publish' }).waitFor();
    expect((await apiCall<RosterPeriodDto>(token, 'GET', P.rosterPeriod(period.id))).status).toBe('draft');

    await page.getByRole('button', { name: 'Publish' }).click();
    await dialog.getByRole('button', { name: 'Publish' }).click();
    await dialog.waitFor({ state: 'detached' });
    await page.getByText(/Read-only: change it through repair or a swap\./).waitFor();
    await page.getByText('Published: read-only').waitFor();
    await page.getByRole('button', { name: 'Repair' }).waitFor();
    expect(await page.getByRole('button', { name: 'Publish' }).count()).toBe(0);
    // The server agrees: the period is published.
    const now = await apiCall<RosterPeriodDto>(token, 'GET', P.rosterPeriod(period.id));
    expect(now.status).toBe('published');
    await screenshot(page, 'publish-read-only');

    // The audit trail, linked from the board, records the publish.
    await page.getByRole('link', { name: 'Audit trail' }).click();
    await page.getByRole('heading', { level: 1, name: 'Audit trail' }).waitFor();
    const rows = page.getByRole('table', { name: 'Audit entries' }).getByRole('row');
    await rows
      .filter({ hasText: /Published the roster: \d+ shift/ })
      .first()
      .waitFor();
    expect(await unnamedControls(page)).toEqual([]);
  });

  it('e-mails everyone on the roster: the messages arrive in the mailbox and the outbox shows them sent', async () => {
    const { page } = browser;
    await signOut(page);
    await signIn(page, 'admin@example.com');
    await page.goto('/admin/mailbox');
    await page.getByRole('heading', { level: 1, name: 'Mailbox' }).waitFor();
    const rows = page.getByRole('table', { name: 'Messages' }).getByRole('row').filter({ hasText: SUBJECT });
    await eventually(async () => {
      if ((await rows.count()) > 1) return true;
      await page.getByRole('button', { name: 'Refresh' }).click();
      return undefined;
    }, 'roster e-mails in the mailbox');
    await rows.first().getByRole('link').click();
    // The plain-text version (the formatted one is in a sandboxed frame).
    await page.getByRole('tab', { name: 'Plain text' }).click();
    await page
      .getByText(/Times are in the unit's time zone, Europe\/London\./)
      .first()
      .waitFor();
    await screenshot(page, 'publish-mail');

    await page.goto('/admin/outbox');
    await page.getByRole('heading', { level: 1, name: 'Outbox' }).waitFor();
    const sent = page
      .getByRole('table', { name: 'Outbox messages' })
      .getByRole('row')
      .filter({ hasText: SUBJECT })
      .filter({ hasText: 'Sent' });
    await eventually(async () => ((await sent.count()) > 0 ? true : undefined), 'sent rows in the outbox');
    expect(await unnamedControls(page)).toEqual([]);
    await screenshot(page, 'outbox');
  });
});
