import type { AppContext } from '../context';

/**
 * Removes what a member owns before their account row is deleted. Today an account owns
 * only its sessions and e-mail tokens, which the caller ends and the foreign keys cascade;
 * each later kind of content (journals, photos, tastings, comments) adds its clean-up here,
 * so that files leave the disk together with their rows.
 */
export async function removeMemberContent(ctx: AppContext, userId: number): Promise<void> {
  ctx.logger.info({ userId }, 'removing member content before account deletion');
}
