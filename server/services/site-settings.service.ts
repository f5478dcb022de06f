import type { ModerationSettingsInput } from '../../shared/schemas/community';
import type { ModerationSettingsDto } from '../../shared/types/community';
import type { AppContext } from '../context';
import type { AuthMember } from '../middleware/authenticate';
import type { Db } from '../repositories/journals.repository';
import { findSetting, upsertSetting } from '../repositories/moderation.repository';
import { recordAudit } from './audit.service';

const HOLD_KEY = 'hold_first_comments';

/** Whether new members' first comments wait for a moderator (off until someone turns it on). */
export async function holdsFirstComments(db: Db): Promise<boolean> {
  return (await findSetting(db, HOLD_KEY))?.value === 'on';
}

/** The settings moderators can change, with who changed them last. */
export async function getModerationSettings(ctx: AppContext): Promise<ModerationSettingsDto> {
  const row = await findSetting(ctx.database.db, HOLD_KEY);
  return {
    holdFirstComments: row?.value === 'on',
    updatedAt: row?.updatedAt.toISOString() ?? null,
    updatedBy: row?.updatedBy ?? null,
  };
}

/** Changes the moderation settings (moderators and admins); a real change is audited. */
export async function updateModerationSettings(
  ctx: AppContext,
  actor: AuthMember,
  input: ModerationSettingsInput,
): Promise<ModerationSettingsDto> {
  const db = ctx.database.db;
  const value = input.holdFirstComments ? 'on' : 'off';
  const before = (await findSetting(db, HOLD_KEY))?.value ?? 'off';
  if (before !== value) {
    await db.transaction(async (tx) => {
      await upsertSetting(tx, HOLD_KEY, value, actor.id);
      await recordAudit(tx, actor, {
        action: 'setting-changed',
        targetType: 'setting',
        targetId: null,
        summary: `Hold new members' first comments for review: ${value}`,
      });
    });
    ctx.logger.info({ event: 'setting-changed', key: HOLD_KEY, value, actorId: actor.id });
  }
  return getModerationSettings(ctx);
}
