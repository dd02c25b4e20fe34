import { DEMO_PASSWORD, openBrowser, signIn, unnamedControls, type Session } from './support/browser';
import { linkFromMailbox } from './support/mailbox';

// Issue 2, item 4: password reset by e-mail with a single-use, expiring token. The request page
// says the same for any address (no account enumeration, OWASP Authentication Cheat Sheet).
const PERSON = 'ines.moreau@example.com';
const NEW_PASSWORD = 'ines picked a new passphrase';

describe('forgotten password', () => {
  let person: Session;
  let admin: Session;
  beforeAll(async () => {
    person = await openBrowser();
    admin = await openBrowser();
  });
  afterAll(async () => {
    await person.close();
    await admin.close();
  });

  it('mails a reset link that sets a new password', async () => {
    const { page } = person;
    await page.goto('/sign-in');
    await page.getByRole('link', { name: 'Forgot your password?' }).click();
    await page.getByRole('heading', { name: 'Reset your password' }).waitFor();
    expect(await unnamedControls(page)).toEqual([]);
    await page.getByRole('textbox', { name: 'E-mail address', exact: true }).fill(PERSON);
    await page.getByRole('textbox', { name: 'E-mail address', exact: true }).press('Enter');
    await page.getByText('Check your e-mail').waitFor();

    await signIn(admin.page, 'admin@example.com');
    const link = await linkFromMailbox(admin.page, PERSON, '/reset-password?token=');

    await page.goto(link);
    await page.getByRole('heading', { name: 'Choose a new password' }).waitFor();
    await page.getByRole('textbox', { name: 'New password', exact: true }).fill('short');
    await page.getByRole('textbox', { name: 'Repeat the new password', exact: true }).fill('short');
    await page.getByRole('button', { name: 'Change password' }).click();
    await page.getByText('Use at least 8 characters.').waitFor();
    await page.getByRole('textbox', { name: 'New password', exact: true }).fill(NEW_PASSWORD);
    await page.getByRole('textbox', { name: 'Repeat the new password', exact: true }).fill(NEW_PASSWORD);
    await page.getByRole('button', { name: 'Change password' }).click();
    await page.getByText('Password changed').waitFor();

    await page.goto('/sign-in');
    await page.getByRole('textbox', { name: 'E-mail address', exact: true }).fill(PERSON);
    await page.getByRole('textbox', { name: 'Password', exact: true }).fill(DEMO_PASSWORD);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('alert').waitFor();
    await signIn(page, PERSON, NEW_PASSWORD);
  });
});
