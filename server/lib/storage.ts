import { randomBytes } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { mkdir, open, rename, rm, stat } from 'node:fs/promises';
import path from 'node:path';
import type { Readable } from 'node:stream';

/** One stored object, ready to stream to a response. */
export type StoredObject = {
  body: Readable;
  size: number;
  contentType: string;
};

/**
 * Where photo renditions live. Keys are flat file names ("KEY-960.webp"), so the same key
 * works as a file under a folder and as an object name under a bucket prefix; every method
 * is async and idempotent where S3 is (a delete of a missing key succeeds), so an S3
 * implementation can replace the local one without touching the callers.
 */
export interface PhotoStorage {
  /** Stores the bytes under the key; readers never see a partly written object. */
  put(key: string, body: Buffer, contentType: string): Promise<void>;
  /** Removes the key; succeeds when it is already gone. */
  delete(key: string): Promise<void>;
  exists(key: string): Promise<boolean>;
  /** The object as a stream, or null when there is none. */
  get(key: string): Promise<StoredObject | null>;
}

/** Only our own key shape reaches the file system, so no key can climb out of the root. */
const SAFE_KEY = /^[A-Za-z0-9][A-Za-z0-9._-]{0,127}$/;

/** Throws on any key not of our own shape (no slashes, no dot-dot, no leading dot). */
export function assertSafeKey(key: string): void {
  if (!SAFE_KEY.test(key) || key.includes('..')) {
    throw new Error(`Refusing an unsafe storage key: ${JSON.stringify(key)}`);
  }
}

const CONTENT_TYPES: Record<string, string> = {
  '.webp': 'image/webp',
  '.jpg': 'image/jpeg',
  '.png': 'image/png',
};

const isNotFound = (error: unknown) => (error as NodeJS.ErrnoException)?.code === 'ENOENT';

/**
 * Photos in a local folder (UPLOADS_DIR/photos by default). Writes go to a hidden temporary
 * name in the same folder, are flushed, then renamed over the final name: a rename within one
 * file system is atomic, so a crash leaves either the whole file or none.
 */
export class LocalStorage implements PhotoStorage {
  private ready: Promise<unknown> | null = null;

  constructor(readonly root: string) {}

  private ensureRoot(): Promise<unknown> {
    this.ready ??= mkdir(this.root, { recursive: true });
    return this.ready;
  }

  private pathOf(key: string): string {
    assertSafeKey(key);
    return path.join(this.root, key);
  }

  // The content type is not needed on disk: the key's extension carries it.
  async put(key: string, body: Buffer): Promise<void> {
    const target = this.pathOf(key);
    await this.ensureRoot();
    // A leading dot keeps the temporary name out of the key pattern the media route serves.
    const temp = path.join(this.root, `.${key}.${randomBytes(6).toString('hex')}.tmp`);
    try {
      const handle = await open(temp, 'wx');
      try {
        await handle.writeFile(body);
        await handle.sync();
      } finally {
        await handle.close();
      }
      await rename(temp, target);
    } catch (error) {
      await rm(temp, { force: true });
      throw error;
    }
  }

  async delete(key: string): Promise<void> {
    await rm(this.pathOf(key), { force: true });
  }

  async exists(key: string): Promise<boolean> {
    try {
      return (await stat(this.pathOf(key))).isFile();
    } catch (error) {
      if (isNotFound(error)) return false;
      throw error;
    }
  }

  async get(key: string): Promise<StoredObject | null> {
    const file = this.pathOf(key);
    try {
      const info = await stat(file);
      if (!info.isFile()) return null;
      return {
        body: createReadStream(file),
        size: info.size,
        contentType: CONTENT_TYPES[path.extname(key)] ?? 'application/octet-stream',
      };
    } catch (error) {
      if (isNotFound(error)) return null;
      throw error;
    }
  }
}
