import { type RosterPeriodDto } from '@rotaplex/contracts';
import { apiSignIn, demoPeriod as findDemoPeriod, findWard } from './support/api';
import { seriousViolations } from './support/axe';
import { openBrowser, screenshot, signIn, signOut, type Session } from './support/browser';

/**
 * Issue 10, item 8: the main pages have no serious or critical accessibility violation by axe-core
 * (Deque Systems; WCAG 2.1 level A and AA rule set, see support/axe.ts), at desktop width and on a
 * 390 px phone. The check reads the page as it is once its content has loaded.
 */
describe('accessibility of the main pages (axe-core, WCAG 2.1 AA)', () => {
  let browser: Session;
  let demoPeriod: RosterPeriodDto;

  beforeAll(async () => {
    const token = await apiSignIn('manager@example.com');
    const ward = await findWard(token);
    // The demo period: the first made for the ward (other journeys add periods before or after it).
    demoPeriod = await findDemoPeriod(token, ward.id);
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  type Page = Session['page'];
  /** Opens a path, waits until its heading is there and nothing is loading, and runs axe-core. */
  const check = async (page: Page, path: string, name: string) => {
    if (path) await page.goto(path);
    await page.getByRole('heading', { level: 1 }).first().waitFor();
    await page.waitForLoadState('networkidle');
    await page.locator('.fui-Skeleton, [role="progressbar"]').first().waitFor({ state: 'detached' });
    const found = await seriousViolations(page);
    if (found.length) await screenshot(page, `axe-${name}`);
    return found.map((f) => `${name}: ${f.rule} (${f.impact}) ${f.help} at ${f.targets.join(' | ')}`);
  };

  it('the sign-in page', async () => {
    const { page } = browser;
    expect(await check(page, '/sign-in', 'sign-in')).toEqual([]);
  });

  it.each([['desktop', 1360] as const, ['phone', 390] as const])(
    'the staff member’s pages (%s)',
    async (label, width) => {
      const { page } = browser;
      await page.setViewportSize({ width, height: width > 400 ? 860 : 844 });
      await signIn(page, 'staff@example.com');
      const found: string[] = [];
      try {
        found.push(
          ...(await check(page, '', `staff-home-${label}`)),
          ...(await check(page, '/my-roster', `my-roster-${label}`)),
          ...(await check(page, '/my-availability', `availability-${label}`)),
          ...(await check(page, '/open-shifts', `open-shifts-${label}`)),
          ...(await check(page, '/my-requests', `my-requests-${label}`)),
          ...(await check(page, '/swaps', `swaps-${label}`)),
        );
      } finally {
        await signOut(page);
        await page.setViewportSize({ width: 1360, height: 860 });
      }
      expect(found).toEqual([]);
    },
  );

  it('the manager’s pages', async () => {
    const { page } = browser;
    await signIn(page, 'manager@example.com');
    const found: string[] = [];
    try {
      found.push(
        ...(await check(page, '', 'manager-home')),
        ...(await check(page, `/planning/periods/${demoPeriod.id}/board`, 'board')),
        ...(await check(page, `/planning/periods/${demoPeriod.id}/board?view=calendar`, 'board-calendar')),
        ...(await check(page, '/approvals/requests', 'requests')),
        ...(await check(page, '/approvals/swaps', 'swap-approvals')),
        ...(await check(page, '/open-shifts', 'open-shifts-manager')),
        ...(await check(page, `/planning/periods/${demoPeriod.id}/reports`, 'reports')),
        ...(await check(page, '/planning/periods', 'periods')),
        ...(await check(page, '/planning/cover-needs', 'cover-needs')),
        ...(await check(page, '/planning/staff', 'staff')),
      );
    } finally {
      await signOut(page);
    }
    expect(found).toEqual([]);
  });
});
