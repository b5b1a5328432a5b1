import { afterAll, describe, expect, it } from 'vitest';
import { createDb } from '../../server/db/knex';
import { testConfig } from '../helpers/app';

const db = createDb(testConfig().databaseUrl);
afterAll(() => db.destroy());

async function tables() {
  const { rows } = await db.raw("select tablename from pg_tables where schemaname = 'public' order by tablename");
  return rows.map((r: { tablename: string }) => r.tablename);
}

describe('migrations', () => {
  it('go to latest, roll back to zero and up again cleanly', async () => {
    await db.migrate.latest();
    const full = await tables();
    expect(full).toEqual(expect.arrayContaining(['users', 'clubs', 'memberships', 'invites', 'password_resets', 'session']));

    await db.migrate.rollback(undefined, true);
    expect((await tables()).filter((t: string) => !t.startsWith('knex_'))).toEqual([]);
    const [, pending] = await db.migrate.list();
    expect(pending.length).toBeGreaterThan(0);

    await db.migrate.latest();
    expect(await tables()).toEqual(full);
    const [done, left] = await db.migrate.list();
    expect(left).toEqual([]);
    expect(done.length).toBe(pending.length);
  });
});
