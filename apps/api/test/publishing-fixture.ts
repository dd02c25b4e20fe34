import {
  PLANNING_ROUTES as P,
  type RosterPeriodDto,
  type ShiftTypeDto,
  SOLVING_ROUTES as R,
  type SolveRunDto,
  type StaffMemberDto,
  type UnitDto,
} from '@rotaplex/contracts';
import { api, bearer, type TestApp } from './support/test-app';

/** Polls until `check` returns a value other than undefined (solves and the outbox run in the background). */
export async function until<T>(
  what: string,
  check: () => Promise<T | undefined>,
  timeoutMs = 90_000,
): Promise<T> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const v = await check();
    if (v !== undefined) return v;
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

export interface SmallUnit {
  unit: UnitDto;
  shifts: ShiftTypeDto[];
  staff: StaffMemberDto[];
  period: RosterPeriodDto;
}

/**
 * A small unit of our own (invented for the tests): five people, an early and a late shift, one of
 * each needed every day, and a one-week draft period. Small enough that the solver proves the
 * optimum in well under a second, so the tests do not depend on the machine's load.
 */
export async function smallUnit(
  t: TestApp,
  admin: string,
  name: string,
  startDate: string,
  timeZone = 'Europe/London',
): Promise<SmallUnit> {
  const unit = (await t.http().post(api('/units')).set(bearer(admin)).send({ name, timeZone }).expect(201))
    .body as UnitDto;
  const shifts: ShiftTypeDto[] = [];
  for (const s of [
    { code: 'E', name: 'Early', start: '07:00', end: '15:00', paidMinutes: 450, colour: 'teal' },
    { code: 'L', name: 'Late', start: '14:30', end: '22:30', paidMinutes: 450, colour: 'amber' },
  ]) {
    shifts.push(
      (
        await t
          .http()
          .post(api(P.shiftTypes(unit.id)))
          .set(bearer(admin))
          .send(s)
          .expect(201)
      ).body as ShiftTypeDto,
    );
  }
  const staff: StaffMemberDto[] = [];
  for (const person of ['Maren Oakes', 'Tobiah Quill', 'Sunniva Hart', 'Ezra Lindqvist', 'Noor Castell']) {
    staff.push(
      (
        await t
          .http()
          .post(api(P.staff))
          .set(bearer(admin))
          .send({
            unitId: unit.id,
            name: person,
            email: `${person.toLowerCase().replace(/\s+/g, '.')}@${name.toLowerCase().replace(/\W+/g, '')}.example`,
            skills: [],
          })
          .expect(201)
      ).body as StaffMemberDto,
    );
  }
  const rows = [0, 1, 2, 3, 4, 5, 6].flatMap((weekday) =>
    shifts.map((s) => ({ weekday, shiftTypeId: s.id, skillId: null, min: 1, target: 1 })),
  );
  await t
    .http()
    .put(api(P.coverPattern(unit.id)))
    .set(bearer(admin))
    .send({ rows })
    .expect(200);
  const period = (
    await t
      .http()
      .post(api(P.rosterPeriods))
      .set(bearer(admin))
      .send({ unitId: unit.id, startDate, days: 7 })
      .expect(201)
  ).body as RosterPeriodDto;
  return { unit, shifts, staff, period };
}

/** Generates a period's roster and waits for the run to end. */
export async function generate(
  t: TestApp,
  token: string,
  periodId: string,
  timeLimitSeconds = 60,
): Promise<SolveRunDto> {
  const started = await t
    .http()
    .post(api(R.periodSolveRuns(periodId)))
    .set(bearer(token))
    .send({ timeLimitSeconds })
    .expect(202);
  return waitForRun(t, token, (started.body as { id: string }).id);
}

export function waitForRun(t: TestApp, token: string, id: string): Promise<SolveRunDto> {
  return until('the solve run to end', async () => {
    const run = (
      await t
        .http()
        .get(api(R.solveRun(id)))
        .set(bearer(token))
    ).body as SolveRunDto;
    return ['finished', 'failed', 'cancelled'].includes(run.status) ? run : undefined;
  });
}

/** Waits until the outbox has nothing left to send. */
export function outboxSettled(t: TestApp): Promise<true> {
  return until('the outbox to settle', async () =>
    ((await t.dataSource.query(`SELECT id FROM outbox_messages WHERE status != 'sent'`)) as unknown[])
      .length === 0
      ? true
      : undefined,
  );
}
