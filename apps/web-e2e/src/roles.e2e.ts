import { PLANNING_ROUTES as P, type Page as PageOf, type RosterPeriodDto } from '@rotaplex/contracts';
import {
  DEMO_PASSWORD,
  eventually,
  navLinks,
  openBrowser,
  screenshot,
  signIn,
  signOut,
  unnamedControls,
  type Session,
} from './support/browser';
import { apiCall, apiSignIn, findWard } from './support/api';

// Issue 2, "Done when": the demo sign-ins work and each role sees its own navigation; wrong
// passwords and wrong roles are refused. Demo accounts are those the README lists.
describe('signing in by role', () => {
  let browser: Session;
  beforeEach(async () => {
    browser = await openBrowser();
  });
  afterEach(async () => {
    await browser.close();
  });

  it('shows an administrator every administration page, with named controls', async () => {
    const { page } = browser;
    await signIn(page, 'admin@example.com');
    expect(await navLinks(page)).toEqual([
      'Overview',
      'My roster',
      'Open shifts',
      'Swap approvals',
      'Requests',
      'Profile',
      'Roster periods',
      'Cover needs',
      'Demand',
      'Staff',
      'Shift types',
      'Contracts',
      'Skills',
      'People',
      'Units',
      'Organisation',
      'Mailbox',
      'Outbox',
    ]);
    await page.getByRole('heading', { name: 'Administration' }).waitFor();
    await page.getByRole('banner').getByText('Rotaplex', { exact: true }).waitFor();
    // The overview names the role and the organisation's units (demo data).
    await page.getByRole('heading', { level: 1, name: /^Good (morning|afternoon|evening), Alex$/ }).waitFor();
    await page.getByText('Ward 7 Acute Medicine').first().waitFor();
    await page.getByText('Contact Centre North').first().waitFor();
    expect(await unnamedControls(page)).toEqual([]);
    await screenshot(page, 'admin-overview');

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'People' }).click();
    const people = page.getByRole('table', { name: 'People' });
    await people.getByRole('cell', { name: 'admin@example.com' }).waitFor();
    // 30 demo people at 20 a page: the list pages.
    await page.getByText(/^Showing 1–20 of \d+$/).waitFor();
    await page.getByRole('searchbox', { name: /Search people/ }).fill('tallis');
    // The header row and Robin Tallis's row, once the search has settled.
    await eventually(
      async () => ((await people.getByRole('row').count()) === 2 ? true : undefined),
      'the search',
    );
    await people.getByRole('cell', { name: 'staff@example.com' }).waitFor();
    expect(await unnamedControls(page)).toEqual([]);
    await screenshot(page, 'admin-people');

    await page.getByRole('button', { name: 'Invite person' }).click();
    await page.getByRole('dialog', { name: 'Invite a person' }).waitFor();
    expect(await unnamedControls(page)).toEqual([]);
    await page.keyboard.press('Escape');
    await page.getByRole('dialog').waitFor({ state: 'detached' });
  });

  it('restores the session after a reload from the refresh cookie', async () => {
    const { page } = browser;
    await signIn(page, 'admin@example.com');
    await page.goto('/admin/units');
    await page.reload();
    await page.getByRole('heading', { level: 1, name: 'Units' }).waitFor();
    expect(page.url()).toMatch(/\/admin\/units$/);
  });

  it('shows a manager the people of their own unit only', async () => {
    const { page } = browser;
    await signIn(page, 'manager@example.com');
    expect(await navLinks(page)).toEqual([
      'Overview',
      'My roster',
      'Open shifts',
      'Swap approvals',
      'Requests',
      'Profile',
      'Roster periods',
      'Cover needs',
      'Demand',
      'Staff',
      'Shift types',
      'Contracts',
      'Skills',
      'People',
    ]);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'People' }).click();
    const table = page.getByRole('table', { name: 'People' });
    await page.getByRole('searchbox', { name: /Search people/ }).fill('example.com');
    await table.getByRole('cell', { name: 'staff@example.com' }).waitFor();
    await page.getByRole('combobox', { name: 'Rows per page' }).selectOption('50');
    await page.getByText(/^Showing 1–\d+ of \d+$/).waitFor();
    // manager2@example.com plans the contact centre, another unit.
    expect(await table.getByRole('cell', { name: 'manager2@example.com' }).count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Invite person' }).count()).toBe(0);
    await page.goto('/admin/organisation');
    await page.getByRole('heading', { level: 1, name: "You don't have access to this page" }).waitFor();
  });

  it('tells a manager who opens another unit’s board that they have no access, with the way home and no retry', async () => {
    const { page } = browser;
    // A period of the contact centre, which manager@example.com does not plan (demo data).
    const other = await apiSignIn('manager2@example.com');
    const contact = await findWard(other, 'Contact Centre North');
    const periods = await apiCall<PageOf<RosterPeriodDto>>(
      other,
      'GET',
      `${P.rosterPeriods}?unitId=${encodeURIComponent(contact.id)}`,
    );
    await signIn(page, 'manager@example.com');
    await page.goto(`/planning/periods/${periods.items[0].id}/board`);
    const refusal = page.getByRole('alert').filter({ hasText: "You don't have access to this page" });
    await refusal.waitFor();
    await refusal.getByText('You do not have access to this unit').waitFor();
    // A 403 is not a failure a retry can mend.
    expect(await page.getByRole('button', { name: 'Try again' }).count()).toBe(0);
    await screenshot(page, 'forbidden-board');
    await refusal.getByRole('button', { name: 'Go to the overview' }).click();
    await page.waitForURL((url) => url.pathname === '/');
    await page.getByRole('navigation', { name: 'Main' }).waitFor();
  });

  it('gives staff no administration and refuses the people page', async () => {
    const { page } = browser;
    await signIn(page, 'staff@example.com');
    expect(await navLinks(page)).toEqual([
      'Overview',
      'My roster',
      'Swaps',
      'Open shifts',
      'My availability',
      'My requests',
      'Profile',
    ]);
    expect(await page.getByRole('heading', { name: 'Administration' }).count()).toBe(0);
    await page.goto('/admin/users');
    await page.getByRole('heading', { level: 1, name: "You don't have access to this page" }).waitFor();
    expect(await page.getByRole('table', { name: 'People' }).count()).toBe(0);
    await page.goto('/no-such-page');
    await page.getByRole('heading', { level: 1, name: 'Page not found' }).waitFor();
    await screenshot(page, 'staff-not-found');
  });

  it('refuses a wrong password with a message and keeps the person on the sign-in page', async () => {
    const { page } = browser;
    await page.goto('/');
    await page.getByRole('heading', { name: 'Sign in to Rotaplex' }).waitFor();
    expect(await unnamedControls(page)).toEqual([]);
    await page.getByRole('textbox', { name: 'E-mail address', exact: true }).fill('admin@example.com');
    await page.getByRole('textbox', { name: 'Password', exact: true }).fill(`${DEMO_PASSWORD}-wrong`);
    await page.getByRole('textbox', { name: 'Password', exact: true }).press('Enter');
    const alert = page.getByRole('alert');
    await alert.waitFor();
    expect((await alert.innerText()).toLowerCase()).toMatch(/password/);
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    expect(await page.getByRole('navigation', { name: 'Main' }).count()).toBe(0);
    await screenshot(page, 'sign-in-wrong-password');
  });

  it('signs out, and a reload does not bring the session back', async () => {
    const { page } = browser;
    await signIn(page, 'staff@example.com');
    await signOut(page);
    await page.goto('/profile');
    await page.getByRole('heading', { name: 'Sign in to Rotaplex' }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
  });
});
