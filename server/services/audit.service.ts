import type { z } from 'zod';
import type { AuditAction, AuditTarget, ReportTarget } from '../../shared/constants/community';
import type { auditQuerySchema } from '../../shared/schemas/community';
import type { AuditEntryDto } from '../../shared/types/community';
import type { Page } from '../../shared/types/admin';
import type { HiddenMarkDto } from '../../shared/types/journal';
import type { AppContext } from '../context';
import type { AuthMember } from '../middleware/authenticate';
import { presentAuditEntry } from '../presenters/community.presenter';
import type { Db } from '../repositories/journals.repository';
import {
  insertAuditEntry,
  listAuditEntries,
  listAuditFor,
} from '../repositories/moderation.repository';

export type AuditInput = {
  action: AuditAction;
  targetType: AuditTarget;
  targetId: number | null;
  targetUser?: { id: number; handle: string } | null;
  reportId?: number | null;
  summary?: string;
  note?: string;
};

const clip = (text: string, max: number) =>
  text.length > max ? `${text.slice(0, max - 1).trimEnd()}…` : text;

/**
 * Writes one audit entry for an action by a moderator or admin. Call it in the same
 * transaction as the action, so that no action happens without its entry.
 */
export async function recordAudit(
  db: Db,
  actor: Pick<AuthMember, 'id' | 'handle'>,
  entry: AuditInput,
): Promise<void> {
  await insertAuditEntry(db, {
    actorId: actor.id,
    actorHandle: actor.handle,
    action: entry.action,
    targetType: entry.targetType,
    targetId: entry.targetId,
    targetUserId: entry.targetUser?.id ?? null,
    targetUserHandle: entry.targetUser?.handle ?? null,
    reportId: entry.reportId ?? null,
    summary: clip(entry.summary ?? '', 300),
    note: clip(entry.note ?? '', 1000),
  });
}

/** A page of the audit log for admins, newest first, optionally one actor's entries. */
export async function listAudit(
  ctx: AppContext,
  query: z.infer<typeof auditQuerySchema>,
): Promise<Page<AuditEntryDto>> {
  const { rows, total } = await listAuditEntries(ctx.database.db, {
    page: query.page,
    pageSize: query.pageSize,
    actorHandle: query.actor?.replace(/^@/, '') || undefined,
  });
  return { items: rows.map(presentAuditEntry), total, page: query.page, pageSize: query.pageSize };
}

// --- what an author sees of a hide -------------------------------------------------------

type HiddenItem = { type: ReportTarget; id: number; hiddenAt: Date };

/**
 * The "hidden by a moderator" marks of some hidden items, for their author and staff: when,
 * and the note of the moderator's latest hide (a report's hide or a held comment's
 * rejection) from the audit log; '' when none was written. Keyed "type:id".
 */
export async function hiddenMarks(
  db: Db,
  items: readonly HiddenItem[],
): Promise<Map<string, HiddenMarkDto>> {
  const marks = new Map<string, HiddenMarkDto>();
  if (!items.length) return marks;
  const entries = await listAuditFor(db, items);
  for (const item of items) {
    const key = `${item.type}:${item.id}`;
    // Newest first: the first hide of this item is the one that stands.
    const entry = entries.find(
      (e) =>
        e.targetType === item.type &&
        e.targetId === item.id &&
        (e.action === 'item-hidden' || e.action === 'comment-rejected'),
    );
    marks.set(key, { hiddenAt: item.hiddenAt.toISOString(), reason: entry?.note ?? '' });
  }
  return marks;
}
