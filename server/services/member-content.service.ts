import type { AppContext } from '../context';
import { deletePhotoFilesForMember } from './photos.service';

/**
 * Removes what a member owns before their account row is deleted. Sessions and e-mail tokens
 * are ended by the caller and cascade with the row, as do journals and their photo rows; the
 * photo files are not rows, so they are removed here first, so that files leave the disk
 * together with their rows. Each later kind of content with files adds its clean-up here.
 */
export async function removeMemberContent(ctx: AppContext, userId: number): Promise<void> {
  ctx.logger.info({ userId }, 'removing member content before account deletion');
  await deletePhotoFilesForMember(ctx, userId);
}
