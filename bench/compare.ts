// Compare alone, started by bench/compare-run.mjs with a throwaway database (or pointed at a
// filled one with BENCH_DATABASE_URL and BENCH_SKIP_FILL=1). Fills the community as
// `npm run bench` does, starts the app twice (read cache on, and READ_CACHE_SECONDS=0 so
// every query runs), and measures each Compare route with autocannon at the bench's
// concurrency. Prints p50/p95/p99 with the machine's load average before and after, since
// figures taken on a busy machine say more about the machine than about the route.
import { spawn, type ChildProcess } from 'node:child_process';
import net, { type AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import autocannon from 'autocannon';
import { createDatabase } from '../server/db/client';
import { migrateDatabase } from '../server/db/migrate';
import { fillCommunity, type FillSize } from './fill';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const env = process.env;
const url = env.BENCH_DATABASE_URL!;
const quick = env.BENCH_QUICK === '1';
const SIZE: FillSize = quick
  ? { members: 500, journals: 5000, tastings: 25_000, detailed: 200 }
  : { members: 10_000, journals: 100_000, tastings: 500_000, detailed: 5000 };
const SECONDS = Number(env.BENCH_SECONDS ?? (quick ? 2 : 6));
const CONNECTIONS = Number(env.BENCH_CONNECTIONS ?? 10);

const say = (line: string) => process.stdout.write(`${line}\n`);
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));
const load = () =>
  os
    .loadavg()
    .map((l) => l.toFixed(2))
    .join(' ');

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
      SERVE_CLIENT: 'false',
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

type Stats = { rps: number; p50: number; p95: number; p99: number; n: number; errors: number };

function percentile(sorted: number[], p: number): number {
  if (!sorted.length) return Number.NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

/** One autocannon run; latencies come from every response, so p95 is exact. */
function cannon(target: string, seconds: number): Promise<Stats> {
  return new Promise((resolve, reject) => {
    const latencies: number[] = [];
    let errors = 0;
    const instance = autocannon(
      { url: target, connections: CONNECTIONS, duration: seconds, timeout: 10 },
      (err, result) => {
        if (err) return reject(err);
        const sorted = [...latencies].sort((a, b) => a - b);
        resolve({
          rps: latencies.length / (result.duration || seconds),
          p50: percentile(sorted, 50),
          p95: percentile(sorted, 95),
          p99: percentile(sorted, 99),
          n: latencies.length,
          errors: errors + result.errors + result.timeouts,
        });
      },
    );
    instance.on('response', (_client, status, _bytes, responseTime) => {
      if (status >= 400) errors += 1;
      latencies.push(responseTime);
    });
  });
}

async function main() {
  const handle = createDatabase(url, 4);
  await migrateDatabase(handle.db);
  let styleSlug = 'cheddar';
  if (env.BENCH_SKIP_FILL !== '1') {
    say(`Filling: ${SIZE.members} members, ${SIZE.journals} journals, ${SIZE.tastings} tastings…`);
    const fill = await fillCommunity(handle.pool, SIZE);
    styleSlug = fill.probes.styleSlug;
    say(`Filled in ${(fill.ms / 1000).toFixed(1)} s: ${JSON.stringify(fill.rows)}`);
  }
  await handle.close();

  const routes = [
    ['salt/L vs overall, one style', `/api/compare?x=saltPerLitre&y=overall&style=${styleSlug}`],
    ['salt/L vs overall, everything', '/api/compare?x=saltPerLitre&y=overall'],
    ['age vs flavour, everything', '/api/compare?x=ageDays&y=flavour'],
    ['cook temp vs texture per journal', '/api/compare?x=cookTemp&y=texture&per=journal'],
  ] as const;
  const cachedPort = await freePort();
  const uncachedPort = await freePort();
  const cached = await startApp(cachedPort);
  const uncached = await startApp(uncachedPort, { READ_CACHE_SECONDS: '0' });
  say(`\nautocannon: ${CONNECTIONS} connections × ${SECONDS} s per route and app`);
  say('route | cache | req/s | p50 ms | p95 ms | p99 ms | errors | load before → after');
  try {
    for (const [name, route] of routes) {
      for (const [label, port] of [
        ['off', uncachedPort],
        ['on', cachedPort],
      ] as const) {
        const target = `http://127.0.0.1:${port}${route}`;
        const probe = await fetch(target);
        if (!probe.ok) throw new Error(`${route} answered ${probe.status}`);
        await probe.arrayBuffer();
        await cannon(target, 1); // warm up: JIT, pool, buffer pool
        const before = load();
        const s = await cannon(target, SECONDS);
        say(
          [
            name,
            label,
            s.rps.toFixed(0),
            s.p50.toFixed(1),
            s.p95.toFixed(1),
            s.p99.toFixed(1),
            s.errors,
            `${before} → ${load()}`,
          ].join(' | '),
        );
      }
    }
  } finally {
    cached.kill('SIGTERM');
    uncached.kill('SIGTERM');
  }
}

main().catch((error) => {
  process.stderr.write(
    `${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n`,
  );
  process.exit(1);
});
