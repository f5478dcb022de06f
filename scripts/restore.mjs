// `npm run restore -- FILE`: brings a `npm run backup` archive back into an empty database
// (DATABASE_URL, or the private instance of `npm start` under .data/, created if absent) and
// copies its uploads into UPLOADS_DIR (./uploads by default). It refuses a database that
// already has tables, so a restore never mixes two sites' rows.
import { cpSync, existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { clientOptionsFile, parseDatabaseUrl, querySql, runFromFile, tar } from './lib/backup.mjs';
import { ensureMariadbBinaries } from './lib/deps.mjs';
import { SetupError, fail, ok, step } from './lib/say.mjs';
import { targetDatabase } from './lib/target-database.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

async function main() {
  const file = process.argv.slice(2).find((arg) => !arg.startsWith('--'));
  if (!file || !existsSync(file)) {
    throw new SetupError(
      file ? `No backup archive at ${file}.` : 'Name the archive to restore.',
      'Usage: npm run restore -- backups/rindwise-backup-….tar.gz',
    );
  }
  const uploads = path.resolve(process.env.UPLOADS_DIR ?? path.join(root, 'uploads'));
  const bin = await ensureMariadbBinaries();
  const staging = mkdtempSync(path.join(os.tmpdir(), 'rindwise-restore-'));
  let target = null;
  let options = null;
  try {
    step(`Unpacking ${file}…`);
    await tar(['-xzf', path.resolve(file), '-C', staging]);
    const manifestFile = path.join(staging, 'manifest.json');
    if (!existsSync(manifestFile) || !existsSync(path.join(staging, 'database.sql'))) {
      throw new SetupError(`${file} is not a Rindwise backup (no manifest.json or database.sql).`);
    }
    const manifest = JSON.parse(readFileSync(manifestFile, 'utf8'));
    if (manifest.app !== 'rindwise' || manifest.format !== 1) {
      throw new SetupError(`${file} is a backup format this version cannot read.`);
    }

    target = await targetDatabase(root, { mustExist: false });
    const conn = parseDatabaseUrl(target.url);
    options = clientOptionsFile(conn);
    const [[tables]] = await querySql(
      bin.client,
      options.file,
      conn.database,
      'SELECT COUNT(*) FROM information_schema.tables WHERE table_schema = DATABASE()',
    );
    if (Number(tables) > 0) {
      throw new SetupError(
        `The database ${conn.database} in ${target.where} already has ${tables} table(s); a restore needs an empty one.`,
        'Create an empty database and point DATABASE_URL at it (or, for the local one, stop npm start and move .data/ aside).',
      );
    }
    step(`Loading the dump of ${manifest.createdAt} into ${conn.database}…`);
    const started = Date.now();
    await runFromFile(
      bin.client,
      [`--defaults-file=${options.file}`, conn.database],
      path.join(staging, 'database.sql'),
    );
    ok(`database restored in ${Date.now() - started} ms`);

    const files = path.join(staging, 'uploads');
    if (existsSync(files)) {
      step(`Copying ${manifest.uploadFiles} upload file(s) into ${uploads}…`);
      mkdirSync(uploads, { recursive: true });
      // Photo names are random and never reused, so an existing file of the same name is the
      // same photo: keep it.
      cpSync(files, uploads, { recursive: true, force: false, errorOnExist: false });
      ok('uploads restored');
    }
    ok('restore complete');
  } finally {
    rmSync(staging, { recursive: true, force: true });
    if (options) rmSync(options.dir, { recursive: true, force: true });
    await target?.release();
  }
}

main().catch((error) => {
  fail(error);
  process.exit(1);
});
