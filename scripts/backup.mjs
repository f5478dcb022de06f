// `npm run backup [-- --out DIR]`: one dated archive with a consistent dump of the database
// (mariadb-dump --single-transaction: one snapshot, no table locks, the site stays up) and
// the uploads folder (UPLOADS_DIR, without its .tmp/ work area). The database is DATABASE_URL,
// or the private instance of `npm start` under .data/. The archive goes to --out, BACKUP_DIR
// or ./backups, written under a temporary name and renamed when complete.
import {
  mkdirSync,
  mkdtempSync,
  readdirSync,
  renameSync,
  rmSync,
  statSync,
  writeFileSync,
} from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { archiveName, clientOptionsFile, parseDatabaseUrl, runToFile, tar } from './lib/backup.mjs';
import { ensureMariadbBinaries } from './lib/deps.mjs';
import { SetupError, fail, info, ok, step } from './lib/say.mjs';
import { targetDatabase } from './lib/target-database.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

function argValue(name) {
  const at = process.argv.indexOf(name);
  return at >= 0 ? process.argv[at + 1] : undefined;
}

function countFiles(dir) {
  let n = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true, recursive: true })) {
    if (entry.isFile() && !path.relative(dir, entry.parentPath).split(path.sep).includes('.tmp'))
      n += 1;
  }
  return n;
}

async function main() {
  const outDir = path.resolve(
    argValue('--out') ?? process.env.BACKUP_DIR ?? path.join(root, 'backups'),
  );
  const uploads = path.resolve(process.env.UPLOADS_DIR ?? path.join(root, 'uploads'));
  const bin = await ensureMariadbBinaries();
  if (!bin.dump)
    throw new SetupError('mariadb-dump is missing.', 'apt-get install -y mariadb-client');
  const target = await targetDatabase(root, { mustExist: true });
  const staging = mkdtempSync(path.join(os.tmpdir(), 'rindwise-backup-'));
  const conn = parseDatabaseUrl(target.url);
  const options = clientOptionsFile(conn);
  try {
    step(`Dumping ${conn.database} from ${target.where}…`);
    const started = Date.now();
    await runToFile(
      bin.dump,
      [
        `--defaults-file=${options.file}`,
        '--single-transaction',
        '--routines',
        '--triggers',
        '--hex-blob',
        '--quick',
        '--no-tablespaces',
        '--skip-lock-tables',
        conn.database,
      ],
      path.join(staging, 'database.sql'),
    );
    const dumpBytes = statSync(path.join(staging, 'database.sql')).size;
    ok(`dump written (${(dumpBytes / 1e6).toFixed(1)} MB in ${Date.now() - started} ms)`);

    // Files after the dump: every photo row in the dump has its files, unless the photo was
    // deleted while the backup ran; a file without a row is harmless.
    const hasUploads = statSync(uploads, { throwIfNoEntry: false })?.isDirectory() ?? false;
    const files = hasUploads ? countFiles(uploads) : 0;
    writeFileSync(
      path.join(staging, 'manifest.json'),
      `${JSON.stringify(
        {
          format: 1,
          app: 'rindwise',
          createdAt: new Date().toISOString(),
          database: conn.database,
          dumpBytes,
          uploadFiles: files,
        },
        null,
        2,
      )}\n`,
    );
    mkdirSync(outDir, { recursive: true });
    const name = archiveName();
    const final = path.join(outDir, name);
    const partial = `${final}.partial`;
    step(`Packing the dump and ${files} upload file(s) from ${uploads}…`);
    const args = ['-czf', partial, '-C', staging, 'manifest.json', 'database.sql'];
    if (hasUploads) {
      // Members under uploads/ in the archive, whatever the folder is called here.
      args.push('-C', uploads, '--exclude=./.tmp', '--transform=s,^\\.,uploads,', '.');
    }
    await tar(args);
    renameSync(partial, final);
    ok(`backup written: ${final}`);
    info(`Restore it into an empty database with: npm run restore -- ${final}`);
    process.stdout.write(`${final}\n`);
  } finally {
    rmSync(staging, { recursive: true, force: true });
    rmSync(options.dir, { recursive: true, force: true });
    await target.release();
  }
}

main().catch((error) => {
  fail(error);
  process.exit(1);
});
