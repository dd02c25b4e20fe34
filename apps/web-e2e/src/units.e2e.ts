import { openBrowser, screenshot, signIn, unnamedControls, type Session } from './support/browser';

// Issue 2, item 4: units have a name and an IANA time zone. The picker offers the IANA names;
// India Standard Time is UTC+05:30 all year (IANA tzdata, Asia/Kolkata).
describe('units', () => {
  let browser: Session;
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser.close();
  });

  it('creates a unit in a time zone picked by typing, then renames it', async () => {
    const { page } = browser;
    const name = `Support Desk ${Date.now()}`;
    await signIn(page, 'admin@example.com');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Units' }).click();
    await page.getByRole('button', { name: 'New unit' }).click();
    const dialog = page.getByRole('dialog', { name: 'New unit' });
    await dialog.getByRole('textbox', { name: 'Name', exact: true }).fill(name);
    const zone = dialog.getByRole('combobox', { name: 'Time zone' });
    await zone.click();
    await zone.pressSequentially('kolk');
    await page.getByRole('option', { name: /^Asia\/Kolkata \(UTC\+05:30\)$/ }).click();
    expect(await unnamedControls(page)).toEqual([]);
    await dialog.getByRole('button', { name: 'Create unit' }).click();
    await dialog.waitFor({ state: 'detached' });

    const row = page.getByRole('row').filter({ hasText: name });
    await row.waitFor();
    expect(await row.innerText()).toMatch(/Asia\/Kolkata\s*\(UTC\+05:30\)/);
    await screenshot(page, 'admin-units');

    // An empty name is refused beside the field and nothing is saved.
    await row.getByRole('button', { name: `Actions for ${name}` }).click();
    await page.getByRole('menuitem', { name: 'Edit name and time zone' }).click();
    const edit = page.getByRole('dialog', { name: `Edit ${name}` });
    await edit.getByRole('textbox', { name: 'Name', exact: true }).fill('   ');
    await edit.getByRole('button', { name: 'Save changes' }).click();
    await edit.getByText(/Give the unit a name/).waitFor();
    await edit.getByRole('textbox', { name: 'Name', exact: true }).fill(`${name} (renamed)`);
    await edit.getByRole('button', { name: 'Save changes' }).click();
    await edit.waitFor({ state: 'detached' });
    await page
      .getByRole('row')
      .filter({ hasText: `${name} (renamed)` })
      .waitFor();
  });
});
