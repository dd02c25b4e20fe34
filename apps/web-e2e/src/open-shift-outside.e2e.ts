import {
  PLANNING_ROUTES,
  PUBLISHING_ROUTES,
  SOLVING_ROUTES,
  type RosterPeriodDto,
} from '@rotaplex/contracts';
import { apiCall, apiSignIn, createPeriod, findWard, shiftIdsByCode, staffIdLookup } from './support/api';
import { seriousViolations } from './support/axe';
import { openBrowser, screenshot, signIn, signOut, unnamedControls, type Session } from './support/browser';

/**
 * Issue 10, item 6, the manager's side of an open shift nobody may take: what it would take (which
 * rule for whom, in words, with the cautions) and an offer to bank staff outside the roster, marked in
 * the list and withdrawn again. A week of its own (June 2032), published
 * with Robin Tallis on the first day's Late (14:30-22:30): the next day's Early (07:00) would leave him
 * 8 h 30 min of rest, under the 11 h of the demo contracts (EU Working Time Directive 2003/88/EC,
 * Art. 3).
 */
describe('open shifts outside the roster (manager)', () => {
  let browser: Session;
  let tuesday = '';
  const addDays = (date: string, n: number) =>
    new Date(Date.parse(`${date}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);
  /** As the web app writes a day: "Tue 12 May". */
  const dayLabel = (date: string) =>
    new Date(`${date}T12:00:00Z`).toLocaleDateString('en-GB', {
      weekday: 'short',
      day: 'numeric',
      month: 'short',
      timeZone: 'UTC',
    });

  beforeAll(async () => {
    const token = await apiSignIn('manager@example.com');
    const ward = await findWard(token);
    // A week of its own (a Monday), apart from the demo period and every other journey's weeks: the
    // journeys share one server and run in Jest's order, so none picks its dates from what is there.
    const start = '2032-06-07';
    tuesday = addDays(start, 1);
    const period = await createPeriod(token, ward.id, start);
    const shift = await shiftIdsByCode(token, ward.id);
    const id = await staffIdLookup(token, ward.id);
    await apiCall(token, 'PUT', SOLVING_ROUTES.assignmentCell(period.id), {
      staffMemberId: id('Robin Tallis'),
      date: start,
      shiftTypeId: shift['L'],
    });
    const current = await apiCall<RosterPeriodDto>(token, 'GET', PLANNING_ROUTES.rosterPeriod(period.id));
    await apiCall(token, 'POST', PUBLISHING_ROUTES.publish(period.id), {
      version: current.version,
      acknowledgeBelowMinimum: true,
      reason: 'A journey roster for offers outside the roster',
    });
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  type Page = Session['page'];
  /** Dialogs fade and slide in: wait until nothing moves before a screenshot. */
  const settled = (page: Page) =>
    page.waitForFunction(() => document.getAnimations().every((a) => a.playState !== 'running'));
  /** The open shift's row (table) or card (phone), after paging to it. */
  const openShift = async (page: Page, narrow = false) => {
    const items = narrow
      ? page.getByRole('list', { name: 'Open shifts' }).getByRole('listitem')
      : page.getByRole('table', { name: 'Open shifts' }).getByRole('row');
    const target = items
      .filter({ hasText: dayLabel(tuesday) })
      .filter({ hasText: /Early \(E\)/ })
      .filter({ hasText: /RN/ })
      .first();
    const next = page
      .getByRole('navigation', { name: 'Open shifts pages' })
      .getByRole('button', { name: 'Next' });
    for (let n = 1; ; n++) {
      await items.first().waitFor();
      if ((await target.count()) > 0) return target;
      if ((await next.count()) === 0 || (await next.isDisabled())) throw new Error('Not on any page');
      await next.click();
      await page.getByText(new RegExp(`^Page ${n + 1} of \\d+$`)).waitFor();
      await page.waitForLoadState('networkidle');
    }
  };

  it('shows what it would take, offers the shift to bank staff, marks it, and withdraws the offer', async () => {
    const { page } = browser;
    await signIn(page, 'manager@example.com');
    await page.goto('/open-shifts');
    let row = await openShift(page);
    await row.getByRole('button', { name: /^What it would take/ }).click();

    const dialog = page.getByRole('dialog', { name: /^What it would take: Early \(E\) on / });
    await dialog.getByRole('list', { name: 'Who could take it' }).waitFor();
    // Robin's reason names the rule, the hours, the shifts and the days.
    const robin = dialog.getByRole('listitem').filter({ hasText: 'Robin Tallis' }).first();
    await robin
      .getByText(
        /^Rest between shifts: Robin Tallis: only 8 h 30 min of rest between Late \(L\) on .+ and Early \(E\) on .+ \(the contract asks for at least 11 h\)$/,
      )
      .waitFor();
    // The cautions: fatigue, working-time law, local law first.
    await dialog.getByText(/^Fatigue risk:/).waitFor();
    await dialog
      .getByText(/^Local law, collective agreements and professional staffing standards decide/)
      .waitFor();
    await dialog.getByRole('link', { name: 'Open the planning board' }).waitFor();
    expect(await unnamedControls(page)).toEqual([]);
    // WCAG 2.1 AA as axe-core checks it: no serious or critical finding in the open dialog.
    expect(await seriousViolations(page)).toEqual([]);
    await settled(page);
    await screenshot(page, 'open-shift-outside-what-it-would-take', { fullPage: false });

    await dialog.getByRole('button', { name: 'Offer outside the roster' }).click();
    const form = page.getByRole('dialog', { name: /^Offer outside the roster: Early \(E\) on / });
    // Nothing said to whom: refused in the form, nothing recorded.
    await form.getByRole('button', { name: 'Record the offer' }).click();
    await form.getByText('Say to whom: a bank office or an agency.').waitFor();
    await form.getByRole('textbox', { name: 'Offered to' }).fill('Staff bank office');
    await form.getByRole('textbox', { name: 'Note' }).fill('Asked by phone, booking 4471');
    await form.getByRole('button', { name: 'Record the offer' }).click();
    await page
      .locator('.fui-ToastTitle')
      .getByText('Recorded: offered outside the roster to Staff bank office')
      .waitFor();

    // Marked in the list, with to whom; Mark filled and Withdraw offer are there now.
    row = await openShift(page);
    await row.getByText('Offered outside the roster').waitFor();
    await row.getByText('to Staff bank office').waitFor();
    await row.getByRole('button', { name: /^Mark filled/ }).waitFor();
    await screenshot(page, 'open-shift-outside-marked');

    // At 390 px: the card carries the same mark.
    await page.setViewportSize({ width: 390, height: 844 });
    const card = await openShift(page, true);
    await card.getByText('Offered outside the roster').waitFor();
    await card.scrollIntoViewIfNeeded();
    await settled(page);
    await screenshot(page, 'open-shift-outside-marked-390', { fullPage: false });
    await card.getByRole('button', { name: /^What it would take/ }).click();
    await page
      .getByRole('dialog', { name: /^What it would take/ })
      .getByText(/^Fatigue risk:/)
      .waitFor();
    await settled(page);
    await screenshot(page, 'open-shift-outside-what-it-would-take-390', { fullPage: false });
    await page
      .getByRole('dialog', { name: /^What it would take/ })
      .getByRole('button', { name: 'Close' })
      .click();
    await page.setViewportSize({ width: 1360, height: 860 });

    // Staff still see the shift, marked, without to whom it was offered.
    await signOut(page);
    await signIn(page, 'staff@example.com');
    await page.goto('/open-shifts');
    row = await openShift(page);
    await row.getByText('Offered outside the roster').waitFor();
    expect(await row.getByText(/Staff bank office/).count()).toBe(0);
    await signOut(page);
    await signIn(page, 'manager@example.com');
    await page.goto('/open-shifts');

    // Withdrawn: the mark goes, the shift stays open.
    row = await openShift(page);
    await row.getByRole('button', { name: 'Withdraw offer' }).click();
    await page
      .getByRole('alertdialog', { name: 'Withdraw the offer?' })
      .getByRole('button', { name: 'Withdraw offer' })
      .click();
    await page
      .locator('.fui-ToastTitle')
      .getByText('Offer withdrawn: the shift is open on the roster only')
      .waitFor();
    row = await openShift(page);
    await row.getByRole('button', { name: /^What it would take/ }).waitFor();
    expect(await row.getByText('Offered outside the roster').count()).toBe(0);
    await signOut(page);
  });
});
