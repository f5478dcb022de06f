// What the vat keeps in this browser per journal, so a reload (or a phone that dropped the
// tab while asleep) comes back to the running step: the step and press timers, the repeating
// prompts, the maker's ramp limit, when pressing ended and which drying days were turned.
// Checked with zod on the way in: a damaged or older entry is ignored, never trusted.

import { z } from 'zod';
import type { PromptState } from './prompts';
import type { TimerState } from './timer';
import { createTimer, fitTimer } from './timer';

const run = z.object({
  status: z.enum(['pending', 'running', 'paused', 'done', 'skipped']),
  startedAt: z.number().nullable(),
  runningSince: z.number().nullable(),
  accumulatedMs: z.number().min(0),
  endedAt: z.number().nullable(),
});

const timer = z.object({ current: z.number().int().min(0), runs: z.array(run) });

const prompt = z.object({
  intervalMinutes: z.number().positive(),
  anchorAt: z.number(),
  count: z.number().int().min(0),
});

const localSchema = z.object({
  v: z.literal(1),
  steps: timer,
  press: timer,
  /** by step index ("3") or "press" */
  prompts: z.record(z.string(), prompt),
  /** the maker's own ramp limit, °C per 5 min; null for the default */
  rampLimitC: z.number().positive().nullable(),
  /** when the last press stage ended, ms; drying counts from it */
  pressEndedAt: z.number().nullable(),
  /** ISO dates of the drying days the wheel was turned */
  turned: z.array(z.string()),
});

export interface VatLocalState {
  v: 1;
  steps: TimerState;
  press: TimerState;
  prompts: Record<string, PromptState>;
  rampLimitC: number | null;
  pressEndedAt: number | null;
  turned: string[];
}

/** The localStorage key of one journal's vat state. */
export const localStateKey = (journalId: number) => `rindwise:vat:${journalId}:state`;

/** A fresh state for a journal with `steps` steps and `stages` press stages. */
export function emptyLocalState(steps: number, stages: number): VatLocalState {
  return {
    v: 1,
    steps: createTimer(steps),
    press: createTimer(stages),
    prompts: {},
    rampLimitC: null,
    pressEndedAt: null,
    turned: [],
  };
}

/** Reads a journal's saved vat state, fitted to its current steps; null if none or unusable. */
export function loadLocalState(
  storage: Storage | undefined,
  journalId: number,
  steps: number,
  stages: number,
): VatLocalState | null {
  try {
    const raw = storage?.getItem(localStateKey(journalId));
    if (!raw) return null;
    const parsed = localSchema.safeParse(JSON.parse(raw));
    if (!parsed.success) return null;
    const state = parsed.data as VatLocalState;
    return { ...state, steps: fitTimer(state.steps, steps), press: fitTimer(state.press, stages) };
  } catch {
    return null;
  }
}

/** Saves a journal's vat state; a full or refused storage only costs the restore. */
export function saveLocalState(
  storage: Storage | undefined,
  journalId: number,
  state: VatLocalState,
) {
  try {
    storage?.setItem(localStateKey(journalId), JSON.stringify(state));
    return true;
  } catch {
    return false;
  }
}
