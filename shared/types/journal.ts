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
} from '../constants/journal';
import type { AmountUnit, ForceUnit, LengthUnit, VolumeUnit } from '../trade/units';

export type MakerRef = { id: number; handle: string; displayName: string };
export type StyleRef = { slug: string; name: string; family: string };

/** What a maker (and staff) see on something of theirs a moderator hid; readers never see it. */
export type HiddenMarkDto = {
  hiddenAt: string;
  /** The moderator's note when they hid it; '' when none was written. */
  reason: string;
};

export type PhotoDto = {
  id: number;
  caption: string;
  width: number;
  height: number;
  position: number;
  /** URLs of the WebP renditions, smallest first, for srcset. */
  sources: { width: number; url: string }[];
  /** Set for the maker and staff when a moderator hid the photo. */
  hidden?: HiddenMarkDto | null;
};

/** One journal as a card in Discover, a profile or a list. */
export type JournalSummaryDto = {
  id: number;
  title: string;
  style: StyleRef;
  maker: MakerRef;
  makeDate: string;
  status: JournalStatus;
  visibility: Visibility;
  wheelStatus: WheelStatus;
  species: Species;
  heatTreatment: HeatTreatment;
  rindTreatment: RindTreatment;
  milkVolumeL: number;
  agingTargetDays: number | null;
  /** Today's age, or the age on openedOn for an opened or finished wheel. */
  ageDays: number;
  /** The day an opened or finished wheel was cut (its age stops there); null while it ages. */
  openedOn: string | null;
  tastingCount: number;
  meanOverall: number | null;
  cover: PhotoDto | null;
  updatedAt: string;
  /** Set in the maker's own lists (and for staff) when a moderator hid the journal. */
  hidden?: HiddenMarkDto | null;
};

export type IngredientDto = {
  kind: IngredientKind;
  name: string;
  amount: number;
  unit: AmountUnit;
  mlPerDrop: number | null;
  note: string;
  /** The amount in SI: L for volumes, kg for masses, a count for drops. */
  si: { dimension: 'volume' | 'mass' | 'count'; value: number };
};

export type StepDto = {
  kind: StepKind;
  targetTempC: number | null;
  actualTempC: number | null;
  targetMinutes: number | null;
  actualMinutes: number | null;
  startedAt: string | null;
  cutSizeMm: number | null;
  note: string;
};

export type PressStageDto = { loadN: number; loadUnit: ForceUnit; minutes: number };
export type WeighInDto = { date: string; massKg: number; note: string };
export type ReadingDto = {
  id: string;
  takenAt: string;
  tempC: number | null;
  ph: number | null;
  stepIndex: number | null;
  note: string;
};

/** Figures the server works out from the structured fields with shared/trade. */
export type DerivedFiguresDto = {
  milkMassKg: number;
  milkDensityAssumed: boolean;
  yield: {
    actualPercent: number | null;
    kgPer100KgMilk: number | null;
    predictedKgPer100Kg: number | null;
    efficiency: number | null;
    /** What the prediction assumed (moisture, casein fraction). */
    basis: string | null;
  };
  moisture: {
    lossSinceGreenPercent: number | null;
    ratePerWeekPercent: number | null;
    series: { date: string; massKg: number; lossSinceGreenPercent: number | null }[];
  };
  rates: {
    saltGramsPerLitre: number | null;
    saltPercentOfCheese: number | null;
    colouringMlPerLitre: number | null;
    calciumChlorideMlPerLitre: number | null;
    cultureGramsPerLitre: number | null;
  };
  press: {
    stage: number;
    loadN: number;
    minutes: number;
    kPa: number;
    psi: number;
    startMinute: number;
    endMinute: number;
  }[];
  ramp: {
    limitCPer5Min: number;
    fastestCPer5Min: number | null;
    tooFast: { fromAt: string; toAt: string; ratePer5MinC: number }[];
  };
  aging: {
    ageDays: number;
    targetDays: number | null;
    daysLeft: number | null;
    readyDate: string | null;
    /** true once the wheel is opened or finished: its age stopped at the opening. */
    cut: boolean;
    /** The day it was opened, when known (opened or finished wheels only). */
    openedOn: string | null;
    ageAtOpeningDays: number | null;
    /** For unpasteurised milk with a target: the 60-day mark (21 CFR 133.113). */
    rawMilkMinimumOn: string | null;
    /** true when the ready date comes before that mark. */
    readyBeforeRawMilkMinimum: boolean;
  };
  rawMilkCaution: { flagged: boolean; text: string } | null;
};

/** The whole journal with its derived figures, as the journal page shows it. */
export type JournalDto = JournalSummaryDto & {
  notes: string;
  notesHtml: string;
  milk: {
    volumeL: number;
    volumeUnit: VolumeUnit;
    species: Species;
    heatTreatment: HeatTreatment;
    homogenised: boolean;
    fatPercent: number | null;
    proteinPercent: number | null;
  };
  mould: {
    shape: MouldShape;
    diameterMm: number | null;
    lengthMm: number | null;
    widthMm: number | null;
    unit: LengthUnit;
  };
  dryingDays: number | null;
  aging: {
    targetDays: number | null;
    tempC: number | null;
    humidityPercent: number | null;
    checkDate: string | null;
  };
  greenWeightKg: number | null;
  ingredients: IngredientDto[];
  steps: StepDto[];
  pressStages: PressStageDto[];
  weighIns: WeighInDto[];
  readings: ReadingDto[];
  photos: PhotoDto[];
  source: { id: number; title: string; maker: MakerRef } | null;
  derived: DerivedFiguresDto;
  canEdit: boolean;
  createdAt: string;
  /**
   * The version of the document a PUT replaces (fields, ingredients, steps, press stages,
   * weigh-ins): send it back in If-Match; readings, photos and tastings do not change it.
   */
  version: string;
  hidden: HiddenMarkDto | null;
};
