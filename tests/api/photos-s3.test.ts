import { randomBytes } from 'node:crypto';
import { mkdtemp, readdir, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { ListObjectsV2Command } from '@aws-sdk/client-s3';
import { eq } from 'drizzle-orm';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { journals, styles } from '../../server/db/schema';
import { S3Storage } from '../../server/lib/s3-storage';
import type { PhotoDto } from '../../shared/types/journal';
import { createTestApp, visitor, type TestApp } from '../support/app';
import { startFakeS3, type FakeS3 } from '../support/fake-s3';
import { signedIn, unique } from '../support/factories';
import { checkMediaAccess } from '../support/media-access';

// The same photo paths as photos.test.ts, with STORAGE=s3 against s3rver on loopback.
let s3: FakeS3;
let t: TestApp;
let uploadsDir: string;
let cheddarId: number;

beforeAll(async () => {
  s3 = await startFakeS3();
  uploadsDir = await mkdtemp(path.join(process.env.UPLOADS_DIR ?? os.tmpdir(), 'photos-s3-'));
  t = await createTestApp({ ...s3.env, UPLOADS_DIR: uploadsDir });
  const [style] = await t.ctx.database.db
    .select({ id: styles.id })
    .from(styles)
    .where(eq(styles.slug, 'cheddar'));
  cheddarId = style.id;
});
afterAll(async () => {
  await t?.close();
  await s3?.close();
  if (uploadsDir) await rm(uploadsDir, { recursive: true, force: true });
});

const storage = () => t.ctx.storage as S3Storage;

async function bucketKeys(): Promise<string[]> {
  const out = await storage().client.send(new ListObjectsV2Command({ Bucket: s3.bucket }));
  return (out.Contents ?? []).map((o) => o.Key!).sort();
}

async function publicJournal(userId: number): Promise<number> {
  const [row] = await t.ctx.database.db
    .insert(journals)
    .values({
      userId,
      styleId: cheddarId,
      title: `Bucket cheddar ${unique()}`,
      makeDate: '2026-03-14',
      milkVolumeL: 10,
      species: 'cow',
      heatTreatment: 'pasteurised',
      notes: '',
      status: 'published',
      visibility: 'public',
    })
    .$returningId();
  return row.id;
}

describe('S3Storage against a fake S3 server', () => {
  it('is the storage the context picks for STORAGE=s3', () => {
    expect(t.ctx.storage).toBeInstanceOf(S3Storage);
  });

  it('puts, reads back as a stream, tells existence and deletes idempotently', async () => {
    const key = `${randomBytes(16).toString('hex')}-320.webp`;
    const body = Buffer.from('not really a webp, but bytes are bytes');
    expect(await storage().exists(key)).toBe(false);
    expect(await storage().get(key)).toBeNull();
    await storage().put(key, body, 'image/webp');
    expect(await storage().exists(key)).toBe(true);
    const got = await storage().get(key);
    expect(got).not.toBeNull();
    expect(got!.size).toBe(body.length);
    const chunks: Buffer[] = [];
    for await (const chunk of got!.body) chunks.push(chunk as Buffer);
    expect(Buffer.concat(chunks).equals(body)).toBe(true);
    expect(await bucketKeys()).toContain(`photos/${key}`);
    await storage().delete(key);
    await storage().delete(key); // a second delete of a missing key succeeds
    expect(await storage().exists(key)).toBe(false);
  });

  it('refuses keys that could climb out of the prefix', async () => {
    await expect(storage().put('../escape.webp', Buffer.from('x'), 'image/webp')).rejects.toThrow(
      /unsafe/,
    );
    await expect(storage().get('a/b.webp')).rejects.toThrow(/unsafe/);
  });
});

describe('photos through the API with STORAGE=s3', () => {
  it('uploads renditions to the bucket, serves them on /media by stream, and deletes them', async () => {
    const owner = await signedIn(t.app, t.ctx);
    const id = await publicJournal(owner.member.id);
    const image = await sharp({
      create: { width: 1200, height: 800, channels: 3, background: '#c9a227' },
    })
      .jpeg()
      .toBuffer();
    const token = await owner.csrf();
    const res = await owner.agent
      .post(`/api/journals/${id}/photos`)
      .set('x-csrf-token', token)
      .attach('photos', image, 'wheel.jpg');
    expect(res.status).toBe(201);
    const [photo] = res.body.photos as PhotoDto[];
    const names = photo.sources.map((s) => path.basename(s.url));
    expect(names).toHaveLength(2); // 320 and 960: never upscaled past 1200
    const keys = await bucketKeys();
    for (const name of names) expect(keys).toContain(`photos/${name}`);
    // Nothing was written under the local photos folder.
    const local = await readdir(path.join(uploadsDir, 'photos')).catch(() => []);
    expect(local).toEqual([]);

    const served = await visitor(t.app).get(photo.sources[1].url).buffer(true);
    expect(served.status).toBe(200);
    expect(served.headers['content-type']).toBe('image/webp');
    expect(served.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(Number(served.headers['content-length'])).toBe((served.body as Buffer).length);
    expect((await sharp(served.body as Buffer).metadata()).width).toBe(960);
    const head = await visitor(t.app).agent.head(photo.sources[0].url);
    expect(head.status).toBe(200);

    const missing = photo.sources[0].url.replace(/[0-9a-f]{32}/, 'f'.repeat(32));
    expect((await visitor(t.app).get(missing)).status).toBe(404);

    const del = await owner.delete(`/api/journals/${id}/photos/${photo.id}`);
    expect(del.status).toBe(204);
    const after = await bucketKeys();
    for (const name of names) expect(after).not.toContain(`photos/${name}`);
    expect((await visitor(t.app).get(photo.sources[1].url)).status).toBe(404);
  });
});

describe('who may fetch a photo with STORAGE=s3', () => {
  it('gates hidden photos and photos of draft, private or hidden journals before the bucket is read', async () => {
    await checkMediaAccess(t);
  });
});
