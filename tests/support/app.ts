import { randomBytes } from 'node:crypto';
import type { Express } from 'express';
import supertest from 'supertest';
import { createApp } from '../../server/app';
import { loadConfig, type AppConfig } from '../../server/config';
import { createContext, type AppContext } from '../../server/context';

export type TestApp = { app: Express; ctx: AppContext; close: () => Promise<void> };

/** The real app on the test database, with the local mail fake; trust proxy so tests pick IPs. */
export async function createTestApp(env: Record<string, string> = {}): Promise<TestApp> {
  const config: AppConfig = loadConfig({
    ...process.env,
    NODE_ENV: 'test',
    TRUST_PROXY: 'true',
    SESSION_SECRET: 'test-session-secret-that-is-long-enough-0123456789',
    SMTP_URL: '',
    ...env,
  });
  const ctx = await createContext(config);
  const app = createApp(ctx);
  return { app, ctx, close: () => ctx.close() };
}

/** A random documentation-range IPv4 address, so rate limits per IP stay per test. */
export function randomIp(): string {
  const b = randomBytes(3);
  return `198.51.${b[0]}.${(b[1] % 254) + 1}`;
}

/**
 * A cookie-keeping supertest agent from one IP, with a helper that fetches the CSRF token
 * and sends it on every state-changing request.
 */
export function visitor(app: Express, ip = randomIp()) {
  const agent = supertest.agent(app);
  agent.set('X-Forwarded-For', ip);
  let csrfToken: string | null = null;
  const csrf = async () => {
    csrfToken ??= (await agent.get('/api/auth/csrf').expect(200)).body.token as string;
    return csrfToken;
  };
  const withCsrf = async (
    method: 'post' | 'patch' | 'put' | 'delete',
    path: string,
    body?: object,
  ) => {
    // The token first: a supertest request copies the cookie jar when it is created.
    const token = await csrf();
    const req = agent[method](path).set('x-csrf-token', token);
    return body === undefined ? req : req.send(body);
  };
  return {
    agent,
    ip,
    csrf,
    /** Forget the token (the session changed, e.g. after sign-in). */
    resetCsrf: () => (csrfToken = null),
    get: (path: string) => agent.get(path),
    post: (path: string, body?: object) => withCsrf('post', path, body),
    patch: (path: string, body?: object) => withCsrf('patch', path, body),
    put: (path: string, body?: object) => withCsrf('put', path, body),
    delete: (path: string, body?: object) => withCsrf('delete', path, body),
  };
}

export type Visitor = ReturnType<typeof visitor>;
