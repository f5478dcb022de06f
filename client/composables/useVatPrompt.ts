import { computed, watch, type Ref } from 'vue';
import {
  acknowledge,
  changeInterval,
  createPrompt,
  isDue,
  nextDueAt,
  undoAcknowledge,
  type PromptState,
  type PromptWording,
} from '../lib/vat/prompts';

type Options = {
  /** all prompts of the make, by key; the caller persists it */
  prompts: Ref<Record<string, PromptState>>;
  /** the key of this prompt (the step index, or 'press'), or null when there is none */
  key: () => string | null;
  now: Ref<number>;
  /** prompts only call while the step or stage is running */
  active: () => boolean;
  wording: () => PromptWording;
  /** called when the prompt falls due, and again each minute it stays undone */
  onDue?: () => void;
};

/** Minutes between repeated calls of a prompt left undone. */
const RECALL_MINUTES = 1;

/**
 * A repeating prompt inside a step ("stir every 5 minutes"): whether it is due, the time
 * to the next one, the count done, and the maker's controls. Sound and vibration are the
 * caller's, through onDue.
 */
export function useVatPrompt(options: Options) {
  const prompt = computed(() => {
    const key = options.key();
    return key === null ? null : (options.prompts.value[key] ?? null);
  });
  const due = computed(
    () => prompt.value !== null && options.active() && isDue(prompt.value, options.now.value),
  );
  const nextInMs = computed(() =>
    prompt.value ? nextDueAt(prompt.value) - options.now.value : null,
  );
  // Which call of an undone prompt this is: 0 when it falls due, 1 a minute later, …
  const call = computed(() =>
    due.value && nextInMs.value !== null
      ? Math.floor(-nextInMs.value / (RECALL_MINUTES * 60_000))
      : -1,
  );
  watch(call, (n, before) => {
    if (n >= 0 && n !== before) options.onDue?.();
  });

  function put(next: PromptState | null) {
    const key = options.key();
    if (key === null) return;
    const all = { ...options.prompts.value };
    if (next) all[key] = next;
    else delete all[key];
    options.prompts.value = all;
  }

  return {
    prompt,
    due,
    nextInMs,
    /** Sets (or changes) the interval, minutes; the first prompt falls one interval from now. */
    set(minutes: number) {
      put(
        prompt.value
          ? changeInterval(prompt.value, minutes, Date.now())
          : createPrompt(minutes, Date.now()),
      );
    },
    /** The maker did it: counts it, the next one falls an interval from now. */
    done() {
      if (prompt.value) put(acknowledge(prompt.value, Date.now()));
    },
    /** Takes back the last Done. */
    undo() {
      if (prompt.value) put(undoAcknowledge(prompt.value));
    },
    /** Stops the prompt (its count is forgotten). */
    stop() {
      put(null);
    },
  };
}
