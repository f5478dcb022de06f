import { mkdtemp, rm, writeFile, mkdir } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, visitor, type TestApp } from '../support/app';
import { signedIn } from '../support/factories';
import { publicJournalDocument } from '../support/journal-factory';

// The production read path: shared answers cached for READ_CACHE_SECONDS, forgotten on this
// server's writes; the client's text assets compressed.
let t: TestApp;
let dist: string;
const script = `console.log(${JSON.stringify('curd '.repeat(2000))});\n`;

beforeAll(async () => {
  dist = await mkdtemp(path.join(os.tmpdir(), 'rindwise-dist-'));
  await mkdir(path.join(dist, 'assets'));
  await writeFile(path.join(dist, 'assets', 'index-abc123.js'), script);
  await writeFile(path.join(dist, 'index.html'), '<!doctype html><title>x</title>');
  t = await createTestApp({ READ_CACHE_SECONDS: '60', SERVE_CLIENT: 'true', CLIENT_DIST: dist });
});
afterAll(async () => {
  await t.close();
  await rm(dist, { recursive: true, force: true });
});

describe('the shared read cache', () => {
  it('serves a public Discover page from the cache until a write through this server', async () => {
    const maker = await signedIn(t.app, t.ctx);
    const word = `cachetest${maker.member.id}x`;
    const url = `/api/journals?q=${word}`;
    expect((await visitor(t.app).get(url).expect(200)).body.total).toBe(0);
    // A row written behind the app's back is not seen while the answer is cached…
    const created = await maker.post(
      '/api/journals',
      publicJournalDocument({ title: `The ${word} wheel` }),
    );
    expect(created.status).toBe(201);
    // …but the write went through this server, which forgot its cached reads.
    const after = await visitor(t.app).get(url).expect(200);
    expect(after.body.total).toBe(1);
    expect(after.headers['content-type']).toMatch(/application\/json/);
  });

  it('never caches what depends on the viewer', async () => {
    const maker = await signedIn(t.app, t.ctx);
    const mine = await maker.get('/api/journals?mine=true').expect(200);
    expect(mine.headers['cache-control']).toBe('no-store');
    expect(mine.body.total).toBe(0);
    await maker.post('/api/journals', publicJournalDocument({ title: 'Mine now' }));
    expect((await maker.get('/api/journals?mine=true').expect(200)).body.total).toBe(1);
  });
});

describe('compressed client assets', () => {
  it('sends Brotli or gzip as the browser accepts, and the plain file otherwise', async () => {
    const br = await visitor(t.app)
      .get('/assets/index-abc123.js')
      .set('Accept-Encoding', 'gzip, deflate, br');
    expect(br.headers['content-encoding']).toBe('br');
    expect(br.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(br.headers.vary).toMatch(/Accept-Encoding/);
    expect(Number(br.headers['content-length'])).toBeLessThan(script.length / 10);
    // superagent undoes the encoding itself.
    expect(br.text).toBe(script);

    const gz = await visitor(t.app).get('/assets/index-abc123.js').set('Accept-Encoding', 'gzip');
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(gz.text).toBe(script);

    const plain = await visitor(t.app)
      .get('/assets/index-abc123.js')
      .set('Accept-Encoding', 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(plain.text).toBe(script);
    expect(
      (await visitor(t.app).get('/assets/missing-1.js').set('Accept-Encoding', 'br')).status,
    ).toBe(404);
  });
});

describe('compressed API answers', () => {
  it('compresses JSON above a kilobyte as the client accepts, cached answers included', async () => {
    const maker = await signedIn(t.app, t.ctx);
    for (const title of ['A clothbound wheel', 'A waxed wheel', 'A washed-rind wheel'])
      expect((await maker.post('/api/journals', publicJournalDocument({ title }))).status).toBe(
        201,
      );
    // The styles are read afresh each time; a Discover page comes from the read cache the
    // second time: both are compressed the same way.
    for (const url of ['/api/styles', '/api/journals']) {
      const plain = await visitor(t.app).get(url).set('Accept-Encoding', 'identity').expect(200);
      expect(plain.headers['content-encoding']).toBeUndefined();
      expect(Buffer.byteLength(plain.text), url).toBeGreaterThan(1024);
      for (const round of [1, 2]) {
        const br = await visitor(t.app)
          .get(url)
          .set('Accept-Encoding', 'gzip, deflate, br')
          .expect(200);
        expect(br.headers['content-encoding'], `${url}, round ${round}`).toBe('br');
        expect(br.headers.vary).toMatch(/Accept-Encoding/);
        // superagent undoes the encoding itself: the same JSON arrives.
        expect(br.body).toEqual(plain.body);

        const gz = await visitor(t.app).get(url).set('Accept-Encoding', 'gzip').expect(200);
        expect(gz.headers['content-encoding'], `${url}, round ${round}`).toBe('gzip');
        expect(gz.body).toEqual(plain.body);
      }
    }

    // A small answer goes out as it is.
    const small = await visitor(t.app)
      .get('/api/health/live')
      .set('Accept-Encoding', 'br')
      .expect(200);
    expect(small.headers['content-encoding']).toBeUndefined();
  });
});
