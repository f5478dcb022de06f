import type { Logger } from 'pino';
import type { Database } from '../client';
import { users } from '../schema';
import { hashPassword } from '../../lib/passwords';
import { DEMO_MEMBERS } from './club';

export type SeededAccount = { email: string; password: string; role: string; handle: string };

/**
 * Seeds the invented demo club. Safe to run on an empty database only: it refuses when
 * members already exist, so a real install is never touched.
 */
export async function seedDemo(
  db: Database,
  opts: { uploadsDir: string; logger: Logger },
): Promise<SeededAccount[]> {
  const existing = await db.select({ id: users.id }).from(users).limit(1);
  if (existing.length) {
    opts.logger.warn('members already exist: the demo seed only runs on an empty database');
    return [];
  }
  const now = Date.now();
  for (const member of DEMO_MEMBERS) {
    await db.insert(users).values({
      email: member.email,
      handle: member.handle,
      displayName: member.displayName,
      passwordHash: await hashPassword(member.password),
      role: member.role,
      units: member.units,
      bio: member.bio,
      emailVerifiedAt: new Date(now - 200 * 86_400_000),
      createdAt: new Date(now - 210 * 86_400_000),
    });
  }
  return DEMO_MEMBERS.map(({ email, password, role, handle }) => ({
    email,
    password,
    role,
    handle,
  }));
}
