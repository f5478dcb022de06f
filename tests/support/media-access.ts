// Who may fetch a photo's /media address, checked the same way whatever the storage is
// (a local folder or an S3 bucket): photos.test.ts-style uploads through the API, then the
// journal and the photo are hidden, made private or turned back into a draft.
import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import { expect } from 'vitest';
import { journalPhotos, journals } from '../../server/db/schema';
import type { PhotoDto } from '../../shared/types/journal';
import { visitor, type TestApp } from './app';
import { signedIn } from './factories';
import { insertJournalRow } from './journal-rows';

const PUBLIC = 'public, max-age=31536000, immutable';
const PRIVATE = 'private, no-store';

export async function checkMediaAccess(t: TestApp): Promise<void> {
  const db = t.ctx.database.db;
  const maker = await signedIn(t.app, t.ctx);
  const reader = await signedIn(t.app, t.ctx);
  const mod = await signedIn(t.app, t.ctx, { role: 'moderator' });
  const journalId = await insertJournalRow(t.ctx, maker.member.id, { title: 'Gated wheel' });
  const image = await sharp({
    create: { width: 700, height: 500, channels: 3, background: '#b5651d' },
  })
    .jpeg()
    .toBuffer();
  const uploaded = await maker.agent
    .post(`/api/journals/${journalId}/photos`)
    .set('x-csrf-token', await maker.csrf())
    .attach('photos', image, 'wheel.jpg');
  expect(uploaded.status).toBe(201);
  const photo = (uploaded.body.photos as PhotoDto[])[0];
  const url = photo.sources[0].url;

  const fetchAs = async (who: 'visitor' | 'reader' | 'maker' | 'mod') => {
    const agent = who === 'visitor' ? visitor(t.app).agent : { reader, maker, mod }[who].agent;
    const res = await agent.get(url).buffer(true);
    return { status: res.status, cache: res.headers['cache-control'] as string };
  };
  const expectSeen = async (who: Parameters<typeof fetchAs>[0], cache: string | null) => {
    const res = await fetchAs(who);
    if (cache === null) expect([who, res.status, res.cache]).toEqual([who, 404, 'no-store']);
    else expect([who, res.status, res.cache]).toEqual([who, 200, cache]);
  };

  // Public journal, photo not hidden: everyone, with the long cache life.
  for (const who of ['visitor', 'reader', 'maker', 'mod'] as const) await expectSeen(who, PUBLIC);

  // A photo hidden by a moderator: its maker and staff only, never stored by a cache.
  await db
    .update(journalPhotos)
    .set({ hiddenAt: new Date() })
    .where(eq(journalPhotos.id, photo.id));
  await expectSeen('visitor', null);
  await expectSeen('reader', null);
  await expectSeen('maker', PRIVATE);
  await expectSeen('mod', PRIVATE);
  const head = await visitor(t.app).agent.head(url);
  expect(head.status).toBe(404);
  await db.update(journalPhotos).set({ hiddenAt: null }).where(eq(journalPhotos.id, photo.id));

  // A hidden journal: the same.
  await db.update(journals).set({ hiddenAt: new Date() }).where(eq(journals.id, journalId));
  await expectSeen('visitor', null);
  await expectSeen('maker', PRIVATE);
  await expectSeen('mod', PRIVATE);
  await db.update(journals).set({ hiddenAt: null }).where(eq(journals.id, journalId));

  // A private journal and a draft: its maker only (they do not exist for staff either).
  for (const change of [{ visibility: 'private' as const }, { status: 'draft' as const }]) {
    await db.update(journals).set(change).where(eq(journals.id, journalId));
    await expectSeen('visitor', null);
    await expectSeen('reader', null);
    await expectSeen('mod', null);
    await expectSeen('maker', PRIVATE);
    await db
      .update(journals)
      .set({ visibility: 'public', status: 'published' })
      .where(eq(journals.id, journalId));
  }

  // Unlisted: the link is the key, so the photo is as open as the journal.
  await db.update(journals).set({ visibility: 'unlisted' }).where(eq(journals.id, journalId));
  await expectSeen('visitor', PUBLIC);
}
