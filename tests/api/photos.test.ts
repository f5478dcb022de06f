import { randomBytes } from 'node:crypto';
import { existsSync } from 'node:fs';
import { mkdtemp, readdir, readFile, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { journalPhotos, journals, styles } from '../../server/db/schema';
import type { PhotoStorage } from '../../server/lib/storage';
import { deletePhotoFilesForJournal } from '../../server/services/photos.service';
import type { PhotoDto } from '../../shared/types/journal';
import { createTestApp, visitor, type TestApp, type Visitor } from '../support/app';
import { createMember, signedIn, unique } from '../support/factories';

let t: TestApp;
let uploadsDir: string;
let photosDir: string;
let cheddarId: number;

beforeAll(async () => {
  // A folder of our own inside the run's UPLOADS_DIR: "no new file" must not see other files'.
  const base = process.env.UPLOADS_DIR ?? os.tmpdir();
  uploadsDir = await mkdtemp(path.join(base, `photos-test-${unique()}-`));
  photosDir = path.join(uploadsDir, 'photos');
  t = await createTestApp({ UPLOADS_DIR: uploadsDir });
  const [style] = await t.ctx.database.db
    .select({ id: styles.id })
    .from(styles)
    .where(eq(styles.slug, 'cheddar'));
  cheddarId = style.id;
});
afterAll(async () => {
  await t.close();
  await rm(uploadsDir, { recursive: true, force: true });
});

// ---------------------------------------------------------------------------------------------
// Helpers

type JournalOptions = Partial<typeof journals.$inferInsert>;

/** Inserts a journal row straight into the database (private draft unless told otherwise). */
async function createJournal(userId: number, opts: JournalOptions = {}): Promise<number> {
  const [row] = await t.ctx.database.db
    .insert(journals)
    .values({
      userId,
      styleId: cheddarId,
      title: `Farmhouse cheddar ${unique()}`,
      makeDate: '2026-03-14',
      milkVolumeL: 10,
      species: 'cow',
      heatTreatment: 'pasteurised',
      notes: '',
      ...opts,
    })
    .$returningId();
  return row.id;
}

const publicJournal: JournalOptions = { status: 'published', visibility: 'public' };

type Part = { data: Buffer; name: string };

/** A multipart upload with the CSRF token, files in "photos" and optional captions. */
async function upload(
  v: Visitor,
  journalId: number,
  files: Part[],
  opts: { captions?: string[]; field?: string } = {},
) {
  const token = await v.csrf();
  let req = v.agent.post(`/api/journals/${journalId}/photos`).set('x-csrf-token', token);
  for (const caption of opts.captions ?? []) req = req.field('captions', caption);
  for (const file of files) req = req.attach(opts.field ?? 'photos', file.data, file.name);
  return req;
}

const jpeg = (width: number, height: number, colour = '#c9a227') =>
  sharp({ create: { width, height, channels: 3, background: colour } })
    .jpeg()
    .toBuffer();

/** A JPEG with real image content, so a cut-off copy loses actual scan data. */
async function noisyJpeg(width: number, height: number): Promise<Buffer> {
  return sharp(randomBytes(width * height * 3), { raw: { width, height, channels: 3 } })
    .jpeg({ quality: 90 })
    .toBuffer();
}

/** Every file under a folder, relative names, recursively (an absent folder is empty). */
async function filesUnder(dir: string): Promise<string[]> {
  if (!existsSync(dir)) return [];
  const entries = await readdir(dir, { recursive: true, withFileTypes: true });
  return entries
    .filter((e) => e.isFile())
    .map((e) => path.relative(dir, path.join(e.parentPath, e.name)))
    .sort();
}

const photoRows = (journalId: number) =>
  t.ctx.database.db.select().from(journalPhotos).where(eq(journalPhotos.journalId, journalId));

/** The storage file of each rendition of a presented photo. */
const storedFiles = (photo: PhotoDto) =>
  photo.sources.map((s) => path.join(photosDir, path.basename(s.url)));

/** Whether an EXIF block (as sharp's metadata().exif gives it) has a GPS IFD with entries. */
function exifHasGps(exif: Buffer | undefined): boolean {
  if (!exif) return false;
  const tiff = exif.subarray(exif.toString('latin1', 0, 6) === 'Exif\0\0' ? 6 : 0);
  const le = tiff.toString('latin1', 0, 2) === 'II';
  const u16 = (at: number) => (le ? tiff.readUInt16LE(at) : tiff.readUInt16BE(at));
  const u32 = (at: number) => (le ? tiff.readUInt32LE(at) : tiff.readUInt32BE(at));
  const ifd0 = u32(4);
  for (let i = 0; i < u16(ifd0); i++) {
    const entry = ifd0 + 2 + i * 12;
    if (u16(entry) === 0x8825) return u16(u32(entry + 8)) > 0; // GPSInfo pointer
  }
  return false;
}

/** Runs the body with the context's storage swapped for a wrapper. */
async function withStorage(wrap: (real: PhotoStorage) => PhotoStorage, body: () => Promise<void>) {
  const real = t.ctx.storage;
  t.ctx.storage = wrap(real);
  try {
    await body();
  } finally {
    t.ctx.storage = real;
  }
}

/** A storage wrapper that counts writes and passes them on. */
function countingPuts(counter: { puts: number }) {
  return (real: PhotoStorage): PhotoStorage => ({
    get: real.get.bind(real),
    exists: real.exists.bind(real),
    delete: real.delete.bind(real),
    put: (key, body, type) => {
      counter.puts += 1;
      return real.put(key, body, type);
    },
  });
}

const SVG_WITH_SCRIPT = Buffer.from(
  '<?xml version="1.0"?><svg xmlns="http://www.w3.org/2000/svg" width="400" height="300">' +
    '<script>fetch("/api/auth/me").then(r=>r.text()).then(alert)</script>' +
    '<rect width="400" height="300" fill="#c9a227"/></svg>',
);

// ---------------------------------------------------------------------------------------------
// Refusals first

describe('POST /api/journals/:id/photos: who may upload', () => {
  it('refuses a signed-out visitor with 401', async () => {
    const owner = await createMember(t.ctx);
    const id = await createJournal(owner.id, publicJournal);
    const res = await upload(visitor(t.app), id, [{ data: await jpeg(400, 300), name: 'a.jpg' }]);
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('SIGNED_OUT');
  });

  it('refuses a request without the CSRF token with 403', async () => {
    const s = await signedIn(t.app, t.ctx);
    const id = await createJournal(s.member.id);
    const res = await s.agent
      .post(`/api/journals/${id}/photos`)
      .attach('photos', await jpeg(400, 300), 'a.jpg');
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('CSRF_INVALID');
    expect(await photoRows(id)).toHaveLength(0);
  });

  it("answers 403 on someone else's public journal and 404 on a private one or a draft", async () => {
    const owner = await createMember(t.ctx);
    const stranger = await signedIn(t.app, t.ctx);
    const image = [{ data: await jpeg(400, 300), name: 'a.jpg' }];
    const open = await createJournal(owner.id, publicJournal);
    const unlisted = await createJournal(owner.id, { status: 'published', visibility: 'unlisted' });
    const secret = await createJournal(owner.id, { status: 'published', visibility: 'private' });
    const draft = await createJournal(owner.id, { status: 'draft', visibility: 'public' });
    const hidden = await createJournal(owner.id, { ...publicJournal, hiddenAt: new Date() });

    const forbidden = await upload(stranger, open, image);
    expect(forbidden.status).toBe(403);
    expect(forbidden.body.error.code).toBe('NOT_JOURNAL_OWNER');
    expect((await upload(stranger, unlisted, image)).status).toBe(403);
    for (const id of [secret, draft, hidden, 999_999_999]) {
      const res = await upload(stranger, id, image);
      expect(res.status).toBe(404);
      expect(res.body.error.code).toBe('JOURNAL_NOT_FOUND');
    }
    for (const id of [open, unlisted, secret, draft, hidden]) {
      expect(await photoRows(id)).toHaveLength(0);
    }
  });

  it('refuses a journal id that is not a number with 400', async () => {
    const s = await signedIn(t.app, t.ctx);
    const res = await s.patch('/api/journals/abc/photos/1', { caption: 'x' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.id).toBeTruthy();
  });
});

describe('POST /api/journals/:id/photos: what is refused', () => {
  let s: Visitor & { member: { id: number } };
  let journalId: number;
  beforeAll(async () => {
    s = await signedIn(t.app, t.ctx);
    journalId = await createJournal(s.member.id);
  });

  it('refuses a text file named .jpg', async () => {
    const before = await filesUnder(uploadsDir);
    const res = await upload(s, journalId, [
      { data: Buffer.from('This is my make sheet, not a photo.\n'), name: 'curd.jpg' },
    ]);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('NOT_AN_IMAGE');
    expect(res.body.error.message).toMatch(/"curd\.jpg" is not a photo/);
    expect(res.body.error.message).toMatch(/No photos were added/);
    expect(res.body.error.fields['photos.0']).toBeTruthy();
    expect(await filesUnder(uploadsDir)).toEqual(before);
  });

  it('refuses an SVG carrying a script, whatever its name says', async () => {
    expect((await sharp(SVG_WITH_SCRIPT).metadata()).format).toBe('svg'); // sharp would read it
    for (const name of ['wheel.svg', 'wheel.png', 'wheel.jpg']) {
      const res = await upload(s, journalId, [{ data: SVG_WITH_SCRIPT, name }]);
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('NOT_AN_IMAGE');
    }
    expect(await photoRows(journalId)).toHaveLength(0);
  });

  it('says plainly that HEIC photos cannot be read yet', async () => {
    const heic = Buffer.concat([
      Buffer.from('00000018667479706865696300000000', 'hex'), // ftyp box, brand "heic"
      randomBytes(2000),
    ]);
    const res = await upload(s, journalId, [{ data: heic, name: 'IMG_0042.HEIC' }]);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('HEIC_NOT_SUPPORTED');
    expect(res.body.error.message).toMatch(/as JPEG/);
  });

  it('refuses a 20000 × 20000 PNG with a message about its size', { timeout: 60_000 }, async () => {
    const huge = await sharp({
      create: { width: 20000, height: 20000, channels: 3, background: '#e8c872' },
      limitInputPixels: false,
    })
      .png({ compressionLevel: 9 })
      .toBuffer();
    expect(huge.length).toBeLessThan(15 * 1024 * 1024); // small on disk, 400 megapixels inside
    const res = await upload(s, journalId, [{ data: huge, name: 'bomb.png' }]);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('IMAGE_TOO_MANY_PIXELS');
    expect(res.body.error.message).toMatch(/20000 × 20000 px/);
    expect(res.body.error.message).toMatch(/at most 50 megapixels/);
  });

  it('refuses a truncated JPEG', async () => {
    const whole = await noisyJpeg(800, 600);
    const cut = whole.subarray(0, Math.floor(whole.length * 0.6));
    expect((await sharp(cut).metadata()).format).toBe('jpeg'); // the header still reads fine
    const res = await upload(s, journalId, [{ data: cut, name: 'cut.jpg' }]);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('IMAGE_DAMAGED');
    expect(res.body.error.message).toMatch(/damaged or incomplete/);
  });

  it('adds nothing when one file of a batch is bad: no new file, no new row', async () => {
    const before = await filesUnder(uploadsDir);
    const whole = await noisyJpeg(1200, 900);
    const good = await jpeg(2400, 1600);
    const counter = { puts: 0 };
    let res!: Awaited<ReturnType<typeof upload>>;
    // The good one is first, so its renditions are written before the bad one fails.
    await withStorage(countingPuts(counter), async () => {
      res = await upload(s, journalId, [
        { data: good, name: 'good.jpg' },
        { data: whole.subarray(0, whole.length - 4000), name: 'bad.jpg' },
      ]);
    });
    expect(counter.puts).toBe(3);
    expect(res.status).toBe(400);
    expect(res.body.error.fields['photos.1']).toMatch(/"bad\.jpg"/);
    expect(res.body.error.message).toMatch(/No photos were added/);
    expect(await filesUnder(uploadsDir)).toEqual(before);
    expect(await photoRows(journalId)).toHaveLength(0);
  });

  it('refuses 11 files in one request', async () => {
    const before = await filesUnder(uploadsDir);
    const one = await jpeg(400, 300);
    const files = Array.from({ length: 11 }, (_, i) => ({ data: one, name: `p${i}.jpg` }));
    const res = await upload(s, journalId, files);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('TOO_MANY_FILES');
    expect(res.body.error.message).toMatch(/at most 10 photos/);
    expect(await photoRows(journalId)).toHaveLength(0);
    expect(await filesUnder(uploadsDir)).toEqual(before);
  });

  it('refuses a file over 15 MB with 413', async () => {
    const before = await filesUnder(uploadsDir);
    const res = await upload(s, journalId, [
      { data: randomBytes(15 * 1024 * 1024 + 1), name: 'huge.jpg' },
    ]);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('PHOTO_TOO_LARGE');
    expect(res.body.error.message).toMatch(/"huge\.jpg" is larger than 15 MB/);
    expect(await filesUnder(uploadsDir)).toEqual(before);
  });

  it('refuses files in another field, no files at all, and a body that is not multipart', async () => {
    const wrong = await upload(s, journalId, [{ data: await jpeg(400, 300), name: 'a.jpg' }], {
      field: 'photo',
    });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.code).toBe('UNEXPECTED_FILE_FIELD');

    const none = await upload(s, journalId, [], { captions: ['lonely caption'] });
    expect(none.status).toBe(400);
    expect(none.body.error.fields.photos).toMatch(/at least one/);

    const json = await s.post(`/api/journals/${journalId}/photos`, { photos: [] });
    expect(json.status).toBe(400);
    expect(json.body.error.code).toBe('NOT_MULTIPART');
  });

  it('checks captions: at most 200 characters, at most one per photo', async () => {
    const image = { data: await jpeg(400, 300), name: 'a.jpg' };
    const long = await upload(s, journalId, [image], { captions: ['x'.repeat(201)] });
    expect(long.status).toBe(400);
    expect(long.body.error.fields.captions).toMatch(/200/);
    const many = await upload(s, journalId, [image], { captions: ['one', 'two'] });
    expect(many.status).toBe(400);
    expect(many.body.error.fields.captions).toMatch(/one caption per photo/);
    expect(await photoRows(journalId)).toHaveLength(0);
  });

  it('holds at most 30 photos per journal', async () => {
    const id = await createJournal(s.member.id);
    await t.ctx.database.db.insert(journalPhotos).values(
      Array.from({ length: 29 }, (_, i) => ({
        journalId: id,
        fileKey: randomBytes(16).toString('hex'),
        width: 320,
        height: 240,
        widths: '320',
        position: i,
      })),
    );
    const image = { data: await jpeg(400, 300), name: 'a.jpg' };
    const res = await upload(s, id, [image, image]);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('TOO_MANY_PHOTOS');
    expect(res.body.error.message).toMatch(/has 29; add at most 1 more/);
    expect((await upload(s, id, [image])).status).toBe(201);
    expect((await upload(s, id, [image])).status).toBe(400);
  });
});

describe('POST /api/journals/:id/photos: a failure after files are written leaves nothing', () => {
  let s: Visitor & { member: { id: number } };
  beforeAll(async () => {
    s = await signedIn(t.app, t.ctx);
  });

  it('removes the files already written when the storage fails part-way', async () => {
    const id = await createJournal(s.member.id);
    const before = await filesUnder(uploadsDir);
    let puts = 0;
    await withStorage(
      (real) => ({
        get: real.get.bind(real),
        exists: real.exists.bind(real),
        delete: real.delete.bind(real),
        put: async (key, body, type) => {
          if (++puts === 4) throw new Error('disk full (simulated)');
          return real.put(key, body, type);
        },
      }),
      async () => {
        const res = await upload(s, id, [
          { data: await jpeg(2400, 1600), name: 'a.jpg' },
          { data: await jpeg(2400, 1600), name: 'b.jpg' },
        ]);
        expect(res.status).toBe(500);
      },
    );
    expect(puts).toBe(4);
    expect(await filesUnder(uploadsDir)).toEqual(before);
    expect(await photoRows(id)).toHaveLength(0);
  });

  it('removes the files when the rows cannot go in (the journal filled up meanwhile)', async () => {
    const id = await createJournal(s.member.id);
    const before = await filesUnder(uploadsDir);
    let filled = false;
    await withStorage(
      (real) => ({
        get: real.get.bind(real),
        exists: real.exists.bind(real),
        delete: real.delete.bind(real),
        put: async (key, body, type) => {
          // Another upload finishes while this one is writing its files.
          if (!filled) {
            filled = true;
            await t.ctx.database.db.insert(journalPhotos).values(
              Array.from({ length: 30 }, (_, i) => ({
                journalId: id,
                fileKey: randomBytes(16).toString('hex'),
                width: 320,
                height: 240,
                widths: '320',
                position: i,
              })),
            );
          }
          return real.put(key, body, type);
        },
      }),
      async () => {
        const res = await upload(s, id, [{ data: await jpeg(2400, 1600), name: 'a.jpg' }]);
        expect(res.status).toBe(400);
        expect(res.body.error.code).toBe('TOO_MANY_PHOTOS');
      },
    );
    expect(await filesUnder(uploadsDir)).toEqual(before);
    expect(await photoRows(id)).toHaveLength(30);
  });
});

// ---------------------------------------------------------------------------------------------
// Happy paths

describe('POST /api/journals/:id/photos: stored renditions', () => {
  let s: Visitor & { member: { id: number } };
  beforeAll(async () => {
    s = await signedIn(t.app, t.ctx);
  });

  it('writes 320, 960 and 1920 px WebPs for a large photo, served with a long cache life', async () => {
    const id = await createJournal(s.member.id, publicJournal);
    const res = await upload(s, id, [{ data: await jpeg(3000, 2000), name: 'wheel.jpg' }], {
      captions: ['  Fresh from the press  '],
    });
    expect(res.status).toBe(201);
    const [photo] = res.body.photos as PhotoDto[];
    expect(photo.caption).toBe('Fresh from the press');
    expect(photo.sources.map((x) => x.width)).toEqual([320, 960, 1920]);
    expect([photo.width, photo.height]).toEqual([1920, 1280]);
    for (const [i, file] of storedFiles(photo).entries()) {
      const meta = await sharp(file).metadata();
      expect(meta.format).toBe('webp');
      expect(meta.width).toBe(photo.sources[i].width);
    }

    const url = photo.sources[1].url;
    expect(url).toMatch(/^\/media\/photos\/[0-9a-f]{32}-960\.webp$/);
    const served = await visitor(t.app).get(url).buffer(true);
    expect(served.status).toBe(200);
    expect(served.headers['content-type']).toBe('image/webp');
    expect(served.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(served.headers['x-content-type-options']).toBe('nosniff');
    expect((await sharp(served.body as Buffer).metadata()).width).toBe(960);

    const [row] = await photoRows(id);
    expect(row.widths).toBe('320,960,1920');
    expect(await filesUnder(path.join(uploadsDir, '.tmp'))).toEqual([]);
  });

  it('never upscales: a 1000 px photo gets 320 and 960, a 200 px one a single 200 px file', async () => {
    const id = await createJournal(s.member.id);
    const res = await upload(s, id, [
      { data: await jpeg(1000, 750), name: 'mid.jpg' },
      { data: await jpeg(200, 100), name: 'tiny.png' },
      {
        data: await sharp(await jpeg(320, 200))
          .png()
          .toBuffer(),
        name: 'exact.png',
      },
    ]);
    expect(res.status).toBe(201);
    const [mid, tiny, exact] = res.body.photos as PhotoDto[];
    expect(mid.sources.map((x) => x.width)).toEqual([320, 960]);
    expect(tiny.sources.map((x) => x.width)).toEqual([200]);
    expect([tiny.width, tiny.height]).toEqual([200, 100]);
    expect(exact.sources.map((x) => x.width)).toEqual([320]);
    expect([mid.position, tiny.position, exact.position]).toEqual([0, 1, 2]);
    for (const photo of [mid, tiny, exact]) {
      for (const file of storedFiles(photo)) expect(existsSync(file)).toBe(true);
    }
  });

  it('strips EXIF with its GPS position from every stored file', async () => {
    const withGps = await sharp({
      create: { width: 2000, height: 1500, channels: 3, background: '#b5651d' },
    })
      .jpeg()
      .withExif({
        IFD0: { Make: 'Vat Camera', Model: 'Curd Cam 2', Copyright: 'A. Maker' },
        IFD3: {
          GPSLatitudeRef: 'N',
          GPSLatitude: '51/1 28/1 4/1',
          GPSLongitudeRef: 'W',
          GPSLongitude: '3/1 10/1 51/1',
        },
      })
      .toBuffer();
    const input = await sharp(withGps).metadata();
    expect(exifHasGps(input.exif)).toBe(true);

    const id = await createJournal(s.member.id);
    const res = await upload(s, id, [{ data: withGps, name: 'where-i-live.jpg' }]);
    expect(res.status).toBe(201);
    const [photo] = res.body.photos as PhotoDto[];
    expect(photo.sources).toHaveLength(3);
    for (const file of storedFiles(photo)) {
      const meta = await sharp(file).metadata();
      expect(meta.exif).toBeUndefined();
      expect(meta.xmp).toBeUndefined();
      expect(meta.iptc).toBeUndefined();
      const bytes = await readFile(file);
      expect(bytes.includes('EXIF')).toBe(false);
      expect(bytes.includes('Curd Cam')).toBe(false);
    }
  });

  it('applies the EXIF orientation before resizing', async () => {
    const sideways = await sharp({
      create: { width: 800, height: 400, channels: 3, background: '#6b8e23' },
    })
      .jpeg()
      .withMetadata({ orientation: 6 })
      .toBuffer();
    const id = await createJournal(s.member.id);
    const res = await upload(s, id, [{ data: sideways, name: 'portrait.jpg' }]);
    expect(res.status).toBe(201);
    const [photo] = res.body.photos as PhotoDto[];
    expect(photo.sources.map((x) => x.width)).toEqual([320]);
    expect([photo.width, photo.height]).toEqual([320, 640]);
    const meta = await sharp(storedFiles(photo)[0]).metadata();
    expect([meta.width, meta.height, meta.orientation]).toEqual([320, 640, undefined]);
  });

  it('takes PNG, WebP, GIF, AVIF and TIFF as well as JPEG', async () => {
    const base = sharp({
      create: { width: 500, height: 400, channels: 4, background: '#ffd70080' },
    });
    const id = await createJournal(s.member.id);
    const res = await upload(s, id, [
      { data: await base.clone().png().toBuffer(), name: 'a.png' },
      { data: await base.clone().webp().toBuffer(), name: 'b.webp' },
      { data: await base.clone().gif().toBuffer(), name: 'c.gif' },
      { data: await base.clone().avif().toBuffer(), name: 'd.avif' },
      { data: await base.clone().tiff().toBuffer(), name: 'e.tiff' },
    ]);
    expect(res.status).toBe(201);
    expect(res.body.photos).toHaveLength(5);
  });
});

describe('GET /media/photos/:file', () => {
  it('answers 404 for names that are not photo keys, and for keys that are not stored', async () => {
    const v = visitor(t.app);
    for (const name of [
      'nothing.webp',
      `${'a'.repeat(32)}-320.jpg`,
      `${'A'.repeat(32)}-320.webp`,
      `.${'a'.repeat(32)}-320.webp.abc.tmp`,
      '..%2F..%2Fpackage.json',
      `${'a'.repeat(32)}-320.webp`,
    ]) {
      const res = await v.get(`/media/photos/${name}`);
      expect(res.status).toBe(404);
      expect(res.headers['cache-control']).toBe('no-store');
    }
    expect((await v.get('/media/other/thing')).status).toBe(404);
  });
});

describe('PATCH /api/journals/:id/photos/:photoId', () => {
  it('edits the caption for the owner only, with per-field messages', async () => {
    const s = await signedIn(t.app, t.ctx);
    const id = await createJournal(s.member.id, publicJournal);
    const [photo] = (await upload(s, id, [{ data: await jpeg(400, 300), name: 'a.jpg' }])).body
      .photos as PhotoDto[];
    const path = `/api/journals/${id}/photos/${photo.id}`;

    expect((await visitor(t.app).patch(path, { caption: 'x' })).status).toBe(401);
    const stranger = await signedIn(t.app, t.ctx);
    expect((await stranger.patch(path, { caption: 'mine now' })).status).toBe(403);
    const long = await s.patch(path, { caption: 'y'.repeat(201) });
    expect(long.status).toBe(400);
    expect(long.body.error.fields.caption).toMatch(/200/);
    expect((await s.patch(path, { caption: 42 })).body.error.fields.caption).toBeTruthy();
    expect((await s.patch(`/api/journals/${id}/photos/999999999`, { caption: 'x' })).status).toBe(
      404,
    );
    // A photo of another journal is not reachable through this one.
    const other = await createJournal(s.member.id);
    expect(
      (await s.patch(`/api/journals/${other}/photos/${photo.id}`, { caption: 'x' })).status,
    ).toBe(404);

    const ok = await s.patch(path, { caption: 'Cut at 6 weeks: close, buttery texture' });
    expect(ok.status).toBe(200);
    expect(ok.body.photo.caption).toBe('Cut at 6 weeks: close, buttery texture');
    const [row] = await photoRows(id);
    expect(row.caption).toBe('Cut at 6 weeks: close, buttery texture');
  });
});

describe('DELETE /api/journals/:id/photos/:photoId', () => {
  it('removes the files and the row, for the owner only', async () => {
    const s = await signedIn(t.app, t.ctx);
    const id = await createJournal(s.member.id, publicJournal);
    const [photo] = (await upload(s, id, [{ data: await jpeg(2000, 1000), name: 'a.jpg' }])).body
      .photos as PhotoDto[];
    const files = storedFiles(photo);
    expect(files.every((f) => existsSync(f))).toBe(true);
    const path = `/api/journals/${id}/photos/${photo.id}`;

    expect((await visitor(t.app).delete(path)).status).toBe(401);
    const stranger = await signedIn(t.app, t.ctx);
    expect((await stranger.delete(path)).status).toBe(403);
    expect(files.every((f) => existsSync(f))).toBe(true);

    expect((await s.delete(path)).status).toBe(204);
    expect(files.some((f) => existsSync(f))).toBe(false);
    expect(await photoRows(id)).toHaveLength(0);
    expect((await visitor(t.app).get(photo.sources[0].url)).status).toBe(404);
    expect((await s.delete(path)).status).toBe(404);
  });
});

describe('PUT /api/journals/:id/photos/order', () => {
  it('reorders when given exactly the journal photo ids', async () => {
    const s = await signedIn(t.app, t.ctx);
    const id = await createJournal(s.member.id, publicJournal);
    const image = { data: await jpeg(400, 300), name: 'a.jpg' };
    const added = (await upload(s, id, [image, image, image])).body.photos as PhotoDto[];
    const [a, b, c] = added.map((p) => p.id);
    const path = `/api/journals/${id}/photos/order`;

    expect((await visitor(t.app).put(path, { ids: [c, b, a] })).status).toBe(401);
    const stranger = await signedIn(t.app, t.ctx);
    expect((await stranger.put(path, { ids: [c, b, a] })).status).toBe(403);
    for (const ids of [[c, b], [c, b, a, 999999], [c, c, a], [], 'abc', [c, b, -1]]) {
      const res = await s.put(path, { ids });
      expect(res.status).toBe(400);
      expect(res.body.error.fields.ids ?? res.body.error.fields['ids.2']).toBeTruthy();
    }

    const res = await s.put(path, { ids: [c, a, b] });
    expect(res.status).toBe(200);
    expect((res.body.photos as PhotoDto[]).map((p) => [p.id, p.position])).toEqual([
      [c, 0],
      [a, 1],
      [b, 2],
    ]);
  });
});

describe('removing files with their journal or account', () => {
  it('deletePhotoFilesForJournal removes every rendition of the journal', async () => {
    const s = await signedIn(t.app, t.ctx);
    const id = await createJournal(s.member.id);
    const keep = await createJournal(s.member.id);
    const photos = (
      await upload(s, id, [
        { data: await jpeg(2000, 1000), name: 'a.jpg' },
        { data: await jpeg(500, 300), name: 'b.jpg' },
      ])
    ).body.photos as PhotoDto[];
    const [kept] = (await upload(s, keep, [{ data: await jpeg(500, 300), name: 'c.jpg' }])).body
      .photos as PhotoDto[];

    await deletePhotoFilesForJournal(t.ctx, id);
    expect(photos.flatMap(storedFiles).some((f) => existsSync(f))).toBe(false);
    expect(storedFiles(kept).every((f) => existsSync(f))).toBe(true);
    // Safe to repeat when a journal delete is retried.
    await deletePhotoFilesForJournal(t.ctx, id);
  });

  it('deleting an account removes the files of all its photos', async () => {
    const s = await signedIn(t.app, t.ctx);
    const first = await createJournal(s.member.id, publicJournal);
    const second = await createJournal(s.member.id);
    const photos = [
      ...((await upload(s, first, [{ data: await jpeg(1000, 800), name: 'a.jpg' }])).body
        .photos as PhotoDto[]),
      ...((await upload(s, second, [{ data: await jpeg(400, 300), name: 'b.jpg' }])).body
        .photos as PhotoDto[]),
    ];
    const files = photos.flatMap(storedFiles);
    expect(files.every((f) => existsSync(f))).toBe(true);

    expect((await s.delete('/api/auth/me', { password: s.member.password })).status).toBe(204);
    expect(files.some((f) => existsSync(f))).toBe(false);
    expect(await photoRows(first)).toHaveLength(0);
    expect(await photoRows(second)).toHaveLength(0);
  });
});
