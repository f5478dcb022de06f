import { Readable } from 'node:stream';
import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
} from '@aws-sdk/client-s3';
import type { StorageConfig } from '../config';
import { assertSafeKey, type PhotoStorage, type StoredObject } from './storage';

type S3Config = Extract<StorageConfig, { kind: 's3' }>;

const isMissing = (error: unknown): boolean =>
  error instanceof S3ServiceException &&
  (error.name === 'NoSuchKey' ||
    error.name === 'NotFound' ||
    error.$metadata.httpStatusCode === 404);

/**
 * Photos in an S3-compatible object store (AWS S3, MinIO, Ceph, R2…), so every app server
 * sees the same files. A PUT is atomic in S3 (readers see the old object or the whole new
 * one), a DELETE of a missing key succeeds, and GET streams the body without buffering it.
 */
export class S3Storage implements PhotoStorage {
  readonly client: S3Client;

  constructor(private readonly config: S3Config) {
    this.client = new S3Client({
      region: config.region,
      ...(config.endpoint ? { endpoint: config.endpoint } : {}),
      forcePathStyle: config.forcePathStyle,
      ...(config.accessKeyId && config.secretAccessKey
        ? {
            credentials: {
              accessKeyId: config.accessKeyId,
              secretAccessKey: config.secretAccessKey,
            },
          }
        : {}),
      // Checksums only where the API demands them: many S3-compatible stores reject the
      // SDK's newer default (CRC32 trailers on every upload).
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
      maxAttempts: 3,
      // A store that hangs must not hold a request (or a media stream) for minutes.
      requestHandler: { connectionTimeout: 3000, requestTimeout: 15_000 },
    });
  }

  private keyOf(key: string): string {
    assertSafeKey(key);
    return `${this.config.prefix}${key}`;
  }

  async put(key: string, body: Buffer, contentType: string): Promise<void> {
    await this.client.send(
      new PutObjectCommand({
        Bucket: this.config.bucket,
        Key: this.keyOf(key),
        Body: body,
        ContentType: contentType,
        ContentLength: body.length,
        // Names never change content: let any CDN in front of the bucket keep them.
        CacheControl: 'public, max-age=31536000, immutable',
      }),
    );
  }

  async delete(key: string): Promise<void> {
    try {
      await this.client.send(
        new DeleteObjectCommand({ Bucket: this.config.bucket, Key: this.keyOf(key) }),
      );
    } catch (error) {
      if (!isMissing(error)) throw error;
    }
  }

  async exists(key: string): Promise<boolean> {
    try {
      await this.client.send(
        new HeadObjectCommand({ Bucket: this.config.bucket, Key: this.keyOf(key) }),
      );
      return true;
    } catch (error) {
      if (isMissing(error)) return false;
      throw error;
    }
  }

  async get(key: string): Promise<StoredObject | null> {
    try {
      const out = await this.client.send(
        new GetObjectCommand({ Bucket: this.config.bucket, Key: this.keyOf(key) }),
      );
      if (!(out.Body instanceof Readable)) {
        throw new Error('The S3 client returned a body that is not a Node stream.');
      }
      return {
        body: out.Body,
        size: Number(out.ContentLength ?? 0),
        contentType: out.ContentType ?? 'application/octet-stream',
      };
    } catch (error) {
      if (isMissing(error)) return null;
      throw error;
    }
  }

  /** Closes the client's pooled sockets. */
  close(): void {
    this.client.destroy();
  }
}
