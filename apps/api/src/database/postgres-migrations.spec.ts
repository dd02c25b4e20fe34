import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { type DataSource } from 'typeorm';
import { OrganisationEntity } from '../organisation/organisation.entity';
import { RosterPeriodEntity } from '../roster-periods/roster-period.entity';
import { UnitEntity } from '../units/unit.entity';
import {
  createDataSource,
  dataSourceOptions,
  initializeDataSource,
  numberPlaceholders,
} from './data-source-options';
import { MIGRATIONS } from './migrations';
import { POSTGRES_BASELINE_COVERS, POSTGRES_MIGRATIONS } from './migrations/postgres';
import { POSTGRES_BIN, type PostgresCluster, startPostgresCluster } from './postgres-cluster';
import { isRetryableConflict, serialisableTransactions } from './postgres-transactions';
import { WriteGeneration } from './write-generation';

/**
 * The PostgreSQL side of the schema, on a real PostgreSQL 15 from Debian (a throwaway cluster):
 * migrations against entities with TypeORM's own schema diff, the same migration names as SQLite,
 * and the serialisable transactions that stand in for SQLite's single writer.
 */
describe('PostgreSQL schema and transactions', () => {
  let cluster: PostgresCluster;
  let databases = 0;
  const open = async (url?: string): Promise<DataSource> =>
    initializeDataSource(
      createDataSource(
        dataSourceOptions({
          type: 'postgres',
          url: url ?? (await cluster.createDatabase(`spec_${++databases}`)),
        }),
      ),
    );

  beforeAll(async () => {
    if (!existsSync(join(POSTGRES_BIN, 'initdb'))) {
      throw new Error(
        `No PostgreSQL 15 in ${POSTGRES_BIN}: apt-get install postgresql (Debian's postgresql-15)`,
      );
    }
    cluster = await startPostgresCluster();
  }, 60_000);
  afterAll(() => cluster?.stop());

  it('has a PostgreSQL twin, of the same name and in the same order, for every SQLite migration since the baseline', () => {
    const sqlite = MIGRATIONS.map((m) => m.name);
    const baselineAt = sqlite.indexOf(POSTGRES_BASELINE_COVERS);
    expect(baselineAt).toBeGreaterThanOrEqual(0);
    const sqliteSince = sqlite.slice(baselineAt + 1);
    const postgresSince = POSTGRES_MIGRATIONS.slice(1).map((m) => m.name);
    const missing = sqliteSince.filter((name) => !postgresSince.includes(name));
    if (missing.length) {
      throw new Error(
        `SQLite migrations without a PostgreSQL twin: ${missing.join(', ')}. Write each with ` +
          '`npx tsx --tsconfig apps/api/tsconfig.json apps/api/src/database/generate-postgres-migration.ts <Name>` ' +
          'and list it in migrations/postgres/index.ts',
      );
    }
    const extra = postgresSince.filter((name) => !sqliteSince.includes(name));
    if (extra.length) throw new Error(`PostgreSQL migrations without a SQLite twin: ${extra.join(', ')}`);
    expect(postgresSince).toEqual(sqliteSince);
  });

  it('creates on an empty database the tables SQLite has, and the schema diff finds nothing to change', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'rotaplex-pg-spec-'));
    const lite = createDataSource(dataSourceOptions(join(dir, 'db.sqlite')));
    await lite.initialize();
    const pg = await open();
    try {
      const liteTables = (
        (await lite.query(
          `SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name`,
        )) as { name: string }[]
      ).map((r) => r.name);
      const pgTables = (
        (await pg.query(
          `SELECT table_name AS name FROM information_schema.tables WHERE table_schema = 'public' ORDER BY table_name`,
        )) as { name: string }[]
      ).map((r) => r.name);
      expect(pgTables).toEqual(liteTables);
      // TypeORM's own schema diff (what `migration:generate` would write) must be empty on both.
      expect((await pg.driver.createSchemaBuilder().log()).upQueries.map((q) => q.query)).toEqual([]);
      expect((await lite.driver.createSchemaBuilder().log()).upQueries.map((q) => q.query)).toEqual([]);
    } finally {
      await pg.destroy();
      await lite.destroy();
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('is idempotent on restart, runs once when two instances start together, keeps the data and reverts cleanly', async () => {
    const url = await cluster.createDatabase('restart');
    const [a, b] = await Promise.all([open(url), open(url)]);
    await a.getRepository(OrganisationEntity).save({ name: 'Kept' });
    await Promise.all([a.destroy(), b.destroy()]);
    const again = await open(url);
    try {
      expect(await again.query(`SELECT name FROM migrations ORDER BY id`)).toEqual(
        POSTGRES_MIGRATIONS.map((m) => ({ name: m.name })),
      );
      expect(await again.query(`SELECT name FROM organisations`)).toEqual([{ name: 'Kept' }]);
      for (let i = 0; i < POSTGRES_MIGRATIONS.length; i++) await again.undoLastMigration();
      expect(
        await again.query(
          `SELECT table_name FROM information_schema.tables WHERE table_schema = 'public' AND table_name <> 'migrations'`,
        ),
      ).toEqual([]);
    } finally {
      await again.destroy();
    }
  });

  it('stores date-times as instants, booleans as booleans, JSON as text and enforces the CHECK and foreign keys', async () => {
    const ds = await open();
    try {
      const columns = (await ds.query(
        `SELECT column_name, data_type FROM information_schema.columns WHERE (table_name, column_name) IN (('roster_periods', 'publishedAt'), ('roster_periods', 'createdAt'), ('users', 'active'), ('solve_runs', 'weights')) ORDER BY column_name`,
      )) as { column_name: string; data_type: string }[];
      expect(columns).toEqual([
        { column_name: 'active', data_type: 'boolean' },
        { column_name: 'createdAt', data_type: 'timestamp with time zone' },
        { column_name: 'publishedAt', data_type: 'timestamp with time zone' },
        { column_name: 'weights', data_type: 'text' }, // simple-json
      ]);
      const org = await ds.getRepository(OrganisationEntity).save({ name: 'O' });
      const unit = await ds
        .getRepository(UnitEntity)
        .save({ organisationId: org.id, name: 'U', timeZone: 'Europe/London' });
      const at = new Date('2030-03-31T00:30:00.123Z'); // the night the clocks go forward in London
      const period = await ds.getRepository(RosterPeriodEntity).save({
        unitId: unit.id,
        startDate: '2030-04-01',
        days: 7,
        status: 'published',
        publishedAt: at,
        version: 1,
      });
      // A connection whose session is in another time zone reads the same instant.
      const elsewhere = createDataSource({
        ...dataSourceOptions({
          type: 'postgres',
          url: ds.options.type === 'postgres' ? ds.options.url! : '',
        }),
        extra: { max: 1, options: '-c TimeZone=America/New_York' },
      });
      await elsewhere.initialize();
      try {
        expect(await elsewhere.query('SHOW TimeZone')).toEqual([{ TimeZone: 'America/New_York' }]);
        const read = await elsewhere.getRepository(RosterPeriodEntity).findOneByOrFail({ id: period.id });
        expect(read.publishedAt?.toISOString()).toBe('2030-03-31T00:30:00.123Z');
      } finally {
        await elsewhere.destroy();
      }
      await expect(
        ds.query(`UPDATE roster_periods SET status = 'lost' WHERE id = $1`, [period.id]),
      ).rejects.toThrow(/CHK_roster_periods_status/);
      await expect(
        ds.query(
          `INSERT INTO units ("organisationId", name, "timeZone") VALUES (gen_random_uuid(), 'X', 'UTC')`,
        ),
      ).rejects.toThrow(/foreign key/);
      // Hand-written SQL with SQLite's ? placeholders runs unchanged.
      expect(await ds.query(`SELECT name FROM units WHERE "id" = ? AND name <> '?'`, [unit.id])).toEqual([
        { name: 'U' },
      ]);
    } finally {
      await ds.destroy();
    }
  });

  it('numbers ? placeholders outside quoted text only', () => {
    expect(numberPlaceholders(`SELECT '?', "a?" FROM t WHERE a = ? AND b = 'it''s ?' AND c = ?`)).toBe(
      `SELECT '?', "a?" FROM t WHERE a = $1 AND b = 'it''s ?' AND c = $2`,
    );
  });

  it('loses no update when transactions read, wait for each other and write the same row (as on SQLite)', async () => {
    const url = await cluster.createDatabase('counter');
    const setUp = await open(url);
    const org = await setUp.getRepository(OrganisationEntity).save({ name: '0' });
    await setUp.destroy();

    // Every transaction reads the counter, waits until all of them have read it, then writes
    // counter + 1: the classic lost update unless the database refuses the interleaving.
    const increments = async (ds: DataSource, n: number): Promise<number> => {
      let read = 0;
      let allRead: () => void = () => undefined;
      const barrier = new Promise<void>((resolve) => (allRead = resolve));
      let conflicts = 0;
      await Promise.all(
        Array.from({ length: n }, async () => {
          let first = true;
          await ds.transaction(async (em) => {
            const row = await em.findOneByOrFail(OrganisationEntity, { id: org.id });
            if (first) {
              first = false;
              if (++read === n) allRead();
              await barrier;
            } else {
              conflicts++;
            }
            await em.update(OrganisationEntity, { id: org.id }, { name: String(Number(row.name) + 1) });
          });
        }),
      );
      const final = await ds.getRepository(OrganisationEntity).findOneByOrFail({ id: org.id });
      await ds.getRepository(OrganisationEntity).update({ id: org.id }, { name: '0' });
      expect(conflicts).toBeGreaterThan(0); // the retries did happen
      return Number(final.name);
    };

    const guarded = createDataSource(dataSourceOptions({ type: 'postgres', url }));
    serialisableTransactions(guarded);
    await initializeDataSource(guarded);
    try {
      expect(await increments(guarded, 5)).toBe(5);
    } finally {
      await guarded.destroy();
    }

    // The control: plain READ COMMITTED transactions lose the updates, so the check above can fail.
    const plain = await open(url);
    try {
      const n = 5;
      let read = 0;
      let allRead: () => void = () => undefined;
      const barrier = new Promise<void>((resolve) => (allRead = resolve));
      await Promise.all(
        Array.from({ length: n }, () =>
          plain.transaction(async (em) => {
            const row = await em.findOneByOrFail(OrganisationEntity, { id: org.id });
            if (++read === n) allRead();
            await barrier;
            await em.update(OrganisationEntity, { id: org.id }, { name: String(Number(row.name) + 1) });
          }),
        ),
      );
      const lost =
        n - Number((await plain.getRepository(OrganisationEntity).findOneByOrFail({ id: org.id })).name);
      expect(lost).toBe(n - 1);
    } finally {
      await plain.destroy();
    }
  });

  it("moves the read caches' write generation when each of two overlapping transactions ends", async () => {
    const ds = await open();
    try {
      const writes = new WriteGeneration(ds);
      let wrote: () => void = () => undefined;
      const written = new Promise<void>((resolve) => (wrote = resolve));
      let release: () => void = () => undefined;
      const gate = new Promise<void>((resolve) => (release = resolve));
      const first = ds.transaction(async (em) => {
        await em.save(em.create(OrganisationEntity, { name: 'First' }));
        wrote();
        await gate;
      });
      await written;
      await ds.transaction((em) => em.save(em.create(OrganisationEntity, { name: 'Second' })));
      const afterSecond = writes.current();
      release();
      await first;
      // The first transaction's rows became visible to other connections only now.
      expect(writes.current()).toBeGreaterThan(afterSecond);
    } finally {
      await ds.destroy();
    }
  });

  it('tells a serialization failure and a deadlock from other errors', async () => {
    const ds = await open();
    try {
      const failure = await ds.query(`SELECT 1/0`).catch((e: unknown) => e);
      expect(isRetryableConflict(failure)).toBe(false);
      const raised = await ds
        .query(`DO $$ BEGIN RAISE EXCEPTION USING ERRCODE = 'serialization_failure'; END $$`)
        .catch((e: unknown) => e);
      expect(isRetryableConflict(raised)).toBe(true);
    } finally {
      await ds.destroy();
    }
  });
});
