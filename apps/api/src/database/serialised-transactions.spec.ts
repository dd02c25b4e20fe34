import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DataSource } from 'typeorm';
import { OrganisationEntity } from '../organisation/organisation.entity';
import { UnitEntity } from '../units/unit.entity';
import { UserEntity } from '../users/user.entity';
import { dataSourceOptions } from './data-source-options';
import { serialiseTransactions } from './serialised-transactions';

/** A promise plus its resolver, to interleave two "requests" deterministically. */
function gate() {
  let open!: () => void;
  const opened = new Promise<void>((resolve) => (open = resolve));
  return { open, opened };
}

describe('serialised transactions on the shared SQLite connection', () => {
  let dir: string;
  beforeEach(() => {
    dir = mkdtempSync(join(tmpdir(), 'rotaplex-tx-'));
  });
  afterEach(() => rmSync(dir, { recursive: true, force: true }));

  async function open(serialise: boolean): Promise<DataSource> {
    const ds = new DataSource(dataSourceOptions(join(dir, 'db.sqlite')));
    if (serialise) serialiseTransactions(ds);
    await ds.initialize();
    return ds;
  }

  /**
   * Request A opens a transaction, writes, and waits; meanwhile request B writes (in its own
   * transaction, and with a plain query); then A fails and rolls back. B's work must survive.
   */
  async function scenario(ds: DataSource): Promise<string[]> {
    const aWrote = gate();
    const bStarted = gate();
    const a = ds
      .transaction(async (em) => {
        await em.query(`INSERT INTO organisations (id, name) VALUES ('a', 'A')`);
        aWrote.open();
        await bStarted.opened;
        await new Promise((r) => setTimeout(r, 20));
        throw new Error('A fails');
      })
      .catch(() => 'A rolled back');
    await aWrote.opened;
    const b = (async () => {
      bStarted.open();
      await ds.transaction((em) => em.query(`INSERT INTO organisations (id, name) VALUES ('b', 'B')`));
      await ds.query(`INSERT INTO organisations (id, name) VALUES ('c', 'C')`);
    })();
    await Promise.all([a, b]);
    return ((await ds.query(`SELECT id FROM organisations ORDER BY id`)) as { id: string }[]).map(
      (r) => r.id,
    );
  }

  it('without serialising, a rollback of one request undoes the work of another (the problem)', async () => {
    const ds = await open(false);
    try {
      expect(await scenario(ds)).not.toEqual(['b', 'c']);
    } finally {
      await ds.destroy();
    }
  });

  it('with serialising, each request keeps exactly its own outcome', async () => {
    const ds = await open(true);
    try {
      expect(await scenario(ds)).toEqual(['b', 'c']);
    } finally {
      await ds.destroy();
    }
  });

  it('keeps nested transactions (savepoints) of the owner working', async () => {
    const ds = await open(true);
    try {
      await ds.transaction(async (em) => {
        await em.query(`INSERT INTO organisations (id, name) VALUES ('outer', 'O')`);
        await em
          .transaction(async (inner) => {
            await inner.query(`INSERT INTO organisations (id, name) VALUES ('inner', 'I')`);
            throw new Error('inner fails');
          })
          .catch(() => undefined);
      });
      expect(await ds.query(`SELECT id FROM organisations`)).toEqual([{ id: 'outer' }]);
    } finally {
      await ds.destroy();
    }
  });

  it('implicit transactions (repository.save with relations) and failing explicit ones, all overlapping', async () => {
    const ds = await open(true);
    try {
      const org = await ds.getRepository(OrganisationEntity).save({ name: 'Org' });
      const unit = await ds
        .getRepository(UnitEntity)
        .save({ organisationId: org.id, name: 'U', timeZone: 'UTC' });
      const users = ds.getRepository(UserEntity);
      const work: Promise<unknown>[] = [];
      for (let i = 0; i < 10; i++) {
        work.push(
          users.save(
            users.create({
              organisationId: org.id,
              email: `p${i}@example.com`,
              displayName: `P${i}`,
              role: 'staff',
              passwordHash: null,
              units: [unit],
            }),
          ),
        );
        work.push(
          ds
            .transaction(async (em) => {
              await em.query(`INSERT INTO organisations (id, name) VALUES (?, 'doomed')`, [`d${i}`]);
              await new Promise((r) => setTimeout(r, 1));
              throw new Error('fails');
            })
            .catch(() => undefined),
        );
      }
      await Promise.all(work);
      expect(await ds.query(`SELECT COUNT(*) AS n FROM users`)).toEqual([{ n: 10 }]);
      expect(await ds.query(`SELECT COUNT(*) AS n FROM user_units`)).toEqual([{ n: 10 }]);
      expect(await ds.query(`SELECT COUNT(*) AS n FROM organisations`)).toEqual([{ n: 1 }]);
    } finally {
      await ds.destroy();
    }
  });
});
