import {
  DEMO_PASSWORD,
  openBrowser,
  screenshot,
  signIn,
  signOut,
  unnamedControls,
  type Session,
} from './support/browser';

// Issue 2, item 6: profile with change of password. A demo person no other journey uses.
const PERSON = 'grace.holloway@example.com';
const NEW_PASSWORD = 'grace changed her passphrase';

describe('changing one’s password', () => {
  let browser: Session;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser.close();
  });

  it('checks the current password, then the new one works and the old one does not', async () => {
    const { page } = browser;
    await signIn(page, PERSON);
    await page.getByRole('button', { name: /^Account menu for / }).click();
    await page.getByRole('menuitem', { name: 'Profile' }).click();
    await page.getByRole('heading', { level: 1, name: 'Profile' }).waitFor();
    expect(await unnamedControls(page)).toEqual([]);

    const form = page.getByRole('form', { name: 'Change password' });
    // Mismatched repeat: caught before anything is sent.
    await form.getByRole('textbox', { name: 'Current password', exact: true }).fill(DEMO_PASSWORD);
    await form.getByRole('textbox', { name: 'New password', exact: true }).fill(NEW_PASSWORD);
    await form
      .getByRole('textbox', { name: 'Repeat the new password', exact: true })
      .fill(`${NEW_PASSWORD}!`);
    await form.getByRole('button', { name: 'Change password' }).click();
    await form.getByText('The two passwords are not the same.').waitFor();

    // Wrong current password: refused by the server, said in the form.
    await form.getByRole('textbox', { name: 'Current password', exact: true }).fill('not-my-password');
    await form.getByRole('textbox', { name: 'Repeat the new password', exact: true }).fill(NEW_PASSWORD);
    await form.getByRole('button', { name: 'Change password' }).click();
    await form.getByRole('alert').first().waitFor();
    await screenshot(page, 'profile-wrong-current');

    await form.getByRole('textbox', { name: 'Current password', exact: true }).fill(DEMO_PASSWORD);
    await form.getByRole('button', { name: 'Change password' }).click();
    await page.locator('.fui-ToastTitle', { hasText: 'Password changed' }).waitFor();
    expect(await form.getByRole('textbox', { name: 'Current password', exact: true }).inputValue()).toBe('');

    await signOut(page);
    await page.getByRole('textbox', { name: 'E-mail address', exact: true }).fill(PERSON);
    await page.getByRole('textbox', { name: 'Password', exact: true }).fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('alert').waitFor();
    await signIn(page, PERSON, NEW_PASSWORD);
  });
});
