import { createHmac } from 'node:crypto';
import ical from 'ical-generator';
import {
  RAW_MILK_MIN_AGING_DAYS,
  ageInDays,
  daysToTarget,
  openedOnAfter,
  rawMilkReadyCheck,
  readyDate,
} from '../../shared/trade/aging';
import { calendarDateOf, dayInWords, isoDate } from '../../shared/trade/time';
import type { CaveWheelDto } from '../../shared/types/tasting';
import type { AppContext } from '../context';
import { ForbiddenError, NotFoundError } from '../lib/errors';
import { safeEqual } from '../lib/tokens';
import type { AuthMember } from '../middleware/authenticate';
import { listCaveWheels, listReadyDates, setWheelStatus } from '../repositories/cave.repository';
import { findJournalForTasting } from '../repositories/tastings.repository';
import { accessTo } from './journal-access';
import { findUserById, updateUser } from '../repositories/users.repository';

/** The member's wheels drying and aging, with age, days left and progress to the target. */
export async function listCave(
  ctx: AppContext,
  member: AuthMember,
  today = new Date(),
): Promise<CaveWheelDto[]> {
  const rows = await listCaveWheels(ctx.database.db, member.id);
  return rows.map((r) => {
    const age = ageInDays(r.makeDate, today);
    const target = r.agingTargetDays;
    return {
      journalId: r.id,
      title: r.title,
      style: r.styleName,
      makeDate: r.makeDate,
      wheelStatus: r.wheelStatus,
      ageDays: age,
      targetDays: target,
      daysLeft: target === null ? null : daysToTarget(r.makeDate, target, today),
      readyDate: target === null ? null : readyDate(r.makeDate, target),
      progress: target ? Math.max(0, Math.min(1, age / target)) : null,
      conditions: {
        tempC: r.agingTempC,
        humidityPercent: r.agingHumidityPercent,
        rind: r.rindTreatment,
      },
      lastWeighIn: r.lastWeighIn,
      heatTreatment: r.heatTreatment,
      styleSlug: r.styleSlug,
      rawMilk: rawMilkReadyCheck({
        heatTreatment: r.heatTreatment,
        madeOn: r.makeDate,
        targetDays: target ?? RAW_MILK_MIN_AGING_DAYS,
      }),
    };
  });
}

/** Moves the owner's wheel along (aging, opened, finished, discarded). */
export async function changeWheelStatus(
  ctx: AppContext,
  member: AuthMember,
  journalId: number,
  status: 'drying' | 'aging' | 'opened' | 'finished' | 'discarded',
): Promise<void> {
  const journal = await findJournalForTasting(ctx.database.db, journalId);
  if (!journal || accessTo(journal, member) === 'none') {
    throw new NotFoundError('JOURNAL_NOT_FOUND', 'No journal with that id, or it is private.');
  }
  if (journal.userId !== member.id)
    throw new ForbiddenError('NOT_YOUR_JOURNAL', 'Only the maker can move this wheel.');
  const today = isoDate(calendarDateOf(new Date()));
  await setWheelStatus(ctx.database.db, journalId, status, openedOnAfter(journal, status, today));
}

function calendarSignature(ctx: AppContext, userId: number, version: number): string {
  return createHmac('sha256', ctx.config.sessionSecret)
    .update(`calendar:${userId}:${version}`)
    .digest('base64url')
    .slice(0, 32);
}

/**
 * The member's secret calendar address. Nothing secret is stored: the address is signed
 * with the server's secret and a per-member version that "reset" increases, which ends the
 * old address.
 */
export async function calendarUrl(
  ctx: AppContext,
  member: AuthMember,
  reset = false,
): Promise<string> {
  const user = await findUserById(ctx.database.db, member.id);
  if (!user) throw new NotFoundError();
  let version = user.calendarVersion;
  if (reset) {
    version += 1;
    await updateUser(ctx.database.db, member.id, { calendarVersion: version });
  }
  return `${ctx.config.publicUrl}/api/calendar/${member.id}-${calendarSignature(ctx, member.id, version)}.ics`;
}

/** The iCalendar feed of ready dates behind a secret address; 404 for a wrong secret. */
export async function calendarFeed(ctx: AppContext, token: string): Promise<string> {
  const match = /^(\d{1,10})-([A-Za-z0-9_-]{32})$/.exec(token);
  const user = match ? await findUserById(ctx.database.db, Number(match[1])) : undefined;
  if (
    !match ||
    !user ||
    user.disabledAt ||
    !safeEqual(match[2], calendarSignature(ctx, user.id, user.calendarVersion))
  ) {
    throw new NotFoundError(
      'CALENDAR_NOT_FOUND',
      'No calendar at that address. The member may have reset it.',
    );
  }
  const wheels = await listReadyDates(ctx.database.db, user.id);
  const calendar = ical({
    name: `Rindwise cave of ${user.displayName}`,
    prodId: { company: 'Rindwise', product: 'cave' },
  });
  for (const w of wheels) {
    const ready = readyDate(w.makeDate, w.agingTargetDays!);
    const raw = rawMilkReadyCheck({
      heatTreatment: w.heatTreatment,
      madeOn: w.makeDate,
      targetDays: w.agingTargetDays,
    });
    const rawLine = raw?.readyBeforeMinimum
      ? ` Raw milk: this is before the ${RAW_MILK_MIN_AGING_DAYS}-day mark (${dayInWords(raw.minimumMetOn)}); see the safety notes before eating or sharing it.`
      : '';
    calendar.createEvent({
      id: `rindwise-ready-${w.id}`,
      start: new Date(`${ready}T00:00:00Z`),
      allDay: true,
      summary: raw?.readyBeforeMinimum
        ? `Aging target reached (raw milk, under ${RAW_MILK_MIN_AGING_DAYS} days): ${w.title}`
        : `Ready to taste: ${w.title}`,
      description: `Made on ${w.makeDate}, aging target ${w.agingTargetDays} days.${rawLine} Score it at ${ctx.config.publicUrl}/journals/${w.id}/taste`,
      url: `${ctx.config.publicUrl}/journals/${w.id}`,
    });
    if (w.agingCheckDate) {
      calendar.createEvent({
        id: `rindwise-check-${w.id}`,
        start: new Date(`${w.agingCheckDate}T00:00:00Z`),
        allDay: true,
        summary: `Check the wheel: ${w.title}`,
        url: `${ctx.config.publicUrl}/journals/${w.id}`,
      });
    }
  }
  return calendar.toString();
}
