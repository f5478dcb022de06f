import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { journalReadings } from '../../server/db/schema';
import { createTestApp, type TestApp } from '../support/app';
import { createMember } from '../support/factories';
import { HttpVisitor, listen, type Listening } from '../support/http';
import { insertJournalRow } from '../support/journal-rows';
import { startThrowawayDatabase, type ThrowawayDatabase } from '../support/private-db';

// Database loss under load: vat readings (idempotent by their client UUID) are written by a
// few concurrent clients over real HTTP while the private mariadbd of this file is killed
// with SIGKILL and started again. Bounded: about 2 s of load, 3 s down, 3 s after.
const WRITERS = 6;
const BEFORE_KILL_MS = 2000;
const DOWN_MS = 3000;
const AFTER_RESTART_MS = 3000;
const RECOVERY_DEADLINE_MS = 30_000;

let database: ThrowawayDatabase;
let t: TestApp;
let server: Listening;

beforeAll(async () => {
  database = await startThrowawayDatabase('rindwise_faults');
  t = await createTestApp({ DATABASE_URL: database.url, DATABASE_POOL_SIZE: '8' });
  server = await listen(t.app);
}, 90_000);

afterAll(async () => {
  await server?.close();
  await t?.close();
  await database?.stop();
}, 60_000);

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

type Tally = { acked: Set<string>; attempted: Set<string>; statuses: Map<number, number> };

function count(tally: Tally, status: number) {
  tally.statuses.set(status, (tally.statuses.get(status) ?? 0) + 1);
}

/** One client: a new reading, sent again with the same id until the API acknowledges it. */
async function writer(v: HttpVisitor, journalId: number, stopAt: () => number, tally: Tally) {
  while (Date.now() < stopAt()) {
    const id = randomUUID();
    tally.attempted.add(id);
    const body = { id, takenAt: new Date().toISOString(), tempC: 30 + Math.random() * 8 };
    while (Date.now() < stopAt()) {
      let status: number;
      try {
        status = (
          await v.request(server.url, 'POST', `/api/journals/${journalId}/readings`, body, 8000)
        ).status;
      } catch {
        status = 0; // the connection itself failed: unacknowledged, try the same id again
      }
      count(tally, status);
      if (status === 201 || status === 200) {
        tally.acked.add(id);
        break;
      }
      await sleep(status === 503 || status === 0 ? 100 : 20);
    }
  }
}

describe('database loss under load', () => {
  it('answers 503 while the database is gone, recovers by itself, and loses or doubles no acknowledged write', async () => {
    const member = await createMember(t.ctx);
    const journalId = await insertJournalRow(t.ctx, member.id, { title: 'Vat under fire' });
    const v = new HttpVisitor();
    const signIn = await v.post(server.url, '/api/auth/signin', {
      email: member.email,
      password: member.password,
    });
    expect(signIn.status).toBe(200);
    v.useCsrf((signIn.body as { csrfToken: string }).csrfToken);

    const tally: Tally = { acked: new Set(), attempted: new Set(), statuses: new Map() };
    let stopAt = Date.now() + 120_000; // moved to the real end once the restart is done
    const writers = Array.from({ length: WRITERS }, () =>
      writer(v, journalId, () => stopAt, tally),
    );

    await sleep(BEFORE_KILL_MS);
    const ackedBeforeKill = tally.acked.size;
    expect(ackedBeforeKill).toBeGreaterThan(0);
    const pid = database.server.child?.pid ?? database.server.runningPid();
    expect(pid).toBeTruthy();
    process.kill(pid!, 'SIGKILL');

    await sleep(DOWN_MS / 2);
    const health = await fetch(`${server.url}/api/health`);
    expect(health.status).toBe(503);
    expect(await health.json()).toMatchObject({ ok: false, db: 'down' });
    const during = await v.request(server.url, 'GET', '/api/auth/me');
    expect(during.status).toBe(503);
    await sleep(DOWN_MS / 2);

    await database.server.start();
    // The app reconnects on its own: no restart, no call into it.
    const recoveredBy = Date.now() + RECOVERY_DEADLINE_MS;
    let healthy = false;
    while (!healthy && Date.now() < recoveredBy) {
      healthy = (await fetch(`${server.url}/api/health`)).status === 200;
      if (!healthy) await sleep(200);
    }
    expect(healthy).toBe(true);
    const ackedAtRecovery = tally.acked.size;
    stopAt = Date.now() + AFTER_RESTART_MS;
    await Promise.all(writers);

    // Writes go through again after the restart.
    expect(tally.acked.size).toBeGreaterThan(ackedAtRecovery);
    // Every answer was an acknowledgement, a 503, or a dropped connection: never a 500.
    const statuses = Object.fromEntries(tally.statuses);
    for (const status of tally.statuses.keys()) {
      expect([0, 200, 201, 503], JSON.stringify(statuses)).toContain(status);
    }
    expect((tally.statuses.get(503) ?? 0) + (tally.statuses.get(0) ?? 0)).toBeGreaterThan(0);

    const rows = await t.ctx.database.db
      .select({ id: journalReadings.id })
      .from(journalReadings)
      .where(eq(journalReadings.journalId, journalId));
    const stored = rows.map((r) => r.id);
    // None doubled, every acknowledged write stored, nothing that was never sent.
    expect(new Set(stored).size).toBe(stored.length);
    const missing = [...tally.acked].filter((id) => !stored.includes(id));
    expect(missing).toEqual([]);
    expect(stored.every((id) => tally.attempted.has(id))).toBe(true);
    // At most one write per writer was in flight and unacknowledged at the end.
    expect(stored.length - tally.acked.size).toBeLessThanOrEqual(WRITERS);
  }, 90_000);
});
