import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { Express } from 'express';
import { randomIp } from './app';

export type Listening = { server: Server; url: string; close: () => Promise<void> };

/** Serves an app on a free loopback port over real HTTP (what a proxy in front would reach). */
export function listen(app: Express): Promise<Listening> {
  return new Promise((resolve, reject) => {
    const server = createServer(app);
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as AddressInfo;
      resolve({
        server,
        url: `http://127.0.0.1:${port}`,
        close: () =>
          new Promise<void>((done) => {
            server.closeAllConnections();
            server.close(() => done());
          }),
      });
    });
  });
}

export type HttpAnswer = { status: number; body: unknown; headers: Headers };

/**
 * A browser-like visitor over fetch: one cookie jar and one client address, whichever app
 * server it talks to (as behind a load balancer without sticky sessions).
 */
export class HttpVisitor {
  private cookies = new Map<string, string>();
  private csrfToken: string | null = null;

  constructor(readonly ip = randomIp()) {}

  private cookieHeader(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  async request(
    base: string,
    method: string,
    path: string,
    body?: unknown,
    timeoutMs = 10_000,
  ): Promise<HttpAnswer> {
    const headers: Record<string, string> = { 'x-forwarded-for': this.ip };
    if (this.cookies.size) headers.cookie = this.cookieHeader();
    if (method !== 'GET' && method !== 'HEAD') {
      this.csrfToken ??= await this.fetchCsrf(base);
      headers['x-csrf-token'] = this.csrfToken;
      headers.cookie = this.cookieHeader();
    }
    if (body !== undefined) headers['content-type'] = 'application/json';
    const res = await fetch(base + path, {
      method,
      headers,
      body: body === undefined ? undefined : JSON.stringify(body),
      signal: AbortSignal.timeout(timeoutMs),
    });
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(';');
      const at = pair.indexOf('=');
      this.cookies.set(pair.slice(0, at), pair.slice(at + 1));
    }
    const text = await res.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : null;
    } catch {
      // not JSON: keep the text
    }
    return { status: res.status, body: parsed, headers: res.headers };
  }

  private async fetchCsrf(base: string): Promise<string> {
    const res = await this.request(base, 'GET', '/api/auth/csrf');
    if (res.status !== 200) throw new Error(`csrf: ${res.status}`);
    return (res.body as { token: string }).token;
  }

  /** The cookie and CSRF headers of this visitor, for requests sent some other way. */
  authHeaders(): Record<string, string> {
    return {
      ...(this.cookies.size ? { cookie: this.cookieHeader() } : {}),
      ...(this.csrfToken ? { 'x-csrf-token': this.csrfToken } : {}),
    };
  }

  /** Use this CSRF token (as the client does with the one the sign-in answer carries). */
  useCsrf(token: string): void {
    this.csrfToken = token;
  }

  /** Forget the CSRF token (the session id changed at sign-in). */
  resetCsrf(): void {
    this.csrfToken = null;
  }

  get(base: string, path: string) {
    return this.request(base, 'GET', path);
  }

  post(base: string, path: string, body?: unknown) {
    return this.request(base, 'POST', path, body);
  }
}
