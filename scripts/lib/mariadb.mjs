import { spawn } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, openSync, readFileSync, closeSync } from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { capture } from './run.mjs';
import { SetupError, info, ok } from './say.mjs';

const sleep = (ms) => new Promise((resolve) => setTimeout(resolve, ms));

function tail(file, lines = 25) {
  if (!existsSync(file)) return '(no error log was written)';
  return readFileSync(file, 'utf8').trimEnd().split('\n').slice(-lines).join('\n');
}

function isAlive(pid) {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

function canConnect(socketPath) {
  return new Promise((resolve) => {
    const socket = net.createConnection(socketPath);
    socket.once('connect', () => {
      socket.destroy();
      resolve(true);
    });
    socket.once('error', () => resolve(false));
  });
}

/**
 * A private MariaDB instance: its own data directory, loopback port, socket and pid file,
 * started with --no-defaults so the system's /etc/mysql settings never apply.
 */
export class PrivateMariaDb {
  constructor({ dir, port, binaries }) {
    this.dir = dir;
    this.dataDir = path.join(dir, 'data');
    this.port = port;
    this.bin = binaries;
    this.errorLog = path.join(dir, 'error.log');
    // Its own temporary folder: /tmp is shared with every other program on the machine, and
    // a clean-up there must not take an internal temporary table from under a query.
    this.tmpDir = path.join(dir, 'tmp');
    this.pidFile = path.join(dir, 'mysqld.pid');
    const socket = path.join(dir, 'mysqld.sock');
    // Unix socket paths are limited to about 107 bytes; fall back to a short temp path.
    this.socket =
      socket.length < 100
        ? socket
        : path.join(
            os.tmpdir(),
            `rindwise-${createHash('sha1').update(dir).digest('hex').slice(0, 12)}.sock`,
          );
    this.child = null;
  }

  get initialised() {
    return existsSync(path.join(this.dataDir, 'mysql'));
  }

  /** Creates the data directory with the system tables on first use. */
  async init() {
    if (this.initialised) return;
    mkdirSync(this.dataDir, { recursive: true });
    mkdirSync(this.tmpDir, { recursive: true });
    const result = await capture(this.bin.installDb, [
      '--no-defaults',
      `--tmpdir=${this.tmpDir}`,
      `--user=${os.userInfo().username}`,
      '--basedir=/usr',
      `--datadir=${this.dataDir}`,
      '--auth-root-authentication-method=socket',
      '--skip-test-db',
    ]);
    if (result.code !== 0) {
      throw new SetupError(
        `mariadb-install-db failed (exit ${result.code}):\n${(result.stderr || result.stdout).trim().split('\n').slice(-15).join('\n')}`,
        `Remove ${this.dataDir} and try again.`,
      );
    }
  }

  /** Pid of an instance already running on this data directory, or null. */
  runningPid() {
    if (!existsSync(this.pidFile)) return null;
    const pid = Number(readFileSync(this.pidFile, 'utf8').trim());
    return Number.isInteger(pid) && pid > 0 && isAlive(pid) ? pid : null;
  }

  /** Starts mariadbd in the background (its own process group) and waits for its socket. */
  async start() {
    const running = this.runningPid();
    if (running && (await canConnect(this.socket))) {
      info(`reusing the MariaDB already running on this data directory (pid ${running})`);
      this.adoptedPid = running;
      return;
    }
    const log = openSync(this.errorLog, 'a');
    mkdirSync(this.tmpDir, { recursive: true });
    const args = [
      '--no-defaults',
      `--tmpdir=${this.tmpDir}`,
      `--user=${os.userInfo().username}`,
      `--datadir=${this.dataDir}`,
      `--port=${this.port}`,
      '--bind-address=127.0.0.1',
      `--socket=${this.socket}`,
      `--pid-file=${this.pidFile}`,
      `--log-error=${this.errorLog}`,
      '--skip-name-resolve',
      '--character-set-server=utf8mb4',
      '--collation-server=utf8mb4_unicode_ci',
      // Durable: flush the redo log at every commit, so an acknowledged write survives a crash.
      '--innodb-flush-log-at-trx-commit=1',
      '--innodb-doublewrite=1',
      '--max-connections=300',
    ];
    this.child = spawn(this.bin.server, args, { detached: true, stdio: ['ignore', log, log] });
    closeSync(log);
    let exited = null;
    this.child.once('exit', (code, signal) => (exited = { code, signal }));
    const deadline = Date.now() + 60_000;
    while (Date.now() < deadline) {
      if (exited) {
        throw new SetupError(
          `MariaDB did not start (exit ${exited.code ?? exited.signal}). The end of its error log:\n${tail(this.errorLog)}`,
          `Is port ${this.port} taken? The full log is ${this.errorLog}.`,
        );
      }
      if (await canConnect(this.socket)) {
        ok(`MariaDB is up on 127.0.0.1:${this.port}`);
        return;
      }
      await sleep(150);
    }
    this.child.kill('SIGKILL');
    throw new SetupError(
      `MariaDB did not answer within 60 s. The end of its error log:\n${tail(this.errorLog)}`,
      `The full log is ${this.errorLog}.`,
    );
  }

  /** Runs SQL as the socket-authenticated root user. */
  async sql(statement) {
    const result = await capture(this.bin.client, [
      '--no-defaults',
      `--socket=${this.socket}`,
      '-uroot',
      '--batch',
      '-e',
      statement,
    ]);
    if (result.code !== 0) {
      throw new SetupError(
        `A set-up statement failed in MariaDB:\n${result.stderr.trim()}`,
        `Statement: ${statement}`,
      );
    }
    return result.stdout;
  }

  /** Creates the database and an application user reachable over TCP on loopback. */
  async ensureDatabase({ database, user, password }) {
    const quoted = password.replace(/\\/g, '\\\\').replace(/'/g, "\\'");
    await this.sql(
      [
        `CREATE DATABASE IF NOT EXISTS \`${database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`,
        `CREATE USER IF NOT EXISTS '${user}'@'127.0.0.1' IDENTIFIED BY '${quoted}'`,
        `ALTER USER '${user}'@'127.0.0.1' IDENTIFIED BY '${quoted}'`,
        `GRANT ALL PRIVILEGES ON \`${database}\`.* TO '${user}'@'127.0.0.1'`,
        'FLUSH PRIVILEGES',
      ].join('; '),
    );
  }

  /** Shuts the instance down cleanly and waits for the process to end. */
  async stop() {
    const pid = this.child?.pid ?? this.adoptedPid ?? this.runningPid();
    if (!pid || !isAlive(pid)) return;
    await capture(this.bin.admin, [
      '--no-defaults',
      `--socket=${this.socket}`,
      '-uroot',
      'shutdown',
    ]);
    const deadline = Date.now() + 30_000;
    while (isAlive(pid) && Date.now() < deadline) await sleep(100);
    if (isAlive(pid)) {
      process.kill(pid, 'SIGKILL');
      await sleep(200);
    }
  }
}
