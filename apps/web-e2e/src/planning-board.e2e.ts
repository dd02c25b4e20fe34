import { apiSignIn, demoPeriod, findWard } from './support/api';
import {
  openBrowser,
  openDemoDraft,
  pressGenerate,
  screenshot,
  signIn,
  unnamedControls,
  type Session,
} from './support/browser';

// Issue 4, item 3 and issue 10, item 3: the planning board as the demo manager. The rest check
// follows the EU Working Time Directive 2003/88/EC, Art. 3 (11 consecutive hours of daily rest), which
// the demo contracts carry: a Night shift ending 07:30 and an Early shift at 07:00 the same morning
// overlap, which is refused outright; a Late ending 22:30 then an Early leaves 8 h 30 min of rest,
// which is kept only with a reason and then shows the rest finding with the fatigue warning.
describe('planning board as the demo manager', () => {
  let browser: Session;
  let demoId = '';
  beforeAll(async () => {
    const token = await apiSignIn('manager@example.com');
    demoId = (await demoPeriod(token, (await findWard(token)).id)).id;
    browser = await openBrowser();
    await signIn(browser.page, 'manager@example.com');
  });
  afterAll(async () => {
    await browser.close();
  });

  const board = () => browser.page.getByRole('table', { name: 'Planning board' });
  const cell = (row: number, col: number) => board().locator(`button[data-row="${row}"][data-col="${col}"]`);

  it('opens the draft period of the ward from the roster periods list', async () => {
    const { page } = browser;
    await openDemoDraft(page, /^Planning board: /, demoId);
    await board().waitFor();
    expect(await board().getByRole('columnheader').count()).toBeGreaterThanOrEqual(7 + 2);
    await page.getByText(/Cover against needs/).waitFor();
    expect(await unnamedControls(page)).toEqual([]);
  });

  it('generates with a time limit, shows progress, then the quality statement and explanations', async () => {
    const { page } = browser;
    await page.getByRole('textbox', { name: 'Time limit (seconds)' }).fill('45');
    await pressGenerate(page);
    // While the run is queued or running the Stop button and the time bar are shown.
    await page.getByRole('button', { name: 'Stop' }).waitFor();
    await page.getByRole('progressbar', { name: 'Time used of the limit' }).waitFor();
    await screenshot(page, 'planning-board-progress');
    await page.getByTestId('quality-statement').waitFor({ timeout: 110_000 });
    expect((await page.getByTestId('quality-statement').innerText()).trim().length).toBeGreaterThan(10);
    // The demo ward's study day leaves at least one shift below minimum by construction (8 of its 14
    // nurses away, 6 left for the 7 the day needs; apps/api/src/demo/demo-planning.ts): the board says
    // so first, in words, with the proven fewest and the usual advice, not as a success.
    const safety = page.getByTestId('staffing-safety');
    expect(await safety.innerText()).toMatch(
      /Below minimum staffing[\s\S]*\d+ shifts? (is|are) below minimum staffing \(\d+ (person|people) short[\s\S]*bank or agency staff/,
    );
    // The quality line is in words: no solver figures on the face of the board.
    expect(await page.getByTestId('quality-statement').innerText()).not.toMatch(/objective|bound|gap/i);
    expect(await page.getByText('Best objective').count()).toBe(0);
    // The figures are behind a toggle in plain words, and come back out of sight.
    const toggle = page.getByRole('button', { name: 'Show the calculation details' });
    await toggle.click();
    await page.getByText('Best objective').waitFor();
    await page.getByRole('button', { name: 'Hide the calculation details' }).click();
    await page.getByText('Best objective').waitFor({ state: 'detached' });
    await screenshot(page, 'planning-board-generated-grid');
    // Explanations open in a side panel, grouped by severity: below minimum first.
    await page.getByRole('button', { name: /^Explanations \(\d+\)$/ }).click();
    const explanations = page.getByRole('region', { name: 'Explanations' });
    await explanations.getByText(/Unmet needs \(\d+\): \d+ below minimum, \d+ below target/).waitFor();
    await explanations.getByRole('heading', { name: /^Below minimum staffing \(\d+\)$/ }).waitFor();
    await screenshot(page, 'planning-board-explanations');
    await page.getByRole('button', { name: 'Close the explanations' }).click();
    await explanations.waitFor({ state: 'detached' });
    expect(await page.getByRole('status', { name: 'Solve progress' }).innerText()).toMatch(
      /Finished|Stopped/,
    );
    // The generated roster is on the board: at least one cell holds a shift.
    await cell(0, 0).waitFor();
    expect(
      await board()
        .locator('button[data-row] span')
        .filter({ hasText: /^[A-Z0-9]{1,4}$/ })
        .count(),
    ).toBeGreaterThan(0);
    await screenshot(page, 'planning-board-generated');
  }, 150_000);

  it('refuses a night followed by an overlapping early, keeps a late then early only with a reason, then pins', async () => {
    const { page } = browser;
    const dialog = page.getByRole('dialog');
    const select = dialog.getByRole('combobox', { name: 'Shift' });
    const open = async (col: number) => {
      await cell(0, col).focus();
      await page.keyboard.press('Enter');
      await select.waitFor();
    };
    const close = async () => {
      await dialog.getByRole('button', { name: 'Close' }).click();
      await dialog.waitFor({ state: 'detached' });
    };
    const optionLabel = async (label: RegExp) => {
      const options = await dialog.getByRole('option').allInnerTexts();
      const found = options.find((o) => label.test(o));
      if (!found) throw new Error(`No shift option matching ${label} in ${options.join(' | ')}`);
      return found;
    };
    /** The answer to the next cell edit the page sends. */
    const nextEdit = () =>
      page.waitForResponse((r) => r.url().endsWith('/assignments/cell') && r.request().method() === 'PUT');
    /** Picks a shift and saves it; the status of the server's answer, or null when nothing changed. */
    const choose = async (label: RegExp) => {
      const wanted = await optionLabel(label);
      const current = await select.evaluate(
        (el: HTMLSelectElement) => el.selectedOptions[0]?.textContent ?? '',
      );
      if (current === wanted) return null; // the generated roster already holds it: Save stays disabled
      await select.selectOption({ label: wanted });
      const answer = nextEdit();
      await dialog.getByRole('button', { name: 'Save shift' }).click();
      return (await answer).status();
    };
    const reasonBox = dialog.getByRole('textbox', { name: /Reason for keeping this edit/ });
    /** Sets a cell; when the generated neighbours make the edit break a rule, keeps it with a reason. */
    const setShift = async (col: number, label: RegExp) => {
      await open(col);
      const status = await choose(label);
      if (status === 422) {
        await reasonBox.fill('Set up for the journey');
        const answer = nextEdit();
        await dialog.getByRole('button', { name: 'Keep with this reason' }).click();
        expect((await answer).status()).toBe(200);
      } else if (status !== null) expect(status).toBe(200);
      await dialog.getByRole('button', { name: 'Save shift' }).and(page.locator(':disabled')).waitFor();
      await close();
    };

    // The Night (22:00-07:30) and the next day's Early (07:00) overlap: refused whatever the reason.
    await setShift(2, /^Day off/);
    await setShift(1, /^N · Night/);
    expect(await cell(0, 1).getAttribute('aria-label')).toMatch(/, N Night/);
    await open(2);
    expect(await choose(/^E · Early/)).toBe(422);
    const overlap = dialog.getByText(/overlap by 30 min/);
    await overlap.waitFor();
    expect(await overlap.innerText()).not.toMatch(/-0 h/);
    expect(await reasonBox.count()).toBe(0);
    await screenshot(page, 'planning-board-overlap');
    await close();
    expect(await cell(0, 2).getAttribute('aria-label')).not.toMatch(/E Early/);

    // A Late (ends 22:30) then an Early (07:00) leaves 8 h 30 min of rest, under the 11 h of the demo
    // contracts: the edit names the rule and the caution, and is kept only with a reason.
    await setShift(1, /^L · Late/);
    await open(2);
    expect(await choose(/^E · Early/)).toBe(422);
    const breaks = dialog.getByRole('list', { name: 'Rules this edit breaks' });
    await breaks.getByText(/only 8 h 30 min of rest between L on .* and E on/).waitFor();
    await dialog.getByText(/Local law, collective agreements/).waitFor();
    const keep = dialog.getByRole('button', { name: 'Keep with this reason' });
    expect(await keep.isDisabled()).toBe(true);
    expect(await unnamedControls(page)).toEqual([]);
    await screenshot(page, 'planning-board-rest-caution');
    await reasonBox.fill('Agreed with the nurse for a long weekend off');
    const kept = nextEdit();
    await keep.click();
    expect((await kept).status()).toBe(200);
    await dialog.getByRole('list', { name: 'Rule findings for this cell' }).waitFor();
    await dialog
      .getByText(/Fatigue risk/)
      .first()
      .waitFor();
    await screenshot(page, 'planning-board-violation');

    await dialog.getByRole('button', { name: 'Pin' }).click();
    await dialog.getByText('Pinned: a new Generate keeps this cell as it is.').waitFor();
    await close();
    expect(await cell(0, 2).getAttribute('aria-label')).toMatch(/E Early, pinned, has a rule finding/);
    await page
      .getByRole('region', { name: 'Rule findings' })
      .getByText(/Fatigue risk/)
      .first()
      .waitFor();

    // Arrow keys move between cells of the grid.
    await cell(0, 2).focus();
    await page.keyboard.press('ArrowLeft');
    expect(await cell(0, 1).evaluate((el) => el === document.activeElement)).toBe(true);
    await screenshot(page, 'planning-board-pinned');
  });

  it('stops a new Generate on request and keeps the pinned cell', async () => {
    const { page } = browser;
    await page.getByRole('textbox', { name: 'Time limit (seconds)' }).fill('120');
    // The draft has generated shifts, an edit made by hand and a pin: Generate asks first, says what
    // it replaces and that the pin is kept; Cancel starts nothing.
    await page.getByRole('button', { name: 'Generate', exact: true }).click();
    const confirm = page.getByRole('alertdialog', { name: 'Replace the draft?' });
    await confirm.waitFor();
    expect(await confirm.innerText()).toMatch(
      /Generate replaces the \d+ shifts of this draft that are not pinned, including changes made by hand\. The 1 pinned cell stays as it is\./,
    );
    await screenshot(page, 'planning-board-replace-draft');
    await confirm.getByRole('button', { name: 'Cancel' }).click();
    await confirm.waitFor({ state: 'detached' });
    expect(await page.getByRole('button', { name: 'Stop' }).count()).toBe(0);
    await page.getByRole('button', { name: 'Generate', exact: true }).click();
    await confirm.getByRole('button', { name: 'Replace and generate' }).click();
    const status = page.getByRole('status', { name: 'Solve progress' });
    await status.getByText(/^Generating/).waitFor({ timeout: 30_000 });
    await page.getByRole('button', { name: 'Stop' }).click();
    await status.getByText(/^Stopped/).waitFor({ timeout: 60_000 });
    await page.getByRole('button', { name: 'Stop' }).waitFor({ state: 'detached' });
    // Pinned cells survive a new Generate (issue 4, item 3).
    await page.waitForFunction(() => !document.querySelector('button[data-row]:disabled'));
    expect(await cell(0, 2).getAttribute('aria-label')).toMatch(/E Early, pinned/);
  }, 120_000);
});
