import { describe, expect, it } from 'vitest';
import { ConfigError, loadConfig } from '../../server/config';

const base = { DATABASE_URL: 'mysql://app:pw@127.0.0.1:3306/rindwise' };

describe('loadConfig', () => {
  it('applies safe defaults', () => {
    const config = loadConfig(base);
    expect(config).toMatchObject({
      env: 'development',
      host: '127.0.0.1',
      port: 3000,
      trustProxy: false,
      secureCookies: false,
    });
    expect(Object.isFrozen(config)).toBe(true);
  });

  it('names every bad variable', () => {
    try {
      loadConfig({ DATABASE_URL: 'postgres://x', PORT: 'eighty', LOG_LEVEL: 'loud' });
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(ConfigError);
      const message = (error as ConfigError).message;
      expect(message).toContain('DATABASE_URL');
      expect(message).toContain('PORT');
      expect(message).toContain('LOG_LEVEL');
    }
  });

  it('requires a session secret and an HTTPS-aware cookie in production', () => {
    expect(() => loadConfig({ ...base, NODE_ENV: 'production' })).toThrow(/SESSION_SECRET/);
    const config = loadConfig({
      ...base,
      NODE_ENV: 'production',
      SESSION_SECRET: 'x'.repeat(40),
      TRUST_PROXY: '1',
    });
    expect(config.trustProxy).toBe(1);
    expect(config.secureCookies).toBe(true);
  });
});
