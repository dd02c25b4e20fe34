/**
 * Open-shift list benchmark: starts the built product with its demo data, generates and publishes
 * the ward's four-week demo period, then times GET /api/open-shifts for the ward manager (every
 * open shift) and three staff members (only those the checker lets each take): the first read, repeated
 * reads while nothing is written, and the first read after a write.
 *
 *   npx tsx --tsconfig apps/web-e2e/tsconfig.json apps/web-e2e/bench/open-shifts.ts [--reads 50]
 */
import {
  API_PREFIX,
  type AvailabilityDto,
  MAX_PAGE_SIZE,
  type OpenShiftDto,
  type MyRequestsDto,
  type Page,
  PUBLISHING_ROUTES,
  REQUESTS_ROUTES,
  type RosterPeriodDto,
  SOLVING_ROUTES,
  SWAP_ROUTES,
  type SolveRunDto,
  type SolveRunStartedDto,
} from '@rotaplex/contracts';
import { api, type ApiSession, draftPeriods, signInApi, startServer, stopServer, table } from './product';

function option(name: string, fallback: number): number {
  const at = process.argv.indexOf(`--${name}`);
  const value = at > 0 ? Number(process.argv[at + 1]) : fallback;
  if (!Number.isInteger(value) || value <= 0) throw new Error(`--${name} needs a positive whole number`);
  return value;
}

/** Ward staff of the demo who read the list (each sees only what they may take). */
const STAFF = ['staff@example.com', 'priya.wendover@example.com', 'grace.holloway@example.com'];

/** The q-quantile (0..1) of sorted values, nearest-rank method. */
function quantile(sorted: number[], q: number): number {
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1))];
}

/** One read of the first page (MAX_PAGE_SIZE items): milliseconds and the total. */
async function timedRead(session: ApiSession): Promise<{ ms: number; total: number }> {
  const started = performance.now();
  const page = await api<Page<OpenShiftDto>>(session, `${SWAP_ROUTES.openShifts}?pageSize=${MAX_PAGE_SIZE}`);
  return { ms: performance.now() - started, total: page.total };
}

async function main(): Promise<void> {
  const reads = option('reads', 50);
  const server = await startServer();
  try {
    const manager = await signInApi(server.baseUrl, 'manager@example.com');
    const staff = await signInApi(server.baseUrl, STAFF[0]);
    const [period] = await draftPeriods(manager);
    if (!period) throw new Error('The demo has no draft period for the ward manager');
    const { id } = await api<SolveRunStartedDto>(manager, SOLVING_ROUTES.periodSolveRuns(period.id), {
      method: 'POST',
      body: JSON.stringify({ timeLimitSeconds: 20 }),
    });
    for (;;) {
      const run = await api<SolveRunDto>(manager, SOLVING_ROUTES.solveRun(id));
      if (run.status === 'finished') break;
      if (run.status !== 'queued' && run.status !== 'running')
        throw new Error(`The solve ended ${run.status}`);
      await new Promise((ok) => setTimeout(ok, 500));
    }
    const { version } = await api<RosterPeriodDto>(manager, `/roster-periods/${period.id}`);
    await api(manager, PUBLISHING_ROUTES.publish(period.id), {
      method: 'POST',
      body: JSON.stringify({
        version,
        acknowledgeBelowMinimum: true,
        reason: 'Benchmark of the open-shift list',
      }),
    });

    const me = (await api<MyRequestsDto>(staff, REQUESTS_ROUTES.mine)).staffMembers[0].id;
    const { cells } = await api<AvailabilityDto>(staff, REQUESTS_ROUTES.availability(me));
    const rows: (string | number)[][] = [];
    const callers: [string, ApiSession][] = [['manager', manager]];
    for (const email of STAFF) callers.push([email.split('@')[0], await signInApi(server.baseUrl, email)]);
    for (const [who, session] of callers) {
      const first = await timedRead(session);
      const repeated: number[] = [];
      for (let i = 0; i < reads; i++) repeated.push((await timedRead(session)).ms);
      repeated.sort((a, b) => a - b);
      // A write that moves the write generation on: the staff member saves their weekly availability.
      await api(staff, REQUESTS_ROUTES.availability(me), { method: 'PUT', body: JSON.stringify({ cells }) });
      const afterWrite = await timedRead(session);
      rows.push([
        who,
        first.total,
        first.ms.toFixed(1),
        quantile(repeated, 0.5).toFixed(1),
        quantile(repeated, 0.95).toFixed(1),
        afterWrite.ms.toFixed(1),
      ]);
    }
    console.log(
      `\nGET ${API_PREFIX}${SWAP_ROUTES.openShifts} on the published ${period.days}-day ward period ` +
        `(${reads} repeated reads each, one at a time)\n`,
    );
    console.log(
      table(
        ['caller', 'open shifts', 'first ms', 'repeat p50 ms', 'repeat p95 ms', 'after a write ms'],
        rows,
      ),
    );
  } finally {
    await stopServer(server);
  }
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
