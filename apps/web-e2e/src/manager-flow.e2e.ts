import { PLANNING_ROUTES, type RosterPeriodDto } from '@rotaplex/contracts';
import { apiCall, apiSignIn, demoPeriod, findWard } from './support/api';
import {
  openBrowser,
  openDemoDraft,
  pressGenerate,
  screenshot,
  signIn,
  unnamedControls,
  type Session,
} from './support/browser';

// Issue 4, item 5: the manager's whole flow on a demo period, from Generate to Publish (staff
// reading published shifts in their calendar is my-roster.e2e.ts). It uses the contact
// centre's four-week demo draft (no other journey touches it; the ward's draft stays a draft for
// the board and calendar journeys). The demo puts the only French speaker on approved leave on the
// period's second Monday, so one need is short on purpose and its explanation says why.
describe('the contact centre planner generates and publishes the demo period', () => {
  let browser: Session;
  let period: RosterPeriodDto;
  let demoId = '';
  beforeAll(async () => {
    const token = await apiSignIn('manager2@example.com');
    demoId = (await demoPeriod(token, (await findWard(token, 'Contact Centre North')).id)).id;
    browser = await openBrowser();
    await signIn(browser.page, 'manager2@example.com');
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('generates the demo period and explains the short need', async () => {
    const { page } = browser;
    await openDemoDraft(page, /^Planning board: Contact Centre North/, demoId);
    await page.getByRole('textbox', { name: 'Time limit (seconds)' }).fill('30');
    await pressGenerate(page);
    await page.getByTestId('quality-statement').waitFor({ timeout: 110_000 });
    // The explanations open in a side panel, so the grid stays in view.
    await page.getByRole('button', { name: /^Explanations \(\d+\)$/ }).click();
    const explanations = page.getByRole('region', { name: 'Explanations' });
    await explanations.getByText(/Unmet needs \([1-9]\d*\)/).waitFor();
    await explanations
      .getByText(/on leave/)
      .first()
      .waitFor();
    expect(await unnamedControls(page)).toEqual([]);
    await screenshot(page, 'manager-flow-generated');
    await page.getByRole('button', { name: 'Close the explanations' }).click();
    await explanations.waitFor({ state: 'detached' });
    const id = /\/planning\/periods\/([^/]+)\/board/.exec(page.url())?.[1];
    const token = await apiSignIn('manager2@example.com');
    period = await apiCall<RosterPeriodDto>(token, 'GET', PLANNING_ROUTES.rosterPeriod(id!));
    expect(period.status).toBe('draft');
  }, 150_000);

  it('publishes after the publish check lists the short French need, with an acknowledgement and a reason', async () => {
    const { page } = browser;
    await page.getByRole('button', { name: 'Publish' }).click();
    const dialog = page.getByRole('alertdialog', { name: 'Publish this roster?' });
    // Nobody with French on the Monday of the leave: the worst kind of shortfall, listed first.
    const short = dialog.getByRole('region', { name: 'Shifts below minimum cover' });
    await short.getByRole('listitem').first().getByText('No FR').waitFor();
    await short.getByText(/Day \(D\): 0 of 1 FR/).waitFor();
    await dialog.getByRole('checkbox', { name: /I have read the shifts below minimum cover/ }).check();
    await dialog
      .getByRole('textbox', { name: /Reason \(kept in the audit trail\)/ })
      .fill('French calls routed to the partner centre that Monday');
    await dialog.getByRole('button', { name: 'Publish below minimum' }).click();
    await dialog.waitFor({ state: 'detached' });
    await page.getByText('Published: read-only').waitFor();
    const token = await apiSignIn('manager2@example.com');
    expect(
      (await apiCall<RosterPeriodDto>(token, 'GET', PLANNING_ROUTES.rosterPeriod(period.id))).status,
    ).toBe('published');
  });
});
