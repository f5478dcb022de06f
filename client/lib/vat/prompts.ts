// Repeating prompts inside a step: "stir every 5 minutes", "turn the slabs every 15",
// "check the press load every 30". The next prompt falls one interval after the last one the
// maker acknowledged (or after the prompt was set), because a maker who stirs a minute late
// stirs the next time five minutes after that, not four. Pure: time comes in as `now`.

import type { StepKind } from '@shared/constants/journal';

export interface PromptState {
  /** minutes between prompts, as the maker set it */
  intervalMinutes: number;
  /** the prompt was set, or last acknowledged, at this instant (ms) */
  anchorAt: number;
  /** how many prompts the maker marked done */
  count: number;
}

/** Shortest and longest interval a maker may set, minutes. */
export const PROMPT_MIN_MINUTES = 1;
export const PROMPT_MAX_MINUTES = 240;

function clampInterval(minutes: number): number {
  if (!Number.isFinite(minutes)) return PROMPT_MIN_MINUTES;
  return Math.min(PROMPT_MAX_MINUTES, Math.max(PROMPT_MIN_MINUTES, Math.round(minutes)));
}

/** Returns a prompt that first falls one interval from `now`, with no prompts done yet. */
export function createPrompt(intervalMinutes: number, now: number): PromptState {
  return { intervalMinutes: clampInterval(intervalMinutes), anchorAt: now, count: 0 };
}

/** Changes the interval, keeping the count; the next prompt is one new interval from now. */
export function changeInterval(prompt: PromptState, intervalMinutes: number, now: number) {
  return { ...prompt, intervalMinutes: clampInterval(intervalMinutes), anchorAt: now };
}

/** Returns when the next prompt falls, ms since the epoch. */
export function nextDueAt(prompt: PromptState): number {
  return prompt.anchorAt + prompt.intervalMinutes * 60_000;
}

/** True once the next prompt has fallen and the maker has not yet marked it done. */
export function isDue(prompt: PromptState, now: number): boolean {
  return now >= nextDueAt(prompt);
}

/** Marks a prompt done (one more stir): counts it and starts the next interval from now. */
export function acknowledge(prompt: PromptState, now: number): PromptState {
  return { ...prompt, count: prompt.count + 1, anchorAt: now };
}

/** Takes back the last "Done" (a double tap with wet hands); the interval is left as it is. */
export function undoAcknowledge(prompt: PromptState): PromptState {
  return { ...prompt, count: Math.max(0, prompt.count - 1) };
}

/** What a prompt asks for and how its count reads. */
export interface PromptWording {
  /** the button and the alert: "Stir the curd" */
  action: string;
  /** the count: "Stirred 7 times", "Not stirred yet" */
  counted: (count: number) => string;
  /** a sensible first interval, minutes (common practice) */
  defaultMinutes: number;
}

const times = (n: number) => (n === 1 ? 'once' : n === 2 ? 'twice' : `${n} times`);
const counter = (done: string, notYet: string) => (n: number) =>
  n === 0 ? notYet : `${done} ${times(n)}`;

const STIR: PromptWording = {
  action: 'Stir the curd',
  counted: counter('Stirred', 'Not stirred yet'),
  defaultMinutes: 5,
};

/** The prompt that suits a step, in the trade's words. */
export function promptWordingFor(kind: StepKind | 'press'): PromptWording {
  switch (kind) {
    case 'warming':
    case 'ripening':
    case 'colouring':
      return {
        action: 'Stir the milk',
        counted: counter('Stirred', 'Not stirred yet'),
        defaultMinutes: 10,
      };
    case 'healing':
    case 'cooking':
    case 'stirring':
    case 'salting':
      return STIR;
    case 'cheddaring':
      return {
        action: 'Turn and stack the slabs',
        counted: counter('Turned', 'Not turned yet'),
        defaultMinutes: 15,
      };
    case 'draining':
    case 'hooping':
    case 'pressing':
    case 'press':
      return {
        action: 'Check the press load',
        counted: counter('Checked', 'Not checked yet'),
        defaultMinutes: 30,
      };
    default:
      return {
        action: 'Check the vat',
        counted: counter('Checked', 'Not checked yet'),
        defaultMinutes: 10,
      };
  }
}
