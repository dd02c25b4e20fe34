import {
  type AssignmentGridDto,
  CONTRACT_RULE_FIELDS,
  type ContractRules,
  type Page,
  PLANNING_ROUTES as P,
  PUBLISHING_ROUTES,
  type RosterPeriodDto,
  type ShiftTypeDto,
  SOLVING_ROUTES as R,
  type StaffMemberDto,
  type UnitDto,
} from '@rotaplex/contracts';
import { ContractEntity } from '../../src/contracts/contract.entity';
import { RosterPeriodEntity } from '../../src/roster-periods/roster-period.entity';
import { StaffMemberEntity } from '../../src/staff/staff-member.entity';
import { api, bearer, type TestApp } from './test-app';

/**
 * Set-up steps the API specs share: finding the demo ward and its shift types and staff, creating a
 * period, setting cells, reading the grid and publishing. Each step goes through the real API (and
 * fails on an unexpected status) unless its name says it writes the database directly.
 */

/** The demo ward most specs plan in (demo data). */
export const DEMO_WARD = 'Ward 7 Acute Medicine';

/** The units the token's holder can see. */
export async function listUnits(t: TestApp, token: string): Promise<UnitDto[]> {
  return (await t.http().get(api('/units')).set(bearer(token)).expect(200)).body as UnitDto[];
}

/** The unit with that name among those the token's holder can see (the demo ward by default). */
export async function findUnit(t: TestApp, token: string, name = DEMO_WARD): Promise<UnitDto> {
  const unit = (await listUnits(t, token)).find((u) => u.name === name);
  if (!unit) throw new Error(`no unit named ${name}`);
  return unit;
}

/** Creates a draft roster period of the unit. */
export async function createPeriod(
  t: TestApp,
  token: string,
  unitId: string,
  startDate: string,
  days = 7,
): Promise<RosterPeriodDto> {
  return (
    await t.http().post(api(P.rosterPeriods)).set(bearer(token)).send({ unitId, startDate, days }).expect(201)
  ).body as RosterPeriodDto;
}

/** The unit's shift types by code (E, L, N, ...). */
export async function shiftTypesByCode(
  t: TestApp,
  token: string,
  unitId: string,
): Promise<Record<string, ShiftTypeDto>> {
  const types = (
    await t
      .http()
      .get(api(P.shiftTypes(unitId)))
      .set(bearer(token))
      .expect(200)
  ).body as ShiftTypeDto[];
  return Object.fromEntries(types.map((s) => [s.code, s]));
}

/** Looks up the unit's staff members by name (throws on a name that is not on the unit). */
export async function staffByName(
  t: TestApp,
  token: string,
  unitId: string,
): Promise<(name: string) => StaffMemberDto> {
  const people = (
    await t.http().get(api(P.staff)).query({ unitId, pageSize: 100 }).set(bearer(token)).expect(200)
  ).body as Page<StaffMemberDto>;
  return (name) => {
    const person = people.items.find((p) => p.name === name);
    if (!person) throw new Error(`no staff member named ${name}`);
    return person;
  };
}

/** The period's grid of people by days, with the checker's result. */
export async function readGrid(t: TestApp, token: string, periodId: string): Promise<AssignmentGridDto> {
  return (
    await t
      .http()
      .get(api(R.assignments(periodId)))
      .set(bearer(token))
      .expect(200)
  ).body as AssignmentGridDto;
}

/** Sets (or, with a null shift type, clears) one cell through the assignments API. */
export async function putCell(
  t: TestApp,
  token: string,
  periodId: string,
  cell: { staffMemberId: string; date: string; shiftTypeId: string | null },
): Promise<void> {
  await t
    .http()
    .put(api(R.assignmentCell(periodId)))
    .set(bearer(token))
    .send(cell)
    .expect(200);
}

/** The period as it is now. */
export async function readPeriod(t: TestApp, token: string, periodId: string): Promise<RosterPeriodDto> {
  return (
    await t
      .http()
      .get(api(P.rosterPeriod(periodId)))
      .set(bearer(token))
      .expect(200)
  ).body as RosterPeriodDto;
}

/**
 * Publishes a draft period through the publish endpoint, with the version it has now, and returns
 * that version. Test rosters are sparse, so it acknowledges shifts below minimum cover with a reason.
 */
export async function publishPeriod(t: TestApp, token: string, periodId: string): Promise<number> {
  const { version } = await readPeriod(t, token, periodId);
  await t
    .http()
    .post(api(PUBLISHING_ROUTES.publish(periodId)))
    .set(bearer(token))
    .send({ version, acknowledgeBelowMinimum: true, reason: 'A test roster: only the shifts the test needs' })
    .expect(200);
  return version;
}

/** Marks a period published by writing the database directly (no publish e-mails, no audit entry). */
export async function markPublished(t: TestApp, periodId: string): Promise<void> {
  await t.dataSource.manager.update(
    RosterPeriodEntity,
    { id: periodId },
    { status: 'published', publishedAt: new Date() },
  );
}

/**
 * Puts everyone on the unit on one new organisation-wide contract whose only rule is 11 consecutive
 * hours of daily rest (EU Working Time Directive 2003/88/EC, Art. 3), written to the database
 * directly, so a sparse test roster breaks no other rule. Returns the unit's staff as stored.
 */
export async function restOnlyContract(t: TestApp, unitId: string): Promise<StaffMemberEntity[]> {
  const em = t.dataSource.manager;
  const [{ organisationId }] = (await em.query(`SELECT "organisationId" FROM "units" WHERE "id" = ?`, [
    unitId,
  ])) as { organisationId: string }[];
  const noRules = Object.fromEntries(CONTRACT_RULE_FIELDS.map((f) => [f, null])) as unknown as ContractRules;
  const contract = await em.save(
    em.create(ContractEntity, {
      ...noRules,
      organisationId,
      unitId: null,
      name: 'Rest only (test)',
      minRestMinutes: 660,
    }),
  );
  await em.update(StaffMemberEntity, { unitId }, { contractId: contract.id });
  return em.findBy(StaffMemberEntity, { unitId });
}

/** Staff member ids keyed like `emails` ('' for an address nobody on the list has). */
export function idsByEmail<K extends string>(
  staff: { id: string; email: string | null }[],
  emails: Record<K, string>,
): Record<K, string> {
  return Object.fromEntries(
    (Object.keys(emails) as K[]).map((k) => [k, staff.find((s) => s.email === emails[k])?.id ?? '']),
  ) as Record<K, string>;
}

/**
 * Demo people on the demo ward the swap and open-shift specs act as (demo data): a = Robin Tallis
 * (the demo staff sign-in), b = Priya Wendover, c = Tomasz Kellaway, d = Grace Holloway, and
 * contact = a person of the contact centre (another unit).
 */
export const WARD_PEOPLE = {
  a: 'staff@example.com',
  b: 'priya.wendover@example.com',
  c: 'tomasz.kellaway@example.com',
  d: 'grace.holloway@example.com',
  contact: 'sofia.marin@example.com',
} as const;
export type WardPerson = keyof typeof WARD_PEOPLE;

/** Signs every one of `emails` in and returns their access tokens under the same keys. */
export async function loginAll<K extends string>(
  t: TestApp,
  emails: Record<K, string>,
): Promise<Record<K, string>> {
  const tokens = {} as Record<K, string>;
  for (const key of Object.keys(emails) as K[]) tokens[key] = (await t.login(emails[key])).token;
  return tokens;
}
