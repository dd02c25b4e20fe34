/**
 * Board read load benchmark: starts the built product with its demo data, starts a long solve of
 * the ward's demo period (so the solver pool is busy, as when a manager presses Generate), then
 * lets 20 concurrent readers fetch the planning board (the assignments grid with the checker's
 * findings, which is what the board page loads) for a fixed time with autocannon, a well-known
 * HTTP load tool. Prints latency percentiles; the target (issue 4) is p95 under 100 ms.
 *
 *   npm run bench:load -- [--connections 20] [--duration 20]
 */
import autocannon from 'autocannon';
import { API_PREFIX, SOLVING_ROUTES, type SolveRunDto, type SolveRunStartedDto } from '@rotaplex/contracts';
import { api, draftPeriods, signInApi, startServer, stopServer, table } from './product';

function option(name: string, fallback: number): number {
  const at = process.argv.indexOf(`--${name}`);
  const value = at > 0 ? Number(process.argv[at + 1]) : fallback;
  if (!Number.isInteger(value) || value <= 0) throw new Error(`--${name} needs a positive whole number`);
  return value;
}

/** The q-quantile (0..1) of sorted values, nearest-rank method. */
function quantile(sorted: number[], q: number): number {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1))];
}

async function main(): Promise<void> {
  const connections = option('connections', 20);
  const duration = option('duration', 20);
  const server = await startServer();
  try {
    const manager = await signInApi(server.baseUrl, 'manager@example.com');
    const [period] = await draftPeriods(manager);
    if (!period) throw new Error('The demo has no draft period for the ward manager');
    const { id: runId } = await api<SolveRunStartedDto>(manager, SOLVING_ROUTES.periodSolveRuns(period.id), {
      method: 'POST',
      body: JSON.stringify({ timeLimitSeconds: duration + 30 }),
    });
    // Wait until the solve really runs, so the load meets a busy solver.
    for (let i = 0; ; i++) {
      const run = await api<SolveRunDto>(manager, SOLVING_ROUTES.solveRun(runId));
      if (run.status === 'running') break;
      if (run.status !== 'queued' || i > 120) throw new Error(`The solve did not start: ${run.status}`);
      await new Promise((ok) => setTimeout(ok, 250));
    }
    const latencies: number[] = [];
    const statuses = new Map<number, number>();
    const result = await new Promise<autocannon.Result>((ok, fail) => {
      const instance = autocannon(
        {
          url: `${server.baseUrl}${API_PREFIX}${SOLVING_ROUTES.assignments(period.id)}`,
          headers: { authorization: `Bearer ${manager.token}` },
          connections,
          duration,
        },
        (error, done) => (error ? fail(error) : ok(done)),
      );
      instance.on('response', (_client, statusCode, _bytes, responseTime) => {
        latencies.push(responseTime);
        statuses.set(statusCode, (statuses.get(statusCode) ?? 0) + 1);
      });
    });
    const during = await api<SolveRunDto>(manager, SOLVING_ROUTES.solveRun(runId));
    await api(manager, SOLVING_ROUTES.solveRunCancel(runId), { method: 'POST' });
    latencies.sort((a, b) => a - b);
    const ms = (v: number) => v.toFixed(1);
    console.log(
      `\nPlanning board reads (GET assignments of a ${period.days}-day period) by ${connections} ` +
        `concurrent readers for ${duration} s while a solve runs (run status at the end: ${during.status})\n`,
    );
    console.log(
      table(
        [
          'requests',
          'req/s',
          'p50 ms',
          'p90 ms',
          'p95 ms',
          'p99 ms',
          'max ms',
          'errors',
          'statuses',
          'p95<100ms',
        ],
        [
          [
            latencies.length,
            ms(result.requests.average),
            ms(quantile(latencies, 0.5)),
            ms(quantile(latencies, 0.9)),
            ms(quantile(latencies, 0.95)),
            ms(quantile(latencies, 0.99)),
            ms(latencies[latencies.length - 1] ?? NaN),
            result.errors + result.timeouts,
            [...statuses].map(([s, n]) => `${s}:${n}`).join(' '),
            quantile(latencies, 0.95) < 100 ? 'yes' : 'no',
          ],
        ],
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
