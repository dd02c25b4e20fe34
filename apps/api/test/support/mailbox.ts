import { type MailMessageDto, type MailMessageSummaryDto, type Page } from '@rotaplex/contracts';
import { MailCatcherService } from '../../src/mail/mail-catcher.service';
import { MailMessageEntity } from '../../src/mail/mail-message.entity';
import { api, bearer, type TestApp } from './test-app';

/** Reads the newest message to `to` through the admin mailbox API (the catcher received it over SMTP). */
export async function latestMailTo(
  t: TestApp,
  adminToken: string,
  to: string,
): Promise<MailMessageDto | null> {
  const list = await t
    .http()
    .get(api('/mailbox'))
    .query({ q: to, pageSize: 100 })
    .set(bearer(adminToken))
    .expect(200);
  const page = list.body as Page<MailMessageSummaryDto>;
  const summary = page.items.find((m) => m.to.includes(to));
  if (!summary) return null;
  const res = await t
    .http()
    .get(api(`/mailbox/${summary.id}`))
    .set(bearer(adminToken))
    .expect(200);
  return res.body as MailMessageDto;
}

/** The token query parameter of the first link to `path` in a text body. */
export function linkToken(text: string, path: string): { url: string; token: string } {
  const match = new RegExp(`(https?://\\S+${path.replace(/[/]/g, '\\/')}\\?token=([A-Za-z0-9_%\\-]+))`).exec(
    text,
  );
  if (!match) throw new Error(`no ${path} link in: ${text}`);
  return { url: match[1], token: decodeURIComponent(match[2]) };
}

/**
 * Waits for a message to `to` whose subject matches and whose id is not in `seen` (the outbox
 * delivers in the background), marks it seen and reads it through the admin mailbox API.
 */
export async function nextMailTo(
  t: TestApp,
  adminToken: string,
  seen: Set<string>,
  to: string,
  subject: RegExp,
): Promise<MailMessageDto> {
  for (let i = 0; i < 100; i++) {
    const page = (
      await t.http().get(api('/mailbox')).query({ q: to, pageSize: 100 }).set(bearer(adminToken)).expect(200)
    ).body as Page<MailMessageSummaryDto>;
    const hit = page.items.find((m) => m.to.includes(to) && subject.test(m.subject) && !seen.has(m.id));
    if (hit) {
      seen.add(hit.id);
      return (
        await t
          .http()
          .get(api(`/mailbox/${hit.id}`))
          .set(bearer(adminToken))
          .expect(200)
      ).body as MailMessageDto;
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail to ${to} matching ${subject}`);
}

/**
 * Every message the local catcher kept, oldest first, with its bodies decrypted by the catcher
 * (they are stored sealed, see MailBodyCipher).
 */
export async function caughtMails(
  t: Pick<TestApp, 'app' | 'dataSource'>,
): Promise<{ id: string; from: string; to: string[]; subject: string; text: string; html: string | null }[]> {
  const rows = await t.dataSource.getRepository(MailMessageEntity).find({ order: { receivedAt: 'ASC' } });
  const catcher = t.app.get(MailCatcherService);
  return rows.map((m) => ({
    id: m.id,
    from: m.from,
    to: m.to,
    subject: m.subject,
    ...catcher.readBodies(m),
  }));
}
