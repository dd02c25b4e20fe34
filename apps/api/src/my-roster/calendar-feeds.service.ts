import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { API_PREFIX, type CalendarFeedDto, MY_ROSTER_ROUTES } from '@rotaplex/contracts';
import { createHmac, randomBytes } from 'node:crypto';
import { DataSource, type EntityManager } from 'typeorm';
import { type AuthUser } from '../common/auth-user';
import { sha256 } from '../common/crypto';
import { AppConfig } from '../config/app-config';
import { ReadConnection } from '../database/read-connection';
import { StaffService } from '../staff/staff.service';
import { UsersService } from '../users/users.service';
import { CalendarFeedEntity, CalendarFeedEventEntity } from './calendar-feed.entity';
import { type FeedEvent, type FeedEventContent, writeCalendar } from './ical-feed';
import { type PublishedShift, PublishedShifts } from './published-shifts';

/** Feed tokens are 32 bytes of HMAC-SHA256 in base64url: 43 characters. */
const TOKEN_FORMAT = /^[A-Za-z0-9_-]{43}$/;

/** UID of a person's shift on a day: stable across re-solves, repairs and swaps (one shift a day). */
export function feedUid(staffMemberId: string, date: string): string {
  return `${date}-${staffMemberId}@rotaplex`;
}

/** The event content of a shift, with its keys always in the same order (it is hashed). */
export function feedContent(s: PublishedShift): FeedEventContent {
  return {
    summary: `${s.shiftName}, ${s.unitName}`,
    location: s.unitName,
    description: `${s.shiftName} shift (${s.shiftCode}), ${s.startTime} to ${s.endTime} ${s.timeZone} time, ${s.paidMinutes} paid minutes, ${s.unitName}.`,
    timeZone: s.timeZone,
    start: new Date(s.start).toISOString(),
    end: new Date(s.end).toISOString(),
  };
}

/**
 * Personal iCalendar feeds (RFC 5545).
 *
 * The URL carries a secret token; only its SHA-256 is stored, plus a random nonce from which the
 * server (and only the server, which holds the key) can compute the token again to show the URL.
 *
 * What the feed last said is kept per user and UID (calendar_feed_events). The table is brought up
 * to date lazily, each time the feed is read: a new shift is added with SEQUENCE 0, a changed one
 * gets SEQUENCE + 1, a shift that is gone is sent as STATUS:CANCELLED with SEQUENCE + 1. So swaps,
 * repairs and edits made anywhere in the API show up in the feed without calling this service; a
 * module that wants the table current at once may call {@link CalendarFeedsService.sync}.
 *
 * Calendar programs poll the feed; almost every read finds nothing changed. A read therefore runs
 * on the read-only connection (it does not queue behind, or hold up, the writers) and takes a
 * write transaction only when what the feed says really changes.
 */
@Injectable()
export class CalendarFeedsService {
  private readonly key: Buffer;

  private readonly publicUrl: string | null;

  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly reads: ReadConnection,
    config: AppConfig,
    private readonly staff: StaffService,
    private readonly users: UsersService,
    private readonly published: PublishedShifts,
  ) {
    if (!config.jwtSecret) throw new Error('The server secret is not resolved');
    // A key of its own, derived from the server secret (a new JWT_SECRET also changes every feed URL).
    this.key = createHmac('sha256', config.jwtSecret).update('rotaplex calendar feed token').digest();
    this.publicUrl = config.publicUrl;
  }

  private token(feed: Pick<CalendarFeedEntity, 'userId' | 'nonce'>): string {
    return createHmac('sha256', this.key).update(`${feed.userId}:${feed.nonce}`).digest('base64url');
  }

  private urlOf(feed: CalendarFeedEntity, origin: string): CalendarFeedDto {
    const base = (this.publicUrl ?? origin).replace(/\/+$/, '');
    return { url: `${base}${API_PREFIX}${MY_ROSTER_ROUTES.calendarFeed(this.token(feed))}` };
  }

  private withNewToken(feed: CalendarFeedEntity): CalendarFeedEntity {
    feed.nonce = randomBytes(24).toString('base64url');
    feed.tokenHash = sha256(this.token(feed));
    return feed;
  }

  /** The caller's feed URL, creating the feed on first use. */
  async url(user: AuthUser, origin: string): Promise<CalendarFeedDto> {
    const existing = await this.reads.manager.findOne(CalendarFeedEntity, { where: { userId: user.id } });
    if (existing) return this.urlOf(existing, origin);
    return this.dataSource.transaction(async (em) => {
      const repo = em.getRepository(CalendarFeedEntity);
      const feed =
        (await repo.findOne({ where: { userId: user.id } })) ??
        (await repo.save(this.withNewToken(repo.create({ userId: user.id }))));
      return this.urlOf(feed, origin);
    });
  }

  /** A new secret URL; the old one stops working at once. */
  async regenerate(user: AuthUser, origin: string): Promise<CalendarFeedDto> {
    return this.dataSource.transaction(async (em) => {
      const repo = em.getRepository(CalendarFeedEntity);
      const feed = (await repo.findOne({ where: { userId: user.id } })) ?? repo.create({ userId: user.id });
      return this.urlOf(await repo.save(this.withNewToken(feed)), origin);
    });
  }

  /** The iCalendar text of the feed a token opens; 404 for an unknown or replaced token. */
  async render(token: string): Promise<string> {
    const notFound = new NotFoundException('No calendar feed at this address');
    if (!TOKEN_FORMAT.test(token)) throw notFound;
    const read = this.reads.manager;
    const feed = await read.findOne(CalendarFeedEntity, { where: { tokenHash: sha256(token) } });
    if (!feed) throw notFound;
    const user = await this.users.byId(feed.userId, read);
    if (!user || !user.active) throw notFound;
    const title = `Rotaplex roster (${user.displayName})`;
    const seen = await this.compare(feed.userId, read);
    if (seen.changed.length === 0) return writeCalendar(title, seen.events);
    // Something changed since the last read: record it, comparing again inside the transaction.
    return writeCalendar(title, await this.sync(feed.userId));
  }

  /**
   * Brings what the user's feed says up to date with the visible rosters and returns every event
   * the feed lists (current shifts and cancelled ones), ordered by start.
   */
  async sync(userId: string, em?: EntityManager): Promise<FeedEvent[]> {
    if (!em) return this.dataSource.transaction((tx) => this.sync(userId, tx));
    const { events, changed } = await this.compare(userId, em);
    if (changed.length) await em.getRepository(CalendarFeedEventEntity).save(changed, { chunk: 100 });
    return events;
  }

  /**
   * What the feed should list now, and the rows of calendar_feed_events that must change for it
   * (new, changed or cancelled events, already updated in memory, not saved).
   */
  private async compare(
    userId: string,
    em: EntityManager,
  ): Promise<{ events: FeedEvent[]; changed: CalendarFeedEventEntity[] }> {
    const records = await this.staff.ofUser(userId, em);
    const shifts = await this.published.of({ staffMemberIds: records.map((r) => r.id) }, em);
    const current = new Map(shifts.map((s) => [feedUid(s.staffMemberId, s.date), feedContent(s)]));
    const repo = em.getRepository(CalendarFeedEventEntity);
    const known = new Map((await repo.find({ where: { userId } })).map((e) => [e.uid, e]));
    const now = new Date();
    const changed: CalendarFeedEventEntity[] = [];

    for (const [uid, content] of current) {
      const text = JSON.stringify(content);
      const hash = sha256(text);
      const last = known.get(uid);
      if (!last) {
        const created = repo.create({
          userId,
          uid,
          sequence: 0,
          contentHash: hash,
          cancelled: false,
          content: text,
          changedAt: now,
        });
        known.set(uid, created);
        changed.push(created);
      } else if (last.cancelled || last.contentHash !== hash) {
        Object.assign(last, {
          sequence: last.sequence + 1,
          contentHash: hash,
          cancelled: false,
          content: text,
          changedAt: now,
        });
        changed.push(last);
      }
    }
    for (const [uid, last] of known) {
      if (current.has(uid) || last.cancelled) continue;
      Object.assign(last, { sequence: last.sequence + 1, cancelled: true, changedAt: now });
      changed.push(last);
    }
    const events = [...known.values()]
      .map((e) => ({
        uid: e.uid,
        sequence: e.sequence,
        cancelled: e.cancelled,
        createdAt: e.createdAt ?? now,
        changedAt: e.changedAt,
        content: JSON.parse(e.content) as FeedEventContent,
      }))
      .sort((a, b) => a.content.start.localeCompare(b.content.start) || a.uid.localeCompare(b.uid));
    return { events, changed };
  }
}
