import { randomUUID } from 'node:crypto';
import {
  type CalendarFeedDto,
  MY_ROSTER_ROUTES as M,
  PLANNING_ROUTES as P,
  type RosterPeriodDto,
  type ShiftTypeDto,
  type StaffMemberDto,
} from '@rotaplex/contracts';
import ICAL from 'ical.js';
import { AssignmentEntity } from '../src/roster-periods/assignment.entity';
import {
  createPeriod,
  findUnit,
  publishPeriod,
  putCell,
  shiftTypesByCode,
  staffByName,
} from './support/planning';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

/**
 * The personal iCalendar feed, read back with a general-purpose iCalendar parser (ical.js, the
 * parser of several calendar clients) rather than by string matching. Reference: RFC 5545
 * (iCalendar): UID (3.8.4.7), SEQUENCE (3.8.7.4), STATUS:CANCELLED (3.8.1.11), DTSTART/DTEND with
 * TZID (3.2.19, 3.8.2.4) and VTIMEZONE (3.6.5).
 *
 * Time zone facts (from memory, IANA tz database "EU" rule used by Europe/London since 1996):
 * summer time starts on the last Sunday of March at 01:00 UTC (clocks 01:00 GMT -> 02:00 BST) and
 * ends on the last Sunday of October at 01:00 UTC. In 2030 those Sundays are 31 March and
 * 27 October, so 30 March 2030 is on GMT (UTC+0) and 31 March onward on BST (UTC+1).
 */

type Component = InstanceType<typeof ICAL.Component>;

interface ParsedEvent {
  uid: string;
  sequence: number;
  status: string;
  summary: string;
  tzid: string | null;
  startLocal: string;
  endLocal: string;
  start: string;
  end: string;
}

/** Parses a feed with ical.js, registering its VTIMEZONEs so zoned times convert to instants. */
function parseFeed(text: string): { calendar: Component; events: Map<string, ParsedEvent> } {
  const calendar = new ICAL.Component(ICAL.parse(text));
  for (const tz of calendar.getAllSubcomponents('vtimezone')) ICAL.TimezoneService.register(tz);
  const events = new Map<string, ParsedEvent>();
  for (const v of calendar.getAllSubcomponents('vevent')) {
    const e = new ICAL.Event(v);
    const dtstart = v.getFirstProperty('dtstart')!;
    events.set(e.uid, {
      uid: e.uid,
      sequence: e.sequence,
      status: String(v.getFirstPropertyValue('status')),
      summary: e.summary,
      tzid: (dtstart.getParameter('tzid') as string | undefined) ?? null,
      startLocal: e.startDate.toString(),
      endLocal: e.endDate.toString(),
      start: e.startDate.toJSDate().toISOString(),
      end: e.endDate.toJSDate().toISOString(),
    });
  }
  return { calendar, events };
}

describe('iCalendar feed /api/calendar-feeds/:token.ics', () => {
  let t: TestApp;
  let manager: string;
  let staff: string;
  let period: RosterPeriodDto;
  let shifts: Record<string, ShiftTypeDto>;
  let robin: StaffMemberDto;
  let grace: StaffMemberDto;

  const feedPath = (url: string) => new URL(url).pathname;
  const readFeed = async (url: string) => {
    const res = await t.http().get(feedPath(url)).expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/calendar/);
    return parseFeed(res.text);
  };
  const uidOf = (staffMemberId: string, date: string) => `${date}-${staffMemberId}@rotaplex`;
  const setCell = (staffMemberId: string, date: string, code: string | null) =>
    putCell(t, manager, period.id, { staffMemberId, date, shiftTypeId: code ? shifts[code].id : null });

  beforeAll(async () => {
    t = await startTestApp();
    manager = (await t.login('manager@example.com')).token;
    staff = (await t.login('staff@example.com')).token;
    const ward = await findUnit(t, manager);
    expect(ward.timeZone).toBe('Europe/London');
    shifts = await shiftTypesByCode(t, manager, ward.id);
    const person = await staffByName(t, manager, ward.id);
    robin = person('Robin Tallis');
    grace = person('Grace Holloway');
    // A week across the 2030 spring clock change (31 March).
    period = await createPeriod(t, manager, ward.id, '2030-03-27');
    await setCell(robin.id, '2030-03-28', 'E');
    await setCell(robin.id, '2030-03-30', 'N');
    await setCell(robin.id, '2030-04-01', 'E');
    await setCell(robin.id, '2030-04-02', 'L');
    await setCell(grace.id, '2030-03-30', 'L');
    await publishPeriod(t, manager, period.id);
  });
  afterAll(() => t.close());

  it('gives the same secret URL on every read; it works without sign-in', async () => {
    const first = (await t.http().get(api(M.myCalendarFeed)).set(bearer(staff)).expect(200))
      .body as CalendarFeedDto;
    const again = (await t.http().get(api(M.myCalendarFeed)).set(bearer(staff)).expect(200))
      .body as CalendarFeedDto;
    expect(again.url).toBe(first.url);
    expect(first.url).toMatch(/^http:\/\/rotaplex\.test\/api\/calendar-feeds\/[A-Za-z0-9_-]{43}\.ics$/);
    // Only a hash of the token is stored.
    const token = feedPath(first.url)
      .split('/')
      .pop()!
      .replace(/\.ics$/, '');
    const rows = (await t.dataSource.query('SELECT * FROM calendar_feeds')) as Record<string, unknown>[];
    expect(JSON.stringify(rows)).not.toContain(token);
    await t.http().get(feedPath(first.url)).expect(200);
  });

  it('lists my published shifts with stable UIDs, zoned times and a VTIMEZONE (across the DST change)', async () => {
    const { url } = (await t.http().get(api(M.myCalendarFeed)).set(bearer(staff))).body as CalendarFeedDto;
    const { calendar, events } = await readFeed(url);
    expect(calendar.getFirstPropertyValue('version')).toBe('2.0');
    // Mine only: Grace's shift is not in Robin's feed.
    expect([...events.keys()].sort()).toEqual(
      ['2030-03-28', '2030-03-30', '2030-04-01', '2030-04-02'].map((d) => uidOf(robin.id, d)),
    );
    const zones = calendar.getAllSubcomponents('vtimezone');
    expect(zones.map((z) => z.getFirstPropertyValue('tzid'))).toEqual(['Europe/London']);
    // The spring observance: local 01:00 on 31 March 2030, +00:00 -> +01:00 (IANA EU rule, from memory).
    const spring = zones[0]
      .getAllSubcomponents('daylight')
      .find((d) => String(d.getFirstPropertyValue('dtstart')).startsWith('2030-03'));
    expect(String(spring?.getFirstPropertyValue('dtstart'))).toBe('2030-03-31T01:00:00');
    expect(String(spring?.getFirstPropertyValue('tzoffsetfrom'))).toBe('+00:00');
    expect(String(spring?.getFirstPropertyValue('tzoffsetto'))).toBe('+01:00');

    const early = events.get(uidOf(robin.id, '2030-03-28'))!;
    // Demo ward shift types: Early 07:00-15:00, Night 22:00-07:30, Late 14:30-22:30 (unit's zone).
    expect(early).toMatchObject({
      tzid: 'Europe/London',
      startLocal: '2030-03-28T07:00:00',
      endLocal: '2030-03-28T15:00:00',
      start: '2030-03-28T07:00:00.000Z', // GMT: UTC+0
      end: '2030-03-28T15:00:00.000Z',
      sequence: 0,
      status: 'CONFIRMED',
      summary: 'Early, Ward 7 Acute Medicine',
    });
    // The night across the change is one hour shorter in real time: 22:00 GMT to 07:30 BST.
    expect(events.get(uidOf(robin.id, '2030-03-30'))).toMatchObject({
      startLocal: '2030-03-30T22:00:00',
      endLocal: '2030-03-31T07:30:00',
      start: '2030-03-30T22:00:00.000Z',
      end: '2030-03-31T06:30:00.000Z',
    });
    // After the change the same Early shift starts at 06:00 UTC (BST: UTC+1).
    expect(events.get(uidOf(robin.id, '2030-04-01'))).toMatchObject({
      startLocal: '2030-04-01T07:00:00',
      start: '2030-04-01T06:00:00.000Z',
      end: '2030-04-01T14:00:00.000Z',
    });
  });

  it('keeps UIDs and sequences when the rows are rewritten unchanged (as a re-solve does)', async () => {
    const { url } = (await t.http().get(api(M.myCalendarFeed)).set(bearer(staff))).body as CalendarFeedDto;
    const before = (await readFeed(url)).events;
    // Replace every assignment row of the period by a copy with a new id.
    await t.dataSource.transaction(async (em) => {
      const rows = (await em.query(`SELECT * FROM assignments WHERE "rosterPeriodId" = ?`, [period.id])) as {
        staffMemberId: string;
        date: string;
        shiftTypeId: string | null;
        pinned: number | boolean; // 0/1 on SQLite, a boolean on PostgreSQL
      }[];
      await em.query(`DELETE FROM assignments WHERE "rosterPeriodId" = ?`, [period.id]);
      for (const r of rows) {
        await em.query(
          `INSERT INTO assignments (id, "rosterPeriodId", "staffMemberId", date, "shiftTypeId", pinned) VALUES (?, ?, ?, ?, ?, ?)`,
          [randomUUID(), period.id, r.staffMemberId, r.date, r.shiftTypeId, r.pinned],
        );
      }
    });
    const after = (await readFeed(url)).events;
    expect([...after.values()].map((e) => [e.uid, e.sequence, e.start])).toEqual(
      [...before.values()].map((e) => [e.uid, e.sequence, e.start]),
    );
  });

  it('raises SEQUENCE and moves the event after a roster change; a removed shift is cancelled', async () => {
    const { url } = (await t.http().get(api(M.myCalendarFeed)).set(bearer(staff))).body as CalendarFeedDto;
    const before = (await readFeed(url)).events;
    // A change made behind the feed's back (as a swap or repair would): Early -> Late on 1 April,
    // and the Late of 2 April removed.
    await t.dataSource.query(
      `UPDATE assignments SET "shiftTypeId" = ? WHERE "rosterPeriodId" = ? AND "staffMemberId" = ? AND date = ?`,
      [shifts.L.id, period.id, robin.id, '2030-04-01'],
    );
    await t.dataSource.query(
      `DELETE FROM assignments WHERE "rosterPeriodId" = ? AND "staffMemberId" = ? AND date = ?`,
      [period.id, robin.id, '2030-04-02'],
    );
    const after = (await readFeed(url)).events;
    const moved = after.get(uidOf(robin.id, '2030-04-01'))!;
    expect(moved.sequence).toBe(before.get(moved.uid)!.sequence + 1);
    expect(moved).toMatchObject({
      status: 'CONFIRMED',
      summary: 'Late, Ward 7 Acute Medicine',
      start: '2030-04-01T13:30:00.000Z', // 14:30 BST
      end: '2030-04-01T21:30:00.000Z',
    });
    const removed = after.get(uidOf(robin.id, '2030-04-02'))!;
    expect(removed.status).toBe('CANCELLED');
    expect(removed.sequence).toBe(before.get(removed.uid)!.sequence + 1);
    expect(removed.start).toBe('2030-04-02T13:30:00.000Z'); // the times it had
    // Untouched shifts keep their sequence.
    expect(after.get(uidOf(robin.id, '2030-03-28'))!.sequence).toBe(
      before.get(uidOf(robin.id, '2030-03-28'))!.sequence,
    );

    // Reading again changes nothing: the sequence rises once per change, not per read.
    const again = (await readFeed(url)).events;
    expect([...again.values()].map((e) => [e.uid, e.sequence, e.status])).toEqual(
      [...after.values()].map((e) => [e.uid, e.sequence, e.status]),
    );

    // The shift comes back: confirmed again with a higher sequence.
    await t.dataSource.query(
      `INSERT INTO assignments (id, "rosterPeriodId", "staffMemberId", date, "shiftTypeId", pinned) VALUES (?, ?, ?, ?, ?, FALSE)`,
      [randomUUID(), period.id, robin.id, '2030-04-02', shifts.E.id],
    );
    const back = (await readFeed(url)).events.get(uidOf(robin.id, '2030-04-02'))!;
    expect(back).toMatchObject({
      status: 'CONFIRMED',
      sequence: removed.sequence + 1,
      start: '2030-04-02T06:00:00.000Z',
    });
  });

  it('reads without queueing behind an open transaction, sees only committed shifts, and writes only on a change', async () => {
    const { url } = (await t.http().get(api(M.myCalendarFeed)).set(bearer(staff))).body as CalendarFeedDto;
    const before = (await readFeed(url)).events;
    const uid = uidOf(robin.id, '2030-03-28');
    const stored = () =>
      t.dataSource.query(`SELECT sequence, "changedAt" FROM calendar_feed_events WHERE uid = ?`, [uid]);
    const row = await stored();

    // Another writer holds a transaction open (all other queries of the main connection wait for
    // it) and has changed Robin's Early of 28 March to a Night, not yet committed.
    let release!: () => void;
    const held = new Promise<void>((resolve) => (release = resolve));
    let changed!: () => void;
    const changing = new Promise<void>((resolve) => (changed = resolve));
    const writer = t.dataSource.transaction(async (em) => {
      await em.update(
        AssignmentEntity,
        { rosterPeriodId: period.id, staffMemberId: robin.id, date: '2030-03-28' },
        { shiftTypeId: shifts.N.id },
      );
      changed();
      await held;
    });
    await changing;
    // A safety net only: a read that queued behind the writer would never end while it is held.
    const queued = new Promise<'queued'>((resolve) => setTimeout(() => resolve('queued'), 20_000));
    const during = await Promise.race([readFeed(url), queued]);
    release();
    await writer;
    expect(during).not.toBe('queued');
    const seen = (during as Awaited<ReturnType<typeof readFeed>>).events;
    expect(seen.get(uid)).toMatchObject({
      summary: before.get(uid)!.summary,
      sequence: before.get(uid)!.sequence,
    });
    // Nothing changed for the feed, so nothing was written.
    expect(await stored()).toEqual(row);

    // Once committed, the next read records the change (one transaction) and shows it.
    const after = (await readFeed(url)).events.get(uid)!;
    expect(after).toMatchObject({
      summary: 'Night, Ward 7 Acute Medicine',
      sequence: before.get(uid)!.sequence + 1,
    });
    expect((await stored())[0].sequence).toBe(after.sequence);
  });

  it('leaves draft rosters out', async () => {
    const { url } = (await t.http().get(api(M.myCalendarFeed)).set(bearer(staff))).body as CalendarFeedDto;
    const uids = [...(await readFeed(url)).events.keys()];
    // The demo periods are drafts with no published cells; only the 2030 week shows.
    expect(uids.every((u) => u.startsWith('2030-'))).toBe(true);
  });

  it('regenerates the URL: the old one then answers 404', async () => {
    const old = (await t.http().get(api(M.myCalendarFeed)).set(bearer(staff))).body as CalendarFeedDto;
    const fresh = (await t.http().post(api(M.myCalendarFeedRegenerate)).set(bearer(staff)).expect(200))
      .body as CalendarFeedDto;
    expect(fresh.url).not.toBe(old.url);
    await t.http().get(feedPath(old.url)).expect(404);
    await t.http().get(feedPath(fresh.url)).expect(200);
    const current = (await t.http().get(api(M.myCalendarFeed)).set(bearer(staff))).body as CalendarFeedDto;
    expect(current.url).toBe(fresh.url);
  });

  it('answers 404 to an unknown or malformed token, and the feed routes need sign-in', async () => {
    await t
      .http()
      .get(api(M.calendarFeed('A'.repeat(43))))
      .expect(404);
    await t
      .http()
      .get(api(M.calendarFeed('nope')))
      .expect(404);
    await t.http().get(api('/calendar-feeds/whatever')).expect(404);
    await t.http().get(api(M.myCalendarFeed)).expect(401);
    await t.http().post(api(M.myCalendarFeedRegenerate)).expect(401);
  });

  it("gives each person their own feed: a colleague's feed has their shifts, not mine", async () => {
    const graceToken = (await t.login('grace.holloway@example.com')).token;
    const { url } = (await t.http().get(api(M.myCalendarFeed)).set(bearer(graceToken)).expect(200))
      .body as CalendarFeedDto;
    const mine = (await t.http().get(api(M.myCalendarFeed)).set(bearer(staff))).body as CalendarFeedDto;
    expect(url).not.toBe(mine.url);
    const events = (await readFeed(url)).events;
    expect([...events.keys()]).toEqual([uidOf(grace.id, '2030-03-30')]);
    expect(events.get(uidOf(grace.id, '2030-03-30'))).toMatchObject({
      start: '2030-03-30T14:30:00.000Z',
      end: '2030-03-30T22:30:00.000Z',
    });
  });
  it('keeps the shifts of an archived period (a closed roster is not cancelled)', async () => {
    const { url } = (await t.http().get(api(M.myCalendarFeed)).set(bearer(staff))).body as CalendarFeedDto;
    const before = (await readFeed(url)).events;
    await t
      .http()
      .post(api(P.rosterPeriodArchive(period.id)))
      .set(bearer(manager))
      .expect(200);
    const after = (await readFeed(url)).events;
    expect([...after.values()].map((e) => [e.uid, e.sequence, e.status])).toEqual(
      [...before.values()].map((e) => [e.uid, e.sequence, e.status]),
    );
  });

  it("closes a deactivated user's feed (404)", async () => {
    const { url } = (await t.http().get(api(M.myCalendarFeed)).set(bearer(staff))).body as CalendarFeedDto;
    await t.http().get(feedPath(url)).expect(200);
    await t.dataSource.query(`UPDATE users SET active = FALSE WHERE email = ?`, ['staff@example.com']);
    await t.http().get(feedPath(url)).expect(404);
  });
});
