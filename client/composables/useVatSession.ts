import { STEP_LABELS, type StepKind } from '@shared/constants/journal';
import { DEFAULT_RAMP_LIMIT_C_PER_5_MIN } from '@shared/trade';
import { storeToRefs } from 'pinia';
import { computed, ref, watch, type Ref } from 'vue';
import { advanceWheel, applyGreenWeight, applyStepTimer } from '../lib/vat/document';
import { dryingPlan, toggleTurned } from '../lib/vat/drying';
import { pressRows } from '../lib/vat/press';
import { promptWordingFor, type PromptState } from '../lib/vat/prompts';
import { decideRamp } from '../lib/vat/ramp';
import {
  emptyLocalState,
  loadLocalState,
  saveLocalState,
  type VatLocalState,
} from '../lib/vat/state';
import { isComplete, timerFromRecord, type TimerState } from '../lib/vat/timer';
import { useSessionStore } from '../stores/session';
import { useMakeTimer } from './useMakeTimer';
import { useVatAlert } from './useVatAlert';
import { useVatClock } from './useVatClock';
import type { VatJournal } from './useVatJournal';
import { useVatPrompt } from './useVatPrompt';
import { useWakeLock } from './useWakeLock';

// Steps that run for days: a timer is kept, but the screen is not held awake for them.
const LONG_STEPS: readonly StepKind[] = ['drying', 'rind-treatment'];
const AWAKE_KEY = 'rindwise:vat:awake';

function storage(): Storage | undefined {
  try {
    return window.localStorage;
  } catch {
    return undefined;
  }
}

/** A writable ref onto one field of the persisted state. */
function field<K extends keyof VatLocalState>(local: Ref<VatLocalState>, key: K) {
  return computed<VatLocalState[K]>({
    get: () => local.value[key],
    set: (value) => (local.value[key] = value),
  });
}

/**
 * A make day at the vat, for a journal that has loaded (`vat.doc` is set): the step and
 * press timers with what they write back to the journal, the repeating prompts, the ramp
 * check, the green weight and the drying days, the alerts and the wake lock. What the page
 * must keep across a reload is saved in localStorage per journal.
 */
export function useVatSession(vat: VatJournal) {
  const { units } = storeToRefs(useSessionStore());
  const { now } = useVatClock();
  const alert = useVatAlert();
  const doc = computed(() => vat.doc.value!);
  const steps = computed(() => doc.value.steps);
  const stages = computed(() => doc.value.pressStages);

  const local = ref<VatLocalState>(
    loadLocalState(storage(), vat.journalId, steps.value.length, stages.value.length) ?? {
      ...emptyLocalState(steps.value.length, stages.value.length),
      steps: timerFromRecord(steps.value, Date.now()),
    },
  );
  watch(local, (state) => saveLocalState(storage(), vat.journalId, state), { deep: true });

  const stepState = field(local, 'steps') as Ref<TimerState>;
  const pressState = field(local, 'press') as Ref<TimerState>;
  const prompts = field(local, 'prompts') as Ref<Record<string, PromptState>>;

  const problem = ref<string | null>(null);
  function save(next: typeof doc.value) {
    problem.value = vat.saveDocument(next);
  }

  const stepTimer = useMakeTimer(stepState, {
    now,
    targets: () => steps.value.map((s) => s.targetMinutes),
    onAction: (_action, next, _previous, at) => {
      alert.unlock();
      save(applyStepTimer(doc.value, next, vat.readings.value, at));
    },
    onTimeUp: alert.timeUp,
  });

  const currentStep = computed(() => steps.value[stepTimer.index.value] ?? null);
  const nextStep = computed(() => steps.value[stepTimer.index.value + 1] ?? null);
  const stepIndex = computed(() => (currentStep.value ? stepTimer.index.value : null));
  /** On a pressing step with a schedule, the press stages are the step's timer. */
  const pressMode = computed(
    () => currentStep.value?.kind === 'pressing' && stages.value.length > 0,
  );

  const pressTimer = useMakeTimer(pressState, {
    now,
    targets: () => stages.value.map((s) => s.minutes),
    onAction: (action, next, previous, at) => {
      alert.unlock();
      if (action === 'start' && previous.current === 0) {
        save(advanceWheel(doc.value, 'pressing'));
        if (pressMode.value && stepTimer.allowed.value.start) stepTimer.act('start');
      }
      if (isComplete(next) && !isComplete(previous)) {
        local.value.pressEndedAt = at;
        if (pressMode.value && stepTimer.allowed.value.finish) stepTimer.act('finish');
      }
      if (!isComplete(next)) local.value.pressEndedAt = null;
      // Putting on the next weight ends one stage and starts the next in the same moment.
      if (action === 'finish' && !isComplete(next)) pressTimer.act('start');
    },
    onTimeUp: alert.timeUp,
  });
  const pressTable = computed(() => pressRows(stages.value, doc.value.mould));
  const pressingIndex = computed(() => steps.value.findIndex((st) => st.kind === 'pressing'));
  const pressStarted = computed(() => pressState.value.runs.some((r) => r.startedAt !== null));
  const pastPressingStep = computed(
    () => pressingIndex.value >= 0 && stepTimer.index.value > pressingIndex.value,
  );
  /** The press schedule shows on its step, and whenever the make has reached or passed it. */
  const showPress = computed(
    () =>
      stages.value.length > 0 &&
      (pressMode.value ||
        pressStarted.value ||
        pressingIndex.value === -1 ||
        pastPressingStep.value),
  );
  /** Near the top once the press is what the maker is doing; lower down while it is to come. */
  const pressEarly = computed(
    () =>
      pressMode.value ||
      (showPress.value &&
        (pressStarted.value || stepTimer.complete.value || pastPressingStep.value)),
  );

  const stepPrompt = useVatPrompt({
    prompts,
    key: () => (stepIndex.value === null ? null : String(stepIndex.value)),
    now,
    active: () => stepTimer.running.value,
    wording: () => promptWordingFor(currentStep.value?.kind ?? 'other'),
    onDue: alert.promptDue,
  });
  const pressPrompt = useVatPrompt({
    prompts,
    key: () => 'press',
    now,
    active: () => pressTimer.running.value,
    wording: () => promptWordingFor('press'),
    onDue: alert.promptDue,
  });

  const rampLimitC = computed(() => local.value.rampLimitC ?? DEFAULT_RAMP_LIMIT_C_PER_5_MIN);
  const ramp = computed(() =>
    decideRamp(vat.readings.value, {
      stepIndex: stepIndex.value,
      stepKind: currentStep.value?.kind ?? null,
      limitCPer5Min: rampLimitC.value,
    }),
  );
  watch(
    () => ramp.value.level,
    (level, before) => {
      if (level === 'too-fast' && before !== 'too-fast') alert.promptDue();
    },
  );

  /** The last temperature logged, else the step's target: where the logger's field starts. */
  const suggestedTempC = computed(() => {
    const temps = vat.readings.value.filter((r) => r.tempC !== null);
    return temps.length ? temps[temps.length - 1].tempC : (currentStep.value?.targetTempC ?? null);
  });

  function logReading(input: { tempC: number | null; ph: number | null }) {
    alert.unlock();
    return vat.logReading({ ...input, stepIndex: stepIndex.value });
  }

  const pressingDone = computed(
    () =>
      (stages.value.length > 0 && pressTimer.complete.value) ||
      steps.value.some((s, i) => s.kind === 'pressing' && i < stepTimer.index.value),
  );
  const askGreenWeight = computed(
    () =>
      pressingDone.value || doc.value.greenWeightKg !== null || doc.value.wheelStatus === 'drying',
  );
  function saveGreenWeight(kg: number) {
    local.value.pressEndedAt ??= Date.now();
    save(applyGreenWeight(doc.value, kg));
  }

  const drying = computed(() => {
    if (doc.value.wheelStatus !== 'drying' || !doc.value.dryingDays) return null;
    return dryingPlan(
      local.value.pressEndedAt ?? now.value,
      doc.value.dryingDays,
      local.value.turned,
      now.value,
    );
  });
  watch(
    () => doc.value.wheelStatus,
    (status) => {
      // Drying seen first here (the press was run on another phone): count from today.
      if (status === 'drying') local.value.pressEndedAt ??= Date.now();
    },
    { immediate: true },
  );
  function toggleTurnedDay(date: string) {
    local.value.turned = toggleTurned(local.value.turned, date);
  }
  function setDryingDays(days: number) {
    save({ ...doc.value, dryingDays: days });
  }

  const keepAwake = ref(storage()?.getItem(AWAKE_KEY) !== 'off');
  watch(keepAwake, (on) => {
    try {
      storage()?.setItem(AWAKE_KEY, on ? 'on' : 'off');
    } catch {
      // Not remembered.
    }
  });
  const timerLive = computed(
    () =>
      (stepTimer.running.value && !LONG_STEPS.includes(currentStep.value?.kind ?? 'other')) ||
      pressTimer.running.value,
  );
  const wakeLock = useWakeLock(() => keepAwake.value && timerLive.value);

  function setRampLimit(limitC: number | null) {
    local.value.rampLimitC = limitC;
  }

  const stepLabel = (index: number | null) => {
    if (index === null) return '';
    const kind = steps.value[index]?.kind;
    return kind ? STEP_LABELS[kind] : `Step ${index + 1}`;
  };

  return {
    units,
    now,
    doc,
    steps,
    stages,
    stepTimer,
    currentStep,
    nextStep,
    stepIndex,
    pressMode,
    pressTimer,
    pressTable,
    showPress,
    pressEarly,
    stepPrompt,
    pressPrompt,
    ramp,
    rampLimitC,
    setRampLimit,
    suggestedTempC,
    logReading,
    askGreenWeight,
    saveGreenWeight,
    drying,
    toggleTurnedDay,
    setDryingDays,
    keepAwake,
    wakeLock,
    timerLive,
    alert,
    problem,
    stepLabel,
  };
}

export type VatSession = ReturnType<typeof useVatSession>;
