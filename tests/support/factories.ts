import { randomBytes } from 'node:crypto';
import { eq } from 'drizzle-orm';
import type { Express } from 'express';
import { users } from '../../server/db/schema';
import type { AppContext } from '../../server/context';
import { hashPassword } from '../../server/lib/passwords';
import { visitor, type Visitor } from './app';

export const GOOD_PASSWORD = 'rennet-ladle-harbour-62';
let cachedHash: Promise<string> | null = null;

/** A unique suffix for e-mails and handles. */
export const unique = () => randomBytes(5).toString('hex');

type MemberOptions = {
  verified?: boolean;
  role?: 'member' | 'moderator' | 'admin';
  units?: 'metric' | 'us';
};

/** Inserts a member straight into the database (password GOOD_PASSWORD). */
export async function createMember(ctx: AppContext, opts: MemberOptions = {}) {
  const id = unique();
  const email = `maker-${id}@example.test`;
  cachedHash ??= hashPassword(GOOD_PASSWORD);
  const [row] = await ctx.database.db
    .insert(users)
    .values({
      email,
      handle: `maker-${id}`,
      displayName: `Maker ${id}`,
      passwordHash: await cachedHash,
      role: opts.role ?? 'member',
      units: opts.units ?? 'metric',
      emailVerifiedAt: opts.verified === false ? null : new Date(),
    })
    .$returningId();
  const [user] = await ctx.database.db.select().from(users).where(eq(users.id, row.id));
  return { ...user, password: GOOD_PASSWORD };
}

/** A visitor signed in as a new member. */
export async function signedIn(
  app: Express,
  ctx: AppContext,
  opts: MemberOptions = {},
): Promise<Visitor & { member: Awaited<ReturnType<typeof createMember>> }> {
  const member = await createMember(ctx, opts);
  const v = visitor(app);
  const res = await v.post('/api/auth/signin', { email: member.email, password: member.password });
  if (res.status !== 200)
    throw new Error(`sign-in failed in a test factory: ${res.status} ${JSON.stringify(res.body)}`);
  v.resetCsrf();
  return Object.assign(v, { member });
}

/** The newest mail the local fake received for an address. */
export function lastMailTo(ctx: AppContext, email: string) {
  return ctx.mailbox?.list().find((m) => m.to.includes(email));
}

/** The token of the first Rindwise link with ?token= in a message. */
export function tokenFrom(text: string | undefined): string {
  const match = /[?&]token=([A-Za-z0-9_-]+)/.exec(text ?? '');
  if (!match) throw new Error(`no token link in: ${text}`);
  return match[1];
}
