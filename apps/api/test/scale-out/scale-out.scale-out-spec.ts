/**
 * The product on real engines as several processes: Debian's redis-server, two API instances that
 * share nothing in memory, two solver worker processes (`npm run worker`). A smaller set of the
 * journeys than the main suite: sign-in (its rate limits counted across instances), generate
 * (progress followed through the other instance), publish and repair, a swap proposed, accepted and
 * approved across instances, a cache read after another instance's write, one active run per
 * period, cancel, a worker killed mid-solve, health and the scheduled jobs.
 *
 * Needs the compiled API (`npx nx run api:build`), /usr/bin/redis-server and Debian's PostgreSQL
 * 15 (a throwaway cluster, as the API suite's PostgreSQL run makes). Run with
 * `npm run test:scale-out`. Several API instances need PostgreSQL: on one SQLite file shared by
 * two processes, a write of one can find the file locked by the other ("database is locked").
 */
import {
  type AssignmentGridDto,
  type AuditEntryDto,
  type Page,
  PLANNING_ROUTES as P,
  PUBLISHING_ROUTES as PUB,
  type RosterPeriodDto,
  SOLVING_ROUTES as R,
  type SolveRunDto,
  SWAP_ROUTES as S,
  type SwapRequestDto,
  type HealthResponse,
} from '@rotaplex/contracts';
import { Queue } from 'bullmq';
import { Redis } from 'ioredis';
import request from 'supertest';
import { type PostgresCluster, startPostgresCluster } from '../../src/database/postgres-cluster';
import { DEMO_PASSWORD } from '../../src/demo/demo-data';
import { MAINTENANCE_QUEUE, SOLVE_QUEUE } from '../../src/solve-runs/solve-queue-protocol';
import { WORKER_LOST_MESSAGE } from '../../src/solve-runs/solve-runs.service';
import {
  createPeriod,
  findUnit,
  publishPeriod,
  putCell,
  readGrid,
  readPeriod,
  shiftTypesByCode,
  staffByName,
  WARD_PEOPLE,
} from '../support/planning';
import { api, bearer, type TestApp } from '../support/test-app';
import {
  type ApiInstance,
  assertBuilt,
  type Proc,
  type RedisServer,
  startApi,
  startRedis,
  startWorker,
  stop,
  tempDataDir,
} from './cluster';

const PREFIX = 'rotaplex-test';
/** A killed worker's lock runs out after this (the retry starts within about twice it). */
const LOCK_MS = 3000;
const ENDED = ['finished', 'failed', 'cancelled'];

/** The planning helpers need only `http()`: point them at one running instance. */
const remote = (instance: ApiInstance) => ({ http: () => request(instance.baseUrl) }) as unknown as TestApp;

async function waitFor<T>(read: () => Promise<T>, done: (v: T) => boolean, timeoutMs = 120_000): Promise<T> {
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

/** Follows a run's event stream on one instance until its `end` event (or the stream closes). */
function follow(
  instance: ApiInstance,
  token: string,
  runId: string,
): { events: SseEvent[]; ended: Promise<void> } {
  const events: SseEvent[] = [];
  const ended = (async () => {
    const res = await fetch(`${instance.baseUrl}${api(R.solveRunEvents(runId))}`, {
      headers: { Authorization: `Bearer ${token}` },
    });
    if (!res.ok || !res.body) throw new Error(`events: ${res.status}`);
    const decoder = new TextDecoder();
    let buffer = '';
    for await (const chunk of res.body as unknown as AsyncIterable<Uint8Array>) {
      buffer += decoder.decode(chunk, { stream: true });
      let cut: number;
      while ((cut = buffer.indexOf('\n\n')) >= 0) {
        const lines = buffer
          .slice(0, cut)
          .split('\n')
          .filter((l) => l && !l.startsWith(':'));
        buffer = buffer.slice(cut + 2);
        if (!lines.length) continue;
        events.push({
          event: lines.find((l) => l.startsWith('event: '))?.slice(7) ?? 'message',
          data: JSON.parse(
            lines
              .filter((l) => l.startsWith('data: '))
              .map((l) => l.slice(6))
              .join('\n'),
          ),
        });
      }
      if (events.some((e) => e.event === 'end')) break;
    }
  })();
  return { events, ended };
}

describe('scale-out: Redis, PostgreSQL, two API instances, two solver workers', () => {
  let redis: RedisServer;
  let data: { dir: string; remove: () => void };
  let a: ApiInstance;
  let b: ApiInstance;
  const workers: Proc[] = [];
  let queue: Queue;
  let client: Redis;
  let manager: string;
  /** Two ward people (demo data) who swap: signed in before the sign-in limit tests use up this address. */
  let staff: Record<'priya' | 'tomasz', string>;
  let unitId: string;
  let postgres: PostgresCluster | null = null;
  /** The week generated through the queue (published and repaired later). */
  let generated: string;

  const workerEnv = { WORKER_CONCURRENCY: '1', WORKER_THREADS: '1', SOLVE_LOCK_MS: String(LOCK_MS) };
  const addWorker = async (name: string) => {
    const w = await startWorker(name, redis.url, PREFIX, workerEnv);
    workers.push(w);
    return w;
  };
  const alive = () => workers.filter((w) => w.child.exitCode === null && w.child.signalCode === null);

  beforeAll(async () => {
    assertBuilt();
    redis = await startRedis();
    data = tempDataDir();
    postgres = await startPostgresCluster();
    const env = {
      SOLVE_LOCK_MS: String(LOCK_MS),
      DATABASE_URL: await postgres.createDatabase('rotaplex_scale_out'),
    };
    // One after the other: the first migrates and seeds the database, the second finds it ready.
    a = await startApi('api-a', { redisUrl: redis.url, prefix: PREFIX, dataDir: data.dir, env });
    b = await startApi('api-b', { redisUrl: redis.url, prefix: PREFIX, dataDir: data.dir, env });
    await addWorker('worker-1');
    await addWorker('worker-2');
    client = new Redis(redis.url, { maxRetriesPerRequest: null });
    queue = new Queue(SOLVE_QUEUE, { connection: client, prefix: PREFIX });
    const signIn = await request(a.baseUrl)
      .post(api('/auth/login'))
      .send({ email: 'manager@example.com', password: DEMO_PASSWORD })
      .expect(200);
    manager = signIn.body.accessToken;
    const signInStaff = async (email: string) =>
      (await request(b.baseUrl).post(api('/auth/login')).send({ email, password: DEMO_PASSWORD }).expect(200))
        .body.accessToken as string;
    staff = { priya: await signInStaff(WARD_PEOPLE.b), tomasz: await signInStaff(WARD_PEOPLE.c) };
    unitId = (await findUnit(remote(a), manager)).id;
  }, 240_000);

  afterAll(async () => {
    await queue?.close();
    client?.disconnect();
    for (const w of workers) await stop(w);
    for (const api of [a, b]) if (api) await stop(api);
    await redis?.stop();
    postgres?.stop();
    data?.remove();
  }, 120_000);

  it('health on each instance reports the database and the Redis queue with both solver workers', async () => {
    for (const instance of [a, b]) {
      const health = (await request(instance.baseUrl).get(api('/health')).expect(200)).body as HealthResponse;
      expect(health.status).toBe('ok');
      expect(health.database).toBe('up');
      // Two worker processes were started above; BullMQ lists the queue's workers from Redis's CLIENT LIST.
      expect(health.queue).toMatchObject({ kind: 'redis', state: 'up', workers: 2 });
    }
  });

  it('counts sign-in attempts across instances: the 6th attempt within a minute is refused on either', async () => {
    // LOGIN_RATE_LIMIT 5 per address and e-mail (the default); three wrong passwords on one
    // instance and two on the other use them up together.
    const attempt = (instance: ApiInstance) =>
      request(instance.baseUrl)
        .post(api('/auth/login'))
        .send({ email: 'staff@example.com', password: 'not-the-password' });
    for (const instance of [a, a, a, b, b]) expect((await attempt(instance)).status).toBe(401);
    const refused = await attempt(a);
    expect(refused.status).toBe(429);
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
    expect((await attempt(b)).status).toBe(429);
  });

  it('counts failed sign-ins per address across instances, whatever the e-mail', async () => {
    // 4 × LOGIN_RATE_LIMIT = 20 failures a minute per address (SignInAddressLimiter); the test before
    // used 5 of them from this address. Unknown e-mails, alternating instances: 15 more are 401, the
    // next is refused, on either instance.
    const attempt = (instance: ApiInstance, i: number) =>
      request(instance.baseUrl)
        .post(api('/auth/login'))
        .send({ email: `nobody-${i}@example.com`, password: 'not-the-password' });
    const statuses: number[] = [];
    for (let i = 0; i < 15; i++) statuses.push((await attempt(i % 2 ? b : a, i)).status);
    expect(statuses).toEqual(new Array(15).fill(401));
    for (const instance of [a, b]) {
      const refused = await attempt(instance, 99);
      expect(refused.status).toBe(429);
      expect(refused.body.message).toMatch(/failed sign-ins from this address/);
    }
  });

  it('generates on one instance while a browser follows progress through the other; the roster is saved', async () => {
    const period = await createPeriod(remote(a), manager, unitId, '2031-03-03');
    const started = await request(a.baseUrl)
      .post(api(R.periodSolveRuns(period.id)))
      .set(bearer(manager))
      .send({ timeLimitSeconds: 8 })
      .expect(202);
    const runId = started.body.id as string;
    const stream = follow(b, manager, runId);
    await stream.ended;
    const names = stream.events.map((e) => e.event);
    expect(names[0]).toBe('status');
    expect(names[names.length - 1]).toBe('end');
    // How the run ended before what was relayed during it: a run that ended without solving (failed
    // when queued or on its worker) has no progress to relay, and its end says why.
    const end = stream.events[stream.events.length - 1].data as SolveRunDto;
    expect([end.status, end.errorMessage]).toEqual(['finished', null]);
    expect(end.result?.objective).not.toBeNull();
    // The solver worker's progress, relayed through Redis to the instance that did not queue the run.
    expect(names).toContain('progress');
    // Saved by the instance that queued it; read through the other one.
    const grid = await readGrid(remote(b), manager, period.id);
    expect(grid.rows.some((row) => row.cells.some((c) => c.shiftTypeId !== null))).toBe(true);
    const job = await queue.getJob(runId);
    expect(job?.processedBy).toMatch(/^solver-/);
    generated = period.id;
  });

  it('publishes through one instance and repairs through the other: the repair solves on a worker and is saved and audited', async () => {
    if (!generated) throw new Error('needs the week generated by the test before, which failed');
    await publishPeriod(remote(b), manager, generated);
    const started = await request(a.baseUrl)
      .post(api(PUB.repair(generated)))
      .set(bearer(manager))
      .send({ timeLimitSeconds: 5 })
      .expect(202);
    const runId = started.body.id as string;
    const run = await waitFor(
      async () =>
        (
          await request(b.baseUrl)
            .get(api(R.solveRun(runId)))
            .set(bearer(manager))
        ).body as SolveRunDto,
      (r) => ENDED.includes(r.status),
    );
    expect([run.mode, run.status, run.errorMessage]).toEqual(['repair', 'finished', null]);
    expect((await queue.getJob(runId))?.processedBy).toMatch(/^solver-/);
    const trail = (
      await request(b.baseUrl)
        .get(api(PUB.audit(generated)))
        .set(bearer(manager))
        .expect(200)
    ).body as Page<AuditEntryDto>;
    expect(trail.items.map((e) => e.kind)).toEqual(['publish', 'repair']);
  });

  it('approves a swap across instances: proposed on one, accepted on the other, approved on the first', async () => {
    // A week published the way the publish test above does it, with the two shifts the swap needs:
    // Priya Wendover works a Late and Tomasz Kellaway an Early on the Wednesday (demo people and
    // shifts; one shift each, so the daily rest and the weekly hours stay as they were).
    const period = await createPeriod(remote(a), manager, unitId, '2031-09-01');
    const shifts = await shiftTypesByCode(remote(a), manager, unitId);
    const person = await staffByName(remote(a), manager, unitId);
    const priya = person('Priya Wendover').id;
    const tomasz = person('Tomasz Kellaway').id;
    const day = '2031-09-03';
    await putCell(remote(a), manager, period.id, {
      staffMemberId: priya,
      date: day,
      shiftTypeId: shifts.L.id,
    });
    await putCell(remote(a), manager, period.id, {
      staffMemberId: tomasz,
      date: day,
      shiftTypeId: shifts.E.id,
    });
    await publishPeriod(remote(a), manager, period.id);

    const proposal = await request(a.baseUrl).post(api(S.swaps)).set(bearer(staff.priya)).send({
      kind: 'swap',
      rosterPeriodId: period.id,
      myDate: day,
      colleagueStaffMemberId: tomasz,
      theirDate: day,
    });
    expect([proposal.status, proposal.body.message]).toEqual([201, undefined]);
    const proposed = proposal.body as SwapRequestDto;
    expect(proposed.status).toBe('proposed');
    // Each one's cell on the day is exchanged.
    const changes = (r: SwapRequestDto) =>
      r.changes.map((c) => [c.staffMemberId, c.date, c.beforeShiftTypeId, c.afterShiftTypeId]).sort();
    expect(changes(proposed)).toEqual(
      [
        [priya, day, shifts.L.id, shifts.E.id],
        [tomasz, day, shifts.E.id, shifts.L.id],
      ].sort(),
    );

    const accepted = await request(b.baseUrl)
      .post(api(S.swapDecide(proposed.id)))
      .set(bearer(staff.tomasz))
      .send({ decision: 'accept' })
      .expect(200);
    expect(accepted.body.status).toBe('accepted');

    // Each one's shift on the day as a board read through the other instance shows it.
    const onDay = (grid: AssignmentGridDto) =>
      [priya, tomasz].map(
        (id) => grid.rows.find((r) => r.staffMemberId === id)?.cells[grid.dates.indexOf(day)]?.shiftTypeId,
      );
    // (this read also leaves the board cached on b, so the read after the approval tests the cache too)
    expect(onDay(await readGrid(remote(b), manager, period.id))).toEqual([shifts.L.id, shifts.E.id]);
    const { version } = await readPeriod(remote(b), manager, period.id);

    const approved = await request(a.baseUrl)
      .post(api(S.swapDecide(proposed.id)))
      .set(bearer(manager))
      .send({ decision: 'approve' })
      .expect(200);
    expect(approved.body.status).toBe('approved');

    // Read through the other instance: the cells exchanged, the version raised with them (one
    // writer per period, as the main suite's swaps spec checks on SQLite). A decided request is
    // not decided again: 409 Conflict (RFC 9110, section 15.5.10).
    expect(onDay(await readGrid(remote(b), manager, period.id))).toEqual([shifts.E.id, shifts.L.id]);
    expect((await readPeriod(remote(b), manager, period.id)).version).toBe(version + 1);
    const twice = await request(b.baseUrl)
      .post(api(S.swapDecide(proposed.id)))
      .set(bearer(manager))
      .send({ decision: 'approve' })
      .expect(409);
    expect(twice.body.message).toMatch(/already approved/);
    const read = (
      await request(b.baseUrl)
        .get(api(S.swap(proposed.id)))
        .set(bearer(manager))
        .expect(200)
    ).body as SwapRequestDto;
    expect(read.status).toBe('approved');
  });

  it("an instance's cached board read sees a cell another instance wrote", async () => {
    const period = await createPeriod(remote(a), manager, unitId, '2031-04-07');
    const shifts = await shiftTypesByCode(remote(a), manager, unitId);
    const before = await readGrid(remote(b), manager, period.id);
    await readGrid(remote(b), manager, period.id); // now cached on b
    const cell = { staffMemberId: before.rows[0].staffMemberId, date: before.dates[2] };
    expect(before.rows[0].cells[2].shiftTypeId).toBeNull();
    const code = Object.keys(shifts)[0];
    await putCell(remote(a), manager, period.id, { ...cell, shiftTypeId: shifts[code].id });
    const after = await readGrid(remote(b), manager, period.id);
    expect(after.rows[0].cells[2].shiftTypeId).toBe(shifts[code].id);
  });

  it('allows one active run per period across instances, and a cancel on the other instance keeps the best roster', async () => {
    const periods = (
      await request(a.baseUrl).get(api(P.rosterPeriods)).query({ unitId }).set(bearer(manager))
    ).body as Page<RosterPeriodDto>;
    const fourWeeks = periods.items.find((p) => p.status === 'draft') as RosterPeriodDto;
    const started = await request(a.baseUrl)
      .post(api(R.periodSolveRuns(fourWeeks.id)))
      .set(bearer(manager))
      .send({ timeLimitSeconds: 60 })
      .expect(202);
    const runId = started.body.id as string;
    await request(b.baseUrl)
      .post(api(R.periodSolveRuns(fourWeeks.id)))
      .set(bearer(manager))
      .send({ timeLimitSeconds: 60 })
      .expect(409);
    // Running with a roster found, as seen from the other instance.
    await waitFor(
      async () =>
        (
          await request(b.baseUrl)
            .get(api(R.solveRun(runId)))
            .set(bearer(manager))
        ).body as SolveRunDto,
      (r) => r.status === 'running' && r.progress?.objective != null,
    );
    const cancelled = await request(b.baseUrl)
      .post(api(R.solveRunCancel(runId)))
      .set(bearer(manager))
      .expect(200);
    expect(cancelled.body.status).toBe('cancelled');
    expect(cancelled.body.result?.objective).not.toBeNull();
    expect(cancelled.body.result.objective).toBeLessThanOrEqual(cancelled.body.progress.objective);
  });

  it('a solve whose worker is killed is retried on the other worker and finishes', async () => {
    const period = await createPeriod(remote(a), manager, unitId, '2031-05-05', 14);
    const started = await request(b.baseUrl)
      .post(api(R.periodSolveRuns(period.id)))
      .set(bearer(manager))
      .send({ timeLimitSeconds: 20 })
      .expect(202);
    const runId = started.body.id as string;
    const first = await waitFor(
      async () => (await queue.getJob(runId))?.processedBy,
      (name) => Boolean(name),
    );
    const victim = workers.find((w) => first?.endsWith(`-${w.child.pid}`)) as Proc;
    expect(victim).toBeDefined();
    victim.child.kill('SIGKILL');
    await victim.exited;
    const run = await waitFor(
      async () =>
        (
          await request(a.baseUrl)
            .get(api(R.solveRun(runId)))
            .set(bearer(manager))
        ).body as SolveRunDto,
      (r) => ENDED.includes(r.status),
    );
    expect(run.status).toBe('finished');
    const job = await queue.getJob(runId);
    expect(job?.processedBy).not.toBe(first);
    await addWorker('worker-3');
  });

  it('a solve whose workers die twice fails with a clear message, never left running', async () => {
    const period = await createPeriod(remote(a), manager, unitId, '2031-06-02', 14);
    const started = await request(a.baseUrl)
      .post(api(R.periodSolveRuns(period.id)))
      .set(bearer(manager))
      .send({ timeLimitSeconds: 60 })
      .expect(202);
    const runId = started.body.id as string;
    const kill = async (previous: string | undefined): Promise<string> => {
      const name = (await waitFor(
        async () => (await queue.getJob(runId))?.processedBy,
        (n) => Boolean(n) && n !== previous,
      )) as string;
      const victim = alive().find((w) => name.endsWith(`-${w.child.pid}`)) as Proc;
      victim.child.kill('SIGKILL');
      await victim.exited;
      return name;
    };
    const first = await kill(undefined);
    await kill(first);
    const run = await waitFor(
      async () =>
        (
          await request(b.baseUrl)
            .get(api(R.solveRun(runId)))
            .set(bearer(manager))
        ).body as SolveRunDto,
      (r) => ENDED.includes(r.status),
    );
    expect(run.status).toBe('failed');
    expect(run.errorMessage).toBe(WORKER_LOST_MESSAGE);
    const health = (await request(b.baseUrl).get(api('/health')).expect(200)).body as HealthResponse;
    expect(health.queue).toMatchObject({ kind: 'redis', waiting: 0, active: 0, workers: alive().length });
  });

  it('runs each scheduled job from one schedule in Redis, whatever the number of instances', async () => {
    const maintenance = new Queue(MAINTENANCE_QUEUE, { connection: client, prefix: PREFIX });
    const schedulers = await maintenance.getJobSchedulers();
    expect(schedulers.map((s) => s.key).sort()).toEqual(['outbox-retention', 'swap-expiry']);
    await maintenance.close();
  });
});
