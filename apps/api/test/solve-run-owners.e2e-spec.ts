/**
 * Owners of queued solve runs with REDIS_URL (docs/scale-out.md): the API instance that queues a
 * run keeps its instance id under a small Redis key while the run is active, and every instance
 * reads the owners of all active runs in one MGET (no job, with its encoded problem, fetched per
 * run every sweep). A run whose owner is gone is failed as before.
 *
 * One real API instance on a SQLite file and Debian's redis-server on a free port, no solver
 * worker (jobs wait in the queue). "Another instance" is what such an instance leaves in Redis and
 * the database: its heartbeat key, its runs' rows, owner keys and jobs, written here as it writes
 * them. Its end is the removal of its heartbeat key (what a stopping instance does; a killed one's
 * key expires).
 */
import { SOLVING_ROUTES as R, type SolveRunDto } from '@rotaplex/contracts';
import { Queue } from 'bullmq';
import { Redis } from 'ioredis';
import { randomUUID } from 'node:crypto';
import { RedisConnections } from '../src/redis/redis-connections';
import { SolveQueue } from '../src/solve-runs/solve-queue';
import {
  apiInstanceKey,
  encodeValue,
  SOLVE_QUEUE,
  type SolveJobData,
  solveOwnerKey,
} from '../src/solve-runs/solve-queue-protocol';
import { SolveRunEntity } from '../src/solve-runs/solve-run.entity';
import { RESTARTED_MESSAGE } from '../src/solve-runs/solve-runs.service';
import { type RedisServer, startRedis } from './scale-out/cluster';
import { createPeriod, findUnit } from './support/planning';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

const PREFIX = 'rotaplex-owners-test';

async function waitFor<T>(read: () => Promise<T>, done: (v: T) => boolean, timeoutMs = 60_000): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const v = await read();
    if (done(v)) return v;
    if (Date.now() > until) throw new Error(`timed out waiting; last value: ${JSON.stringify(v)}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

describe('solve run owners in Redis (one API instance, real redis-server)', () => {
  let redis: RedisServer;
  let t: TestApp;
  let client: Redis;
  let queue: Queue<SolveJobData>;
  let solveQueue: SolveQueue;
  let instanceId: string;
  let manager: string;
  let unitId: string;

  beforeAll(async () => {
    redis = await startRedis();
    // The app reads REDIS_URL from the environment when it is created (app.ts).
    const saved = { url: process.env.REDIS_URL, prefix: process.env.REDIS_PREFIX };
    process.env.REDIS_URL = redis.url;
    process.env.REDIS_PREFIX = PREFIX;
    try {
      t = await startTestApp();
    } finally {
      if (saved.url === undefined) delete process.env.REDIS_URL;
      else process.env.REDIS_URL = saved.url;
      if (saved.prefix === undefined) delete process.env.REDIS_PREFIX;
      else process.env.REDIS_PREFIX = saved.prefix;
    }
    client = new Redis(redis.url, { maxRetriesPerRequest: null });
    queue = new Queue<SolveJobData>(SOLVE_QUEUE, { connection: client, prefix: PREFIX });
    solveQueue = t.app.get(SolveQueue);
    instanceId = t.app.get(RedisConnections).instanceId;
    manager = (await t.login('manager@example.com')).token;
    unitId = (await findUnit(t, (await t.login('admin@example.com')).token)).id;
  }, 60_000);

  afterAll(async () => {
    await queue?.close();
    client?.disconnect();
    await t?.close();
    await redis?.stop();
  }, 60_000);

  afterEach(() => jest.restoreAllMocks());

  const readRun = async (id: string) =>
    (
      await t
        .http()
        .get(api(R.solveRun(id)))
        .set(bearer(manager))
        .expect(200)
    ).body as SolveRunDto;

  /** A run another instance queued: its row, and (as that instance writes them) its job and owner key. */
  async function othersRun(
    owner: string,
    startDate: string,
    leaves: { ownerKey: boolean; job: boolean; ageMs?: number },
  ): Promise<string> {
    const period = await createPeriod(t, manager, unitId, startDate);
    const runs = t.dataSource.getRepository(SolveRunEntity);
    const run = await runs.save(
      runs.create({
        rosterPeriodId: period.id,
        status: 'queued',
        mode: 'generate',
        requestedById: null,
        timeLimitSeconds: 5,
        weights: {},
        progress: null,
        result: null,
        errorMessage: null,
        startedAt: null,
        finishedAt: null,
      }),
    );
    if (leaves.ageMs) {
      await runs.update({ id: run.id }, { createdAt: new Date(Date.now() - leaves.ageMs) });
      const row = await runs.findOneByOrFail({ id: run.id });
      expect(Date.now() - row.createdAt.getTime()).toBeGreaterThanOrEqual(leaves.ageMs - 1000);
    }
    if (leaves.ownerKey) await client.set(solveOwnerKey(PREFIX, run.id), owner);
    if (leaves.job)
      await queue.add(
        'solve',
        { runId: run.id, owner, problem: encodeValue({}), timeLimitSeconds: 5, queuedAt: Date.now() },
        { jobId: run.id },
      );
    return run.id;
  }

  /** Resolves after `sweeps` orphan sweeps of this instance have looked at every one of `runIds`. */
  function sweepsSeeing(spy: jest.SpyInstance, runIds: string[], sweeps = 2): Promise<number> {
    return waitFor(
      async () =>
        spy.mock.calls.filter(([ids]) => runIds.every((id) => (ids as string[]).includes(id))).length,
      (n) => n >= sweeps,
    );
  }

  it('keeps the owner key of a run it queued while the run waits, and removes it when the run ends', async () => {
    const period = await createPeriod(t, manager, unitId, '2030-03-04');
    const started = await t
      .http()
      .post(api(R.periodSolveRuns(period.id)))
      .set(bearer(manager))
      .send({ timeLimitSeconds: 5 })
      .expect(202);
    const runId = started.body.id as string;
    // Written before the job is queued, so it is there when the start answers.
    expect(await client.get(solveOwnerKey(PREFIX, runId))).toBe(instanceId);
    expect((await queue.getJob(runId))?.data.owner).toBe(instanceId);
    expect(await client.pttl(solveOwnerKey(PREFIX, runId))).toBeGreaterThan(0);

    const cancelled = await t
      .http()
      .post(api(R.solveRunCancel(runId)))
      .set(bearer(manager))
      .expect(200);
    expect((cancelled.body as SolveRunDto).status).toBe('cancelled');
    await waitFor(
      () => client.exists(solveOwnerKey(PREFIX, runId)),
      (n) => n === 0,
    );
    expect(await queue.getJob(runId)).toBeUndefined();
  }, 60_000);

  it("leaves another live instance's run alone without fetching its job, and fails it once that instance is gone", async () => {
    const other = `other-${randomUUID()}`;
    await client.set(apiInstanceKey(PREFIX, other), '1', 'PX', 600_000);
    const runId = await othersRun(other, '2030-04-01', { ownerKey: true, job: true });
    const owners = jest.spyOn(solveQueue, 'owners');
    const getJob = jest.spyOn(solveQueue.queue, 'getJob');

    await sweepsSeeing(owners, [runId]);
    expect((await readRun(runId)).status).toBe('queued');
    expect(getJob.mock.calls.filter(([id]) => id === runId)).toHaveLength(0);

    await client.del(apiInstanceKey(PREFIX, other));
    const run = await waitFor(
      () => readRun(runId),
      (r) => r.status !== 'queued',
    );
    expect(run.status).toBe('failed');
    expect(run.errorMessage).toBe(RESTARTED_MESSAGE);
    // Its job and owner key are gone with it; its job was never fetched.
    expect(await queue.getJob(runId)).toBeUndefined();
    expect(await client.exists(solveOwnerKey(PREFIX, runId))).toBe(0);
    expect(getJob.mock.calls.filter(([id]) => id === runId)).toHaveLength(0);
  }, 60_000);

  it('judges a run without an owner key (queued by an earlier version) by its job once a minute has passed, as before', async () => {
    const other = `other-${randomUUID()}`;
    await client.set(apiInstanceKey(PREFIX, other), '1', 'PX', 600_000);
    const minutesAgo = { ageMs: 2 * 60_000 };
    const legacy = await othersRun(other, '2030-05-06', { ownerKey: false, job: true, ...minutesAgo });
    // Neither key nor job a minute after it was created: its instance stopped before queueing it.
    const neverQueued = await othersRun(other, '2030-06-03', { ownerKey: false, job: false, ...minutesAgo });
    // Neither yet, but only just created: its instance may still be loading the input.
    const justCreated = await othersRun(other, '2030-07-01', { ownerKey: false, job: false });
    const owners = jest.spyOn(solveQueue, 'owners');

    await sweepsSeeing(owners, [legacy, justCreated]);
    expect((await readRun(legacy)).status).toBe('queued');
    expect((await readRun(justCreated)).status).toBe('queued');
    const lost = await readRun(neverQueued);
    expect(lost.status).toBe('failed');
    expect(lost.errorMessage).toBe(RESTARTED_MESSAGE);

    await client.del(apiInstanceKey(PREFIX, other));
    const run = await waitFor(
      () => readRun(legacy),
      (r) => r.status !== 'queued',
    );
    expect(run.status).toBe('failed');
    expect(run.errorMessage).toBe(RESTARTED_MESSAGE);
    expect(await queue.getJob(legacy)).toBeUndefined();
    // Nothing in Redis for the just-created run, and it is still within its minute.
    expect((await readRun(justCreated)).status).toBe('queued');
    await t.dataSource.getRepository(SolveRunEntity).update({ id: justCreated }, { status: 'cancelled' });
  }, 90_000);
});
