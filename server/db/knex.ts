import path from 'node:path';
import knexFactory, { type Knex } from 'knex';
import pg from 'pg';

const root = path.resolve(import.meta.dirname, '..', '..');

/** The knex settings for migrations and seeds, shared by the server, scripts and tests. */
export function knexConfig(databaseUrl: string): Knex.Config {
  return {
    client: 'pg',
    connection: databaseUrl,
    pool: { min: 0, max: 10 },
    migrations: {
      directory: path.join(root, 'migrations'),
      loadExtensions: ['.ts'],
      tableName: 'knex_migrations',
    },
    seeds: { directory: path.join(root, 'seeds'), loadExtensions: ['.ts'] },
  };
}

/** Opens a knex handle on the given database. */
export function createDb(databaseUrl: string): Knex {
  return knexFactory(knexConfig(databaseUrl));
}

export type Db = Knex | Knex.Transaction;

// Calendar dates stay 'YYYY-MM-DD' strings (a Date would shift them by the server's zone);
// bigint counts fit comfortably in a JS number for this product's sizes.
pgTypes();
function pgTypes() {
  const types = pg.types;
  types.setTypeParser(1082, (v: string) => v);
  types.setTypeParser(20, (v: string) => Number(v));
  types.setTypeParser(1700, (v: string) => Number(v));
}
