import { createHash } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { capture, run } from './run.mjs';
import { SetupError, info, ok, step } from './say.mjs';

const STAMP = 'node_modules/.rindwise-lock.sha256';

function lockHash(root) {
  const lock = path.join(root, 'package-lock.json');
  if (!existsSync(lock)) {
    throw new SetupError(
      'package-lock.json is missing.',
      'Restore it from git: git checkout package-lock.json',
    );
  }
  return createHash('sha256').update(readFileSync(lock)).digest('hex');
}

/** Runs `npm ci` when node_modules is absent or was installed from another package-lock.json. */
export async function ensureNodeModules(root) {
  const wanted = lockHash(root);
  const stampPath = path.join(root, STAMP);
  const current = existsSync(stampPath) ? readFileSync(stampPath, 'utf8').trim() : null;
  if (existsSync(path.join(root, 'node_modules')) && current === wanted) return;
  step('Installing npm packages (npm ci)…');
  const code = await run('npm', ['ci', '--no-audit', '--no-fund'], { cwd: root });
  if (code !== 0) {
    throw new SetupError(
      `npm ci failed (exit ${code}).`,
      'Check the npm output above; the npm registry must be reachable.',
    );
  }
  writeFileSync(stampPath, `${wanted}\n`);
  ok('npm packages installed');
}

const SYSTEM_DIRS = ['/usr/sbin', '/usr/bin', '/sbin', '/bin', '/usr/local/bin', '/usr/local/sbin'];

/** Finds an executable by name on PATH or in the usual system folders; null when absent. */
export function findBinary(name) {
  const dirs = [...(process.env.PATH ?? '').split(':').filter(Boolean), ...SYSTEM_DIRS];
  for (const dir of dirs) {
    const candidate = path.join(dir, name);
    if (existsSync(candidate)) return candidate;
  }
  return null;
}

let aptUpdated = false;

/** Installs Debian packages with apt-get, as root or through passwordless sudo. */
export async function aptInstall(packages, why) {
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  const prefix = isRoot ? [] : ['sudo', '-n'];
  if (!isRoot && !findBinary('sudo')) {
    throw new SetupError(
      `${why} needs the Debian package(s) ${packages.join(', ')}, and this user cannot install them.`,
      `Run as root: apt-get update && apt-get install -y ${packages.join(' ')}`,
    );
  }
  step(`Installing Debian package(s) ${packages.join(', ')} for ${why}…`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  const runApt = (args) =>
    prefix.length
      ? run(prefix[0], [...prefix.slice(1), 'apt-get', ...args], { env })
      : run('apt-get', args, { env });
  if (!aptUpdated) {
    const code = await runApt(['update', '-qq']);
    if (code !== 0) {
      throw new SetupError(
        'apt-get update failed.',
        "Check that Debian's package mirrors are reachable, then try again.",
      );
    }
    aptUpdated = true;
  }
  const code = await runApt(['install', '-y', '-qq', '--no-install-recommends', ...packages]);
  if (code !== 0) {
    throw new SetupError(
      `apt-get install ${packages.join(' ')} failed (exit ${code}).`,
      `Try it by hand: apt-get install -y ${packages.join(' ')}`,
    );
  }
  ok(`installed ${packages.join(', ')}`);
}

/** Makes sure Debian's MariaDB server and client programs are present. */
export async function ensureMariadbBinaries() {
  const needed = ['mariadbd', 'mariadb-install-db', 'mariadb', 'mariadb-admin'];
  if (needed.every((name) => findBinary(name))) return resolveMariadb();
  await aptInstall(['mariadb-server', 'mariadb-client'], 'the private database');
  const missing = needed.filter((name) => !findBinary(name));
  if (missing.length) {
    throw new SetupError(
      `MariaDB was installed but ${missing.join(', ')} cannot be found.`,
      'Check `dpkg -L mariadb-server` and your PATH.',
    );
  }
  return resolveMariadb();
}

function resolveMariadb() {
  return {
    server: findBinary('mariadbd'),
    installDb: findBinary('mariadb-install-db'),
    client: findBinary('mariadb'),
    admin: findBinary('mariadb-admin'),
    dump: findBinary('mariadb-dump'),
  };
}

/** Makes sure Debian's Chromium is present for the browser tests; returns its path. */
export async function ensureChromium() {
  const existing = findBinary('chromium');
  if (existing) return existing;
  await aptInstall(['chromium'], 'the browser tests');
  const installed = findBinary('chromium');
  if (!installed)
    throw new SetupError('chromium was installed but cannot be found.', 'Check /usr/bin/chromium.');
  const { stdout } = await capture(installed, ['--version']);
  info(stdout.trim());
  return installed;
}
