// The journal editor's form model: values as the maker types them, in their own units, and
// the conversions to and from the SI document the server stores (shared/schemas/journal).
// Converting only here keeps every input honest about its unit and the wire format SI.

import type {
  HeatTreatment,
  IngredientKind,
  JournalStatus,
  MouldShape,
  RindTreatment,
  Species,
  StepKind,
  Visibility,
  WheelStatus,
} from '@shared/constants/journal';
import type { JournalInputDraft } from '@shared/schemas/journal';
import type { JournalDto } from '@shared/types/journal';
import {
  fromCelsius,
  fromKilograms,
  fromLitres,
  fromMillimetres,
  fromNewtons,
  PREFERRED_UNITS,
  toCelsius,
  toKilograms,
  toLitres,
  toMillimetres,
  toNewtons,
  DEFAULT_ML_PER_DROP,
  type AmountUnit,
  type ForceUnit,
  type LengthUnit,
  type MassUnit,
  type TemperatureUnit,
  type UnitSystem,
  type VolumeUnit,
} from '@shared/trade';

/** The fixed units one editing session shows, from the member's unit system. */
export type FormUnits = {
  system: UnitSystem;
  temperature: TemperatureUnit;
  mass: MassUnit;
  cut: LengthUnit;
  milk: VolumeUnit;
  mould: LengthUnit;
  load: ForceUnit;
};

/** The editor's units for a unit system (cut size in mm or inches). */
export function formUnitsFor(system: UnitSystem): FormUnits {
  const preferred = PREFERRED_UNITS[system];
  return {
    system,
    temperature: preferred.temperature,
    mass: preferred.cheese,
    cut: system === 'us' ? 'in' : 'mm',
    milk: preferred.milk,
    mould: preferred.mould,
    load: preferred.load,
  };
}

export type IngredientRow = {
  key: string;
  kind: IngredientKind;
  name: string;
  amount: number | null;
  unit: AmountUnit;
  mlPerDrop: number | null;
  note: string;
};

export type StepRow = {
  key: string;
  kind: StepKind;
  targetTemp: number | null;
  actualTemp: number | null;
  targetMinutes: number | null;
  actualMinutes: number | null;
  /** A datetime-local value ("2026-03-14T09:30") or empty. */
  startedAt: string;
  cutSize: number | null;
  note: string;
};

export type PressRow = {
  key: string;
  load: number | null;
  loadUnit: ForceUnit;
  minutes: number | null;
};

export type WeighInRow = { key: string; date: string; mass: number | null; note: string };

export type JournalForm = {
  title: string;
  styleSlug: string;
  makeDate: string;
  status: JournalStatus;
  visibility: Visibility;
  wheelStatus: WheelStatus;
  milk: {
    volume: number | null;
    volumeUnit: VolumeUnit;
    species: Species | '';
    heatTreatment: HeatTreatment | '';
    homogenised: boolean;
    fatPercent: number | null;
    proteinPercent: number | null;
  };
  mould: {
    shape: MouldShape;
    diameter: number | null;
    length: number | null;
    width: number | null;
    unit: LengthUnit;
  };
  rindTreatment: RindTreatment;
  dryingDays: number | null;
  aging: {
    targetDays: number | null;
    temp: number | null;
    humidityPercent: number | null;
    checkDate: string;
  };
  greenWeight: number | null;
  notes: string;
  ingredients: IngredientRow[];
  steps: StepRow[];
  pressStages: PressRow[];
  weighIns: WeighInRow[];
};

let rowCounter = 0;
/** A key for v-for that survives reordering (not sent to the server). */
export const rowKey = () => `r${Date.now().toString(36)}${(rowCounter++).toString(36)}`;

const round = (value: number, decimals: number) => {
  const factor = 10 ** decimals;
  return Math.round(value * factor) / factor;
};
const maybe = <T>(value: number | null, convert: (v: number) => T): T | null =>
  value === null || value === undefined ? null : convert(value);

/** Today's date in the browser's time zone, "YYYY-MM-DD". */
export function todayIso(): string {
  const now = new Date();
  const local = new Date(now.getTime() - now.getTimezoneOffset() * 60_000);
  return local.toISOString().slice(0, 10);
}

/** An ISO instant as a datetime-local value in the browser's zone. */
export function toLocalDateTime(iso: string | null): string {
  if (!iso) return '';
  const at = new Date(iso);
  if (Number.isNaN(at.getTime())) return '';
  return new Date(at.getTime() - at.getTimezoneOffset() * 60_000).toISOString().slice(0, 16);
}

function fromLocalDateTime(value: string): string | null {
  if (!value) return null;
  const at = new Date(value);
  return Number.isNaN(at.getTime()) ? value : at.toISOString();
}

export const newIngredient = (kind: IngredientKind = 'culture'): IngredientRow => ({
  key: rowKey(),
  kind,
  name: '',
  amount: null,
  unit: kind === 'salt' ? 'g' : kind === 'culture' ? 'g' : 'mL',
  mlPerDrop: null,
  note: '',
});

export const newStep = (kind: StepKind = 'warming'): StepRow => ({
  key: rowKey(),
  kind,
  targetTemp: null,
  actualTemp: null,
  targetMinutes: null,
  actualMinutes: null,
  startedAt: '',
  cutSize: null,
  note: '',
});

export const newPressStage = (units: FormUnits): PressRow => ({
  key: rowKey(),
  load: null,
  loadUnit: units.load,
  minutes: null,
});

export const newWeighIn = (): WeighInRow => ({
  key: rowKey(),
  date: todayIso(),
  mass: null,
  note: '',
});

/** A blank batch made today, in the member's units. */
export function emptyForm(units: FormUnits): JournalForm {
  return {
    title: '',
    styleSlug: '',
    makeDate: todayIso(),
    status: 'draft',
    visibility: 'public',
    wheelStatus: 'making',
    milk: {
      volume: null,
      volumeUnit: units.milk,
      species: 'cow',
      // No default: whether the milk was raw matters for safety, so the maker says it.
      heatTreatment: '',
      homogenised: false,
      fatPercent: null,
      proteinPercent: null,
    },
    mould: { shape: 'round', diameter: null, length: null, width: null, unit: units.mould },
    rindTreatment: 'natural',
    dryingDays: null,
    aging: { targetDays: null, temp: null, humidityPercent: null, checkDate: '' },
    greenWeight: null,
    notes: '',
    ingredients: [],
    steps: [],
    pressStages: [],
    weighIns: [],
  };
}

/** The form for a stored journal, its SI values shown in the member's units. */
export function formFromJournal(dto: JournalDto, units: FormUnits): JournalForm {
  const t = (c: number | null) => maybe(c, (v) => round(fromCelsius(v, units.temperature), 1));
  const kg = (m: number | null) => maybe(m, (v) => round(fromKilograms(v, units.mass), 3));
  const mould = (mm: number | null) =>
    maybe(mm, (v) => round(fromMillimetres(v, dto.mould.unit), 2));
  return {
    title: dto.title,
    styleSlug: dto.style.slug,
    makeDate: dto.makeDate.slice(0, 10),
    status: dto.status,
    visibility: dto.visibility,
    wheelStatus: dto.wheelStatus,
    milk: {
      volume: round(fromLitres(dto.milk.volumeL, dto.milk.volumeUnit), 3),
      volumeUnit: dto.milk.volumeUnit,
      species: dto.milk.species,
      heatTreatment: dto.milk.heatTreatment,
      homogenised: dto.milk.homogenised,
      fatPercent: dto.milk.fatPercent,
      proteinPercent: dto.milk.proteinPercent,
    },
    mould: {
      shape: dto.mould.shape,
      diameter: mould(dto.mould.diameterMm),
      length: mould(dto.mould.lengthMm),
      width: mould(dto.mould.widthMm),
      unit: dto.mould.unit,
    },
    rindTreatment: dto.rindTreatment,
    dryingDays: dto.dryingDays,
    aging: {
      targetDays: dto.aging.targetDays,
      temp: t(dto.aging.tempC),
      humidityPercent: dto.aging.humidityPercent,
      checkDate: dto.aging.checkDate ?? '',
    },
    greenWeight: kg(dto.greenWeightKg),
    notes: dto.notes,
    ingredients: dto.ingredients.map((i) => ({
      key: rowKey(),
      kind: i.kind,
      name: i.name,
      amount: i.amount,
      unit: i.unit,
      mlPerDrop: i.mlPerDrop,
      note: i.note,
    })),
    steps: dto.steps.map((s) => ({
      key: rowKey(),
      kind: s.kind,
      targetTemp: t(s.targetTempC),
      actualTemp: t(s.actualTempC),
      targetMinutes: s.targetMinutes,
      actualMinutes: s.actualMinutes,
      startedAt: toLocalDateTime(s.startedAt),
      cutSize: maybe(s.cutSizeMm, (v) => round(fromMillimetres(v, units.cut), 2)),
      note: s.note,
    })),
    pressStages: dto.pressStages.map((p) => ({
      key: rowKey(),
      load: round(fromNewtons(p.loadN, p.loadUnit), 2),
      loadUnit: p.loadUnit,
      minutes: p.minutes,
    })),
    weighIns: dto.weighIns.map((w) => ({
      key: rowKey(),
      date: w.date.slice(0, 10),
      mass: kg(w.massKg),
      note: w.note,
    })),
  };
}

/**
 * The SI document for the shared schema. Missing required numbers stay null so the schema
 * answers with its own message ("Enter the amount.") on the right path.
 */
export function documentFromForm(form: JournalForm, units: FormUnits): JournalInputDraft {
  const c = (v: number | null) => maybe(v, (x) => toCelsius(x, units.temperature));
  const mm = (v: number | null) => maybe(v, (x) => toMillimetres(x, form.mould.unit));
  const doc = {
    title: form.title,
    styleSlug: form.styleSlug || undefined,
    makeDate: form.makeDate,
    status: form.status,
    visibility: form.visibility,
    wheelStatus: form.wheelStatus,
    milk: {
      volumeL: maybe(form.milk.volume, (v) => toLitres(v, form.milk.volumeUnit)),
      volumeUnit: form.milk.volumeUnit,
      species: form.milk.species || undefined,
      heatTreatment: form.milk.heatTreatment || undefined,
      homogenised: form.milk.homogenised,
      fatPercent: form.milk.fatPercent,
      proteinPercent: form.milk.proteinPercent,
    },
    mould: {
      shape: form.mould.shape,
      diameterMm: form.mould.shape === 'round' ? mm(form.mould.diameter) : null,
      lengthMm: form.mould.shape === 'rectangular' ? mm(form.mould.length) : null,
      widthMm: form.mould.shape === 'rectangular' ? mm(form.mould.width) : null,
      unit: form.mould.unit,
    },
    rindTreatment: form.rindTreatment,
    dryingDays: form.dryingDays,
    aging: {
      targetDays: form.aging.targetDays,
      tempC: c(form.aging.temp),
      humidityPercent: form.aging.humidityPercent,
      checkDate: form.aging.checkDate || null,
    },
    greenWeightKg: maybe(form.greenWeight, (v) => toKilograms(v, units.mass)),
    notes: form.notes,
    ingredients: form.ingredients.map((i) => ({
      kind: i.kind,
      name: i.name,
      amount: i.amount,
      unit: i.unit,
      mlPerDrop: i.unit === 'drop' ? i.mlPerDrop : null,
      note: i.note,
    })),
    steps: form.steps.map((s) => ({
      kind: s.kind,
      targetTempC: c(s.targetTemp),
      actualTempC: c(s.actualTemp),
      targetMinutes: s.targetMinutes,
      actualMinutes: s.actualMinutes,
      startedAt: fromLocalDateTime(s.startedAt),
      cutSizeMm: maybe(s.cutSize, (x) => toMillimetres(x, units.cut)),
      note: s.note,
    })),
    pressStages: form.pressStages.map((p) => ({
      loadN: maybe(p.load, (v) => toNewtons(v, p.loadUnit)),
      loadUnit: p.loadUnit,
      minutes: p.minutes,
    })),
    weighIns: form.weighIns.map((w) => ({
      date: w.date,
      massKg: maybe(w.mass, (v) => toKilograms(v, units.mass)),
      note: w.note,
    })),
  };
  // Nulls in required places are deliberate (see above); the schema is the judge.
  return doc as unknown as JournalInputDraft;
}

/** The mL per drop offered when a maker picks drops (common practice, 20 drops per mL). */
export const DEFAULT_DROP_ML = DEFAULT_ML_PER_DROP;
