import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { sql } from 'drizzle-orm';
import supertest from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { migrateDatabase } from '../../server/db/migrate';
import { seedDemo } from '../../server/db/seed';
import { createTestApp, type TestApp } from '../support/app';
import { expectFactsUpToDate } from '../support/compare-facts';

// The demo scenario seeded into its own empty database, as the first `npm start` does.
describe('demo seed', () => {
  let t: TestApp;
  let uploads: string;
  beforeAll(async () => {
    uploads = mkdtempSync(path.join(os.tmpdir(), 'rindwise-seed-uploads-'));
    t = await createTestApp({ DATABASE_URL: process.env.SEED_DATABASE_URL!, UPLOADS_DIR: uploads });
    await migrateDatabase(t.ctx.database.db);
    await t.ctx.database.db.execute(sql`SET FOREIGN_KEY_CHECKS = 0`);
    for (const table of [
      'compare_facts',
      'tastings',
      'journal_photos',
      'journal_readings',
      'journals',
      'users',
    ]) {
      await t.ctx.database.db.execute(sql.raw(`DELETE FROM ${table}`));
    }
    await t.ctx.database.db.execute(sql`SET FOREIGN_KEY_CHECKS = 1`);
  }, 120_000);
  afterAll(async () => {
    await t?.close();
    rmSync(uploads, { recursive: true, force: true });
  });

  it('creates the club, two dozen journals across styles with photos, readings and tastings', async () => {
    const accounts = await seedDemo(t.ctx);
    expect(accounts.map((a) => a.role).sort()).toEqual([
      'admin',
      'member',
      'member',
      'member',
      'moderator',
    ]);
    const [[counts]] = (await t.ctx.database.db.execute(sql`
      SELECT (SELECT COUNT(*) FROM journals) AS journals,
             (SELECT COUNT(DISTINCT style_id) FROM journals) AS styles,
             (SELECT COUNT(*) FROM journals WHERE heat_treatment = 'raw') AS raw,
             (SELECT COUNT(*) FROM journals WHERE heat_treatment = 'pasteurised') AS pasteurised,
             (SELECT COUNT(*) FROM journal_photos) AS photos,
             (SELECT COUNT(*) FROM journal_weigh_ins) AS weighIns,
             (SELECT COUNT(*) FROM journal_press_stages) AS pressStages,
             (SELECT COUNT(*) FROM journal_readings) AS readings,
             (SELECT COUNT(*) FROM tastings) AS tastings`)) as unknown as [
      Record<string, number>[],
    ];
    expect(Number(counts.journals)).toBeGreaterThanOrEqual(24);
    expect(Number(counts.styles)).toBeGreaterThanOrEqual(6);
    expect(Number(counts.raw)).toBeGreaterThanOrEqual(3);
    expect(Number(counts.pasteurised)).toBeGreaterThanOrEqual(3);
    expect(Number(counts.photos)).toBeGreaterThanOrEqual(24);
    expect(Number(counts.weighIns)).toBeGreaterThan(100);
    expect(Number(counts.pressStages)).toBeGreaterThan(40);
    expect(Number(counts.readings)).toBeGreaterThan(20);
    expect(Number(counts.tastings)).toBeGreaterThan(20);
    // Three WebP renditions (320, 960, 1920 px) of each drawn 1920 px photo are on disk.
    expect(
      readdirSync(path.join(uploads, 'photos')).filter((f) => f.endsWith('.webp')),
    ).toHaveLength(Number(counts.photos) * 3);

    const discover = await supertest(t.app)
      .get('/api/journals?style=cheddar&sort=best')
      .expect(200);
    expect(discover.body.total).toBeGreaterThan(3);
    expect(discover.body.items[0].cover).not.toBeNull();
    // Compare counts a batch once by default; every scorecard only when asked for.
    const compare = await supertest(t.app).get('/api/compare?x=saltPerLitre&y=overall').expect(200);
    expect(compare.body).toMatchObject({ per: 'journal', meaningful: true });
    expect(compare.body.n).toBeGreaterThanOrEqual(5);
    const perTasting = await supertest(t.app)
      .get('/api/compare?x=saltPerLitre&y=overall&per=tasting')
      .expect(200);
    expect(perTasting.body.n).toBeGreaterThanOrEqual(10);
    // A second run refuses to touch a database that has members.
    expect(await seedDemo(t.ctx)).toEqual([]);
  }, 180_000);

  it("keeps Compare's facts equal to a from-scratch computation, and so does the migration's backfill", async () => {
    // Written as the seed went, through the services and repositories.
    expect(await expectFactsUpToDate(t.ctx)).toBeGreaterThanOrEqual(24);
    const before = await supertest(t.app).get('/api/compare?x=ageDays&y=flavour').expect(200);
    // The backfill statements of the migrations that made the table and added its title,
    // run in their order on the seeded rows.
    const statements = (file: string) =>
      readFileSync(new URL(`../../migrations/${file}`, import.meta.url), 'utf8')
        .split('--> statement-breakpoint')
        .map((s) => s.trim());
    const backfill = statements('0009_compare_facts.sql').find((s) =>
      s.startsWith('INSERT INTO `compare_facts`'),
    )!;
    const titles = statements('0011_compare_facts_title.sql').find((s) =>
      s.startsWith('UPDATE `compare_facts`'),
    )!;
    await t.ctx.database.db.execute(sql`DELETE FROM compare_facts`);
    await t.ctx.database.db.execute(sql.raw(backfill));
    await t.ctx.database.db.execute(sql.raw(titles));
    expect(await expectFactsUpToDate(t.ctx)).toBeGreaterThanOrEqual(24);
    const after = await supertest(t.app).get('/api/compare?x=ageDays&y=flavour').expect(200);
    expect(after.body).toEqual(before.body);
  });
});
