import { PLANNING_ROUTES as P, type SkillDto } from '@rotaplex/contracts';
import { apiCall, apiSignIn } from './support/api';
import { openBrowser, screenshot, signIn, unnamedControls, type Session } from './support/browser';

// Issue 10, item 1: a skill can be marked registered (a licensed professional skill such as registered
// nurse); shifts that need it are checked for the red flags of safe staffing (NICE SG1 2014, quoted in
// PRODUCT.md "Safe staffing"). The admin sets it on the skills page, where one line says what it changes.
// The skill is our own, created and removed here, so the journey does not depend on others.
describe('marking a skill registered', () => {
  let browser: Session;
  const code = `RM${Date.now().toString().slice(-6)}`;
  const name = 'Registered midwife';
  beforeAll(async () => {
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    const token = await apiSignIn('admin@example.com');
    const left = (await apiCall<SkillDto[]>(token, 'GET', P.skills)).find((s) => s.code === code);
    if (left) await apiCall(token, 'DELETE', P.skill(left.id)).catch(() => undefined);
  });

  it('creates a registered skill, shows it in the list, and unmarks it again', async () => {
    const { page } = browser;
    await signIn(page, 'admin@example.com');
    await page.goto('/planning/skills');
    await page.getByRole('heading', { level: 1, name: 'Skills' }).waitFor();
    // The demo's registered nurse is marked registered.
    const rn = page.getByRole('row').filter({ hasText: 'Registered nurse' });
    expect(await rn.innerText()).toMatch(/Yes: checked for red flags/);

    await page.getByRole('button', { name: 'New skill' }).click();
    const dialog = page.getByRole('dialog', { name: 'New skill' });
    await dialog.getByRole('textbox', { name: /^Code/ }).fill(code);
    await dialog.getByRole('textbox', { name: /^Name/ }).fill(name);
    const registered = dialog.getByRole('checkbox', { name: /^Registered \(licensed\) professional skill/ });
    expect(await registered.isChecked()).toBe(false);
    await registered.check();
    await dialog
      .getByText(
        /checked for the red flags of safe staffing \(NICE SG1\): fewer than 2 .* more than 8 hours or 25%/,
      )
      .waitFor();
    expect(await unnamedControls(page)).toEqual([]);
    await screenshot(page, 'red-flag-skill-dialog', { fullPage: false });
    await page.setViewportSize({ width: 390, height: 844 });
    await screenshot(page, 'red-flag-skill-dialog-390', { fullPage: false });
    await page.setViewportSize({ width: 1360, height: 860 });
    await dialog.getByRole('button', { name: 'Create skill' }).click();
    await dialog.waitFor({ state: 'detached' });
    const row = page.getByRole('row').filter({ hasText: code });
    await row.filter({ hasText: 'Yes: checked for red flags' }).waitFor();
    const token = await apiSignIn('admin@example.com');
    const saved = (await apiCall<SkillDto[]>(token, 'GET', P.skills)).find((s) => s.code === code)!;
    expect(saved).toMatchObject({ name, registered: true });

    // Unmarked again: the list and the server say no.
    await row.getByRole('button', { name: `Actions for ${code} ${name}` }).click();
    await page.getByRole('menuitem', { name: 'Edit' }).click();
    const edit = page.getByRole('dialog', { name: `Edit skill ${code}` });
    const box = edit.getByRole('checkbox', { name: /^Registered \(licensed\) professional skill/ });
    expect(await box.isChecked()).toBe(true);
    await box.uncheck();
    await edit.getByRole('button', { name: 'Save changes' }).click();
    await edit.waitFor({ state: 'detached' });
    await row.filter({ hasText: /No$/ }).waitFor();
    const after = (await apiCall<SkillDto[]>(token, 'GET', P.skills)).find((s) => s.code === code)!;
    expect(after.registered).toBe(false);
  });
});
