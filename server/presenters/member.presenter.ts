import type { MeDto } from '../../shared/types/member';
import type { AdminUserDto } from '../../shared/types/admin';
import type { AuthMember } from '../middleware/authenticate';
import type { UserRow } from '../repositories/users.repository';

/** The signed-in member's own view of their account (never the hash). */
export function presentMe(member: AuthMember | UserRow): MeDto {
  const emailVerified =
    'emailVerified' in member ? member.emailVerified : member.emailVerifiedAt !== null;
  return {
    id: member.id,
    email: member.email,
    handle: member.handle,
    displayName: member.displayName,
    role: member.role,
    units: member.units,
    remindersEnabled: member.remindersEnabled,
    notifyComments: member.notifyComments,
    bio: member.bio ?? '',
    emailVerified,
    createdAt: member.createdAt.toISOString(),
  };
}

/** A member as the admin list shows them. */
export function presentAdminUser(row: UserRow): AdminUserDto {
  return {
    id: row.id,
    email: row.email,
    handle: row.handle,
    displayName: row.displayName,
    role: row.role,
    emailVerified: row.emailVerifiedAt !== null,
    disabled: row.disabledAt !== null,
    createdAt: row.createdAt.toISOString(),
  };
}
