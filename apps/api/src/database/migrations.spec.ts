import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DataSource } from 'typeorm';
import { dataSourceOptions } from './data-source-options';
import { MIGRATIONS } from './migrations';

describe('database migrations', () => {
  let dir: string;
  beforeEach(() => {
    dir = mkdtempSync(join(tmpdir(), 'rotaplex-migrations-'));
  });
  afterEach(() => rmSync(dir, { recursive: true, force: true }));

  const open = async (file: string) => {
    const ds = new DataSource(dataSourceOptions(file));
    await ds.initialize(); // migrationsRun: true
    return ds;
  };

  it('creates on an empty file exactly the schema the entities describe', async () => {
    const ds = await open(join(dir, 'db.sqlite'));
    try {
      const tables = (
        await ds.query(
          `SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name`,
        )
      ).map((r: { name: string }) => r.name);
      expect(tables).toEqual([
        'assignments',
        'audit_entries',
        'availability_cells',
        'calendar_feed_events',
        'calendar_feeds',
        'contracts',
        'cover_overrides',
        'cover_pattern_rows',
        'date_requests',
        'demand_acceptances',
        'late_changes',
        'leave_requests',
        'mail_messages',
        'migrations',
        'one_time_tokens',
        'open_shift_outside_offers',
        'organisations',
        'outbox_messages',
        'refresh_tokens',
        'roster_period_changes',
        'roster_periods',
        'roster_publications',
        'shift_types',
        'skills',
        'solve_runs',
        'staff_member_skills',
        'staff_members',
        'swap_link_tokens',
        'swap_requests',
        'unit_demands',
        'units',
        'user_units',
        'users',
      ]);
      // TypeORM's own schema diff (what `migration:generate` would write) must be empty.
      const pending = await ds.driver.createSchemaBuilder().log();
      expect(pending.upQueries.map((q) => q.query)).toEqual([]);
    } finally {
      await ds.destroy();
    }
  });

  it('is idempotent on restart and keeps the data', async () => {
    const file = join(dir, 'db.sqlite');
    const first = await open(file);
    await first.query(`INSERT INTO organisations (id, name) VALUES ('o1', 'Kept')`);
    await first.destroy();
    const second = await open(file);
    try {
      const ran = await second.query(`SELECT name FROM migrations`);
      expect(ran).toHaveLength(MIGRATIONS.length);
      expect(await second.query(`SELECT name FROM organisations`)).toEqual([{ name: 'Kept' }]);
    } finally {
      await second.destroy();
    }
  });

  it('gives existing swap requests the first day of their changes', async () => {
    const file = join(dir, 'db.sqlite');
    const before = MIGRATIONS.findIndex((m) => m.name === 'SwapFirstDate1765281600000');
    const old = new DataSource({ ...dataSourceOptions(file), migrations: MIGRATIONS.slice(0, before) });
    await old.initialize();
    await old.query('PRAGMA foreign_keys = OFF'); // the row alone, without its period and people
    const changes = JSON.stringify([
      { staffMemberId: 's1', date: '2030-01-09', before: 'x', after: null },
      { staffMemberId: 's2', date: '2030-01-08', before: null, after: 'x' },
    ]);
    await old.query(
      `INSERT INTO swap_requests (id, rosterPeriodId, unitId, kind, status, proposerStaffMemberId, changes, version) VALUES ('r1', 'p1', 'u1', 'swap', 'proposed', 's1', ?, 1)`,
      [changes],
    );
    await old.destroy();
    const ds = await open(file);
    try {
      expect(await ds.query(`SELECT id, firstDate, changes FROM swap_requests`)).toEqual([
        { id: 'r1', firstDate: '2030-01-08', changes },
      ]);
    } finally {
      await ds.destroy();
    }
  });

  it('drops the bodies of sent e-mails and keeps those of unsent ones for sealing at start', async () => {
    const file = join(dir, 'db.sqlite');
    const before = MIGRATIONS.findIndex((m) => m.name === 'OutboxSealedBody1765368000000');
    const old = new DataSource({ ...dataSourceOptions(file), migrations: MIGRATIONS.slice(0, before) });
    await old.initialize();
    for (const [id, status] of [
      ['m1', 'sent'],
      ['m2', 'pending'],
    ]) {
      await old.query(
        `INSERT INTO outbox_messages (id, "to", subject, text, html, status) VALUES (?, 'a@example.org', 'S', 'T', '<p>H</p>', ?)`,
        [id, status],
      );
    }
    await old.destroy();
    const ds = await open(file);
    try {
      const rows = (await ds.query(`SELECT id, body FROM outbox_messages ORDER BY id`)) as {
        id: string;
        body: string | null;
      }[];
      expect(rows[0]).toEqual({ id: 'm1', body: null });
      expect(JSON.parse(rows[1].body!)).toEqual({ text: 'T', html: '<p>H</p>' });
    } finally {
      await ds.destroy();
    }
  });

  it('turns on WAL, foreign keys and secure delete', async () => {
    const ds = await open(join(dir, 'db.sqlite'));
    try {
      expect(await ds.query('PRAGMA journal_mode')).toEqual([{ journal_mode: 'wal' }]);
      expect(await ds.query('PRAGMA foreign_keys')).toEqual([{ foreign_keys: 1 }]);
      expect(await ds.query('PRAGMA secure_delete')).toEqual([{ secure_delete: 1 }]);
      await expect(
        ds.query(
          `INSERT INTO units (id, organisationId, name, timeZone) VALUES ('u1', 'missing', 'X', 'UTC')`,
        ),
      ).rejects.toThrow(/FOREIGN KEY/);
    } finally {
      await ds.destroy();
    }
  });

  it('reverts cleanly', async () => {
    const ds = await open(join(dir, 'db.sqlite'));
    try {
      for (let i = 0; i < MIGRATIONS.length; i++) await ds.undoLastMigration();
      const tables = await ds.query(
        `SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT IN ('migrations') AND name NOT LIKE 'sqlite_%'`,
      );
      expect(tables).toEqual([]);
    } finally {
      await ds.destroy();
    }
  });
});
