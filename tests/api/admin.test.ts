import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, visitor, type TestApp } from '../support/app';
import { signedIn } from '../support/factories';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('/api/admin/users', () => {
  it('is closed to visitors (401), members and moderators (403)', async () => {
    expect((await visitor(t.app).get('/api/admin/users')).status).toBe(401);
    expect((await (await signedIn(t.app, t.ctx)).get('/api/admin/users')).status).toBe(403);
    expect(
      (await (await signedIn(t.app, t.ctx, { role: 'moderator' })).get('/api/admin/users')).status,
    ).toBe(403);
  });

  it('lists members for an admin, searchable, without password hashes', async () => {
    const admin = await signedIn(t.app, t.ctx, { role: 'admin' });
    const target = await signedIn(t.app, t.ctx);
    const res = await admin.get(`/api/admin/users?q=${target.member.handle}`).expect(200);
    expect(res.body.items).toHaveLength(1);
    expect(res.body.items[0]).toMatchObject({
      handle: target.member.handle,
      role: 'member',
      disabled: false,
    });
    expect(JSON.stringify(res.body)).not.toContain('argon2');
    const bad = await admin.get('/api/admin/users?page=0');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.page).toBeDefined();
  });

  it('changes roles and disables a member, which ends their sessions', async () => {
    const admin = await signedIn(t.app, t.ctx, { role: 'admin' });
    const target = await signedIn(t.app, t.ctx);
    const promoted = await admin.patch(`/api/admin/users/${target.member.id}`, {
      role: 'moderator',
    });
    expect(promoted.status).toBe(200);
    expect(promoted.body.member.role).toBe('moderator');
    const disabled = await admin.patch(`/api/admin/users/${target.member.id}`, { disabled: true });
    expect(disabled.body.member.disabled).toBe(true);
    expect((await target.get('/api/auth/me')).status).toBe(401);
  });

  it('validates the change and refuses changes to oneself', async () => {
    const admin = await signedIn(t.app, t.ctx, { role: 'admin' });
    const bad = await admin.patch(`/api/admin/users/${admin.member.id}`, { role: 'overlord' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.role).toBeDefined();
    const self = await admin.patch(`/api/admin/users/${admin.member.id}`, { disabled: true });
    expect(self.status).toBe(400);
    expect(self.body.error.code).toBe('SELF_CHANGE');
    expect((await admin.patch('/api/admin/users/99999999', { role: 'member' })).status).toBe(404);
  });
});
