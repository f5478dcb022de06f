import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { tastings } from '../../server/db/schema';
import { createTestApp, randomIp, type TestApp } from '../support/app';
import { createMember } from '../support/factories';
import { HttpVisitor, listen, type Listening } from '../support/http';
import { insertJournalRow } from '../support/journal-rows';

// Hostile input for every route: fast-check draws a route, a visitor (signed out, a member,
// a moderator), path parameters, a query string, a body and headers, and sends it over real
// HTTP. No answer may be a 500 (or any 5xx: the database is up), none may be slow, and the
// server must still answer normally at the end.
// `npm test` sends 2,000 (cut short after 45 s on a busy machine); `npm run test:faults`
// sends 20,000 with a longer time limit.
const RUNS = Number(process.env.FUZZ_RUNS ?? 2000);
const TIME_LIMIT_MS = Number(process.env.FUZZ_TIME_LIMIT_MS ?? 45_000);
const SLOW_MS = 2500;

type Route = { method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE'; path: string };
const r = (method: Route['method'], path: string): Route => ({ method, path });

// Every API route of server/routes (including the community ones), with their mount paths.
const ROUTES: Route[] = [
  r('GET', '/api/health'),
  r('GET', '/api/auth/csrf'),
  r('POST', '/api/auth/signup'),
  r('POST', '/api/auth/verify'),
  r('POST', '/api/auth/verify/resend'),
  r('POST', '/api/auth/signin'),
  r('POST', '/api/auth/signout'),
  r('GET', '/api/auth/session'),
  r('GET', '/api/auth/me'),
  r('PATCH', '/api/auth/me'),
  r('DELETE', '/api/auth/me'),
  r('POST', '/api/auth/password/forgot'),
  r('POST', '/api/auth/password/reset'),
  r('PATCH', '/api/auth/password'),
  r('GET', '/api/admin/users'),
  r('PATCH', '/api/admin/users/:id'),
  r('GET', '/api/admin/audit'),
  r('GET', '/api/styles'),
  r('GET', '/api/journals'),
  r('GET', '/api/journals/export'),
  r('POST', '/api/journals'),
  r('GET', '/api/journals/:id'),
  r('PUT', '/api/journals/:id'),
  r('DELETE', '/api/journals/:id'),
  r('POST', '/api/journals/:id/copy'),
  r('POST', '/api/journals/:id/readings'),
  r('POST', '/api/journals/:id/readings/batch'),
  r('POST', '/api/journals/:id/weigh-ins'),
  r('POST', '/api/journals/:id/photos'),
  r('PUT', '/api/journals/:id/photos/order'),
  r('PATCH', '/api/journals/:id/photos/:photoId'),
  r('DELETE', '/api/journals/:id/photos/:photoId'),
  r('GET', '/api/journals/:id/tastings'),
  r('POST', '/api/journals/:id/tastings'),
  r('POST', '/api/journals/:id/invites'),
  r('GET', '/api/journals/:id/comments'),
  r('POST', '/api/journals/:id/comments'),
  r('PATCH', '/api/tastings/:id'),
  r('DELETE', '/api/tastings/:id'),
  r('GET', '/api/cave'),
  r('POST', '/api/cave/:id/status'),
  r('GET', '/api/cave/calendar'),
  r('POST', '/api/cave/calendar/reset'),
  r('GET', '/api/calendar/:file'),
  r('GET', '/api/compare'),
  r('GET', '/api/compare/journals'),
  r('PATCH', '/api/comments/:id'),
  r('DELETE', '/api/comments/:id'),
  r('GET', '/api/members/:handle'),
  r('POST', '/api/members/:handle/follow'),
  r('DELETE', '/api/members/:handle/follow'),
  r('GET', '/api/feed'),
  r('GET', '/api/notifications'),
  r('GET', '/api/notifications/count'),
  r('POST', '/api/notifications/read'),
  r('POST', '/api/reports'),
  r('GET', '/api/moderation/reports'),
  r('GET', '/api/moderation/reports/:id'),
  r('POST', '/api/moderation/reports/:id/actions'),
  r('GET', '/api/moderation/comments'),
  r('POST', '/api/moderation/comments/:id/actions'),
  r('GET', '/api/moderation/settings'),
  r('PUT', '/api/moderation/settings'),
  r('GET', '/api/dev/mail'),
  r('GET', '/media/photos/:file'),
  r('GET', '/api/no-such-route'),
];

// Routes that would end the fuzzing visitor's own session or account are drawn for the
// signed-out visitor only.
const SESSION_ENDING = new Set(['POST /api/auth/signout', 'DELETE /api/auth/me']);

const HOSTILE_STRINGS = [
  '',
  ' ',
  '0',
  '-1',
  '1e309',
  '9'.repeat(40),
  '1.5',
  'NaN',
  'Infinity',
  'null',
  'undefined',
  'true',
  '[]',
  '{}',
  '__proto__',
  'constructor',
  'prototype',
  '../../etc/passwd',
  '..%2f..%2fetc%2fpasswd',
  '%00',
  '\u0000',
  '<script>alert(1)</script>',
  "' OR 1=1 -- ",
  '" OR ""="',
  '+cheddar* -(("',
  '@"*~<>()',
  'ŝàlté ñ 🧀 \u202e',
  '\ud800',
  'a'.repeat(5000),
  '%',
  '%%32%65',
  '\r\nSet-Cookie: x=1',
];

/** encodeURIComponent, with a lone surrogate sent on as invalid UTF-8 rather than refused. */
function enc(value: string): string {
  try {
    return encodeURIComponent(value);
  } catch {
    return `${encodeURIComponent(value.replace(/[\uD800-\uDFFF]/g, ''))}%ED%A0%80`;
  }
}

const hostileString = fc.oneof(
  fc.constantFrom(...HOSTILE_STRINGS),
  fc.string({ maxLength: 40 }),
  fc.string({ unit: 'grapheme', maxLength: 20 }),
  fc.integer().map(String),
  fc.double().map(String),
);

const QUERY_KEYS = [
  'style',
  'species',
  'heat',
  'rind',
  'agingMin',
  'agingMax',
  'agingBy',
  'minScore',
  'q',
  'sort',
  'page',
  'pageSize',
  'maker',
  'mine',
  'x',
  'y',
  'per',
  'ids',
  'format',
  'table',
  'status',
  'limit',
  'cursor',
  'token',
  '__proto__',
  'constructor',
];

const queryKey = fc.oneof(
  fc.constantFrom(...QUERY_KEYS),
  fc.constantFrom(...QUERY_KEYS).map((k) => `${k}[]`),
  fc.constantFrom(...QUERY_KEYS).map((k) => `${k}[a][b]`),
  fc.constant('__proto__[polluted]'),
  fc.constant('constructor[prototype][polluted]'),
  fc.string({ maxLength: 10 }),
);

const queryString = fc
  .array(fc.tuple(queryKey, hostileString), { maxLength: 6 })
  .map((pairs) =>
    pairs.length
      ? `?${pairs.map(([k, v]) => `${enc(k).replace(/%5B/g, '[').replace(/%5D/g, ']')}=${enc(v)}`).join('&')}`
      : '',
  );

const BODY_KEYS = [
  'email',
  'password',
  'title',
  'notes',
  'style',
  'makeDate',
  'milk',
  'ingredients',
  'steps',
  'readings',
  'id',
  'takenAt',
  'tempC',
  'overall',
  'wheelStatus',
  'body',
  'reason',
  'action',
  'ids',
  'order',
  'caption',
  'handle',
  'role',
  'units',
  'token',
  '__proto__',
  'constructor',
];

const deep = (depth: number): unknown => (depth === 0 ? 1 : { a: deep(depth - 1) });

const jsonBody = fc.oneof(
  fc.jsonValue({ maxDepth: 3 }),
  fc.dictionary(fc.constantFrom(...BODY_KEYS), fc.jsonValue({ maxDepth: 2 }), { maxKeys: 8 }),
  fc.dictionary(fc.constantFrom(...BODY_KEYS), hostileString, { maxKeys: 8 }),
  fc.constant(deep(200)),
  fc.constant(Array.from({ length: 2000 }, (_, i) => i)),
  fc.constant({ readings: Array.from({ length: 600 }, () => ({ id: 'x' })) }),
);

type Body = { text: string | null; type: string | null };

const rawBody: fc.Arbitrary<Body> = fc.oneof(
  jsonBody.map((b) => ({ text: JSON.stringify(b), type: 'application/json' })),
  fc
    .constantFrom(
      '{"__proto__":{"admin":true},"constructor":{"prototype":{"role":"admin"}}}',
      '{"a":',
      '[1,2,',
      'null',
      '"just a string"',
      '\u0000\u0001\u0002',
      `{"title":"${'x'.repeat(300_000)}"}`,
    )
    .map((text) => ({ text, type: 'application/json' })),
  hostileString.map((text) => ({ text, type: 'text/plain' })),
  hostileString.map((text) => ({
    text: `a=${enc(text)}&b[c]=1`,
    type: 'application/x-www-form-urlencoded',
  })),
  fc.constant({
    text: '--x\r\nContent-Disposition: form-data; name="photos"\r\n\r\n',
    type: 'multipart/form-data; boundary=x',
  }),
  fc.constant({ text: 'garbage', type: 'multipart/form-data' }),
  fc.constant({ text: null, type: null }),
);

const extraHeaders = fc.dictionary(
  fc.constantFrom(
    'accept',
    'accept-encoding',
    'accept-language',
    'if-none-match',
    'if-modified-since',
    'range',
    'x-forwarded-for',
    'x-forwarded-proto',
    'x-http-method-override',
    'origin',
    'referer',
  ),
  fc.oneof(
    fc.constantFrom(
      '*/*',
      'text/html',
      'application/json',
      'bytes=0-1,5-',
      'bytes=99999999-',
      '*',
      'gzip, br',
      'not-an-ip',
    ),
    fc.string({ unit: 'binary-ascii', maxLength: 40 }).map((s) => s.replace(/[^\x20-\x7e]/g, '')),
  ),
  { maxKeys: 4 },
);

const visitorKind = fc.constantFrom('signed-out', 'member', 'moderator', 'bad-csrf', 'bad-cookie');

let t: TestApp;
let server: Listening;
const fixtures: Record<string, string> = {};
const visitors: Record<string, HttpVisitor> = {};

async function signedInVisitor(role: 'member' | 'moderator'): Promise<HttpVisitor> {
  const member = await createMember(t.ctx, { role });
  const v = new HttpVisitor();
  const res = await v.post(server.url, '/api/auth/signin', {
    email: member.email,
    password: member.password,
  });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status}`);
  v.useCsrf((res.body as { csrfToken: string }).csrfToken);
  return v;
}

beforeAll(async () => {
  t = await createTestApp();
  server = await listen(t.app);
  // Real ids to draw from, owned by someone who never fuzzes, so no fuzzed delete removes
  // what the next run needs (nor does it matter if one does).
  const owner = await createMember(t.ctx);
  const journalId = await insertJournalRow(t.ctx, owner.id, { title: 'Fuzz target' });
  const [tasting] = await t.ctx.database.db
    .insert(tastings)
    .values({
      journalId,
      tasterId: owner.id,
      tastedOn: '2026-01-01',
      ageDays: 30,
      overall: 6,
      appearance: 6,
      aroma: 6,
      flavour: 6,
      texture: 6,
      finish: 6,
      descriptors: [],
      defects: [],
      notes: '',
    })
    .$returningId();
  fixtures.id = String(journalId);
  fixtures.tastingId = String(tasting.id);
  fixtures.handle = owner.handle;
  visitors.member = await signedInVisitor('member');
  visitors.moderator = await signedInVisitor('moderator');
}, 60_000);

afterAll(async () => {
  await server?.close();
  await t?.close();
});

const paramValue = fc.oneof(
  { weight: 2, arbitrary: fc.constantFrom('id', 'tastingId', 'handle').map((k) => `@${k}`) },
  { weight: 3, arbitrary: hostileString },
  {
    weight: 1,
    arbitrary: fc.constantFrom(
      `${'0'.repeat(32)}-320.webp`,
      `${'f'.repeat(32)}-99999.webp`,
      'x.ics',
      'a.webp',
    ),
  },
);

function fillPath(template: string, values: string[]): string {
  let i = 0;
  return template.replace(/:[a-zA-Z]+/g, () => {
    const v = values[i++ % values.length] ?? '1';
    if (v.startsWith('@')) return enc(fixtures[v.slice(1)] ?? '1');
    // Mostly encoded; now and then raw, as a hand-made request would be.
    return i % 3 === 0 ? enc(v).replace(/%2F/g, '/') : enc(v);
  });
}

type Outcome = { status: number; ms: number; what: string };

async function send(
  route: Route,
  params: string[],
  query: string,
  body: Body,
  headers: Record<string, string>,
  kind: string,
): Promise<Outcome> {
  const path = fillPath(route.path, params) + query;
  const h: Record<string, string> = { 'x-forwarded-for': randomIp(), ...headers };
  const v = kind === 'member' || kind === 'moderator' ? visitors[kind] : null;
  if (v) {
    Object.assign(h, v.authHeaders());
  } else if (kind === 'bad-csrf') {
    Object.assign(h, visitors.member.authHeaders(), { 'x-csrf-token': 'forged' });
  } else if (kind === 'bad-cookie') {
    h.cookie = 'rindwise.sid=s%3Aforged.signature; a=%; =b';
    h['x-csrf-token'] = 'x';
  }
  const withBody = route.method !== 'GET' && body.text !== null;
  if (withBody && body.type) h['content-type'] = body.type;
  const started = performance.now();
  const res = await fetch(server.url + path, {
    method: route.method,
    headers: h,
    body: withBody ? body.text : undefined,
    redirect: 'manual',
    signal: AbortSignal.timeout(15_000),
  });
  await res.arrayBuffer();
  return {
    status: res.status,
    ms: performance.now() - started,
    what: `${kind} ${route.method} ${path.slice(0, 200)} ${body.type} ${String(body.text).slice(0, 200)} ${JSON.stringify(headers)}`,
  };
}

describe('fuzzing every route with hostile input', () => {
  it(
    `answers ${RUNS} malformed requests without a 5xx, quickly, and stays up`,
    async () => {
      const outcomes: Outcome[] = [];
      await fc.assert(
        fc.asyncProperty(
          fc.constantFrom(...ROUTES),
          fc.array(paramValue, { minLength: 1, maxLength: 2 }),
          queryString,
          rawBody,
          extraHeaders,
          visitorKind,
          async (route, params, query, body, headers, kind) => {
            const signedIn = kind === 'member' || kind === 'moderator' || kind === 'bad-csrf';
            if (signedIn && SESSION_ENDING.has(`${route.method} ${route.path}`))
              kind = 'signed-out';
            const outcome = await send(route, params, query, body, headers, kind);
            outcomes.push(outcome);
            expect(outcome.status, outcome.what).toBeLessThan(500);
            expect(outcome.ms, outcome.what).toBeLessThan(SLOW_MS);
          },
        ),
        { numRuns: RUNS, interruptAfterTimeLimit: TIME_LIMIT_MS, markInterruptAsFailure: false },
      );
      const times = outcomes.map((o) => o.ms).sort((a, b) => a - b);
      if (process.env.FUZZ_DEBUG) {
        const byRoute = new Map<string, number[]>();
        for (const o of outcomes) {
          const key = o.what
            .split(' ')
            .slice(0, 3)
            .join(' ')
            .replace(/\/[^/ ?]*\d[^/ ?]*/g, '/:x')
            .replace(/\?.*/, '');
          byRoute.set(key, [...(byRoute.get(key) ?? []), o.ms]);
        }
        const rows = [...byRoute].map(
          ([k, v]) => [k, v.length, Math.round(v.reduce((a, b) => a + b, 0))] as const,
        );
        rows.sort((a, b) => b[2] - a[2]);
        process.stdout.write(
          `FUZZ ${outcomes.length} runs\n${rows
            .slice(0, 15)
            .map((r) => r.join(' '))
            .join('\n')}\n`,
        );
      }
      // Enough of the planned runs happened within the time limit to mean something.
      expect(outcomes.length).toBeGreaterThanOrEqual(Math.min(RUNS, 500));
      t.ctx.logger.info(
        { runs: outcomes.length, p50: times[Math.floor(times.length / 2)], max: times.at(-1) },
        'fuzz timings',
      );

      // Still up, and both sessions still good.
      expect((await fetch(`${server.url}/api/health`)).status).toBe(200);
      expect((await visitors.member.get(server.url, '/api/auth/me')).status).toBe(200);
      expect((await visitors.moderator.get(server.url, '/api/auth/me')).status).toBe(200);
      // Nothing reached Object.prototype.
      expect(({} as Record<string, unknown>).polluted).toBeUndefined();
      expect(({} as Record<string, unknown>).admin).toBeUndefined();
    },
    TIME_LIMIT_MS + 60_000,
  );
});
