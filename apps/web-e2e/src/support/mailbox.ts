import type { Page } from 'playwright-core';
import { eventually, screenshot, unnamedControls } from './browser';

/**
 * Opens the newest message to `to` in the admin's mailbox page and returns the one link in it
 * whose address contains `path` (for example "/accept-invitation?token="). The page must be
 * signed in as someone who may read the mailbox.
 */
export async function linkFromMailbox(page: Page, to: string, path: string, shot?: string): Promise<string> {
  await page.goto('/admin/mailbox');
  await page.getByRole('heading', { level: 1, name: 'Mailbox' }).waitFor();
  const rows = page.getByRole('table', { name: 'Messages' }).getByRole('row').filter({ hasText: to });
  await eventually(async () => {
    if ((await rows.count()) > 0) return true;
    await page.getByRole('button', { name: 'Refresh' }).click();
    return undefined;
  }, `a message to ${to} in the mailbox`);
  // Newest first: the first row is the latest message to this person.
  await rows.first().getByRole('link').click();
  await page.getByRole('heading', { name: 'Links in this message' }).waitFor();
  expect(await unnamedControls(page)).toEqual([]);
  if (shot) await screenshot(page, shot);
  const escaped = path.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  const links = await page
    .getByRole('link', { name: new RegExp(escaped) })
    .evaluateAll((els) => els.map((el) => (el as HTMLAnchorElement).href));
  expect(links).toHaveLength(1);
  return links[0];
}
