import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { comments, follows } from '../../server/db/schema/community';
import { journalPhotos, tastings } from '../../server/db/schema';
import { createTestApp, visitor, type TestApp, type Visitor } from '../support/app';
import { signedIn, type createMember } from '../support/factories';
import { refreshJournalTastingStats } from '../../server/repositories/tastings.repository';
import { insertJournalRow } from '../support/journal-rows';

// The private-data matrix: a maker with one thing of each kind that nobody else may list
// (a private journal, an unlisted one, a draft, a hidden journal, a hidden tasting, a hidden
// photo, a held comment), each carrying a marker word; three kinds of visitor (signed out,
// another member who follows the maker, a moderator) call every route that lists, searches,
// counts, compares, exports or feeds, and no answer may hold a marker or a secret id.
let t: TestApp;
let maker: Visitor & { member: Awaited<ReturnType<typeof createMember>> };
const word = `zqx${randomBytes(4).toString('hex')}`; // one search term shared by every journal
const markers: Record<string, string> = {};
const secretIds: Record<string, number> = {};
let publicId = 0;
let viewers: Record<'signed-out' | 'member' | 'moderator', Visitor>;

const marker = (name: string) => (markers[name] = `secret${name}${randomBytes(4).toString('hex')}`);

// Every listed journal has a salt figure and a tasting, so Compare has a point for each one.
const metrics = { metricSaltGPerL: 2.4, metricYieldPercent: 10.1, agingTargetDays: 90 };

async function tastingOn(journalId: number, tasterId: number, over: Record<string, unknown> = {}) {
  const [row] = await t.ctx.database.db
    .insert(tastings)
    .values({
      journalId,
      tasterId,
      tastedOn: '2026-02-01',
      ageDays: 60,
      overall: 7,
      appearance: 7,
      aroma: 7,
      flavour: 7,
      texture: 7,
      finish: 7,
      descriptors: [],
      defects: [],
      notes: '',
      ...over,
    })
    .$returningId();
  await refreshJournalTastingStats(t.ctx.database.db, journalId);
  return row.id;
}

beforeAll(async () => {
  t = await createTestApp();
  maker = await signedIn(t.app, t.ctx);
  const uid = maker.member.id;
  const secretJournal = async (name: string, over: Parameters<typeof insertJournalRow>[2]) => {
    const m = marker(name);
    const id = await insertJournalRow(t.ctx, uid, {
      title: `${m} ${word} wheel`,
      notes: `${m} ${word}`,
      ...metrics,
      ...over,
    });
    secretIds[name] = id;
    await tastingOn(id, uid, { notes: m });
    return id;
  };
  await secretJournal('private', { visibility: 'private' });
  await secretJournal('unlisted', { visibility: 'unlisted' });
  await secretJournal('draft', { status: 'draft', visibility: 'public' });
  await secretJournal('hidden', { hiddenAt: new Date() });

  // One public journal with hidden things on it.
  publicId = await insertJournalRow(t.ctx, uid, {
    title: `Open ${word} wheel`,
    notes: word,
    ...metrics,
  });
  await tastingOn(publicId, uid, { notes: 'fine' });
  await tastingOn(publicId, uid, { notes: marker('hiddenTasting'), hiddenAt: new Date() });
  await t.ctx.database.db.insert(journalPhotos).values({
    journalId: publicId,
    fileKey: 'ab'.repeat(16),
    width: 320,
    height: 200,
    widths: '320',
    caption: marker('hiddenPhoto'),
    hiddenAt: new Date(),
  });
  await t.ctx.database.db.insert(comments).values([
    { journalId: publicId, authorId: uid, body: marker('heldComment'), status: 'pending' },
    {
      journalId: publicId,
      authorId: uid,
      body: marker('hiddenComment'),
      status: 'visible',
      hiddenAt: new Date(),
    },
  ]);

  const member = await signedIn(t.app, t.ctx);
  await t.ctx.database.db.insert(follows).values({ followerId: member.member.id, followeeId: uid });
  viewers = {
    'signed-out': visitor(t.app),
    member,
    moderator: await signedIn(t.app, t.ctx, { role: 'moderator' }),
  };
}, 60_000);

afterAll(() => t.close());

const h = () => encodeURIComponent(maker.member.handle);

// Every route that lists, searches, counts, compares, exports or feeds.
const ROUTES: Array<[string, () => string]> = [
  ['Discover, newest', () => `/api/journals?pageSize=100`],
  ['Discover, text search', () => `/api/journals?q=${word}&pageSize=100`],
  ['Discover, search for a marker', () => `/api/journals?q=${markers.private}`],
  ['Discover, maker page', () => `/api/journals?maker=${h()}&pageSize=100`],
  ['Discover, maker by @handle', () => `/api/journals?maker=%40${h()}&pageSize=100`],
  [
    'Discover, style + aging + best',
    () => `/api/journals?style=cheddar&agingMin=30&agingMax=400&sort=best&pageSize=100`,
  ],
  ['Discover, most tasted', () => `/api/journals?sort=most-tasted&maker=${h()}`],
  ['Discover, minimum score', () => `/api/journals?minScore=1&maker=${h()}`],
  ['Discover, by tasted age', () => `/api/journals?agingBy=tasted&agingMin=1&maker=${h()}`],
  ['My journals (another member’s own list)', () => `/api/journals?mine=true`],
  ['Export JSON', () => `/api/journals/export?format=json`],
  ['Export CSV', () => `/api/journals/export?format=csv&table=journals`],
  ['Export tastings CSV', () => `/api/journals/export?format=csv&table=tastings`],
  ['The public journal', () => `/api/journals/${publicId}`],
  ['Tastings of the public journal', () => `/api/journals/${publicId}/tastings`],
  ['Comments of the public journal', () => `/api/journals/${publicId}/comments`],
  [
    'Compare salt per litre, one style',
    () => `/api/compare?x=saltPerLitre&y=overall&style=cheddar`,
  ],
  ['Compare salt per litre, everything', () => `/api/compare?x=saltPerLitre&y=overall`],
  [
    'Compare per journal, maker',
    () => `/api/compare?x=saltPerLitre&y=overall&per=journal&maker=${h()}`,
  ],
  ['Compare yield, maker', () => `/api/compare?x=saltPerLitre&y=yieldPercent&maker=${h()}`],
  ['Compare by style', () => `/api/compare?x=style&y=overall&maker=${h()}`],
  ['Compare side by side', () => `/api/compare/journals?ids=${publicId},${secretIds.private}`],
  [
    'Compare side by side, drafts',
    () => `/api/compare/journals?ids=${secretIds.draft},${publicId}`,
  ],
  ['Maker profile', () => `/api/members/${h()}`],
  ['Feed', () => `/api/feed`],
  ['Notifications', () => `/api/notifications`],
  ['Notification count', () => `/api/notifications/count`],
  ['Cave', () => `/api/cave`],
  ['Cave calendar', () => `/api/cave/calendar`],
  ['Moderation: held comments', () => `/api/moderation/comments`],
];

const secretNames = () => Object.keys(markers);

/** The ids of every journal-like object (an id beside a title) anywhere in a JSON answer. */
function journalIdsIn(value: unknown, out = new Set<number>()): Set<number> {
  if (Array.isArray(value)) value.forEach((v) => journalIdsIn(v, out));
  else if (value && typeof value === 'object') {
    const o = value as Record<string, unknown>;
    if (typeof o.id === 'number' && typeof o.title === 'string') out.add(o.id);
    if (typeof o.journalId === 'number') out.add(o.journalId);
    Object.values(o).forEach((v) => journalIdsIn(v, out));
  }
  return out;
}

// Moderators work with hidden and held items in the moderation views (the queue, and a
// journal read with staff access): there, and only there, they may see those, never a
// private journal or a draft.
const STAFF_VIEWS = new Set([
  'The public journal',
  'Tastings of the public journal',
  'Comments of the public journal',
  'Moderation: held comments',
]);
const MODERATION_ITEMS = new Set(['hiddenTasting', 'hiddenPhoto', 'heldComment', 'hiddenComment']);

function leaks(text: string, body: unknown, allowModerationItems: boolean): string[] {
  const found = secretNames().filter(
    (name) => text.includes(markers[name]) && !(allowModerationItems && MODERATION_ITEMS.has(name)),
  );
  const ids = journalIdsIn(body);
  for (const [name, id] of Object.entries(secretIds)) {
    if (ids.has(id) || text.includes(`/journals/${id}"`)) found.push(`${name} (id ${id})`);
  }
  return found;
}

describe('private-data matrix', () => {
  it('has something to hide, which its maker does see', async () => {
    const mine = await maker.get(`/api/journals?mine=true&pageSize=100`).expect(200);
    const text = JSON.stringify(mine.body);
    for (const name of ['private', 'unlisted', 'draft', 'hidden']) {
      expect(text, name).toContain(markers[name]);
    }
    // The public journal itself is listed for everyone: the routes do answer with data.
    const discover = await visitor(t.app).get(`/api/journals?q=${word}`).expect(200);
    expect(JSON.stringify(discover.body)).toContain(`Open ${word} wheel`);
  });

  for (const kind of ['signed-out', 'member', 'moderator'] as const) {
    describe(`as ${kind}`, () => {
      for (const [name, url] of ROUTES) {
        it(`${name}: nothing private, draft or hidden`, async () => {
          const res = await viewers[kind].get(url());
          expect(res.status, `${url()} ${res.status}`).toBeLessThan(500);
          const text = typeof res.text === 'string' ? res.text : JSON.stringify(res.body);
          const staff = kind === 'moderator' && STAFF_VIEWS.has(name);
          expect(leaks(text, res.body, staff), `${url()} answered ${res.status}`).toEqual([]);
        });
      }
    });
  }

  it('counts only what may be listed', async () => {
    const res = await visitor(t.app).get(`/api/journals?q=${word}&pageSize=100`).expect(200);
    expect(res.body.total).toBe(1);
    const compare = await visitor(t.app)
      .get(`/api/compare?x=saltPerLitre&y=overall&maker=${h()}`)
      .expect(200);
    expect(compare.body.n).toBe(1); // the public journal's one visible tasting
    const tastingsRes = await visitor(t.app).get(`/api/journals/${publicId}/tastings`).expect(200);
    expect(JSON.stringify(tastingsRes.body)).not.toContain(markers.hiddenTasting);
  });
});
