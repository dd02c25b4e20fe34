import { openBrowser, screenshot, signIn, signOut, unnamedControls, type Session } from './support/browser';

/**
 * Issue 10, item 4: the home page lists what waits for this person, not the product's features. The
 * demo manager's ward has a draft period: it is listed with its publish deadline from the unit's lead
 * time (six weeks by default, Drake, J Adv Nurs 2018;74(8):1831-38). Counts say "1 unit", not "1 units".
 */
describe('home page: what waits for you', () => {
  let browser: Session;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });

  it('shows the manager the draft to generate and publish, with its deadline', async () => {
    const { page } = browser;
    await signIn(page, 'manager@example.com');
    const waiting = page.getByRole('region', { name: 'Waiting for you' });
    const draft = waiting.getByRole('link', { name: /^Generate and publish Ward 7 Acute Medicine: / });
    await draft.first().waitFor();
    expect(await draft.first().innerText()).toMatch(
      /(Publish by|Publish was due) \w{3} \d{1,2} \w{3} \(42 days' notice\): \d+ days? (left|late)/,
    );
    expect(await page.getByText('Where to go next').count()).toBe(0);
    expect(await page.getByText(/\b1 units\b/).count()).toBe(0);
    expect(await unnamedControls(page)).toEqual([]);
    await screenshot(page, 'home-manager');
    await page.setViewportSize({ width: 390, height: 844 });
    await screenshot(page, 'home-manager-390');
    await page.setViewportSize({ width: 1360, height: 860 });
    await draft.first().click();
    await page.getByRole('heading', { level: 1, name: /^Planning board: / }).waitFor();
    await signOut(page);
  });

  it('shows staff their shifts and requests', async () => {
    const { page } = browser;
    await signIn(page, 'staff@example.com');
    await page.getByRole('region', { name: 'Your shifts and requests' }).waitFor();
    expect(await page.getByText('Where to go next').count()).toBe(0);
    await screenshot(page, 'home-staff');
    await signOut(page);
  });
});
