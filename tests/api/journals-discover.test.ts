import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { journals } from '../../server/db/schema';
import type { JournalSummaryDto } from '../../shared/types/journal';
import { createTestApp, visitor, type TestApp } from '../support/app';
import { signedIn, unique } from '../support/factories';
import { journalDocument, publicJournalDocument } from '../support/journal-factory';

// Other test files write journals into the same database at the same time, so every list
// here is narrowed to a maker made for the test, or to a word nobody else uses.

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

type Member = Awaited<ReturnType<typeof signedIn>>;
const member = (opts: Parameters<typeof signedIn>[2] = {}) => signedIn(t.app, t.ctx, opts);

async function create(v: Member, doc: ReturnType<typeof journalDocument>): Promise<number> {
  const res = await v.post('/api/journals', doc);
  if (res.status !== 201) throw new Error(`${res.status} ${JSON.stringify(res.body)}`);
  return res.body.id;
}

const ids = (body: { items: JournalSummaryDto[] }) => body.items.map((j) => j.id);

/** An RFC 4180 reader, enough to check that the export parses back. */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') {
        field += '"';
        i++;
      } else if (c === '"') quoted = false;
      else field += c;
    } else if (c === '"') quoted = true;
    else if (c === ',') {
      row.push(field);
      field = '';
    } else if (c === '\r' && text[i + 1] === '\n') {
      row.push(field);
      rows.push(row);
      row = [];
      field = '';
      i++;
    } else field += c;
  }
  if (field || row.length) rows.push([...row, field]);
  return rows;
}

describe('GET /api/journals: who sees what', () => {
  let owner: Member;
  let word: string;
  const made: Record<string, number> = {};

  beforeAll(async () => {
    owner = await member();
    word = `zq${unique()}`;
    const notes = `Washed every other day; ${word} appears in the notes.`;
    made.public = await create(owner, publicJournalDocument({ notes }));
    made.unlisted = await create(owner, publicJournalDocument({ notes, visibility: 'unlisted' }));
    made.private = await create(
      owner,
      journalDocument({ notes, status: 'published', visibility: 'private' }),
    );
    made.draft = await create(owner, journalDocument({ notes, visibility: 'public' }));
    made.hidden = await create(owner, publicJournalDocument({ notes }));
    await t.ctx.database.db
      .update(journals)
      .set({ hiddenAt: new Date() })
      .where(eq(journals.id, made.hidden));
  });

  it('answers 400 for a bad filter', async () => {
    const res = await visitor(t.app).get('/api/journals?species=yak&pageSize=1000&sort=random');
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['pageSize', 'sort', 'species.0']);
  });

  it('lists only published, public, visible journals by a maker, to visitors and members alike', async () => {
    const anon = await visitor(t.app).get(`/api/journals?maker=${owner.member.handle}`).expect(200);
    expect(ids(anon.body)).toEqual([made.public]);
    expect(anon.body.total).toBe(1);
    const other = await member();
    const seen = await other.get(`/api/journals?maker=${owner.member.handle}`).expect(200);
    expect(ids(seen.body)).toEqual([made.public]);
    // the owner's Discover is the same: their own drafts live under mine=true
    const self = await owner.get(`/api/journals?maker=${owner.member.handle}`).expect(200);
    expect(ids(self.body)).toEqual([made.public]);
  });

  it('keeps private, unlisted, drafts and hidden ones out of search and counts', async () => {
    const res = await visitor(t.app).get(`/api/journals?q=${word}`).expect(200);
    expect(ids(res.body)).toEqual([made.public]);
    expect(res.body.total).toBe(1);
  });

  it('lists the same for moderators and admins (they moderate through reports)', async () => {
    for (const role of ['moderator', 'admin'] as const) {
      const staff = await member({ role });
      const res = await staff.get(`/api/journals?q=${word}`).expect(200);
      expect(ids(res.body)).toEqual([made.public]);
    }
  });

  it('mine=true lists every journal of the caller, and needs a sign-in', async () => {
    expect((await visitor(t.app).get('/api/journals?mine=true')).status).toBe(401);
    const res = await owner.get('/api/journals?mine=true&pageSize=100').expect(200);
    expect(ids(res.body).sort()).toEqual(Object.values(made).sort());
    expect(res.body.total).toBe(5);
    const drafts = res.body.items.filter((j: JournalSummaryDto) => j.status === 'draft');
    expect(drafts.map((j: JournalSummaryDto) => j.id)).toEqual([made.draft]);
    const other = await member();
    expect((await other.get('/api/journals?mine=true').expect(200)).body.total).toBe(0);
  });

  it('summaries carry maker, style, age and score, and no notes', async () => {
    const res = await visitor(t.app).get(`/api/journals?q=${word}`).expect(200);
    const card = res.body.items[0];
    expect(card.maker).toEqual({
      id: owner.member.id,
      handle: owner.member.handle,
      displayName: owner.member.displayName,
    });
    expect(card.style).toEqual({ slug: 'cheddar', name: 'Cheddar', family: 'hard' });
    expect(card.cover).toBeNull();
    expect(typeof card.ageDays).toBe('number');
    expect(card).not.toHaveProperty('notes');
  });
});

describe('GET /api/journals: filters, search, sort and pages', () => {
  let maker: Member;
  let handle: string;
  const j: Record<string, number> = {};
  const list = async (query: string) =>
    (await visitor(t.app).get(`/api/journals?maker=${handle}&${query}`).expect(200)).body;

  beforeAll(async () => {
    maker = await member();
    handle = maker.member.handle;
    j.cheddar90 = await create(
      maker,
      publicJournalDocument({ makeDate: '2025-09-01', aging: { targetDays: 90 } }),
    );
    j.cheddar300 = await create(
      maker,
      publicJournalDocument({
        makeDate: '2025-10-01',
        aging: { targetDays: 300 },
        milk: { heatTreatment: 'raw' },
        rindTreatment: 'cloth-bound',
      }),
    );
    j.goatTomme = await create(
      maker,
      publicJournalDocument({
        makeDate: '2025-11-01',
        styleSlug: 'tomme',
        milk: { species: 'goat' },
        rindTreatment: 'natural',
        aging: { targetDays: 60 },
        notes: 'Brushed the natural rind with brine twice a week.',
      }),
    );
    j.sheepFeta = await create(
      maker,
      publicJournalDocument({
        makeDate: '2025-12-01',
        styleSlug: 'feta',
        milk: { species: 'sheep' },
        rindTreatment: 'other',
        aging: { targetDays: 30 },
        pressStages: [],
      }),
    );
    j.noTarget = await create(
      maker,
      publicJournalDocument({ makeDate: '2026-01-01', aging: { targetDays: null } }),
    );
    const scores: [number, number | null, number][] = [
      [j.cheddar90, 7.5, 2],
      [j.cheddar300, 8.5, 1],
      [j.goatTomme, 6, 4],
      [j.sheepFeta, null, 0],
      [j.noTarget, 5, 3],
    ];
    for (const [id, meanOverall, tastingCount] of scores) {
      await t.ctx.database.db
        .update(journals)
        .set({ meanOverall, tastingCount, lastTastedAgeDays: tastingCount ? 40 + (id % 7) : null })
        .where(eq(journals.id, id));
    }
  });

  it('filters by style (one or several)', async () => {
    expect(ids(await list('style=tomme'))).toEqual([j.goatTomme]);
    expect(ids(await list('style=tomme,feta')).sort()).toEqual([j.goatTomme, j.sheepFeta].sort());
    expect(ids(await list('style=cheddar'))).toEqual([j.noTarget, j.cheddar300, j.cheddar90]);
    expect((await visitor(t.app).get('/api/journals?style=not-a-style')).status).toBe(400);
  });

  it('filters by species, heat treatment and rind', async () => {
    expect(ids(await list('species=goat'))).toEqual([j.goatTomme]);
    expect(ids(await list('species=sheep,goat'))).toEqual([j.sheepFeta, j.goatTomme]);
    expect(ids(await list('heat=raw'))).toEqual([j.cheddar300]);
    expect(ids(await list('rind=cloth-bound'))).toEqual([j.cheddar300]);
    expect(ids(await list('rind=natural&species=goat'))).toEqual([j.goatTomme]);
  });

  it('filters by aging target range (agingBy=target, the default)', async () => {
    expect(ids(await list('agingMin=60&agingMax=90'))).toEqual([j.goatTomme, j.cheddar90]);
    expect(ids(await list('agingMin=100'))).toEqual([j.cheddar300]);
    expect(ids(await list('agingMax=30'))).toEqual([j.sheepFeta]);
    expect(ids(await list('agingMin=1000'))).toEqual([]);
  });

  it('filters by age at the latest tasting (agingBy=tasted)', async () => {
    const all = await list('agingBy=tasted&agingMin=0');
    expect(ids(all).sort()).toEqual([j.cheddar90, j.cheddar300, j.goatTomme, j.noTarget].sort());
  });

  it('filters by minimum mean score', async () => {
    expect(ids(await list('minScore=7'))).toEqual([j.cheddar300, j.cheddar90]);
    expect(ids(await list('minScore=8.5'))).toEqual([j.cheddar300]);
  });

  it('sorts by newest, oldest, best scored and most tasted', async () => {
    expect(ids(await list('sort=newest'))).toEqual([
      j.noTarget,
      j.sheepFeta,
      j.goatTomme,
      j.cheddar300,
      j.cheddar90,
    ]);
    expect(ids(await list('sort=oldest'))).toEqual([
      j.cheddar90,
      j.cheddar300,
      j.goatTomme,
      j.sheepFeta,
      j.noTarget,
    ]);
    // unscored journals come last
    expect(ids(await list('sort=best'))).toEqual([
      j.cheddar300,
      j.cheddar90,
      j.goatTomme,
      j.noTarget,
      j.sheepFeta,
    ]);
    expect(ids(await list('sort=most-tasted'))).toEqual([
      j.goatTomme,
      j.noTarget,
      j.cheddar90,
      j.cheddar300,
      j.sheepFeta,
    ]);
  });

  it('pages with a total count', async () => {
    const p1 = await list('pageSize=2&page=1');
    const p2 = await list('pageSize=2&page=2');
    const p3 = await list('pageSize=2&page=3');
    expect([p1.total, p2.total, p3.total]).toEqual([5, 5, 5]);
    expect([p1.page, p1.pageSize]).toEqual([1, 2]);
    expect([...ids(p1), ...ids(p2), ...ids(p3)]).toEqual([
      j.noTarget,
      j.sheepFeta,
      j.goatTomme,
      j.cheddar300,
      j.cheddar90,
    ]);
    expect(ids(await list('pageSize=2&page=4'))).toEqual([]);
  });

  it('finds a word in the notes or the title with full-text search, as a prefix', async () => {
    expect(ids(await list('q=brine'))).toEqual([j.goatTomme]);
    expect(ids(await list('q=BRUSHED natural'))).toEqual([j.goatTomme]);
    expect(ids(await list('q=brush'))).toEqual([j.goatTomme]);
    expect(ids(await list('q=farmhouse')).length).toBe(5); // in every title
    expect(ids(await list('q=brine cheddared'))).toEqual([]);
  });

  it('makes any search text safe: boolean operators and quotes are only words', async () => {
    for (const q of ['"brine', '+brine -natural', 'brine*)(', "brine' OR 1=1 --", '@brine~<>']) {
      const res = await visitor(t.app)
        .get(`/api/journals?maker=${handle}&q=${encodeURIComponent(q)}`)
        .expect(200);
      expect(ids(res.body)).toEqual([j.goatTomme]);
    }
    // nothing searchable (short words and stopwords only) finds nothing rather than everything
    expect(ids(await list('q=of the'))).toEqual([]);
  });

  it('an unknown maker lists nothing', async () => {
    const res = await visitor(t.app).get(`/api/journals?maker=nobody-${unique()}`).expect(200);
    expect(res.body).toEqual({ items: [], total: 0, page: 1, pageSize: 24 });
  });
});

describe('GET /api/journals/export', () => {
  let owner: Member;
  let trickyId: number;
  let draftId: number;

  beforeAll(async () => {
    owner = await member();
    trickyId = await create(
      owner,
      publicJournalDocument({
        title: 'Cheddar, "clothbound" at 12 °C',
        notes: 'Line one\nline two, with a comma',
        weighIns: [{ date: '2026-02-01', massKg: 1.7, note: 'after waxing' }],
      }),
    );
    draftId = await create(owner, journalDocument({ title: 'Secret draft' }));
    await owner.post(`/api/journals/${draftId}/readings`, {
      id: randomUUID(),
      takenAt: '2026-01-10T10:00:00Z',
      tempC: 31,
      ph: 6.6,
    });
    // someone else's journal never reaches this export
    const other = await member();
    await create(other, publicJournalDocument({ title: 'Not mine' }));
  });

  it('needs a sign-in (401) and a known format (400)', async () => {
    expect((await visitor(t.app).get('/api/journals/export?format=csv')).status).toBe(401);
    const bad = await owner.get('/api/journals/export?format=xlsx');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.format).toBeTruthy();
    expect((await owner.get('/api/journals/export?format=csv&table=tastings')).status).toBe(400);
  });

  it('exports the caller’s own journals, drafts included, as CSV that parses back', async () => {
    const res = await owner.get('/api/journals/export?format=csv').expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(
      /^attachment; filename="?rindwise-journals-\d{4}-\d{2}-\d{2}\.csv/,
    );
    const rows = parseCsv(res.text);
    const [header, ...records] = rows;
    expect(header.slice(0, 3)).toEqual(['journal_id', 'title', 'style']);
    expect(header).toEqual(expect.arrayContaining(['press_max_kpa', 'yield_percent', 'notes']));
    expect(records).toHaveLength(2);
    const byId = new Map(records.map((r) => [Number(r[0]), r]));
    const tricky = byId.get(trickyId)!;
    expect(tricky[1]).toBe('Cheddar, "clothbound" at 12 °C');
    expect(tricky[header.indexOf('notes')]).toBe('Line one\nline two, with a comma');
    expect(Number(tricky[header.indexOf('press_max_kpa')])).toBeCloseTo(6.86, 2);
    expect(tricky[header.indexOf('weigh_in_count')]).toBe('1');
    expect(byId.get(draftId)![header.indexOf('status')]).toBe('draft');
    expect(res.text).not.toContain('Not mine');
    expect(res.text.endsWith('\r\n')).toBe(true);
  });

  it('exports child tables as CSV keyed by journal', async () => {
    const ingredients = parseCsv(
      (await owner.get('/api/journals/export?format=csv&table=ingredients').expect(200)).text,
    );
    expect(ingredients[0].slice(0, 4)).toEqual(['journal_id', 'journal_title', 'position', 'kind']);
    expect(ingredients).toHaveLength(1 + 10);
    const readings = parseCsv(
      (await owner.get('/api/journals/export?format=csv&table=readings').expect(200)).text,
    );
    expect(readings).toHaveLength(2);
    expect(readings[1][0]).toBe(String(draftId));
    const weighIns = parseCsv(
      (await owner.get('/api/journals/export?format=csv&table=weigh-ins').expect(200)).text,
    );
    expect(weighIns[1].slice(1)).toEqual([
      'Cheddar, "clothbound" at 12 °C',
      '2026-02-01',
      '1.7',
      'after waxing',
    ]);
  });

  it('exports everything as JSON', async () => {
    const res = await owner.get('/api/journals/export?format=json').expect(200);
    expect(res.headers['content-disposition']).toMatch(
      /^attachment; filename="?rindwise-journals-.*\.json/,
    );
    const doc = JSON.parse(res.text);
    expect(doc.member.handle).toBe(owner.member.handle);
    expect(doc.journals).toHaveLength(2);
    const draft = doc.journals.find((j: { id: number }) => j.id === draftId);
    expect(draft.readings).toHaveLength(1);
    expect(draft.ingredients).toHaveLength(5);
    expect(draft.steps).toHaveLength(9);
    expect(draft.pressStages).toHaveLength(3);
    expect(draft.derived.press).toHaveLength(3);
    const tricky = doc.journals.find((j: { id: number }) => j.id === trickyId);
    expect(tricky.weighIns).toEqual([{ date: '2026-02-01', massKg: 1.7, note: 'after waxing' }]);
  });
});
