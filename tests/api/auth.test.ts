import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { emailTokens, users } from '../../server/db/schema';
import { hashToken } from '../../server/lib/tokens';
import { createTestApp, visitor, type TestApp } from '../support/app';
import {
  createMember,
  GOOD_PASSWORD,
  lastMailTo,
  signedIn,
  tokenFrom,
  unique,
} from '../support/factories';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

const newSignUp = () => {
  const id = unique();
  return {
    email: `new-${id}@example.test`,
    displayName: `New Maker ${id}`,
    handle: `new-${id}`,
    password: GOOD_PASSWORD,
  };
};

describe('CSRF', () => {
  it('refuses a state-changing request without a token', async () => {
    const v = visitor(t.app);
    const res = await v.agent
      .post('/api/auth/signin')
      .send({ email: 'a@b.test', password: 'whatever-it-is' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('CSRF_INVALID');
  });

  it('refuses a wrong token', async () => {
    const v = visitor(t.app);
    await v.csrf();
    const res = await v.agent
      .post('/api/auth/signin')
      .set('x-csrf-token', 'not-the-token')
      .send({ email: 'a@b.test', password: 'x' });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('CSRF_INVALID');
  });

  it('refuses a token taken from another session', async () => {
    const a = visitor(t.app);
    const b = visitor(t.app);
    const tokenOfA = await a.csrf();
    await b.csrf();
    const res = await b.agent
      .post('/api/auth/signin')
      .set('x-csrf-token', tokenOfA)
      .send({ email: 'a@b.test', password: 'x' });
    expect(res.status).toBe(403);
  });
});

describe('POST /api/auth/signup', () => {
  it('rejects bad fields with a message per field', async () => {
    const res = await visitor(t.app).post('/api/auth/signup', {
      email: 'not-an-email',
      displayName: '',
      handle: 'A!',
      password: 'short',
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual([
      'displayName',
      'email',
      'handle',
      'password',
    ]);
  });

  it('rejects a common password, using the strength estimator dictionary', async () => {
    const res = await visitor(t.app).post('/api/auth/signup', {
      ...newSignUp(),
      password: 'password123',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.password).toMatch(/common|guess/i);
  });

  it('accepts a 128-character password and refuses 129 (no truncation)', async () => {
    const long = 'curd '.repeat(26).slice(0, 128);
    expect(
      (await visitor(t.app).post('/api/auth/signup', { ...newSignUp(), password: long })).status,
    ).toBe(202);
    const res = await visitor(t.app).post('/api/auth/signup', {
      ...newSignUp(),
      password: `${long}x`,
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.password).toMatch(/128/);
  });

  it('answers the same for an existing e-mail as for a new one, and mails the owner a notice', async () => {
    const existing = await createMember(t.ctx);
    const fresh = await visitor(t.app).post('/api/auth/signup', newSignUp());
    const again = await visitor(t.app).post('/api/auth/signup', {
      ...newSignUp(),
      email: existing.email,
    });
    expect(again.status).toBe(fresh.status);
    expect(again.body).toEqual(fresh.body);
    expect(lastMailTo(t.ctx, existing.email)?.subject).toMatch(/tried to join/);
  });

  it('reports a taken handle on its field', async () => {
    const existing = await createMember(t.ctx);
    const res = await visitor(t.app).post('/api/auth/signup', {
      ...newSignUp(),
      handle: existing.handle,
    });
    expect(res.status).toBe(409);
    expect(res.body.error.fields.handle).toMatch(/taken/);
  });

  it('creates an unverified member, mails a link, and the link verifies once', async () => {
    const input = newSignUp();
    const v = visitor(t.app);
    expect((await v.post('/api/auth/signup', input)).status).toBe(202);
    const [row] = await t.ctx.database.db.select().from(users).where(eq(users.email, input.email));
    expect(row.emailVerifiedAt).toBeNull();
    expect(row.passwordHash).toMatch(/^\$argon2id\$v=19\$m=19456,t=3,p=1\$/);

    const mail = lastMailTo(t.ctx, input.email);
    expect(mail?.subject).toMatch(/Confirm your e-mail/);
    const token = tokenFrom(mail?.text);
    // Only the hash is stored.
    const stored = await t.ctx.database.db
      .select()
      .from(emailTokens)
      .where(eq(emailTokens.userId, row.id));
    expect(stored[0].tokenHash).toBe(hashToken(token));
    expect(JSON.stringify(stored)).not.toContain(token);

    const ok = await v.post('/api/auth/verify', { token });
    expect(ok.status).toBe(200);
    const reused = await v.post('/api/auth/verify', { token });
    expect(reused.status).toBe(400);
    expect(reused.body.error.code).toBe('TOKEN_INVALID');
  });
});

describe('POST /api/auth/signin and /signout, GET /me', () => {
  it('answers the same 401 for a wrong password and an unknown e-mail', async () => {
    const member = await createMember(t.ctx);
    const wrong = await visitor(t.app).post('/api/auth/signin', {
      email: member.email,
      password: 'not-my-password-at-all',
    });
    const unknown = await visitor(t.app).post('/api/auth/signin', {
      email: `nobody-${unique()}@example.test`,
      password: 'not-my-password-at-all',
    });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(unknown.body).toEqual(wrong.body);
  });

  it('answers 401 on /me when signed out', async () => {
    const res = await visitor(t.app).get('/api/auth/me');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('SIGNED_OUT');
  });

  it('signs in with a new session id, shows /me without secrets, and signs out everywhere', async () => {
    const member = await createMember(t.ctx);
    const v = visitor(t.app);
    await v.csrf();
    const before = v.agent.jar.getCookie('rindwise.sid', {
      path: '/',
      domain: '127.0.0.1',
      secure: false,
      script: false,
    });
    const res = await v.post('/api/auth/signin', {
      email: member.email.toUpperCase(),
      password: member.password,
    });
    expect(res.status).toBe(200);
    const cookie = res.headers['set-cookie'][0] as string;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(before?.value).toBeDefined();
    expect(cookie).not.toContain(before!.value);
    expect(JSON.stringify(res.body)).not.toMatch(/argon2|passwordHash/);

    const other = visitor(t.app);
    await other.post('/api/auth/signin', { email: member.email, password: member.password });
    expect((await other.get('/api/auth/me')).status).toBe(200);

    v.resetCsrf();
    const me = await v.get('/api/auth/me');
    expect(me.body.member.handle).toBe(member.handle);
    expect((await v.post('/api/auth/signout')).status).toBe(204);
    expect((await v.get('/api/auth/me')).status).toBe(401);
    expect((await other.get('/api/auth/me')).status).toBe(401);
  });

  it('limits failed sign-ins per account, whatever the IP', async () => {
    const member = await createMember(t.ctx);
    let last = 0;
    for (let i = 0; i < 9; i++) {
      last = (
        await visitor(t.app).post('/api/auth/signin', {
          email: member.email,
          password: `wrong-password-${i}`,
        })
      ).status;
    }
    expect(last).toBe(429);
    const correct = await visitor(t.app).post('/api/auth/signin', {
      email: member.email,
      password: member.password,
    });
    expect(correct.status).toBe(429);
    expect(correct.headers['retry-after']).toBeDefined();
  });

  it('refuses a disabled account', async () => {
    const member = await createMember(t.ctx);
    await t.ctx.database.db
      .update(users)
      .set({ disabledAt: new Date() })
      .where(eq(users.id, member.id));
    const res = await visitor(t.app).post('/api/auth/signin', {
      email: member.email,
      password: member.password,
    });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('ACCOUNT_DISABLED');
  });
});

describe('password reset', () => {
  it('answers the same for known and unknown e-mails', async () => {
    const member = await createMember(t.ctx);
    const known = await visitor(t.app).post('/api/auth/password/forgot', { email: member.email });
    const unknown = await visitor(t.app).post('/api/auth/password/forgot', {
      email: `nobody-${unique()}@example.test`,
    });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(unknown.body).toEqual(known.body);
  });

  it('resets once with the mailed link, ends old sessions, and refuses reuse', async () => {
    const s = await signedIn(t.app, t.ctx);
    await visitor(t.app).post('/api/auth/password/forgot', { email: s.member.email });
    const token = tokenFrom(lastMailTo(t.ctx, s.member.email)?.text);
    const weak = await visitor(t.app).post('/api/auth/password/reset', {
      token,
      password: 'password1',
    });
    expect(weak.status).toBe(400);
    expect(weak.body.error.fields.password).toBeDefined();
    // A refused password does not use up the link.
    const token2 = token;
    const v = visitor(t.app);
    const ok = await v.post('/api/auth/password/reset', {
      token: token2,
      password: 'new-whey-basket-84',
    });
    expect(ok.status).toBe(200);
    expect((await s.get('/api/auth/me')).status).toBe(401);
    const reused = await v.post('/api/auth/password/reset', {
      token: token2,
      password: 'other-whey-basket-85',
    });
    expect(reused.status).toBe(400);
    expect(reused.body.error.code).toBe('TOKEN_INVALID');
    const signin = await visitor(t.app).post('/api/auth/signin', {
      email: s.member.email,
      password: 'new-whey-basket-84',
    });
    expect(signin.status).toBe(200);
  });

  it('refuses an expired link', async () => {
    const member = await createMember(t.ctx);
    await visitor(t.app).post('/api/auth/password/forgot', { email: member.email });
    const token = tokenFrom(lastMailTo(t.ctx, member.email)?.text);
    await t.ctx.database.db
      .update(emailTokens)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(emailTokens.tokenHash, hashToken(token)));
    const res = await visitor(t.app).post('/api/auth/password/reset', {
      token,
      password: 'new-whey-basket-84',
    });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('TOKEN_INVALID');
  });

  it('rate-limits reset requests per account', async () => {
    const member = await createMember(t.ctx);
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++)
      statuses.push(
        (await visitor(t.app).post('/api/auth/password/forgot', { email: member.email })).status,
      );
    expect(statuses).toEqual([202, 202, 202, 429]);
  });
});

describe('account settings', () => {
  it('updates display name, units and reminders; validates bad values', async () => {
    const s = await signedIn(t.app, t.ctx);
    const bad = await s.patch('/api/auth/me', { units: 'imperial', remindersEnabled: 'yes' });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['remindersEnabled', 'units']);
    const ok = await s.patch('/api/auth/me', {
      displayName: 'Renamed Maker',
      units: 'us',
      remindersEnabled: false,
    });
    expect(ok.status).toBe(200);
    expect(ok.body.member).toMatchObject({
      displayName: 'Renamed Maker',
      units: 'us',
      remindersEnabled: false,
    });
  });

  it('a member cannot make themself admin', async () => {
    const s = await signedIn(t.app, t.ctx);
    await s.patch('/api/auth/me', { role: 'admin' });
    expect((await s.get('/api/auth/me')).body.member.role).toBe('member');
    const res = await s.patch(`/api/admin/users/${s.member.id}`, { role: 'admin' });
    expect(res.status).toBe(403);
  });

  it('changes e-mail only after the new address is confirmed', async () => {
    const s = await signedIn(t.app, t.ctx);
    const newEmail = `moved-${unique()}@example.test`;
    const noPassword = await s.patch('/api/auth/me', { email: newEmail });
    expect(noPassword.status).toBe(400);
    expect(noPassword.body.error.fields.currentPassword).toBeDefined();
    const res = await s.patch('/api/auth/me', {
      email: newEmail,
      currentPassword: s.member.password,
    });
    expect(res.status).toBe(200);
    expect(res.body.member.email).toBe(s.member.email);
    const token = tokenFrom(lastMailTo(t.ctx, newEmail)?.text);
    expect((await s.post('/api/auth/verify', { token })).status).toBe(200);
    expect((await s.get('/api/auth/me')).body.member.email).toBe(newEmail);
  });

  it('changes the password with the current one and ends the other sessions', async () => {
    const s = await signedIn(t.app, t.ctx);
    const other = visitor(t.app);
    await other.post('/api/auth/signin', { email: s.member.email, password: s.member.password });
    const wrong = await s.patch('/api/auth/password', {
      currentPassword: 'not-it-at-all',
      newPassword: 'fresh-curd-lantern-19',
    });
    expect(wrong.status).toBe(400);
    const ok = await s.patch('/api/auth/password', {
      currentPassword: s.member.password,
      newPassword: 'fresh-curd-lantern-19',
    });
    expect(ok.status).toBe(200);
    expect((await s.get('/api/auth/me')).status).toBe(200);
    expect((await other.get('/api/auth/me')).status).toBe(401);
  });

  it('resends the verification link to an unverified member, with a limit', async () => {
    const s = await signedIn(t.app, t.ctx, { verified: false });
    expect((await s.get('/api/auth/me')).body.member.emailVerified).toBe(false);
    const res = await s.post('/api/auth/verify/resend');
    expect(res.status).toBe(200);
    expect(lastMailTo(t.ctx, s.member.email)?.subject).toMatch(/Confirm/);
    await s.post('/api/auth/verify/resend');
    await s.post('/api/auth/verify/resend');
    expect((await s.post('/api/auth/verify/resend')).status).toBe(429);
    expect((await visitor(t.app).post('/api/auth/verify/resend')).status).toBe(401);
  });

  it('deletes the account after a password check', async () => {
    const s = await signedIn(t.app, t.ctx);
    expect((await s.delete('/api/auth/me', { password: 'wrong-one-here' })).status).toBe(400);
    expect((await s.delete('/api/auth/me', { password: s.member.password })).status).toBe(204);
    const rows = await t.ctx.database.db.select().from(users).where(eq(users.id, s.member.id));
    expect(rows).toHaveLength(0);
    expect(
      (
        await visitor(t.app).post('/api/auth/signin', {
          email: s.member.email,
          password: s.member.password,
        })
      ).status,
    ).toBe(401);
  });
});

describe('GET /api/dev/mail', () => {
  it('lists captured messages newest first with to, subject, text, html and date', async () => {
    const member = await createMember(t.ctx);
    await visitor(t.app).post('/api/auth/password/forgot', { email: member.email });
    const res = await visitor(t.app).get('/api/dev/mail').expect(200);
    const mail = res.body.messages.find((m: { to: string[] }) => m.to.includes(member.email));
    expect(mail).toMatchObject({ subject: expect.stringMatching(/new Rindwise password/) });
    expect(mail.html).toContain('<a href=');
    expect(new Date(mail.date).getTime()).not.toBeNaN();
  });
});
