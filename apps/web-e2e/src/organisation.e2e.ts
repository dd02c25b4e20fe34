import { openBrowser, signIn, unnamedControls, type Session } from './support/browser';

// Issue 2, item 4: admins set the organisation's name; the header shows it to everyone.
describe('organisation', () => {
  let browser: Session;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser.close();
  });

  it('renames the organisation, refusing an empty name', async () => {
    const { page } = browser;
    await signIn(page, 'admin@example.com');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Organisation' }).click();
    const field = page.getByRole('textbox', { name: 'Organisation name', exact: true });
    await field.waitFor();
    expect(await unnamedControls(page)).toEqual([]);
    const original = await field.inputValue();
    expect(original.length).toBeGreaterThan(0);

    await field.fill('  ');
    await field.press('Enter');
    await page.getByText('The organisation needs a name.').waitFor();

    const renamed = `${original} (renamed)`;
    await field.fill(renamed);
    await field.press('Enter');
    await page.getByRole('banner').getByText(renamed, { exact: true }).waitFor();
    // After a reload the name comes from the server, not from the form.
    await page.reload();
    await page.getByRole('banner').getByText(renamed, { exact: true }).waitFor();

    await page.getByRole('textbox', { name: 'Organisation name', exact: true }).fill(original);
    await page.getByRole('button', { name: 'Save' }).click();
    await page.getByRole('banner').getByText(original, { exact: true }).waitFor();
  });
});
