// The journal document the vat writes back with PUT /api/journals/:id. A PUT replaces the
// whole document, so it is rebuilt from the JournalDto the page loaded, with the DTO-only
// fields (ids, derived figures, photos, readings, SI amounts …) left out, and only what
// happened at the vat changed: each step's start, minutes and temperature, the green weight
// and where the wheel is in its life.

import type { WheelStatus } from '@shared/constants/journal';
import type { JournalInput } from '@shared/schemas/journal';
import { journalInputSchema } from '@shared/schemas/journal';
import type { JournalDto, ReadingDto } from '@shared/types/journal';
import { isoWithOffset } from './readings';
import type { ItemRun, TimerState } from './timer';
import { elapsedMs } from './timer';

/** Returns the editable document of a journal, as PUT expects it. */
export function documentFromDto(dto: JournalDto): JournalInput {
  return {
    title: dto.title,
    styleSlug: dto.style.slug,
    makeDate: dto.makeDate,
    status: dto.status,
    visibility: dto.visibility,
    wheelStatus: dto.wheelStatus,
    milk: { ...dto.milk },
    mould: { ...dto.mould },
    rindTreatment: dto.rindTreatment,
    dryingDays: dto.dryingDays,
    aging: { ...dto.aging },
    greenWeightKg: dto.greenWeightKg,
    notes: dto.notes,
    ingredients: dto.ingredients.map((i) => ({
      kind: i.kind,
      name: i.name,
      amount: i.amount,
      unit: i.unit,
      mlPerDrop: i.mlPerDrop,
      note: i.note,
    })),
    steps: dto.steps.map((s) => ({ ...s })),
    pressStages: dto.pressStages.map((p) => ({
      loadN: p.loadN,
      loadUnit: p.loadUnit,
      minutes: p.minutes,
    })),
    weighIns: dto.weighIns.map((w) => ({ date: w.date, massKg: w.massKg, note: w.note })),
  };
}

/** Minutes as the journal keeps them: to a tenth of a minute (6 s). */
export function runMinutes(run: ItemRun, now: number): number {
  return Math.round(elapsedMs(run, now) / 6000) / 10;
}

/** The latest temperature logged during a step, °C, or null. */
export function lastTempOfStep(readings: readonly ReadingDto[], stepIndex: number) {
  let latest: ReadingDto | null = null;
  for (const r of readings) {
    if (r.stepIndex !== stepIndex || r.tempC === null) continue;
    if (!latest || Date.parse(r.takenAt) >= Date.parse(latest.takenAt)) latest = r;
  }
  return latest?.tempC ?? null;
}

/**
 * Writes the step timer into the document: a started step gets its start time; a finished or
 * skipped one its actual minutes (a running or paused one none yet), and the last temperature
 * logged during it. Steps the timer has not touched keep what the journal said.
 */
export function applyStepTimer(
  doc: JournalInput,
  timer: TimerState,
  readings: readonly ReadingDto[],
  now: number,
): JournalInput {
  const steps = doc.steps.map((step, i) => {
    const run = timer.runs[i];
    if (!run || run.startedAt === null) return step;
    const ended = run.status === 'done' || run.status === 'skipped';
    return {
      ...step,
      startedAt: isoWithOffset(run.startedAt),
      // A step reopened with Back is not over: its earlier total no longer stands.
      actualMinutes: ended ? runMinutes(run, now) : null,
      actualTempC: ended ? (lastTempOfStep(readings, i) ?? step.actualTempC) : step.actualTempC,
    };
  });
  return { ...doc, steps };
}

/** Sets the green weight (kg, off the press) and moves the wheel on to drying. */
export function applyGreenWeight(doc: JournalInput, kg: number): JournalInput {
  return { ...doc, greenWeightKg: kg, wheelStatus: 'drying' };
}

/** Moves the wheel on (making → pressing → drying); never back from a later stage. */
export function advanceWheel(doc: JournalInput, to: WheelStatus): JournalInput {
  const order: WheelStatus[] = ['making', 'pressing', 'drying', 'aging'];
  const from = order.indexOf(doc.wheelStatus);
  const next = order.indexOf(to);
  if (from === -1 || next <= from) return doc;
  return { ...doc, wheelStatus: to };
}

/** Checks a document with the shared schema before it is queued; returns the first problem. */
export function checkDocument(doc: JournalInput): string | null {
  const result = journalInputSchema.safeParse(doc);
  if (result.success) return null;
  const issue = result.error.issues[0];
  return `${issue.path.join('.')}: ${issue.message}`;
}
