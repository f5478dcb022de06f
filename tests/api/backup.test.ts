import { spawn } from 'node:child_process';
import { createHash, randomUUID } from 'node:crypto';
import { existsSync } from 'node:fs';
import { mkdir, mkdtemp, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { tastings } from '../../server/db/schema';
import { createDatabase } from '../../server/db/client';
import type { PhotoDto } from '../../shared/types/journal';
import { createTestApp, visitor, type TestApp } from '../support/app';
import { signedIn } from '../support/factories';
import { daysAgo, insertJournalRow } from '../support/journal-rows';
import { ownDatabase, type OwnDatabase } from '../support/private-db';

// The round trip of `npm run backup` and `npm run restore`: a source database with rows and
// photos, an archive, a second, empty database restored from it; every table's row count and
// every photo file's bytes must match, and the restored site serves the photo.
const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
let source: OwnDatabase;
let target: OwnDatabase | null = null;
let work: string;
let t: TestApp;

beforeAll(async () => {
  work = await mkdtemp(path.join(os.tmpdir(), 'rindwise-backup-test-'));
  source = await ownDatabase('rindwise_backup_src');
  t = await createTestApp({
    DATABASE_URL: source.url,
    UPLOADS_DIR: path.join(work, 'uploads-src'),
  });
}, 90_000);

afterAll(async () => {
  await t?.close();
  await source?.stop();
  await target?.stop();
  if (work) await rm(work, { recursive: true, force: true });
}, 60_000);

function runScript(script: string, args: string[], env: Record<string, string>) {
  return new Promise<{ code: number; stdout: string; stderr: string }>((resolve) => {
    const child = spawn(process.execPath, [path.join(root, 'scripts', script), ...args], {
      cwd: root,
      env: { ...process.env, ...env },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (d) => (stdout += d));
    child.stderr.on('data', (d) => (stderr += d));
    child.on('exit', (code) => resolve({ code: code ?? 1, stdout, stderr }));
  });
}

async function rowCounts(url: string): Promise<Record<string, number>> {
  const handle = createDatabase(url, 1);
  try {
    const [tables] = await handle.pool.query(
      "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() AND table_type = 'BASE TABLE' ORDER BY table_name",
    );
    const counts: Record<string, number> = {};
    for (const { name } of tables as { name: string }[]) {
      const [[row]] = (await handle.pool.query(`SELECT COUNT(*) AS n FROM \`${name}\``)) as [
        { n: number }[],
        unknown,
      ];
      counts[name] = Number(row.n);
    }
    return counts;
  } finally {
    await handle.close();
  }
}

async function fileHashes(dir: string): Promise<Record<string, string>> {
  const out: Record<string, string> = {};
  if (!existsSync(dir)) return out;
  for (const entry of await readdir(dir, { recursive: true, withFileTypes: true })) {
    if (!entry.isFile()) continue;
    const full = path.join(entry.parentPath, entry.name);
    out[path.relative(dir, full)] = createHash('sha256')
      .update(await readFile(full))
      .digest('hex');
  }
  return out;
}

describe('npm run backup and npm run restore', () => {
  it('round-trip every row and every photo into an empty database', async () => {
    // Some of everything: members, journals, readings, tastings, photos.
    const maker = await signedIn(t.app, t.ctx);
    const ids: number[] = [];
    for (let i = 0; i < 5; i++) {
      ids.push(
        await insertJournalRow(t.ctx, maker.member.id, {
          title: `Backed-up wheel ${i} — “quoted”, 'apostrophe', \\ backslash, ünïcödé`,
          makeDate: daysAgo(40 + i),
        }),
      );
    }
    await t.ctx.database.db.insert(tastings).values(
      ids.map((journalId, i) => ({
        journalId,
        tasterId: maker.member.id,
        tastedOn: daysAgo(1),
        ageDays: 39 + i,
        overall: 7,
        appearance: 6,
        aroma: 7,
        flavour: 8,
        texture: 6,
        finish: 7,
        descriptors: ['nutty'],
        defects: [],
        notes: 'Line one\nline two\ttab',
      })),
    );
    const reading = await maker.post(`/api/journals/${ids[0]}/readings`, {
      id: randomUUID(),
      takenAt: new Date().toISOString(),
      tempC: 31.5,
      ph: 6.6,
    });
    expect(reading.status).toBe(201);
    const image = await sharp({
      create: { width: 1000, height: 700, channels: 3, background: '#b5651d' },
    })
      .jpeg()
      .toBuffer();
    const token = await maker.csrf();
    const upload = await maker.agent
      .post(`/api/journals/${ids[0]}/photos`)
      .set('x-csrf-token', token)
      .attach('photos', image, 'wheel.jpg');
    expect(upload.status).toBe(201);
    const photo = (upload.body.photos as PhotoDto[])[0];
    // A half-finished upload in the work area must stay out of the archive.
    await mkdir(path.join(work, 'uploads-src', '.tmp', 'req-1'), { recursive: true });
    await writeFile(path.join(work, 'uploads-src', '.tmp', 'req-1', 'part'), 'partial');

    const before = await rowCounts(source.url);
    expect(before.users).toBeGreaterThan(0);
    expect(before.journals).toBe(5);
    expect(before.tastings).toBe(5);
    expect(before.journal_readings).toBe(1);
    expect(before.journal_photos).toBe(1);
    const filesBefore = await fileHashes(path.join(work, 'uploads-src'));
    expect(Object.keys(filesBefore).filter((f) => f.startsWith('photos/'))).toHaveLength(2);

    const backup = await runScript('backup.mjs', ['--out', path.join(work, 'archives')], {
      DATABASE_URL: source.url,
      UPLOADS_DIR: path.join(work, 'uploads-src'),
    });
    expect(backup.code, backup.stderr).toBe(0);
    const archives = await readdir(path.join(work, 'archives'));
    expect(archives).toHaveLength(1);
    expect(archives[0]).toMatch(/^rindwise-backup-\d{4}-\d\d-\d\dT\d\d-\d\d-\d\dZ\.tar\.gz$/);
    const archive = path.join(work, 'archives', archives[0]);

    target = await ownDatabase('rindwise_backup_dst', { migrate: false });
    expect(await rowCounts(target.url)).toEqual({});
    const restore = await runScript('restore.mjs', [archive], {
      DATABASE_URL: target.url,
      UPLOADS_DIR: path.join(work, 'uploads-dst'),
    });
    expect(restore.code, restore.stderr).toBe(0);

    expect(await rowCounts(target.url)).toEqual(before);
    const filesAfter = await fileHashes(path.join(work, 'uploads-dst'));
    const expected = Object.fromEntries(
      Object.entries(filesBefore).filter(([name]) => !name.startsWith('.tmp')),
    );
    expect(filesAfter).toEqual(expected);

    // The restored site works: the rows read back intact and the photo is served.
    const restored = await createTestApp({
      DATABASE_URL: target.url,
      UPLOADS_DIR: path.join(work, 'uploads-dst'),
    });
    try {
      const journal = await visitor(restored.app).get(`/api/journals/${ids[0]}`);
      expect(journal.status).toBe(200);
      expect(journal.body.title).toContain('“quoted”');
      const served = await visitor(restored.app).get(photo.sources[0].url);
      expect(served.status).toBe(200);
    } finally {
      await restored.close();
    }

    // A second restore into the now full database is refused.
    const again = await runScript('restore.mjs', [archive], {
      DATABASE_URL: target.url,
      UPLOADS_DIR: path.join(work, 'uploads-dst'),
    });
    expect(again.code).not.toBe(0);
    expect(again.stderr).toMatch(/needs an empty one/);
  });
});
