import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { JournalDto } from '../../shared/types/journal';
import { createTestApp, visitor, type TestApp } from '../support/app';
import { signedIn } from '../support/factories';
import {
  expectStatus,
  journalDocument,
  postJournal,
  publicJournalDocument,
  putJournal,
} from '../support/journal-factory';

// Two tabs, or the phone at the vat and the laptop, saving the same journal: the document
// version in If-Match keeps a stale save from overwriting a newer one.
let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

const member = () => signedIn(t.app, t.ctx);

describe('PUT /api/journals/:id with If-Match', () => {
  it('answers 401 to a visitor and 404/403 to other members before looking at versions', async () => {
    const owner = await member();
    const other = await member();
    const j: JournalDto = await postJournal(owner);
    expect((await putJournal(visitor(t.app), j.id, journalDocument(), j.version)).status).toBe(401);
    const res = await putJournal(other, j.id, journalDocument(), j.version);
    expect(res.status).toBe(404);
  });

  it('answers 428 with a clear message when no version is sent, and 428 for a malformed one', async () => {
    const owner = await member();
    const j: JournalDto = await postJournal(owner);
    const missing = await putJournal(
      owner,
      j.id,
      journalDocument({ title: 'No version' }),
      undefined,
    );
    expect(missing.status).toBe(428);
    expect(missing.body.error.code).toBe('VERSION_REQUIRED');
    expect(missing.body.error.message).toMatch(/If-Match/);
    const garbled = await putJournal(owner, j.id, journalDocument(), '"a b c"');
    expect(garbled.status).toBe(428);
    const after = (await owner.get(`/api/journals/${j.id}`)).body as JournalDto;
    expect(after.title).toBe(j.title);
    expect(after.version).toBe(j.version);
  });

  it('answers 400 per field before the version matters, and changes nothing', async () => {
    const owner = await member();
    const j: JournalDto = await postJournal(owner);
    const res = await putJournal(owner, j.id, { ...journalDocument(), title: '' }, j.version);
    expect(res.status).toBe(400);
    expect(res.body.error.fields.title).toBeTruthy();
  });

  it('saves with the current version and answers the next version', async () => {
    const owner = await member();
    const j: JournalDto = await postJournal(owner);
    expect(j.version).toMatch(/^d1-[A-Za-z0-9_-]{22}$/);
    const res = await putJournal(owner, j.id, journalDocument({ title: 'Second go' }), j.version);
    expect(res.status).toBe(200);
    expect(res.body.title).toBe('Second go');
    expect(res.body.version).not.toBe(j.version);
    expect((await owner.get(`/api/journals/${j.id}`)).body.version).toBe(res.body.version);
    // Quoted and weak forms of the same tag are read the same.
    const quoted = await putJournal(
      owner,
      j.id,
      journalDocument({ title: 'Third go' }),
      `W/"${res.body.version}"`,
    );
    expect(quoted.status).toBe(200);
  });

  it('refuses a stale save with 409, the journal as it is now, and keeps the newer save', async () => {
    const owner = await member();
    const j: JournalDto = await postJournal(owner);
    // The laptop saves first…
    const laptop = await putJournal(
      owner,
      j.id,
      journalDocument({ title: 'From the laptop' }),
      j.version,
    );
    expect(laptop.status).toBe(200);
    // …then the phone, still holding the version it loaded.
    const phone = await putJournal(
      owner,
      j.id,
      journalDocument({ title: 'From the phone' }),
      j.version,
    );
    expect(phone.status).toBe(409);
    expect(phone.body.error.code).toBe('JOURNAL_CHANGED');
    expect(phone.body.error.message).toMatch(/changed somewhere else/);
    const current = phone.body.error.current as JournalDto;
    expect(current.title).toBe('From the laptop');
    expect(current.version).toBe(laptop.body.version);
    expect((await owner.get(`/api/journals/${j.id}`)).body.title).toBe('From the laptop');
    // Re-applied on top of the current version, the phone's save goes through.
    const again = await putJournal(
      owner,
      j.id,
      journalDocument({ title: 'From the phone' }),
      current.version,
    );
    expect(again.status).toBe(200);
    expect(again.body.title).toBe('From the phone');
  });

  it('lets only one of two saves from the same version through when they race', async () => {
    const owner = await member();
    const j: JournalDto = await postJournal(owner);
    const answers = await Promise.all(
      ['Tab one', 'Tab two', 'Tab three'].map((title) =>
        putJournal(owner, j.id, journalDocument({ title }), j.version),
      ),
    );
    const statuses = answers.map((a) => a.status).sort();
    expect(statuses).toEqual([200, 409, 409]);
    const winner = answers.find((a) => a.status === 200)!;
    expect((await owner.get(`/api/journals/${j.id}`)).body.title).toBe(winner.body.title);
  });

  it('overwrites knowingly with If-Match: *', async () => {
    const owner = await member();
    const j: JournalDto = await postJournal(owner);
    await expectStatus(
      putJournal(owner, j.id, journalDocument({ title: 'Newer' }), j.version),
      200,
    );
    const res = await putJournal(owner, j.id, journalDocument({ title: 'Mine anyway' }), '*');
    expect(res.status).toBe(200);
    expect(res.body.title).toBe('Mine anyway');
  });

  it('is not changed by readings (their own idempotent route) but is by a weigh-in', async () => {
    const owner = await member();
    const j: JournalDto = await postJournal(owner);
    const reading = { id: randomUUID(), takenAt: '2026-01-10T10:00:00Z', tempC: 31, stepIndex: 0 };
    await expectStatus(owner.post(`/api/journals/${j.id}/readings`, reading), 201);
    // The replay of the same reading from an offline queue is still a 200 and changes nothing.
    await expectStatus(owner.post(`/api/journals/${j.id}/readings`, reading), 200);
    const afterReading = (await owner.get(`/api/journals/${j.id}`)).body as JournalDto;
    expect(afterReading.version).toBe(j.version);
    // So a document saved at the vat after logging readings goes through and keeps them.
    const saved = await putJournal(owner, j.id, journalDocument({ title: 'Cook done' }), j.version);
    expect(saved.status).toBe(200);
    expect(saved.body.readings.map((r: { id: string }) => r.id)).toEqual([reading.id]);

    // A weigh-in is part of the document: a stale editor must not erase it.
    const weighed = await expectStatus(
      owner.post(`/api/journals/${j.id}/weigh-ins`, { date: '2026-02-01', massKg: 1.9 }),
      201,
    );
    expect(weighed.body.version).not.toBe(saved.body.version);
    const stale = await putJournal(
      owner,
      j.id,
      journalDocument({ title: 'Stale' }),
      saved.body.version,
    );
    expect(stale.status).toBe(409);
    expect(stale.body.error.current.weighIns).toEqual([
      { date: '2026-02-01', massKg: 1.9, note: '' },
    ]);
  });

  it('is the same for the maker and for a reader of a published journal', async () => {
    const owner = await member();
    const reader = await member();
    const j = (await expectStatus(owner.post('/api/journals', publicJournalDocument()), 201))
      .body as JournalDto;
    const seen = (await reader.get(`/api/journals/${j.id}`)).body as JournalDto;
    expect(seen.version).toBe(j.version);
    expect(seen.canEdit).toBe(false);
  });
});
