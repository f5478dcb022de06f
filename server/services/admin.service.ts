import type { z } from 'zod';
import type { adminListUsersSchema, adminUpdateUserSchema } from '../../shared/schemas/auth';
import type { AppContext } from '../context';
import type { Database } from '../db/client';
import { AppError, ConflictError, NotFoundError } from '../lib/errors';
import type { AuthMember } from '../middleware/authenticate';
import {
  countActiveAdmins,
  findUserById,
  listUsers,
  updateUser,
  type UserRow,
} from '../repositories/users.repository';
import { recordAudit } from './audit.service';
import { endAllSessions } from './auth.service';

/** A page of members for the admin list. */
export function listMembers(ctx: AppContext, query: z.infer<typeof adminListUsersSchema>) {
  return listUsers(ctx.database.db, query);
}

/**
 * Changes a member's role or disables them (admins only). An admin cannot change their own
 * role or disable themself, and the last enabled admin is never removed. Disabling ends
 * every session of the member.
 */
export async function updateMemberAsAdmin(
  ctx: AppContext,
  actor: AuthMember,
  userId: number,
  change: z.infer<typeof adminUpdateUserSchema>,
): Promise<UserRow> {
  const db = ctx.database.db;
  const target = await findUserById(db, userId);
  if (!target) throw new NotFoundError('MEMBER_NOT_FOUND', 'No member has that id.');
  if (target.id === actor.id) {
    throw new AppError(
      400,
      'SELF_CHANGE',
      'You cannot change your own role or disable your own account.',
    );
  }
  const losesAdmin =
    target.role === 'admin' &&
    ((change.role && change.role !== 'admin') || change.disabled === true);
  if (losesAdmin && (await countActiveAdmins(db)) <= 1) {
    throw new ConflictError('LAST_ADMIN', 'This is the only admin left.');
  }
  const set: Partial<UserRow> = {};
  if (change.role) set.role = change.role;
  if (change.disabled !== undefined)
    set.disabledAt = change.disabled ? (target.disabledAt ?? new Date()) : null;
  await updateUser(db, userId, set);
  if (change.disabled) await endAllSessions(ctx, userId);
  await auditMemberChange(db, actor, target, change);
  ctx.logger.info(
    { event: 'admin-update-user', actorId: actor.id, userId, change },
    'member updated by admin',
  );
  return (await findUserById(db, userId))!;
}

// Role changes and disabling from the member list go in the audit log with the moderation
// actions, so admins read one history of who did what to whom.
async function auditMemberChange(
  db: Database,
  actor: AuthMember,
  target: UserRow,
  change: z.infer<typeof adminUpdateUserSchema>,
): Promise<void> {
  const targetUser = { id: target.id, handle: target.handle };
  const entry = { targetType: 'member' as const, targetId: target.id, targetUser };
  if (change.role && change.role !== target.role) {
    await recordAudit(db, actor, {
      ...entry,
      action: 'role-changed',
      summary: `@${target.handle}: ${target.role} → ${change.role}`,
    });
  }
  if (change.disabled !== undefined && change.disabled !== (target.disabledAt !== null)) {
    await recordAudit(db, actor, {
      ...entry,
      action: change.disabled ? 'member-disabled' : 'member-enabled',
      summary: `@${target.handle}`,
    });
  }
}
