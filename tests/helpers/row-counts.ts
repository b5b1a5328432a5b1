import type { Knex } from 'knex';

/**
 * How many rows each product table holds (sessions, the per-address request counts, which count refused
 * requests too by design, and the migrations' bookkeeping left out), to check
 * that a refused request wrote nothing. One query, so it is cheap enough to run around every request.
 */
export async function rowCounts(db: Knex): Promise<Record<string, number>> {
  const { rows } = await db.raw(
    "select tablename from pg_tables where schemaname = 'public' and tablename not like 'knex_%' and tablename not in ('session', 'rate_limits') order by tablename",
  );
  const names: string[] = rows.map((r: { tablename: string }) => r.tablename);
  if (names.length === 0) return {};
  const sql = names.map((n) => `select '${n}' as t, count(*)::int as n from "${n}"`).join(' union all ');
  const counted = await db.raw(sql);
  return Object.fromEntries(counted.rows.map((r: { t: string; n: number }) => [r.t, r.n]));
}
