// Shared parts of `npm run backup` and `npm run restore` (Node built-ins and Debian's
// mariadb client programs and GNU tar only).
import { spawn } from 'node:child_process';
import {
  createReadStream,
  createWriteStream,
  existsSync,
  mkdtempSync,
  writeFileSync,
} from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { capture } from './run.mjs';
import { SetupError } from './say.mjs';

/** The parts of a mysql:// URL the client programs need. */
export function parseDatabaseUrl(url) {
  const u = new URL(url);
  if (u.protocol !== 'mysql:') {
    throw new SetupError(`DATABASE_URL must be a mysql:// URL, not ${u.protocol}//…`);
  }
  return {
    host: u.hostname || '127.0.0.1',
    port: Number(u.port || 3306),
    user: decodeURIComponent(u.username),
    password: decodeURIComponent(u.password),
    database: decodeURIComponent(u.pathname.replace(/^\//, '')) || 'rindwise',
  };
}

const quoteOption = (value) => `"${String(value).replace(/\\/g, '\\\\').replace(/"/g, '\\"')}"`;

/**
 * Writes a private client option file (mode 0600) in its own temporary folder, so the
 * password never appears on a command line or in `ps`. Returns its path.
 */
export function clientOptionsFile(conn) {
  const dir = mkdtempSync(path.join(os.tmpdir(), 'rindwise-client-'));
  const file = path.join(dir, 'client.cnf');
  writeFileSync(
    file,
    [
      '[client]',
      `user=${quoteOption(conn.user)}`,
      `password=${quoteOption(conn.password)}`,
      `host=${quoteOption(conn.host)}`,
      `port=${conn.port}`,
      'protocol=TCP',
      'default-character-set=utf8mb4',
      '',
    ].join('\n'),
    { mode: 0o600 },
  );
  return { file, dir };
}

/** Runs a program with stdout written to a file; rejects with its stderr on a non-zero exit. */
export function runToFile(command, args, outFile) {
  return new Promise((resolve, reject) => {
    const out = createWriteStream(outFile, { mode: 0o600 });
    const child = spawn(command, args, { stdio: ['ignore', 'pipe', 'pipe'] });
    let stderr = '';
    child.stderr.on('data', (d) => (stderr += d));
    child.stdout.pipe(out);
    child.on('error', reject);
    child.on('exit', (code) => {
      out.end(() => {
        if (code === 0) resolve();
        else
          reject(
            new SetupError(`${path.basename(command)} failed (exit ${code}):\n${stderr.trim()}`),
          );
      });
    });
  });
}

/** Runs a program with stdin read from a file; rejects with its stderr on a non-zero exit. */
export function runFromFile(command, args, inFile) {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { stdio: ['pipe', 'ignore', 'pipe'] });
    let stderr = '';
    child.stderr.on('data', (d) => (stderr += d));
    createReadStream(inFile).pipe(child.stdin);
    child.on('error', reject);
    child.on('exit', (code) => {
      if (code === 0) resolve();
      else
        reject(
          new SetupError(`${path.basename(command)} failed (exit ${code}):\n${stderr.trim()}`),
        );
    });
  });
}

/** Runs one SQL statement with the mariadb client; resolves with the tab-separated rows. */
export async function querySql(client, optionsFile, database, statement) {
  const result = await capture(client, [
    `--defaults-file=${optionsFile}`,
    '--batch',
    '--skip-column-names',
    database,
    '-e',
    statement,
  ]);
  if (result.code !== 0) {
    throw new SetupError(`A query failed in MariaDB:\n${result.stderr.trim()}`, statement);
  }
  return result.stdout
    .split('\n')
    .filter(Boolean)
    .map((line) => line.split('\t'));
}

/** Runs GNU tar; rejects with its stderr on a non-zero exit. */
export async function tar(args) {
  const result = await capture('tar', args);
  if (result.code !== 0) {
    throw new SetupError(`tar failed (exit ${result.code}):\n${result.stderr.trim()}`);
  }
  return result.stdout;
}

/** The DATABASE_URL of the private instance that `npm start` keeps under .data/, or null. */
export function privateDatabaseUrl(root) {
  const file = path.join(root, '.data/mariadb/credentials.json');
  if (!existsSync(file)) return null;
  return { credentialsFile: file, dir: path.join(root, '.data/mariadb') };
}

/** A dated archive name: rindwise-backup-2026-05-01T03-04-05Z.tar.gz (sorts by time). */
export function archiveName(now = new Date()) {
  return `rindwise-backup-${now
    .toISOString()
    .replace(/\.\d+Z$/, 'Z')
    .replace(/:/g, '-')}.tar.gz`;
}
