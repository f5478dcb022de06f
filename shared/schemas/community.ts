import { z } from 'zod';
import {
  COMMENT_MAX_LENGTH,
  HELD_COMMENT_ACTIONS,
  REPORT_ACTIONS,
  REPORT_REASONS,
  REPORT_STATUSES,
  REPORT_TARGETS,
} from '../constants/community';
import { handleSchema } from './auth';

const page = z.coerce.number().int().min(1).max(10_000).default(1);
const pageSize = (fallback: number, max = 100) =>
  z.coerce.number().int().min(1).max(max).default(fallback);

/** A comment's Markdown body, as a member writes it. */
export const commentBodySchema = z
  .string({ error: 'Write your comment.' })
  .trim()
  .min(1, 'Write your comment.')
  .max(COMMENT_MAX_LENGTH, `Use at most ${COMMENT_MAX_LENGTH} characters.`);

/** POST /api/journals/:id/comments: a comment, or a reply to one (parentId). */
export const commentInputSchema = z.object({
  body: commentBodySchema,
  parentId: z
    .number({ error: 'Reply to a comment by its id.' })
    .int()
    .positive()
    .nullable()
    .optional(),
});

/** PATCH /api/comments/:id: the new body. */
export const commentUpdateSchema = z.object({ body: commentBodySchema });

/** GET /api/journals/:id/comments: top-level comments are paged, replies come with them. */
export const commentListQuerySchema = z.object({ page, pageSize: pageSize(50) });

/** A member's handle in a path (/api/members/:handle), "@" allowed in front. */
export const memberParamsSchema = z.object({
  handle: z.preprocess((v) => (typeof v === 'string' ? v.replace(/^@/, '') : v), handleSchema),
});

/** GET /api/feed. */
export const feedQuerySchema = z.object({ page, pageSize: pageSize(12, 48) });

/** GET /api/notifications. */
export const notificationListQuerySchema = z.object({
  page,
  pageSize: pageSize(20),
  unread: z
    .enum(['true', 'false'])
    .transform((v) => v === 'true')
    .optional(),
});

/** POST /api/notifications/read: some notifications, or all of them. */
export const notificationReadSchema = z
  .object({
    ids: z.array(z.number().int().positive()).max(200).optional(),
    all: z.boolean().optional(),
  })
  .refine((v) => v.all === true || (v.ids?.length ?? 0) > 0, {
    message: 'Say which notifications to mark read, or all.',
    path: ['ids'],
  });

/** POST /api/reports. */
export const reportInputSchema = z.object({
  targetType: z.enum(REPORT_TARGETS, { error: 'Say what you are reporting.' }),
  targetId: z.number({ error: 'Say what you are reporting.' }).int().positive(),
  reason: z.enum(REPORT_REASONS, { error: 'Choose a reason.' }),
  details: z.string().trim().max(1000, 'Use at most 1000 characters.').default(''),
});

/** GET /api/moderation/reports. */
export const reportListQuerySchema = z.object({
  status: z.enum([...REPORT_STATUSES, 'all'] as const).default('open'),
  page,
  pageSize: pageSize(20, 50),
});

const noteSchema = z.string().trim().max(1000, 'Use at most 1000 characters.').default('');

/** POST /api/moderation/reports/:id/actions. */
/**
 * The body of a DELETE of a journal, tasting or comment (optional): the reason a moderator
 * or admin gives for deleting someone else's, kept in the audit log.
 */
export const staffDeleteSchema = z.object({
  reason: z.string().trim().max(1000, 'Use at most 1000 characters for the reason.').default(''),
});

export const reportActionSchema = z.object({
  action: z.enum(REPORT_ACTIONS, { error: 'Choose dismiss, hide, restore or suspend.' }),
  note: noteSchema,
});

/** POST /api/moderation/comments/:id/actions: a comment held for review. */
export const heldCommentActionSchema = z.object({
  action: z.enum(HELD_COMMENT_ACTIONS, { error: 'Choose approve or reject.' }),
  note: noteSchema,
});

/** PUT /api/moderation/settings. */
export const moderationSettingsSchema = z.object({
  holdFirstComments: z.boolean({ error: 'Choose on or off.' }),
});

/** GET /api/admin/audit. */
export const auditQuerySchema = z.object({
  page,
  pageSize: pageSize(50),
  actor: z.string().trim().toLowerCase().max(33).optional(),
});

export type CommentInput = z.infer<typeof commentInputSchema>;
export type ReportInput = z.input<typeof reportInputSchema>;
export type ReportActionInput = z.input<typeof reportActionSchema>;
export type ModerationSettingsInput = z.infer<typeof moderationSettingsSchema>;
