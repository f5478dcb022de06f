// The benchmark itself, started by bench/run.mjs with a throwaway database (BENCH_*). Fills a
// community, starts the real app in a child process (production mode), and for each route:
// captures the SQL the route sends (MariaDB's general log), measures the route with
// autocannon, then the same SQL sent straight through mysql2 at the same concurrency (the
// floor). Then the pages in Chromium. Prints a table; writes bench/results/latest.json.
// BENCH_ONLY=pages skips the routes and measures only the pages (into bench/results/pages.json);
// BENCH_ONLY=compare measures only the trivial route and Compare (into
// bench/results/compare.json). BENCH_CLIENT_DIST serves another client build,
// BENCH_SCREENSHOTS keeps a PNG of each page. BENCH_SKIP_FILL=1 measures the database
// BENCH_DATABASE_URL already holds (a filled one kept between runs).
import { execFile, spawn, type ChildProcess } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import net, { type AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
import autocannon from 'autocannon';
import mysql from 'mysql2/promise';
import { createDatabase } from '../server/db/client';
import { migrateDatabase } from '../server/db/migrate';
import { fillCommunity, findProbes, type FillResult, type FillSize } from './fill';
import { buildScripts, measurePages } from './pages';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const env = process.env;
const url = env.BENCH_DATABASE_URL!;
const quick = env.BENCH_QUICK === '1';
const SIZE: FillSize = quick
  ? { members: 500, journals: 5000, tastings: 25_000, detailed: 200 }
  : { members: 10_000, journals: 100_000, tastings: 500_000, detailed: 5000 };
const SECONDS = Number(env.BENCH_SECONDS ?? (quick ? 2 : 6));
const CONNECTIONS = Number(env.BENCH_CONNECTIONS ?? 10);
const POOL = 10; // the app's DATABASE_POOL_SIZE default, used for the floor as well
const PAGES_ONLY = env.BENCH_ONLY === 'pages';
const COMPARE_ONLY = env.BENCH_ONLY === 'compare';
const CLIENT_DIST = env.BENCH_CLIENT_DIST ?? path.join(root, 'dist');

const say = (line: string) => process.stdout.write(`${line}\n`);
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));
const exec = promisify(execFile);

function percentile(sorted: number[], p: number): number {
  if (!sorted.length) return Number.NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

type Stats = { rps: number; p50: number; p95: number; p99: number; n: number; errors: number };

function stats(latencies: number[], seconds: number, errors: number): Stats {
  const sorted = [...latencies].sort((a, b) => a - b);
  return {
    rps: latencies.length / seconds,
    p50: percentile(sorted, 50),
    p95: percentile(sorted, 95),
    p99: percentile(sorted, 99),
    n: latencies.length,
    errors,
  };
}

async function rootSql(statement: string): Promise<void> {
  await exec(env.BENCH_DB_CLIENT!, [
    '--no-defaults',
    `--socket=${env.BENCH_DB_SOCKET}`,
    '-uroot',
    '-e',
    statement,
  ]);
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as AddressInfo;
      server.close(() => resolve(port));
    });
  });
}

async function startApp(port: number, extra: Record<string, string> = {}): Promise<ChildProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'server/index.ts')], {
    cwd: root,
    env: {
      ...env,
      NODE_ENV: 'production',
      PORT: String(port),
      HOST: '127.0.0.1',
      DATABASE_URL: url,
      SESSION_SECRET: 'bench-only-secret-that-is-long-enough-0123456789',
      SMTP_URL: 'smtp://127.0.0.1:9', // never used: jobs are off and nobody signs up
      JOBS_ENABLED: 'false',
      LOG_LEVEL: 'warn',
      TRUST_PROXY: 'false',
      SECURE_COOKIES: 'false',
      SERVE_CLIENT: 'true',
      CLIENT_DIST,
      UPLOADS_DIR: path.join(env.BENCH_TMP ?? os.tmpdir(), 'uploads'),
      ...extra,
    },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    try {
      if ((await fetch(`http://127.0.0.1:${port}/api/health`)).ok) return child;
    } catch {
      // not listening yet
    }
    await sleep(250);
  }
  child.kill('SIGKILL');
  throw new Error('The app did not answer /api/health within 60 s.');
}

/** One autocannon run; latencies come from every response, so p95 is exact. */
function cannon(target: string, seconds: number, connections = CONNECTIONS): Promise<Stats> {
  return new Promise((resolve, reject) => {
    const latencies: number[] = [];
    let errors = 0;
    const instance = autocannon(
      { url: target, connections, duration: seconds, timeout: 10 },
      (err, result) => {
        if (err) return reject(err);
        resolve(
          stats(latencies, result.duration || seconds, errors + result.errors + result.timeouts),
        );
      },
    );
    instance.on('response', (_client, status, _bytes, responseTime) => {
      if (status >= 400) errors += 1;
      latencies.push(responseTime);
    });
  });
}

type Captured = { sql: string[] };

/** The statements one request of a route sends, read back from MariaDB's general log. */
async function captureSql(pool: mysql.Pool, target: string): Promise<Captured> {
  const conn = await pool.getConnection();
  try {
    const [[{ id }]] = (await conn.query('SELECT CONNECTION_ID() AS id')) as [
      { id: number }[],
      unknown,
    ];
    const [[{ since }]] = (await conn.query('SELECT NOW(6) AS since')) as [
      { since: Date }[],
      unknown,
    ];
    await fetch(target).then((r) => r.arrayBuffer());
    await sleep(100);
    const [rows] = (await conn.query(
      `SELECT command_type AS type, CONVERT(argument USING utf8mb4) AS argument FROM mysql.general_log
       WHERE event_time >= ? AND thread_id <> ? AND command_type IN ('Query', 'Execute')
       ORDER BY event_time`,
      [since, id],
    )) as [{ type: string; argument: string }[], unknown];
    const sql = rows
      .map((r) => r.argument)
      .filter(
        // SET STATEMENT … FOR SELECT is a query with its own settings, not a session set-up;
        // the read cache's epoch is the app's own poll (other servers' writes), not the route's.
        (s) =>
          !/read_cache_epoch/.test(s) &&
          !/^(SET(?! STATEMENT)|SHOW|SELECT 1$|COMMIT|BEGIN|START|ROLLBACK|SELECT @@)/i.test(
            s.trim(),
          ),
      );
    return { sql };
  } finally {
    conn.release();
  }
}

/** The floor: the route's statements, in turn, straight through mysql2, at the same concurrency. */
async function floor(
  pool: mysql.Pool,
  sql: string[],
  seconds: number,
): Promise<Stats & { perStatementMs: number[] }> {
  const latencies: number[] = [];
  const spent = sql.map(() => 0);
  let errors = 0;
  const stopAt = Date.now() + seconds * 1000;
  await Promise.all(
    Array.from({ length: CONNECTIONS }, async () => {
      while (Date.now() < stopAt) {
        const started = performance.now();
        try {
          for (const [i, statement] of sql.entries()) {
            const at = performance.now();
            await pool.query(statement);
            spent[i] += performance.now() - at;
          }
        } catch {
          errors += 1;
        }
        latencies.push(performance.now() - started);
      }
    }),
  );
  // The mean time of each statement under this load: which one the route waits on.
  const perStatementMs = spent.map((ms) => Number((ms / Math.max(1, latencies.length)).toFixed(2)));
  return { ...stats(latencies, seconds, errors), perStatementMs };
}

/**
 * After the bulk load, waits (two minutes at most) until InnoDB has written its dirty pages
 * and purged the load's undo history, so that the routes are measured in the steady state,
 * not beside the load's background writing (which took a third of the trivial route's
 * throughput in one run). Returns the seconds it waited.
 */
async function settle(pool: mysql.Pool): Promise<number> {
  const started = Date.now();
  const status = async (name: string): Promise<number | null> => {
    const [rows] = (await pool.query('SHOW GLOBAL STATUS LIKE ?', [name])) as [
      { Value: string }[],
      unknown,
    ];
    return rows.length ? Number(rows[0].Value) : null;
  };
  const [[setting]] = (await pool.query(
    "SHOW GLOBAL VARIABLES LIKE 'innodb_max_dirty_pages_pct'",
  )) as [{ Value: string }[], unknown];
  await rootSql('SET GLOBAL innodb_max_dirty_pages_pct = 0');
  try {
    while (Date.now() - started < 120_000) {
      const dirty = (await status('Innodb_buffer_pool_pages_dirty')) ?? 0;
      const history = (await status('Innodb_history_list_length')) ?? 0;
      if (dirty < 100 && history < 1000) break;
      await sleep(1000);
    }
  } finally {
    await rootSql(`SET GLOBAL innodb_max_dirty_pages_pct = ${Number(setting.Value)}`);
  }
  return (Date.now() - started) / 1000;
}

/** The row counts of a database measured as it is (BENCH_SKIP_FILL=1). */
async function countRows(pool: mysql.Pool): Promise<Record<string, number>> {
  const counts: Record<string, number> = {};
  for (const table of ['users', 'journals', 'tastings']) {
    const [[row]] = (await pool.query(`SELECT COUNT(*) AS n FROM ${table}`)) as [
      { n: number }[],
      unknown,
    ];
    counts[table] = Number(row.n);
  }
  return counts;
}

type RouteSpec = {
  name: string;
  path: string;
  kind: 'trivial' | 'read' | 'compare';
};

async function main() {
  const started = Date.now();
  const handle = createDatabase(url, 4);
  await migrateDatabase(handle.db);
  let fill: FillResult;
  if (env.BENCH_SKIP_FILL === '1') {
    fill = { ms: 0, rows: await countRows(handle.pool), probes: await findProbes(handle.pool) };
    say(`Measuring the database as it is (BENCH_SKIP_FILL=1): ${JSON.stringify(fill.rows)}`);
  } else {
    say(`Filling: ${SIZE.members} members, ${SIZE.journals} journals, ${SIZE.tastings} tastings…`);
    fill = await fillCommunity(handle.pool, SIZE);
    say(`Filled in ${(fill.ms / 1000).toFixed(1)} s: ${JSON.stringify(fill.rows)}`);
    const waited = await settle(handle.pool);
    say(
      `InnoDB settled after the load in ${waited.toFixed(0)} s (dirty pages written, purge done).`,
    );
  }
  await handle.close();

  if (PAGES_ONLY) return pagesOnly(fill.probes.journalId, started);
  await rootSql(
    "GRANT SELECT ON mysql.general_log TO 'app'@'127.0.0.1'; SET GLOBAL log_output = 'TABLE'",
  );
  const pool = mysql.createPool({ uri: url, connectionLimit: POOL, timezone: 'Z' });
  const port = await freePort();
  // The app as deployed (public reads reused for READ_CACHE_SECONDS, 5 by default), and the
  // same app with that cache off, so every query really runs.
  const app = await startApp(port);
  const base = `http://127.0.0.1:${port}`;
  const uncachedPort = await freePort();
  const uncachedApp = await startApp(uncachedPort, { READ_CACHE_SECONDS: '0' });
  const uncachedBase = `http://127.0.0.1:${uncachedPort}`;
  const { makerHandle, journalId, searchWord, styleSlug } = fill.probes;
  const allRoutes: RouteSpec[] = [
    { name: 'trivial JSON (GET /api/health/live)', path: '/api/health/live', kind: 'trivial' },
    {
      name: 'Discover: style + aging 60–240 d + best',
      path: `/api/journals?style=${styleSlug}&agingMin=60&agingMax=240&sort=best`,
      kind: 'read',
    },
    { name: 'Discover: text search', path: `/api/journals?q=${searchWord}`, kind: 'read' },
    { name: "Discover: a maker's page", path: `/api/journals?maker=${makerHandle}`, kind: 'read' },
    {
      name: 'One journal (GET /api/journals/:id)',
      path: `/api/journals/${journalId}`,
      kind: 'read',
    },
    {
      name: 'Compare: salt/L vs overall, one style',
      path: `/api/compare?x=saltPerLitre&y=overall&style=${styleSlug}`,
      kind: 'compare',
    },
    {
      name: 'Compare: salt/L vs overall, everything',
      path: `/api/compare?x=saltPerLitre&y=overall`,
      kind: 'compare',
    },
    {
      name: 'Compare: salt/L vs overall, everything, per tasting',
      path: `/api/compare?x=saltPerLitre&y=overall&per=tasting`,
      kind: 'compare',
    },
  ];
  const routes = COMPARE_ONLY ? allRoutes.filter((r) => r.kind !== 'read') : allRoutes;

  const results: Array<
    RouteSpec & {
      app: Stats;
      uncached: Stats | null;
      /** Compare without the cache, one request at a time: how long a lone request takes. */
      alone: Stats | null;
      direct: Stats | null;
      sql: string[];
      bytes: number;
    }
  > = [];
  try {
    for (const route of routes) {
      const target = base + route.path;
      const probe = await fetch(target);
      const bytes = (await probe.arrayBuffer()).byteLength;
      if (!probe.ok) throw new Error(`${route.path} answered ${probe.status}`);
      await rootSql('SET GLOBAL general_log = 1');
      const captured = await captureSql(pool, uncachedBase + route.path);
      await rootSql('SET GLOBAL general_log = 0');
      say(`\n${route.name}: ${route.path} (${bytes} bytes, ${captured.sql.length} statements)`);
      await cannon(target, 1); // warm up: JIT, pool, buffer pool
      const appStats = await cannon(target, SECONDS);
      say(`  app    ${appStats.rps.toFixed(0)} req/s, p95 ${appStats.p95.toFixed(1)} ms`);
      let uncached: Stats | null = null;
      if (route.kind !== 'trivial') {
        await cannon(uncachedBase + route.path, 1);
        uncached = await cannon(uncachedBase + route.path, SECONDS);
        say(`  no cache ${uncached.rps.toFixed(0)} req/s, p95 ${uncached.p95.toFixed(1)} ms`);
      }
      let alone: Stats | null = null;
      if (route.kind === 'compare') {
        alone = await cannon(uncachedBase + route.path, SECONDS, 1);
        say(`  alone, no cache: p50 ${alone.p50.toFixed(1)} ms, p95 ${alone.p95.toFixed(1)} ms`);
      }
      let direct: Stats | null = null;
      if (captured.sql.length) {
        await floor(pool, captured.sql, 1);
        direct = await floor(pool, captured.sql, SECONDS);
        say(`  mysql2 ${direct.rps.toFixed(0)} req/s, p95 ${direct.p95.toFixed(1)} ms`);
      }
      results.push({ ...route, app: appStats, uncached, alone, direct, sql: captured.sql, bytes });
    }
  } finally {
    app.kill('SIGTERM');
    uncachedApp.kill('SIGTERM');
    await pool.end();
  }

  const pages = COMPARE_ONLY ? [] : await pagesOf(port, journalId);
  const build = buildScripts(CLIENT_DIST);

  const trivial = results[0].app;
  const rows = results.map((r) => {
    const ratio = r.app.rps / trivial.rps;
    const floorRatio = r.direct ? r.app.p95 / r.direct.p95 : null;
    const uncachedRatio = r.uncached ? r.uncached.rps / trivial.rps : null;
    const uncachedFloorRatio = r.uncached && r.direct ? r.uncached.p95 / r.direct.p95 : null;
    let verdict = '';
    if (r.kind === 'read') {
      const okThroughput = ratio >= 0.5;
      const okLatency = floorRatio !== null && floorRatio <= 2;
      verdict = `${okThroughput ? 'met' : 'MISSED'} ≥50% | ${okLatency ? 'met' : 'MISSED'} ≤2x`;
    } else if (r.kind === 'compare') {
      // As deployed (the read cache on), a lone request without the cache, and ten at once
      // without it (on two cores, ten uncached requests queue behind each other).
      const ok = (s: Stats | null) => (s && s.p95 < 300 ? 'met' : 'MISSED');
      verdict = `${ok(r.app)} p95<300 | alone ${ok(r.alone)} | ${CONNECTIONS} uncached ${ok(r.uncached)}`;
    }
    return { ...r, ratio, floorRatio, uncachedRatio, uncachedFloorRatio, verdict };
  });

  const machine = {
    cpus: os.cpus().length,
    cpu: os.cpus()[0]?.model ?? 'unknown',
    memoryGiB: Math.round(os.totalmem() / 2 ** 30),
    node: process.version,
    platform: `${os.type()} ${os.release()}`,
    loadAverage: os.loadavg().map((l) => Number(l.toFixed(2))),
  };
  const output = {
    at: new Date().toISOString(),
    machine,
    size: SIZE,
    fill: { seconds: fill.ms / 1000, rows: fill.rows },
    settings: { seconds: SECONDS, connections: CONNECTIONS, pool: POOL },
    routes: rows.map((r) => ({
      name: r.name,
      path: r.path,
      bytes: r.bytes,
      app: r.app,
      uncached: r.uncached,
      alone: r.alone,
      direct: r.direct,
      ratioToTrivial: r.ratio,
      p95ToDirect: r.floorRatio,
      uncachedRatioToTrivial: r.uncachedRatio,
      uncachedP95ToDirect: r.uncachedFloorRatio,
      verdict: r.verdict,
      sql: r.sql,
    })),
    pages,
    build,
    totalSeconds: (Date.now() - started) / 1000,
  };
  const resultFile = COMPARE_ONLY ? 'compare.json' : 'latest.json';
  mkdirSync(path.join(root, 'bench/results'), { recursive: true });
  writeFileSync(
    path.join(root, 'bench/results', resultFile),
    `${JSON.stringify(output, null, 2)}\n`,
  );

  const f = (n: number | null | undefined, d = 1) =>
    n === null || n === undefined ? '—' : n.toFixed(d);
  say(`\nRindwise benchmark, ${output.at}`);
  say(
    `Machine: ${machine.cpus} × ${machine.cpu}, ${machine.memoryGiB} GiB, Node ${machine.node}, load ${machine.loadAverage.join(' ')}`,
  );
  say(
    `Fill: ${f(fill.ms / 1000)} s for ${Object.entries(fill.rows)
      .map(([k, v]) => `${v} ${k}`)
      .join(', ')}`,
  );
  say(
    `autocannon: ${CONNECTIONS} connections × ${SECONDS} s per route; direct = the same SQL via mysql2, same concurrency\n`,
  );
  say(
    [
      'route',
      'req/s',
      'p50',
      'p95',
      'p99',
      '×trivial',
      'direct p95',
      'p95/direct',
      'target',
      'no cache req/s',
      'no cache p95',
      'no cache ×trivial',
      'no cache p95/direct',
      'alone p95',
    ].join(' | '),
  );
  for (const r of rows) {
    say(
      [
        r.name,
        f(r.app.rps, 0),
        f(r.app.p50),
        f(r.app.p95),
        f(r.app.p99),
        f(r.ratio, 2),
        f(r.direct?.p95),
        f(r.floorRatio, 2),
        r.verdict,
        f(r.uncached?.rps, 0),
        f(r.uncached?.p95),
        f(r.uncachedRatio, 2),
        f(r.uncachedFloorRatio, 2),
        f(r.alone?.p95),
      ].join(' | '),
    );
  }
  if (!COMPARE_ONLY) printPages(pages, build);
  say(`\nWrote bench/results/${resultFile} (${output.totalSeconds.toFixed(0)} s in all).`);
}

/** Discover and a journal page in Chromium, against a fresh app on `port`, with the verdicts. */
async function pagesOf(port: number, journalId: number) {
  const pageApp = await startApp(port);
  try {
    const pages = await measurePages(
      `http://127.0.0.1:${port}`,
      [
        { name: 'Discover', path: '/' },
        { name: 'A journal page', path: `/journals/${journalId}` },
      ],
      { runs: Number(env.BENCH_PAGE_RUNS ?? 3), screenshots: env.BENCH_SCREENSHOTS },
    );
    return pages.map((p) => ({
      ...p,
      verdict: `${p.lcpMs < 1000 ? 'met' : 'MISSED'} LCP<1s | ${p.cls < 0.02 ? 'met' : 'MISSED'} CLS<0.02`,
    }));
  } finally {
    pageApp.kill('SIGTERM');
  }
}

function printPages(
  pages: Awaited<ReturnType<typeof pagesOf>>,
  build: { files: number; bytes: number },
) {
  say(
    '\npage | viewport | LCP ms (runs) | CLS (runs) | scripts | JS bytes (decoded) | on the wire | encodings | target',
  );
  for (const p of pages) {
    say(
      [
        p.name,
        p.viewport,
        `${p.lcpMs.toFixed(0)} (${p.lcpRuns.join(', ')})`,
        `${p.cls.toFixed(4)} (${p.clsRuns.join(', ')})`,
        p.scripts,
        p.jsBytes,
        p.jsBytesOnWire,
        p.jsEncodings.join(','),
        p.verdict,
      ].join(' | '),
    );
  }
  for (const p of pages) {
    say(
      `${p.name} (${p.viewport}): LCP element ${p.lcpElement || '?'}; largest shift ${p.shiftTarget || 'none'}; ` +
        `first byte ${p.lcpParts.ttfb} ms, last script ${p.lcpParts.scriptsDone} ms, last API answer ${p.lcpParts.apiDone} ms before the LCP`,
    );
  }
  say(`client build: ${build.files} JS files, ${build.bytes} bytes in all`);
}

/** BENCH_ONLY=pages: the pages alone, written to bench/results/pages.json. */
async function pagesOnly(journalId: number, started: number) {
  const pages = await pagesOf(await freePort(), journalId);
  const build = buildScripts(CLIENT_DIST);
  const at = new Date().toISOString();
  const loadAverage = os.loadavg().map((l) => Number(l.toFixed(2)));
  mkdirSync(path.join(root, 'bench/results'), { recursive: true });
  writeFileSync(
    path.join(root, 'bench/results/pages.json'),
    `${JSON.stringify({ at, loadAverage, size: SIZE, pages, build }, null, 2)}\n`,
  );
  say(`\nRindwise pages, ${at}, load ${loadAverage.join(' ')}`);
  printPages(pages, build);
  say(`\nWrote bench/results/pages.json (${((Date.now() - started) / 1000).toFixed(0)} s in all).`);
}

main().catch((error) => {
  process.stderr.write(
    `${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`,
  );
  process.exit(1);
});
