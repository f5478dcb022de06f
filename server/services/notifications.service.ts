import type { z } from 'zod';
import type {
  notificationListQuerySchema,
  notificationReadSchema,
} from '../../shared/schemas/community';
import type { NotificationPageDto } from '../../shared/types/community';
import type { AppContext } from '../context';
import type { AuthMember } from '../middleware/authenticate';
import { presentNotification } from '../presenters/community.presenter';
import { countUnread, listNotifications, markRead } from '../repositories/notifications.repository';

/** A page of the member's notifications, newest first, with how many are unread. */
export async function listNotificationsFor(
  ctx: AppContext,
  member: AuthMember,
  query: z.infer<typeof notificationListQuerySchema>,
): Promise<NotificationPageDto> {
  const { rows, total, unread } = await listNotifications(ctx.database.db, member.id, query);
  return {
    items: rows.map(presentNotification),
    total,
    unread,
    page: query.page,
    pageSize: query.pageSize,
  };
}

/** How many of the member's notifications are unread (the header's mark). */
export function unreadCountFor(ctx: AppContext, member: AuthMember): Promise<number> {
  return countUnread(ctx.database.db, member.id);
}

/** Marks some or all of the member's own notifications read; resolves with what is left unread. */
export async function markNotificationsRead(
  ctx: AppContext,
  member: AuthMember,
  input: z.infer<typeof notificationReadSchema>,
): Promise<{ marked: number; unread: number }> {
  const marked = await markRead(ctx.database.db, member.id, input.all ? 'all' : (input.ids ?? []));
  return { marked, unread: await countUnread(ctx.database.db, member.id) };
}
