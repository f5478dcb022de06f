import type { JournalRow } from '../repositories/journals.repository';
import type { AuthMember } from '../middleware/authenticate';

/** Who is asking: a signed-in member, or undefined for a visitor. */
export type Viewer = Pick<AuthMember, 'id' | 'role'> | undefined;

export type Access = 'owner' | 'staff' | 'reader' | 'none';

/** Moderators and admins. */
export const isStaff = (viewer?: Pick<AuthMember, 'role'>) =>
  viewer?.role === 'moderator' || viewer?.role === 'admin';

/**
 * What a viewer may do with a journal: the one visibility rule, used by journals, photos,
 * tastings, comments and moderation. The owner sees everything of theirs. Anyone else reads
 * only published journals that are public or unlisted (the link is the key) and not hidden;
 * moderators and admins also read hidden ones. Private journals and drafts do not exist for
 * anyone but their owner.
 */
export function accessTo(
  journal: Pick<JournalRow, 'userId' | 'status' | 'visibility' | 'hiddenAt'>,
  viewer: Viewer,
): Access {
  if (viewer && viewer.id === journal.userId) return 'owner';
  if (journal.status !== 'published' || journal.visibility === 'private') return 'none';
  if (journal.hiddenAt) return isStaff(viewer) ? 'staff' : 'none';
  return isStaff(viewer) ? 'staff' : 'reader';
}
