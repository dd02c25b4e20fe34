/**
 * Demo solve benchmark: starts the built product with its demo data, generates every draft demo
 * period through the API (the manager's Generate button does the same) and prints the objective,
 * proven bound, gap and time. Target (issue 4): a proven gap under 1% within 30 s.
 *
 *   npm run bench:demo -- [--time-limit 30] [--repeat 1]
 */
import {
  API_ROUTES,
  SOLVING_ROUTES,
  type SolveRunDto,
  type SolveRunStartedDto,
  type UnitDto,
} from '@rotaplex/contracts';
import { api, draftPeriods, signInApi, startServer, stopServer, table } from './product';

function option(name: string, fallback: number): number {
  const at = process.argv.indexOf(`--${name}`);
  const value = at > 0 ? Number(process.argv[at + 1]) : fallback;
  if (!Number.isFinite(value) || value <= 0) throw new Error(`--${name} needs a positive number`);
  return value;
}

async function main(): Promise<void> {
  const timeLimitSeconds = option('time-limit', 30);
  const repeat = option('repeat', 1);
  const server = await startServer();
  try {
    const admin = await signInApi(server.baseUrl, 'admin@example.com');
    const units = new Map(
      (await api<UnitDto[]>(admin, API_ROUTES.units)).map((u) => [u.id, u.name] as const),
    );
    const rows: (string | number)[][] = [];
    for (const period of await draftPeriods(admin)) {
      for (let r = 1; r <= repeat; r++) {
        const started = Date.now();
        const { id } = await api<SolveRunStartedDto>(admin, SOLVING_ROUTES.periodSolveRuns(period.id), {
          method: 'POST',
          body: JSON.stringify({ timeLimitSeconds }),
        });
        let run: SolveRunDto;
        for (;;) {
          run = await api<SolveRunDto>(admin, SOLVING_ROUTES.solveRun(id));
          if (!['queued', 'running'].includes(run.status)) break;
          await new Promise((ok) => setTimeout(ok, 500));
        }
        const wall = (Date.now() - started) / 1000;
        const result = run.result;
        const num = (v: number | null | undefined) => (v == null ? '-' : v.toFixed(1));
        const pct = (g: number | null | undefined) => (g == null ? '-' : `${(g * 100).toFixed(2)}%`);
        rows.push([
          units.get(period.unitId) ?? period.unitId,
          `${period.startDate} +${period.days}d`,
          r,
          run.status,
          num(result?.objective),
          num(result?.bound),
          pct(result?.gap),
          result?.gap != null && result.gap < 0.01 ? 'yes' : 'no',
          wall.toFixed(1),
        ]);
        console.error(`done: ${rows[rows.length - 1].join(' | ')}`);
      }
    }
    console.log(`\nDemo periods, time limit ${timeLimitSeconds} s\n`);
    console.log(
      table(['unit', 'period', 'run', 'status', 'objective', 'bound', 'gap', 'gap<1%', 'wall s'], rows),
    );
  } finally {
    await stopServer(server);
  }
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
