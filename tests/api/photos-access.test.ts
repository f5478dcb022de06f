import { mkdtemp, rm } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, it } from 'vitest';
import { createTestApp, type TestApp } from '../support/app';
import { unique } from '../support/factories';
import { checkMediaAccess } from '../support/media-access';

let t: TestApp;
let uploadsDir: string;
beforeAll(async () => {
  uploadsDir = await mkdtemp(
    path.join(process.env.UPLOADS_DIR ?? os.tmpdir(), `photos-access-${unique()}-`),
  );
  t = await createTestApp({ UPLOADS_DIR: uploadsDir });
});
afterAll(async () => {
  await t?.close();
  if (uploadsDir) await rm(uploadsDir, { recursive: true, force: true });
});

describe('GET /media/photos/:file: who may fetch a photo (local storage)', () => {
  it('serves hidden photos and photos of draft, private or hidden journals only to their maker and staff', async () => {
    await checkMediaAccess(t);
  });
});
