import { randomBytes } from 'node:crypto';
import type { z } from 'zod';
import { STYLES } from '../../shared/constants/styles';
import { DEFECTS, SCORE_ATTRIBUTES, typicalTraitsOf } from '../../shared/constants/tasting';
import type { tastingInputSchema, tastingUpdateSchema } from '../../shared/schemas/tasting';
import { ageInDays } from '../../shared/trade/aging';
import { mean } from '../../shared/trade/stats';
import type { AgeBandDto } from '../../shared/types/tasting';
import type { AppContext } from '../context';
import { AppError, ConflictError, ForbiddenError, NotFoundError } from '../lib/errors';
import { hashToken } from '../lib/tokens';
import type { AuthMember } from '../middleware/authenticate';
import { updateJournal } from '../repositories/journals.repository';
import { hiddenMarks, recordAudit } from './audit.service';
import { accessTo, isStaff } from './journal-access';
import {
  deleteTasting,
  findJournalForTasting,
  findLiveInvite,
  findTasting,
  insertInvite,
  insertTasting,
  listTastingsForJournal,
  refreshJournalTastingStats,
  updateTasting,
  type JournalForTasting,
} from '../repositories/tastings.repository';

const INVITE_TTL_DAYS = 14;

/** Age bands for the mean scores on a journal (days from the make date). */
export const AGE_BANDS: { label: string; fromDays: number; toDays: number | null }[] = [
  { label: 'Up to 1 month', fromDays: 0, toDays: 30 },
  { label: '1 to 2 months', fromDays: 31, toDays: 60 },
  { label: '2 to 3 months', fromDays: 61, toDays: 90 },
  { label: '3 to 6 months', fromDays: 91, toDays: 182 },
  { label: '6 to 12 months', fromDays: 183, toDays: 365 },
  { label: 'Over a year', fromDays: 366, toDays: null },
];

/**
 * The journal if the viewer may read it (the journals' own rule, accessTo); otherwise 404, so
 * private journals and drafts do not reveal that they exist.
 */
export async function readableJournalForTasting(
  ctx: AppContext,
  viewer: AuthMember | undefined,
  journalId: number,
): Promise<JournalForTasting> {
  const journal = await findJournalForTasting(ctx.database.db, journalId);
  if (!journal || accessTo(journal, viewer) === 'none') {
    throw new NotFoundError('JOURNAL_NOT_FOUND', 'No journal with that id, or it is private.');
  }
  return journal;
}

/** Means of each score per age band, for bands that hold at least one tasting. */
export function meansByAgeBand(
  rows: {
    ageDays: number;
    overall: number;
    appearance: number;
    aroma: number;
    flavour: number;
    texture: number;
    finish: number;
  }[],
): AgeBandDto[] {
  return AGE_BANDS.flatMap((band) => {
    const inBand = rows.filter(
      (r) => r.ageDays >= band.fromDays && (band.toDays === null || r.ageDays <= band.toDays),
    );
    if (!inBand.length) return [];
    const means = Object.fromEntries(
      SCORE_ATTRIBUTES.map((a) => [a, Math.round(mean(inBand.map((r) => r[a])) * 100) / 100]),
    ) as AgeBandDto['means'];
    return [{ ...band, n: inBand.length, means }];
  });
}

/** Every tasting of a journal the viewer can read, with the means per age band. */
export async function listJournalTastings(
  ctx: AppContext,
  viewer: AuthMember | undefined,
  journalId: number,
) {
  const journal = await readableJournalForTasting(ctx, viewer, journalId);
  const rows = await listTastingsForJournal(ctx.database.db, journalId, {
    includeHiddenFor: isStaff(viewer) ? 'all' : viewer?.id,
  });
  const visible = rows.filter((r) => r.tasting.hiddenAt === null).map((r) => r.tasting);
  // The hidden ones here are the viewer's own (or any, for staff): say why they are hidden.
  const marks = await hiddenMarks(
    ctx.database.db,
    rows.flatMap((r) =>
      r.tasting.hiddenAt
        ? [{ type: 'tasting' as const, id: r.tasting.id, hiddenAt: r.tasting.hiddenAt }]
        : [],
    ),
  );
  return {
    rows: rows.map((r) => ({ ...r, hidden: marks.get(`tasting:${r.tasting.id}`) ?? null })),
    bands: meansByAgeBand(visible),
    // Only the maker learns whether invites can be made (and why not).
    invites:
      viewer?.id === journal.userId ? { blockedReason: inviteBlockedReason(journal) } : undefined,
  };
}

function checkDates(journal: JournalForTasting, tastedOn: string): number {
  const age = ageInDays(journal.makeDate, tastedOn);
  if (age < 0) {
    throw new AppError(400, 'VALIDATION_FAILED', 'Some fields need attention.', {
      tastedOn: `The wheel was made on ${journal.makeDate}: a tasting cannot come before it.`,
    });
  }
  if (ageInDays(new Date(), tastedOn) > 1) {
    throw new AppError(400, 'VALIDATION_FAILED', 'Some fields need attention.', {
      tastedOn: 'The tasting date is in the future.',
    });
  }
  return age;
}

/**
 * Refuses a defect that is the style's own trait (crumbly for a Caerphilly-type, say): the
 * judging lists are written for Cheddar (shared/constants/tasting.ts, DEFECTS.typicalIn).
 */
function checkDefects(journal: JournalForTasting, defects: readonly string[] | undefined) {
  if (!defects?.length) return;
  const typical = typicalTraitsOf(journal.styleSlug);
  const index = defects.findIndex((d) => typical.has(d));
  if (index < 0) return;
  const label = DEFECTS.find((d) => d.key === defects[index])?.label ?? defects[index];
  const style = STYLES.find((st) => st.slug === journal.styleSlug)?.name ?? 'this style';
  throw new AppError(400, 'VALIDATION_FAILED', 'Some fields need attention.', {
    defects: `${label} is typical of a ${style}, so it is not counted as a defect here. Describe it in your notes if it stood out.`,
  });
}

/**
 * Adds a scorecard. The owner may always score their wheel; another verified member needs a
 * live invite for this journal (the link handed out at a meeting). The owner's first tasting
 * marks the wheel opened.
 */
export async function addTasting(
  ctx: AppContext,
  member: AuthMember,
  journalId: number,
  input: z.infer<typeof tastingInputSchema>,
): Promise<number> {
  const db = ctx.database.db;
  const journal = await readableJournalForTasting(ctx, member, journalId);
  const isOwner = journal.userId === member.id;
  if (!isOwner) {
    const invite = input.invite
      ? await findLiveInvite(db, journalId, hashToken(input.invite))
      : undefined;
    if (!invite) {
      throw new ForbiddenError(
        'INVITE_REQUIRED',
        'Only the maker, or members invited to the tasting with a link from the maker, can score this wheel.',
      );
    }
  }
  const ageDays = checkDates(journal, input.tastedOn);
  checkDefects(journal, input.defects);
  const id = await insertTasting(db, {
    journalId,
    tasterId: member.id,
    tastedOn: input.tastedOn,
    ageDays,
    overall: input.overall,
    appearance: input.appearance,
    aroma: input.aroma,
    flavour: input.flavour,
    texture: input.texture,
    finish: input.finish,
    descriptors: [...new Set(input.descriptors)],
    defects: [...new Set(input.defects)],
    notes: input.notes,
  });
  await refreshJournalTastingStats(db, journalId);
  if (isOwner && ['making', 'pressing', 'drying', 'aging'].includes(journal.wheelStatus)) {
    // The first cut is the tasting's day: the wheel's age stops there.
    await updateJournal(db, journalId, {
      wheelStatus: 'opened',
      openedOn: journal.openedOn ?? input.tastedOn,
    });
  }
  return id;
}

async function editableTasting(ctx: AppContext, member: AuthMember, id: number) {
  const found = await findTasting(ctx.database.db, id);
  if (!found) throw new NotFoundError('TASTING_NOT_FOUND', 'No tasting with that id.');
  if (found.tasting.tasterId !== member.id && !isStaff(member)) {
    throw new ForbiddenError(
      'NOT_YOUR_TASTING',
      'Only the taster (or a moderator) can change this tasting.',
    );
  }
  return found;
}

/** Changes a tasting (its taster, moderators, admins); the age follows a new date. */
export async function changeTasting(
  ctx: AppContext,
  member: AuthMember,
  id: number,
  patch: z.infer<typeof tastingUpdateSchema>,
): Promise<number> {
  const db = ctx.database.db;
  const { tasting } = await editableTasting(ctx, member, id);
  const set: Parameters<typeof updateTasting>[2] = { ...patch };
  if (patch.descriptors) set.descriptors = [...new Set(patch.descriptors)];
  if (patch.defects) set.defects = [...new Set(patch.defects)];
  if (patch.tastedOn || patch.defects) {
    const journal = (await findJournalForTasting(db, tasting.journalId))!;
    if (patch.tastedOn) set.ageDays = checkDates(journal, patch.tastedOn);
    checkDefects(journal, patch.defects);
  }
  await updateTasting(db, id, set);
  await refreshJournalTastingStats(db, tasting.journalId);
  return tasting.journalId;
}

/**
 * Deletes a tasting (its taster, moderators, admins). A delete by staff of someone else's
 * tasting goes into the audit log with the reason given.
 */
export async function removeTasting(
  ctx: AppContext,
  member: AuthMember,
  id: number,
  reason = '',
): Promise<void> {
  const db = ctx.database.db;
  const { tasting, taster } = await editableTasting(ctx, member, id);
  const journal = await findJournalForTasting(db, tasting.journalId);
  await deleteTasting(db, id);
  if (tasting.tasterId !== member.id) {
    await recordAudit(db, member, {
      action: 'tasting-deleted',
      targetType: 'tasting',
      targetId: id,
      targetUser: { id: taster.id, handle: taster.handle },
      summary: `Tasting by @${taster.handle} of “${journal?.title ?? `journal #${tasting.journalId}`}”`,
      note: reason.trim(),
    });
  }
  await refreshJournalTastingStats(db, tasting.journalId);
}

/**
 * Why invited tasters could not open this journal, or null when they can. An invite gives the
 * right to score, never the right to read: a taster must be able to open the journal as any
 * other member would (accessTo with no special viewer), so a draft, a private journal or one
 * hidden by a moderator cannot be shared this way, and the privacy rule stays the one rule.
 */
export function inviteBlockedReason(
  journal: Pick<JournalForTasting, 'userId' | 'status' | 'visibility' | 'hiddenAt'>,
): string | null {
  if (accessTo(journal, undefined) !== 'none') return null;
  if (journal.hiddenAt)
    return 'A moderator has hidden this journal, so invited tasters could not open it. Invites work again once it is shown.';
  if (journal.status !== 'published')
    return 'This journal is still a draft, so invited tasters could not open it. Publish it first (public or unlisted), then make the invite link.';
  return 'This journal is private, so invited tasters could not open it. Make it public or unlisted first, then make the invite link.';
}

/**
 * Makes a tasting invite link for the owner's wheel, valid for two weeks; refused with a 409
 * while the journal is one the invitee could not open (inviteBlockedReason).
 */
export async function createInvite(ctx: AppContext, member: AuthMember, journalId: number) {
  const journal = await readableJournalForTasting(ctx, member, journalId);
  if (journal.userId !== member.id)
    throw new ForbiddenError('NOT_YOUR_JOURNAL', 'Only the maker can invite tasters.');
  const blocked = inviteBlockedReason(journal);
  if (blocked) throw new ConflictError('JOURNAL_NOT_OPEN_TO_TASTERS', blocked);
  const code = randomBytes(16).toString('base64url');
  const expiresAt = new Date(Date.now() + INVITE_TTL_DAYS * 86_400_000);
  await insertInvite(ctx.database.db, {
    journalId,
    createdBy: member.id,
    codeHash: hashToken(code),
    expiresAt,
  });
  return {
    code,
    expiresAt: expiresAt.toISOString(),
    url: `${ctx.config.publicUrl}/journals/${journalId}/taste?invite=${encodeURIComponent(code)}`,
  };
}
