/**
 * Solve throughput through the BullMQ queue (issue 13): many demo-size solves submitted at once
 * to one API instance with REDIS_URL, run by 1, 2, 4… solver worker processes (`npm run worker`,
 * one solve and one thread each), on Debian's redis-server started here on a free port. Prints,
 * per worker count, the makespan (first job queued → last job finished) and each job's queue
 * wait (queued → a worker began it, from BullMQ's job timestamps), then the overhead of one
 * solve through the queue against the in-process pool: the time from POST to the run's `end`
 * event less the solver's own seconds, median of a few small solves each way.
 *
 *   npx nx run api:build && npm run bench:queue -- [--solves 40] [--seconds 20] [--workers 1,2,4]
 *     [--overhead-runs 5] [--dist dist/api]
 *
 * The database is one SQLite file (BENCH_DB=postgres: a throwaway PostgreSQL 15 cluster). Periods
 * are copies of the demo ward's four-week draft (the same unit, staff and cover needs), one per
 * solve, since a period has one active run at a time.
 */
import {
  type Page,
  PLANNING_ROUTES as P,
  type RosterPeriodDto,
  SOLVING_ROUTES as R,
} from '@rotaplex/contracts';
import { Queue } from 'bullmq';
import { Redis } from 'ioredis';
import { availableParallelism, cpus, hostname } from 'node:os';
import { resolve } from 'node:path';
import type { Proc } from '../test/scale-out/cluster';

function arg(name: string, fallback: string): string {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 && process.argv[i + 1] ? process.argv[i + 1] : fallback;
}
const SOLVES = Number(arg('solves', '40'));
const SECONDS = Number(arg('seconds', '20'));
const WORKER_COUNTS = arg('workers', '1,2,4').split(',').map(Number);
const OVERHEAD_RUNS = Number(arg('overhead-runs', '5'));
const dist = arg('dist', '');
if (dist) process.env.ROTAPLEX_API_DIST = resolve(dist);

// After ROTAPLEX_API_DIST is set: the harness reads it when loaded.
// eslint-disable-next-line @typescript-eslint/no-require-imports
const cluster = require('../test/scale-out/cluster') as typeof import('../test/scale-out/cluster');
// eslint-disable-next-line @typescript-eslint/no-require-imports
const pg = require('../src/database/postgres-cluster') as typeof import('../src/database/postgres-cluster');

const PREFIX = 'rotaplex-bench';
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function json<T>(base: string, path: string, token: string | null, init: RequestInit = {}): Promise<T> {
  const res = await fetch(`${base}/api${path}`, {
    ...init,
    headers: {
      ...(token ? { Authorization: `Bearer ${token}` } : {}),
      ...(init.body ? { 'Content-Type': 'application/json' } : {}),
    },
  });
  if (!res.ok) throw new Error(`${init.method ?? 'GET'} ${path}: ${res.status} ${await res.text()}`);
  return (await res.json()) as T;
}

async function signIn(base: string): Promise<string> {
  const body = await json<{ accessToken: string }>(base, '/auth/login', null, {
    method: 'POST',
    body: JSON.stringify({ email: 'manager@example.com', password: 'rotaplex-demo' }),
  });
  return body.accessToken;
}

async function wardDraft(base: string, token: string): Promise<RosterPeriodDto> {
  const units = await json<{ id: string; name: string }[]>(base, '/units', token);
  const ward = units.find((u) => u.name.startsWith('Ward')) ?? units[0];
  const periods = await json<Page<RosterPeriodDto>>(base, `${P.rosterPeriods}?unitId=${ward.id}`, token);
  return periods.items.find((p) => p.status === 'draft') as RosterPeriodDto;
}

/** Drafts of the ward with the demo draft's length, after it, one per solve. */
async function makePeriods(base: string, token: string, count: number, round: number): Promise<string[]> {
  const draft = await wardDraft(base, token);
  const ids: string[] = [];
  const days = draft.days;
  const start = new Date(`${draft.startDate}T00:00:00Z`);
  for (let i = 0; i < count; i++) {
    const d = new Date(start.getTime() + (round * count + i + 1) * days * 86_400_000);
    const period = await json<RosterPeriodDto>(base, P.rosterPeriods, token, {
      method: 'POST',
      body: JSON.stringify({ unitId: draft.unitId, startDate: d.toISOString().slice(0, 10), days }),
    });
    ids.push(period.id);
  }
  return ids;
}

async function startRun(base: string, token: string, periodId: string, seconds: number): Promise<string> {
  const body = await json<{ id: string }>(base, R.periodSolveRuns(periodId), token, {
    method: 'POST',
    body: JSON.stringify({ timeLimitSeconds: seconds }),
  });
  return body.id;
}

interface RunRow {
  status: string;
  progress: { elapsedSeconds: number } | null;
  result: { objective: number | null } | null;
}

/** Time from POST to the `end` event on the run's event stream, and the solver's own seconds. */
async function timedSolve(base: string, token: string, periodId: string, seconds: number) {
  const t0 = performance.now();
  const id = await startRun(base, token, periodId, seconds);
  const res = await fetch(`${base}/api${R.solveRunEvents(id)}`, {
    headers: { Authorization: `Bearer ${token}` },
  });
  let text = '';
  const decoder = new TextDecoder();
  for await (const chunk of res.body as unknown as AsyncIterable<Uint8Array>) {
    text += decoder.decode(chunk, { stream: true });
    if (text.includes('event: end')) break;
  }
  const wall = (performance.now() - t0) / 1000;
  const run = await json<RunRow>(base, R.solveRun(id), token);
  if (run.status !== 'finished') throw new Error(`overhead solve ended ${run.status}`);
  return { wall, solver: run.progress?.elapsedSeconds ?? 0 };
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};
const pct = (xs: number[], p: number) =>
  [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor(p * xs.length))];

async function main(): Promise<void> {
  cluster.assertBuilt();
  const redis = await cluster.startRedis();
  const data = cluster.tempDataDir();
  const postgres = process.env.BENCH_DB === 'postgres' ? await pg.startPostgresCluster() : null;
  const dbEnv: Record<string, string> = postgres
    ? { DATABASE_URL: await postgres.createDatabase('rotaplex_bench') }
    : {};
  const procs: { child: { kill: (s: NodeJS.Signals) => void } }[] = [];
  const results: string[] = [];
  try {
    const api = await cluster.startApi('api', {
      redisUrl: redis.url,
      prefix: PREFIX,
      dataDir: data.dir,
      // A run of 40 × 20 s with one worker outlasts the default 15-minute access token.
      env: { LOGIN_RATE_LIMIT: '1000', JWT_ACCESS_TTL: '6h', ...dbEnv },
    });
    procs.push(api);
    const token = await signIn(api.baseUrl);
    const client = new Redis(redis.url, { maxRetriesPerRequest: null });
    const queue = new Queue('solve-runs', { connection: client, prefix: PREFIX });

    console.log(
      `Machine: ${hostname()}, ${availableParallelism()} cores (${cpus()[0]?.model ?? '?'}), ${new Date().toISOString()}`,
    );
    console.log(`${SOLVES} solves of ${SECONDS} s on copies of the demo ward's draft, submitted at once\n`);
    const table = [
      '| solver workers | makespan (s) | queue wait median (s) | p90 (s) | max (s) | finished | objective median |',
      '| ---: | ---: | ---: | ---: | ---: | ---: | ---: |',
    ];
    for (const workers of WORKER_COUNTS) {
      const started: Proc[] = [];
      for (let i = 0; i < workers; i++)
        started.push(
          await cluster.startWorker(`worker-${workers}-${i}`, redis.url, PREFIX, {
            WORKER_CONCURRENCY: '1',
            WORKER_THREADS: '1',
          }),
        );
      const periods = await makePeriods(api.baseUrl, token, SOLVES, WORKER_COUNTS.indexOf(workers));
      const ids = await Promise.all(periods.map((p) => startRun(api.baseUrl, token, p, SECONDS)));
      for (;;) {
        const runs = await Promise.all(ids.map((id) => json<RunRow>(api.baseUrl, R.solveRun(id), token)));
        if (runs.every((r) => ['finished', 'failed', 'cancelled'].includes(r.status))) {
          const jobs = await Promise.all(ids.map((id) => queue.getJob(id)));
          const waits = jobs.map((j) => ((j?.processedOn ?? 0) - (j?.timestamp ?? 0)) / 1000);
          const first = Math.min(...jobs.map((j) => j?.timestamp ?? Infinity));
          const last = Math.max(...jobs.map((j) => j?.finishedOn ?? 0));
          const finished = runs.filter((r) => r.status === 'finished').length;
          // Lower is better; with more workers than cores each solve gets less of a core in its time limit.
          const objectives = runs
            .map((r) => r.result?.objective)
            .filter((o): o is number => typeof o === 'number');
          const objective = objectives.length ? median(objectives).toFixed(0) : '-';
          const row = `| ${workers} | ${((last - first) / 1000).toFixed(1)} | ${median(waits).toFixed(1)} | ${pct(waits, 0.9).toFixed(1)} | ${Math.max(...waits).toFixed(1)} | ${finished}/${ids.length} | ${objective} |`;
          table.push(row);
          console.log(row);
          console.log(
            `  queue waits (s, in order of submission): ${waits.map((w) => w.toFixed(1)).join(' ')}`,
          );
          break;
        }
        await sleep(1000);
      }
      for (const w of started) await cluster.stop(w);
    }
    results.push(table.join('\n'));

    // Overhead: small solves (one week, 3 s) one at a time, through the queue and in process.
    const overhead = async (base: string, tok: string) => {
      const draft = await wardDraft(base, tok);
      const extra: number[] = [];
      for (let i = 0; i < OVERHEAD_RUNS; i++) {
        const d = new Date(Date.UTC(2040, 0, 2 + 7 * i)).toISOString().slice(0, 10);
        const period = await json<RosterPeriodDto>(base, P.rosterPeriods, tok, {
          method: 'POST',
          body: JSON.stringify({ unitId: draft.unitId, startDate: d, days: 7 }),
        });
        const { wall, solver } = await timedSolve(base, tok, period.id, 3);
        extra.push(wall - solver);
      }
      return extra;
    };
    const worker = await cluster.startWorker('worker-overhead', redis.url, PREFIX, {
      WORKER_CONCURRENCY: '1',
      WORKER_THREADS: '1',
    });
    const viaQueue = await overhead(api.baseUrl, token);
    await cluster.stop(worker);
    await queue.close();
    client.disconnect();
    const localData = cluster.tempDataDir();
    const local = await cluster.startApi('api-in-process', {
      redisUrl: '',
      prefix: PREFIX,
      dataDir: localData.dir,
      env: { LOGIN_RATE_LIMIT: '1000' },
    });
    const inProcess = await overhead(local.baseUrl, await signIn(local.baseUrl));
    await cluster.stop(local);
    localData.remove();
    const fmt = (xs: number[]) => xs.map((x) => x.toFixed(2)).join(' ');
    const overheadTable = [
      '| path | time beyond the solver, median (s) | each run (s) |',
      '| --- | ---: | --- |',
      `| in-process pool | ${median(inProcess).toFixed(2)} | ${fmt(inProcess)} |`,
      `| BullMQ queue, one worker process | ${median(viaQueue).toFixed(2)} | ${fmt(viaQueue)} |`,
      `| difference | ${(median(viaQueue) - median(inProcess)).toFixed(2)} | |`,
    ].join('\n');
    results.push(overheadTable);
    console.log(`\n${results.join('\n\n')}`);
  } finally {
    for (const p of procs) p.child.kill('SIGTERM');
    await sleep(2000);
    await redis.stop();
    postgres?.stop();
    data.remove();
  }
}

main().then(
  () => process.exit(0),
  (err: unknown) => {
    console.error(err);
    process.exit(1);
  },
);
