import {
  MAX_PAGE_SIZE,
  type Page,
  PUBLISHING_ROUTES as PUB,
  SOLVING_ROUTES as R,
  type SolveRunDto,
  type SolveRunSummaryDto,
} from '@rotaplex/contracts';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { generate, smallUnit, waitForRun } from './publishing-fixture';
import { publishPeriod } from './support/planning';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

jest.setTimeout(240_000);

/**
 * GET /api/roster-periods/:id/solve-runs pages (newest first, no result JSON), and each run keeps
 * its mode (generate or repair) on its row, so a restart of the server on the same database file
 * still knows which run was a repair.
 */
describe('solve run list and mode', () => {
  const dir = mkdtempSync(join(tmpdir(), 'rotaplex-run-mode-'));
  let t: TestApp;
  let admin: string;
  let periodId: string;
  let generated: SolveRunDto;
  let repaired: SolveRunDto;

  const list = (app: TestApp, query: Record<string, unknown>) =>
    app
      .http()
      .get(api(R.periodSolveRuns(periodId)))
      .query(query)
      .set(bearer(admin));

  beforeAll(async () => {
    t = await startTestApp({}, dir);
    admin = (await t.login('admin@example.com')).token;
    periodId = (await smallUnit(t, admin, 'Harbour Desk', '2030-10-07')).period.id;
    generated = await generate(t, admin, periodId);
    await publishPeriod(t, admin, periodId);
    const started = await t
      .http()
      .post(api(PUB.repair(periodId)))
      .set(bearer(admin))
      .send({ timeLimitSeconds: 5 })
      .expect(202);
    repaired = await waitForRun(t, admin, (started.body as { id: string }).id);
  });
  afterAll(async () => {
    await t?.close();
    rmSync(dir, { recursive: true, force: true });
  });

  it('stores the mode with the run and reports it', () => {
    expect([generated.mode, generated.status]).toEqual(['generate', 'finished']);
    expect([repaired.mode, repaired.status]).toEqual(['repair', 'finished']);
    expect(repaired.result).not.toBeNull();
  });

  it('pages newest first, without the result JSON', async () => {
    const first = (await list(t, { pageSize: 1 }).expect(200)).body as Page<SolveRunSummaryDto>;
    expect(first).toMatchObject({ total: 2, page: 1, pageSize: 1 });
    expect(first.items.map((r) => [r.id, r.mode])).toEqual([[repaired.id, 'repair']]);
    expect(first.items[0]).not.toHaveProperty('result');
    const second = (await list(t, { page: 2, pageSize: 1 }).expect(200)).body as Page<SolveRunSummaryDto>;
    expect(second.items.map((r) => r.id)).toEqual([generated.id]);
    const past = (await list(t, { page: 3, pageSize: 1 }).expect(200)).body as Page<SolveRunSummaryDto>;
    expect(past).toMatchObject({ items: [], total: 2, page: 3 });
    const defaults = (await list(t, {}).expect(200)).body as Page<SolveRunSummaryDto>;
    expect(defaults).toMatchObject({ total: 2, page: 1, pageSize: 20 });
    expect(defaults.items.map((r) => r.id)).toEqual([repaired.id, generated.id]);
  });

  it('answers 400 naming the field for pages out of bounds', async () => {
    for (const [query, field] of [
      [{ page: 0 }, 'page'],
      [{ page: 'two' }, 'page'],
      [{ pageSize: 0 }, 'pageSize'],
      [{ pageSize: MAX_PAGE_SIZE + 1 }, 'pageSize'],
      [{ pageSize: 1.5 }, 'pageSize'],
      [{ sort: 'status' }, 'sort'],
    ] as const) {
      const res = await list(t, query).expect(400);
      expect(JSON.stringify(res.body.message)).toContain(field);
    }
    await list(t, { pageSize: MAX_PAGE_SIZE }).expect(200);
  });

  it('keeps each run’s mode across a restart of the server on the same database file', async () => {
    await t.close();
    t = await startTestApp({}, dir);
    admin = (await t.login('admin@example.com')).token;
    const again = (
      await t
        .http()
        .get(api(R.solveRun(repaired.id)))
        .set(bearer(admin))
        .expect(200)
    ).body as SolveRunDto;
    expect([again.mode, again.status]).toEqual(['repair', 'finished']);
    const runs = (await list(t, {}).expect(200)).body as Page<SolveRunSummaryDto>;
    expect(runs.items.map((r) => [r.id, r.mode])).toEqual([
      [repaired.id, 'repair'],
      [generated.id, 'generate'],
    ]);
  });
});
