import {
  type Page,
  PLANNING_ROUTES as P,
  type RosterPeriodDto,
  SOLVING_ROUTES as R,
  type SolveRunDto,
  type SolveRunSummaryDto,
} from '@rotaplex/contracts';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { SolveRunEntity } from '../src/solve-runs/solve-run.entity';
import { RESTARTED_MESSAGE, SolveRunsService } from '../src/solve-runs/solve-runs.service';
import { createPeriod, findUnit, readGrid } from './support/planning';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

/** Polls `read` until `done` holds (real solves on the worker pool take seconds). */
async function waitFor<T>(read: () => Promise<T>, done: (v: T) => boolean, timeoutMs = 90_000): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const v = await read();
    if (done(v)) return v;
    if (Date.now() > until) throw new Error(`timed out waiting; last value: ${JSON.stringify(v)}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

interface SseEvent {
  event: string;
  data: unknown;
}

/** Parses a text/event-stream body into its events (comment lines skipped). */
function parseSse(text: string): SseEvent[] {
  return text
    .split('\n\n')
    .map((block) => block.split('\n').filter((l) => l && !l.startsWith(':')))
    .filter((lines) => lines.length > 0)
    .map((lines) => ({
      event: lines.find((l) => l.startsWith('event: '))?.slice(7) ?? 'message',
      data: JSON.parse(
        lines
          .filter((l) => l.startsWith('data: '))
          .map((l) => l.slice(6))
          .join('\n'),
      ),
    }));
}

const ENDED = ['finished', 'failed', 'cancelled'];

describe('solve runs', () => {
  let t: TestApp;
  let manager: string;
  let manager2: string;
  let staff: string;
  /** The demo's four-week draft: large enough that a solve is still running when the tests act on it. */
  let period: RosterPeriodDto;
  /** A one-week draft of the same unit: solved within a few seconds. */
  let week: RosterPeriodDto;

  beforeAll(async () => {
    t = await startTestApp();
    const admin = (await t.login('admin@example.com')).token;
    manager = (await t.login('manager@example.com')).token;
    manager2 = (await t.login('manager2@example.com')).token;
    staff = (await t.login('staff@example.com')).token;
    const ward = await findUnit(t, admin);
    const periods = (await t.http().get(api(P.rosterPeriods)).query({ unitId: ward.id }).set(bearer(manager)))
      .body as Page<RosterPeriodDto>;
    period = periods.items[0];
    week = await createPeriod(t, manager, ward.id, '2030-01-07');
  });
  afterAll(() => t.close());

  const start = (body: object, token = manager, periodId = period.id) =>
    t
      .http()
      .post(api(R.periodSolveRuns(periodId)))
      .set(bearer(token))
      .send(body);
  const getRun = async (id: string) =>
    (
      await t
        .http()
        .get(api(R.solveRun(id)))
        .set(bearer(manager))
        .expect(200)
    ).body as SolveRunDto;
  const untilEnded = (id: string) =>
    waitFor(
      () => getRun(id),
      (r) => ENDED.includes(r.status),
    );
  const untilImproving = (id: string) =>
    waitFor(
      () => getRun(id),
      (r) => ENDED.includes(r.status) || (r.status === 'running' && r.progress?.objective != null),
    );

  it('refuses bad input naming the field, callers without a token, staff and other units', async () => {
    for (const timeLimitSeconds of [0, 601, 2.5, 'ten']) {
      const res = await start({ timeLimitSeconds });
      expect(res.status).toBe(400);
      expect(JSON.stringify(res.body)).toMatch(/timeLimitSeconds/);
    }
    const missing = await start({});
    expect(missing.status).toBe(400);
    expect(JSON.stringify(missing.body)).toMatch(/timeLimitSeconds/);
    const weight = await start({ timeLimitSeconds: 5, weights: { coverOver: -1 } });
    expect(weight.status).toBe(400);
    expect(JSON.stringify(weight.body)).toMatch(/coverOver/);
    const unknown = await start({ timeLimitSeconds: 5, weights: { speed: 3 } });
    expect(unknown.status).toBe(400);
    expect(JSON.stringify(unknown.body)).toMatch(/speed/);

    await t
      .http()
      .post(api(R.periodSolveRuns(period.id)))
      .send({ timeLimitSeconds: 5 })
      .expect(401);
    expect((await start({ timeLimitSeconds: 5 }, staff)).status).toBe(403);
    expect((await start({ timeLimitSeconds: 5 }, manager2)).status).toBe(403);
    await t
      .http()
      .get(api(R.periodSolveRuns(period.id)))
      .set(bearer(manager2))
      .expect(403);
    expect(
      (await start({ timeLimitSeconds: 5 }, manager, '00000000-0000-4000-8000-000000000000')).status,
    ).toBe(404);
    // Nothing was queued by the refused requests.
    const runs = (
      await t
        .http()
        .get(api(R.periodSolveRuns(period.id)))
        .set(bearer(manager))
        .expect(200)
    ).body as Page<SolveRunSummaryDto>;
    expect(runs).toMatchObject({ items: [], total: 0 });
  });

  it('answers 202 at once, refuses a second active run, streams progress and saves a roster the checker accepts', async () => {
    const res = await start({ timeLimitSeconds: 20, weights: { fairNights: 3 } }, manager, week.id);
    expect(res.status).toBe(202);
    const { id } = res.body as { id: string };
    expect(id).toMatch(/^[0-9a-f-]{36}$/);

    const second = await start({ timeLimitSeconds: 4 }, manager, week.id);
    expect(second.status).toBe(409);

    // Another unit's manager may not follow the run.
    await t
      .http()
      .get(api(R.solveRun(id)))
      .set(bearer(manager2))
      .expect(403);
    await t
      .http()
      .get(api(R.solveRunEvents(id)))
      .set(bearer(manager2))
      .expect(403);

    const stream = await t
      .http()
      .get(api(R.solveRunEvents(id)))
      .set(bearer(manager))
      .buffer(true)
      .parse((r, done) => {
        let text = '';
        r.setEncoding('utf8');
        r.on('data', (chunk: string) => (text += chunk));
        r.on('end', () => done(null, text));
      });
    expect(stream.status).toBe(200);
    expect(stream.headers['content-type']).toMatch(/^text\/event-stream/);
    const events = parseSse(stream.body as string);
    expect(events[0].event).toBe('status');
    expect(events.at(-1)!.event).toBe('end');
    expect(events.filter((e) => e.event === 'end')).toHaveLength(1);
    const progress = events
      .filter((e) => e.event === 'progress')
      .map((e) => e.data as SolveRunDto['progress']);
    expect(progress.length).toBeGreaterThan(0);
    expect(progress.every((p) => typeof p!.elapsedSeconds === 'number')).toBe(true);
    const ended = events.at(-1)!.data as SolveRunDto;
    expect([ended.status, ended.errorMessage]).toEqual(['finished', null]);

    const run = await getRun(id);
    expect(run).toMatchObject({
      status: 'finished',
      timeLimitSeconds: 20,
      weights: { fairNights: 3 },
      errorMessage: null,
    });
    expect(run.weights).toEqual({ fairNights: 3 }); // only the weights given are stored
    expect(run.startedAt).not.toBeNull();
    expect(run.finishedAt).not.toBeNull();
    expect(run.result!.quality.length).toBeGreaterThan(10);
    expect(run.result!.objective).not.toBeNull();
    // Staffing safety is part of every result: people short of minimum agree with the roster's own
    // under-minimum term, the fewest possible is never more, and words come exactly when any is short.
    const staffing = run.result!.staffing!;
    expect(staffing).toEqual({
      peopleShort: expect.any(Number),
      shiftsShort: expect.any(Number),
      noneOfSkill: expect.any(Number),
      fewestPossible: expect.any(Number),
      proven: expect.any(Boolean),
    });
    expect(staffing.peopleShort === 0).toBe(run.result!.terms!.coverUnderMin === 0);
    expect(staffing.fewestPossible!).toBeLessThanOrEqual(staffing.peopleShort);
    expect(run.result!.staffingStatement === '').toBe(staffing.peopleShort === 0);

    // The stored roster, read back and re-checked by the independent checker, is the solver's roster:
    // no hard-rule violation and the same objective (the solver's own result is checked the same way).
    const grid = await readGrid(t, manager, week.id);
    expect(grid.dates).toHaveLength(week.days);
    const worked = grid.rows.flatMap((r) => r.cells).filter((c) => c.shiftTypeId !== null);
    expect(worked.length).toBeGreaterThan(0);
    expect(grid.check.violations).toEqual([]);
    // The run's weights (fairNights 3) differ from the defaults the board's check uses, so compare the
    // unweighted-by-run terms: every term except fairNights is weighted the same.
    const { fairNights: _a, ...runTerms } = run.result!.terms!;
    const { fairNights: _b, ...boardTerms } = grid.check.terms;
    for (const [name, value] of Object.entries(runTerms)) expect(boardTerms[name]).toBeCloseTo(value, 6);

    // The stream of an ended run answers at once with its status and end.
    const again = await t
      .http()
      .get(api(R.solveRunEvents(id)))
      .set(bearer(manager))
      .buffer(true)
      .parse((r, done) => {
        let text = '';
        r.setEncoding('utf8');
        r.on('data', (chunk: string) => (text += chunk));
        r.on('end', () => done(null, text));
      });
    expect(parseSse(again.body as string).map((e) => e.event)).toEqual(['status', 'end']);

    const list = (
      await t
        .http()
        .get(api(R.periodSolveRuns(week.id)))
        .set(bearer(manager))
        .expect(200)
    ).body as Page<SolveRunSummaryDto>;
    expect(list.items.map((r) => r.id)).toContain(id);
  }, 120_000);

  it('cancels a running solve and keeps the best roster found so far', async () => {
    const { id } = (await start({ timeLimitSeconds: 120 }).expect(202)).body as { id: string };
    await untilImproving(id);
    const res = await t
      .http()
      .post(api(R.solveRunCancel(id)))
      .set(bearer(manager));
    expect(res.status).toBe(200);
    const run = res.body as SolveRunDto;
    expect(run.status).toBe('cancelled');
    expect(run.result!.objective).not.toBeNull();
    const grid = await readGrid(t, manager, period.id);
    expect(grid.rows.flatMap((r) => r.cells).some((c) => c.shiftTypeId !== null)).toBe(true);
    // Cancelling again: the run has ended.
    await t
      .http()
      .post(api(R.solveRunCancel(id)))
      .set(bearer(manager))
      .expect(409);
  }, 120_000);

  it('fails the run with a message when the solver worker dies, stays up, and the next run works', async () => {
    const { id } = (await start({ timeLimitSeconds: 120 }).expect(202)).body as { id: string };
    await waitFor(
      () => getRun(id),
      (r) => r.status === 'running',
    );
    // Terminates the worker thread in the middle of the solve (the pool's hard stop).
    await t.app.get(SolveRunsService).stopAtOnce(id);
    const run = await untilEnded(id);
    expect(run.status).toBe('failed');
    expect(run.errorMessage).toMatch(/^The solve failed: .*stopped at once/);
    await t.http().get(api('/health')).expect(200);

    const next = (await start({ timeLimitSeconds: 20 }, manager, week.id).expect(202)).body as { id: string };
    expect((await untilEnded(next.id)).status).toBe('finished');
  }, 180_000);

  it('fails the run and saves nothing when the period stops being a draft during the solve', async () => {
    const before = await readGrid(t, manager, period.id);
    const { id } = (await start({ timeLimitSeconds: 120 }).expect(202)).body as { id: string };
    await untilImproving(id);
    // Publishing is another feature; set the status directly as it would.
    await t.dataSource.query(`UPDATE roster_periods SET status = 'published' WHERE id = ?`, [period.id]);
    try {
      const run = (
        await t
          .http()
          .post(api(R.solveRunCancel(id)))
          .set(bearer(manager))
          .expect(200)
      ).body as SolveRunDto;
      expect(run.status).toBe('failed');
      expect(run.errorMessage).toMatch(/published during the solve/);
      const after = await readGrid(t, manager, period.id);
      expect(after.rows).toEqual(before.rows);
      // A published period cannot be generated.
      expect((await start({ timeLimitSeconds: 2 })).status).toBe(409);
    } finally {
      await t.dataSource.query(`UPDATE roster_periods SET status = 'draft' WHERE id = ?`, [period.id]);
    }
  }, 120_000);
});

describe('solve runs across a server restart', () => {
  it('marks runs left queued or running by the previous process as failed', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'rotaplex-restart-'));
    try {
      const first = await startTestApp({}, dir);
      let ids: string[];
      try {
        const periodId = (
          (await first.dataSource.query(`SELECT id FROM roster_periods LIMIT 1`)) as { id: string }[]
        )[0].id;
        const repo = first.dataSource.getRepository(SolveRunEntity);
        // As the process would leave them when it is killed in the middle of a solve.
        const running = await repo.save(
          repo.create({
            rosterPeriodId: periodId,
            status: 'running',
            timeLimitSeconds: 30,
            weights: {},
            startedAt: new Date(),
          }),
        );
        const queued = await repo.save(
          repo.create({ rosterPeriodId: periodId, status: 'queued', timeLimitSeconds: 30, weights: {} }),
        );
        ids = [running.id, queued.id];
      } finally {
        await first.close();
      }
      const second = await startTestApp({}, dir);
      try {
        const admin = (await second.login('admin@example.com')).token;
        for (const id of ids) {
          const run = (
            await second
              .http()
              .get(api(R.solveRun(id)))
              .set(bearer(admin))
              .expect(200)
          ).body as SolveRunDto;
          expect(run.status).toBe('failed');
          expect(run.errorMessage).toBe(RESTARTED_MESSAGE);
          expect(run.finishedAt).not.toBeNull();
        }
      } finally {
        await second.close();
      }
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  }, 60_000);
});

describe('solve runs when the server stops', () => {
  it('fails a solve in progress with a message when the server shuts down, and closes promptly', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'rotaplex-stop-'));
    try {
      const first = await startTestApp({}, dir);
      let id: string;
      try {
        const manager = (await first.login('manager@example.com')).token;
        const periodId = (
          (await first.http().get(api(P.rosterPeriods)).set(bearer(manager)).expect(200))
            .body as Page<RosterPeriodDto>
        ).items[0].id;
        id = (
          (
            await first
              .http()
              .post(api(R.periodSolveRuns(periodId)))
              .set(bearer(manager))
              .send({ timeLimitSeconds: 300 })
              .expect(202)
          ).body as { id: string }
        ).id;
        // Wait until the solver reports progress: the worker is in the middle of the solve.
        await waitFor(
          async () =>
            (
              await first
                .http()
                .get(api(R.solveRun(id)))
                .set(bearer(manager))
                .expect(200)
            ).body as SolveRunDto,
          (r) => r.status === 'running' && r.progress !== null,
        );
      } finally {
        await first.close(); // stops the worker pool in the middle of the solve
      }
      const second = await startTestApp({}, dir);
      try {
        const admin = (await second.login('admin@example.com')).token;
        const run = (
          await second
            .http()
            .get(api(R.solveRun(id)))
            .set(bearer(admin))
            .expect(200)
        ).body as SolveRunDto;
        expect(run.status).toBe('failed');
        expect(run.errorMessage).toMatch(/server stopped during the solve/);
      } finally {
        await second.close();
      }
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  }, 120_000);
});
