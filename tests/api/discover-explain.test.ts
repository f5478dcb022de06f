import { drizzle } from 'drizzle-orm/mysql2';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fillCommunity } from '../../bench/fill';
import * as schema from '../../server/db/schema';
import { createTestApp, visitor, type TestApp } from '../support/app';
import { ownDatabase, type OwnDatabase } from '../support/private-db';

// Every Discover filter and sort, as the API sends it, must be answered through an index on
// journals (never a full scan). Over a small community from the benchmark's generator (3,000
// journals) in a database of this file's own, so the optimizer sees a realistic spread.
let database: OwnDatabase;
let t: TestApp;
const captured: { sql: string; params: unknown[] }[] = [];
let maker = '';

beforeAll(async () => {
  database = await ownDatabase('rindwise_explain');
  t = await createTestApp({ DATABASE_URL: database.url });
  const fill = await fillCommunity(t.ctx.database.pool, {
    members: 300,
    journals: 3000,
    tastings: 12_000,
    detailed: 20,
  });
  maker = fill.probes.makerHandle;
  // The same pool, with a logger that keeps every statement Drizzle sends.
  t.ctx.database = {
    ...t.ctx.database,
    db: drizzle(t.ctx.database.pool, {
      schema,
      mode: 'default',
      logger: { logQuery: (sql, params) => captured.push({ sql, params }) },
    }),
  };
}, 120_000);

afterAll(async () => {
  await t?.close();
  await database?.stop();
}, 60_000);

const FILTERS = [
  '',
  'sort=oldest',
  'sort=best',
  'sort=most-tasted',
  'style=cheddar',
  'style=cheddar&sort=best',
  'style=cheddar&agingMin=60&agingMax=240&sort=best',
  'style=gouda&style=alpine&sort=newest',
  'agingMin=90',
  'agingMin=30&agingMax=120&agingBy=tasted',
  'minScore=6&sort=best',
  'species=goat',
  'heat=raw&agingMin=60',
  'rind=waxed',
  'q=nutty',
  'q=nutty&style=cheddar',
  'maker=@MAKER',
  'maker=@MAKER&sort=best',
  'page=5',
];

type Plan = { table: string; type: string; key: string | null; Extra: string | null };

describe('EXPLAIN of every Discover filter', () => {
  for (const filter of FILTERS) {
    it(`uses an index on journals for ?${filter || '(no filter)'}`, async () => {
      captured.length = 0;
      const query = filter.replace('@MAKER', maker);
      const res = await visitor(t.app).get(`/api/journals?${query}`);
      expect(res.status).toBe(200);
      const onJournals = captured.filter((q) => /from `journals`/i.test(q.sql));
      expect(onJournals.length).toBeGreaterThan(0);
      for (const { sql, params } of onJournals) {
        const [rows] = (await t.ctx.database.pool.query(`EXPLAIN ${sql}`, params)) as unknown as [
          Plan[],
        ];
        const journalsRow = rows.find((r) => r.table === 'journals');
        expect(journalsRow, sql).toBeDefined();
        expect(journalsRow!.type, `${sql}\n${JSON.stringify(rows)}`).not.toBe('ALL');
        expect(journalsRow!.key, `${sql}\n${JSON.stringify(rows)}`).not.toBeNull();
      }
    });
  }
});
