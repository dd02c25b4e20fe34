import { DEMO_PASSWORD, eventually, openBrowser, screenshot, signIn, type Session } from './support/browser';
import { linkFromMailbox } from './support/mailbox';

// Issue 2, item 4: admins change role and units of people, deactivate them (who then cannot sign
// in) and resend invitations. Demo people no other journey signs in as.
const PERSON = { email: 'owen.treharne@example.com', name: 'Owen Treharne' };

describe('looking after people', () => {
  let admin: Session;
  let other: Session;
  beforeAll(async () => {
    admin = await openBrowser();
    other = await openBrowser();
    await signIn(admin.page, 'admin@example.com');
  });
  afterAll(async () => {
    await admin.close();
    await other.close();
  });

  async function findRow(name: string) {
    const { page } = admin;
    await page.goto(`/admin/users?q=${encodeURIComponent(name)}`);
    const row = page.getByRole('table', { name: 'People' }).getByRole('row').filter({ hasText: name });
    await row.waitFor();
    return row;
  }

  it('deactivates a person after confirmation, refusing their sign-in until reactivated', async () => {
    const { page } = admin;
    let row = await findRow(PERSON.name);
    await row.getByRole('button', { name: `Actions for ${PERSON.name}` }).click();
    await page.getByRole('menuitem', { name: 'Deactivate' }).click();
    const confirm = page.getByRole('alertdialog', { name: `Deactivate ${PERSON.name}?` });
    // Cancel leaves the person as they were.
    await confirm.getByRole('button', { name: 'Cancel' }).click();
    await confirm.waitFor({ state: 'detached' });
    expect(await row.innerText()).toMatch(/Active/);

    await row.getByRole('button', { name: `Actions for ${PERSON.name}` }).click();
    await page.getByRole('menuitem', { name: 'Deactivate' }).click();
    await confirm.getByRole('button', { name: 'Deactivate' }).click();
    await confirm.waitFor({ state: 'detached' });
    await eventually(
      async () => ((await row.innerText()).includes('Deactivated') ? true : undefined),
      'the status',
    );
    await screenshot(page, 'people-deactivated');

    await other.page.goto('/sign-in');
    await other.page.getByRole('textbox', { name: 'E-mail address', exact: true }).fill(PERSON.email);
    await other.page.getByRole('textbox', { name: 'Password', exact: true }).fill(DEMO_PASSWORD);
    await other.page.getByRole('button', { name: 'Sign in' }).click();
    await other.page.getByRole('alert').waitFor();
    expect(await other.page.getByRole('navigation', { name: 'Main' }).count()).toBe(0);

    row = await findRow(PERSON.name);
    await row.getByRole('button', { name: `Actions for ${PERSON.name}` }).click();
    await page.getByRole('menuitem', { name: 'Reactivate' }).click();
    await page
      .getByRole('alertdialog', { name: `Reactivate ${PERSON.name}?` })
      .getByRole('button', { name: 'Reactivate' })
      .click();
    await eventually(
      async () => ((await row.innerText()).match(/\bActive\b/) ? true : undefined),
      'the status',
    );
    await signIn(other.page, PERSON.email);
  });

  it('moves a person to another unit and makes them a manager', async () => {
    const { page } = admin;
    const name = 'Lucy Fenwick';
    const row = await findRow(name);
    await row.getByRole('button', { name: `Actions for ${name}` }).click();
    await page.getByRole('menuitem', { name: 'Edit role and units' }).click();
    const dialog = page.getByRole('dialog', { name: `Edit ${name}` });
    await dialog.getByRole('combobox', { name: 'Role', exact: true }).selectOption('manager');
    await dialog.getByRole('checkbox', { name: 'Ward 7 Acute Medicine' }).uncheck();
    // A manager with no unit is caught before anything is sent.
    await dialog.getByRole('button', { name: 'Save changes' }).click();
    await dialog.getByText('A manager belongs to at least one unit.').waitFor();
    await dialog.getByRole('checkbox', { name: 'Contact Centre North' }).check();
    await dialog.getByRole('button', { name: 'Save changes' }).click();
    await dialog.waitFor({ state: 'detached' });
    await eventually(
      async () => ((await row.innerText()).match(/Manager\s+Contact Centre North/) ? true : undefined),
      'the new role and unit in the list',
    );
  });

  it('resends an invitation with a fresh link, and only the newest link works', async () => {
    const { page } = admin;
    const email = `sam.latecomer.${Date.now()}@example.com`;
    await page.goto('/admin/users');
    await page.getByRole('button', { name: 'Invite person' }).click();
    const dialog = page.getByRole('dialog', { name: 'Invite a person' });
    await dialog.getByRole('textbox', { name: 'E-mail address', exact: true }).fill(email);
    await dialog.getByRole('textbox', { name: 'Full name', exact: true }).fill('Sam Latecomer');
    await dialog.getByRole('checkbox', { name: 'Contact Centre North' }).check();
    await dialog.getByRole('button', { name: 'Send invitation' }).click();
    await dialog.waitFor({ state: 'detached' });
    const first = await linkFromMailbox(page, email, '/accept-invitation?token=');

    const row = await findRow('Sam Latecomer');
    await row.getByRole('button', { name: 'Actions for Sam Latecomer' }).click();
    await page.getByRole('menuitem', { name: 'Resend invitation' }).click();
    await page
      .locator('.fui-ToastTitle', { hasText: `A new invitation is on its way to ${email}` })
      .waitFor();
    const second = await eventually(async () => {
      const link = await linkFromMailbox(page, email, '/accept-invitation?token=');
      return link !== first ? link : undefined;
    }, 'the second invitation');
    expect(second).not.toBe(first);

    // The first link was replaced by the second.
    await other.page.goto(first);
    await other.page
      .getByRole('textbox', { name: 'New password', exact: true })
      .fill('sam sets a passphrase');
    await other.page
      .getByRole('textbox', { name: 'Repeat the new password', exact: true })
      .fill('sam sets a passphrase');
    await other.page.getByRole('button', { name: 'Set password and activate' }).click();
    await other.page.getByText('The link could not be used').waitFor();

    await other.page.goto(second);
    await other.page
      .getByRole('textbox', { name: 'New password', exact: true })
      .fill('sam sets a passphrase');
    await other.page
      .getByRole('textbox', { name: 'Repeat the new password', exact: true })
      .fill('sam sets a passphrase');
    await other.page.getByRole('button', { name: 'Set password and activate' }).click();
    await other.page.getByText('Your account is ready').waitFor();
  });
});
