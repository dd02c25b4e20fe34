import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DataSource } from 'typeorm';
import { OrganisationEntity } from '../organisation/organisation.entity';
import { MailMessageEntity } from '../mail/mail-message.entity';
import { dataSourceOptions } from './data-source-options';
import { serialiseTransactions } from './serialised-transactions';
import { GenerationCache, WriteGeneration } from './write-generation';

// The cache must never serve data older than the last committed write: each case reads through
// the cache, writes through a real SQLite file, and reads again.
describe('write generation and the read cache', () => {
  let dir: string;
  let ds: DataSource;
  let writes: WriteGeneration;
  let cache: GenerationCache<string[]>;
  const names = () =>
    cache.get('orgs', async () =>
      (await ds.manager.find(OrganisationEntity, { order: { name: 'ASC' } })).map((o) => o.name),
    );

  beforeEach(async () => {
    dir = mkdtempSync(join(tmpdir(), 'rotaplex-gen-'));
    ds = new DataSource(dataSourceOptions(join(dir, 'db.sqlite')));
    serialiseTransactions(ds);
    await ds.initialize();
    writes = new WriteGeneration(ds);
    cache = new GenerationCache(writes);
  });
  afterEach(async () => {
    await ds.destroy();
    rmSync(dir, { recursive: true, force: true });
  });

  it('serves a repeated read from the cache until a write, then reads again', async () => {
    await ds.manager.save(OrganisationEntity, { name: 'Alpha' });
    let computed = 0;
    const counted = () =>
      cache.get('x', async () => {
        computed++;
        return [];
      });
    await counted();
    await counted();
    expect(computed).toBe(1);
    await ds.manager.save(OrganisationEntity, { name: 'Beta' });
    await counted();
    expect(computed).toBe(2);
    expect(await names()).toEqual(['Alpha', 'Beta']);
  });

  it('expires an entry after its maximum age even when nothing was written', async () => {
    const aged = new GenerationCache<number>(writes, { maxAgeMs: 50 });
    let computed = 0;
    const read = () => aged.get('k', async () => ++computed);
    expect(await read()).toBe(1);
    expect(await read()).toBe(1);
    await new Promise((r) => setTimeout(r, 80));
    expect(await read()).toBe(2);
  });

  it('sees saves, query-builder updates and deletes, removes and transactions', async () => {
    const org = await ds.manager.save(OrganisationEntity, { name: 'Alpha' });
    expect(await names()).toEqual(['Alpha']);
    await ds.manager.update(OrganisationEntity, { id: org.id }, { name: 'Gamma' });
    expect(await names()).toEqual(['Gamma']);
    await ds.transaction(async (em) => {
      await em.save(OrganisationEntity, { name: 'Delta' });
      await em.save(OrganisationEntity, { name: 'Epsilon' });
    });
    expect(await names()).toEqual(['Delta', 'Epsilon', 'Gamma']);
    await ds.manager.delete(OrganisationEntity, { name: 'Delta' });
    expect(await names()).toEqual(['Epsilon', 'Gamma']);
    await ds.manager.remove(await ds.manager.findOneByOrFail(OrganisationEntity, { name: 'Gamma' }));
    expect(await names()).toEqual(['Epsilon']);
  });

  it('reads what is stored after a rolled-back transaction, also when a read waited for it', async () => {
    await ds.manager.save(OrganisationEntity, { name: 'Alpha' });
    expect(await names()).toEqual(['Alpha']);
    let release!: () => void;
    const held = new Promise<void>((r) => (release = r));
    const tx = ds
      .transaction(async (em) => {
        await em.save(OrganisationEntity, { name: 'Beta' });
        await held;
        throw new Error('rolled back');
      })
      .catch(() => undefined);
    // Queries of other requests wait for the open transaction (serialised-transactions.ts).
    const during = names();
    release();
    await tx;
    expect(await during).toEqual(['Alpha']);
    expect(await names()).toEqual(['Alpha']);
    await ds.manager.save(OrganisationEntity, { name: 'Beta' });
    expect(await names()).toEqual(['Alpha', 'Beta']);
  });

  it('is not moved by writes to tables that reads do not show (caught mail)', async () => {
    const before = writes.current();
    await ds.manager.save(OrganisationEntity, { name: 'Alpha' });
    const afterOrg = writes.current();
    expect(afterOrg).toBeGreaterThan(before);
    await ds.manager.save(MailMessageEntity, {
      messageId: null,
      from: 'a@example.com',
      to: ['b@example.com'],
      subject: 'Hello',
      text: 'Hello',
      html: null,
      receivedAt: new Date(),
    });
    expect(writes.current()).toBe(afterOrg);
  });
});
