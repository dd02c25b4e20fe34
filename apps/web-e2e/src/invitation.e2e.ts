import {
  eventually,
  navLinks,
  openBrowser,
  screenshot,
  signIn,
  unnamedControls,
  type Session,
} from './support/browser';
import { linkFromMailbox } from './support/mailbox';

// Issue 2, item 9: an admin invites a new user, the invitation arrives in the local mail
// catcher, the link sets a password, the new user signs in. Tokens are single use (item 4).
const NEWCOMER = { email: `jordan.newcomer.${Date.now()}@example.com`, name: 'Jordan Newcomer' };
const NEW_PASSWORD = 'a long new passphrase';

describe('inviting a person', () => {
  let browser: Session;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser.close();
  });

  it('names a bad e-mail address beside its field and keeps the dialog open', async () => {
    const { page } = browser;
    await signIn(page, 'admin@example.com');
    await page.goto('/admin/users');
    await page.getByRole('button', { name: 'Invite person' }).click();
    const dialog = page.getByRole('dialog', { name: 'Invite a person' });
    await dialog.getByRole('textbox', { name: 'E-mail address', exact: true }).fill('not-an-address');
    await dialog.getByRole('textbox', { name: 'Full name', exact: true }).fill('Nobody');
    await dialog.getByRole('checkbox', { name: 'Ward 7 Acute Medicine' }).check();
    await dialog.getByRole('button', { name: 'Send invitation' }).click();
    await eventually(
      async () =>
        (await dialog
          .getByRole('textbox', { name: 'E-mail address', exact: true })
          .getAttribute('aria-invalid')) === 'true'
          ? true
          : undefined,
      'the e-mail field to be marked invalid',
    );
    expect(await dialog.isVisible()).toBe(true);
    await screenshot(page, 'invite-validation');
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await dialog.waitFor({ state: 'detached' });
  });

  it('sends an invitation that sets a password once and lets the new person sign in', async () => {
    const { page } = browser;
    await page.goto('/admin/users');
    await page.getByRole('button', { name: 'Invite person' }).click();
    const dialog = page.getByRole('dialog', { name: 'Invite a person' });
    await dialog.getByRole('textbox', { name: 'E-mail address', exact: true }).fill(NEWCOMER.email);
    await dialog.getByRole('textbox', { name: 'Full name', exact: true }).fill(NEWCOMER.name);
    await dialog.getByRole('combobox', { name: 'Role', exact: true }).selectOption('staff');
    await dialog.getByRole('checkbox', { name: 'Ward 7 Acute Medicine' }).check();
    await dialog.getByRole('button', { name: 'Send invitation' }).click();
    await dialog.waitFor({ state: 'detached' });

    await page.getByRole('searchbox', { name: /Search people/ }).fill('newcomer');
    await page.waitForURL(/[?&]q=newcomer/);
    const row = page.getByRole('row').filter({ hasText: NEWCOMER.email });
    await row.waitFor();
    expect(await row.innerText()).toMatch(/Invited/);

    const link = await linkFromMailbox(
      page,
      NEWCOMER.email,
      '/accept-invitation?token=',
      'mailbox-invitation',
    );
    // The formatted version is shown too, in a sandboxed frame that runs no scripts.
    expect(await page.locator('iframe').getAttribute('sandbox')).toBe(
      'allow-popups allow-popups-to-escape-sandbox',
    );
    expect(link.startsWith(process.env.ROTAPLEX_E2E_BASE_URL ?? '')).toBe(true);

    await page.goto(link);
    await page.getByRole('heading', { name: 'Welcome to Rotaplex' }).waitFor();
    expect(await unnamedControls(page)).toEqual([]);
    await page.getByRole('textbox', { name: 'New password', exact: true }).fill(NEW_PASSWORD);
    await page.getByRole('textbox', { name: 'Repeat the new password', exact: true }).fill(NEW_PASSWORD);
    await page.getByRole('button', { name: 'Set password and activate' }).click();
    await page.getByText('Your account is ready').waitFor();
    await screenshot(page, 'invitation-accepted');

    // The same link a second time is refused: the token is single use.
    await page.goto(link);
    await page.getByRole('textbox', { name: 'New password', exact: true }).fill('another passphrase');
    await page
      .getByRole('textbox', { name: 'Repeat the new password', exact: true })
      .fill('another passphrase');
    await page.getByRole('button', { name: 'Set password and activate' }).click();
    await page.getByText('The link could not be used').waitFor();

    await signIn(page, NEWCOMER.email, NEW_PASSWORD);
    expect(await navLinks(page)).toEqual([
      'Overview',
      'My roster',
      'Swaps',
      'Open shifts',
      'My availability',
      'My requests',
      'Profile',
    ]);
    await page.getByRole('heading', { level: 1, name: /, Jordan$/ }).waitFor();
    await page.getByText('Ward 7 Acute Medicine').first().waitFor();
  });
});
