import { describe, expect, it } from 'vitest';
import { ConfigError, loadConfig } from '../../server/config';

const base = { DATABASE_URL: 'mysql://app:pw@127.0.0.1:3306/rindwise' };

describe('loadConfig: photo storage', () => {
  it('keeps photos in the local folder by default', () => {
    expect(loadConfig(base).storage).toEqual({ kind: 'local' });
  });

  it('reads an S3-compatible store from the S3_* variables', () => {
    const config = loadConfig({
      ...base,
      STORAGE: 's3',
      S3_ENDPOINT: 'http://127.0.0.1:9000',
      S3_BUCKET: 'rindwise-photos',
      S3_ACCESS_KEY_ID: 'key',
      S3_SECRET_ACCESS_KEY: 'secret',
      S3_FORCE_PATH_STYLE: 'true',
    });
    expect(config.storage).toEqual({
      kind: 's3',
      endpoint: 'http://127.0.0.1:9000',
      bucket: 'rindwise-photos',
      region: 'us-east-1',
      accessKeyId: 'key',
      secretAccessKey: 'secret',
      forcePathStyle: true,
      prefix: 'photos/',
    });
  });

  it('leaves credentials to the SDK chain when neither key is given', () => {
    const config = loadConfig({ ...base, STORAGE: 's3', S3_BUCKET: 'rindwise-photos' });
    expect(config.storage).toMatchObject({ accessKeyId: null, secretAccessKey: null });
  });

  it('names every bad S3 variable', () => {
    expect(() => loadConfig({ ...base, STORAGE: 's3' })).toThrow(/S3_BUCKET/);
    expect(() =>
      loadConfig({ ...base, STORAGE: 's3', S3_BUCKET: 'ok-bucket', S3_ACCESS_KEY_ID: 'only' }),
    ).toThrow(/give both or neither/);
    expect(() => loadConfig({ ...base, STORAGE: 'ftp' })).toThrow(ConfigError);
    expect(() => loadConfig({ ...base, STORAGE: 's3', S3_BUCKET: 'Bad_Bucket' })).toThrow(
      /S3_BUCKET/,
    );
    expect(() =>
      loadConfig({ ...base, STORAGE: 's3', S3_BUCKET: 'ok-bucket', S3_ENDPOINT: 'not a url' }),
    ).toThrow(/S3_ENDPOINT/);
  });
});
