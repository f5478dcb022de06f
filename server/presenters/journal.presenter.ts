import { cutOn, wheelAgeDays } from '../../shared/trade/aging';
import {
  journalDerivedFigures,
  type JournalFiguresInput,
} from '../../shared/trade/journal-figures';
import type {
  IngredientDto,
  JournalDto,
  JournalSummaryDto,
  MakerRef,
  PressStageDto,
  ReadingDto,
  StepDto,
  StyleRef,
  WeighInDto,
} from '../../shared/types/journal';
import { renderNotes } from '../lib/markdown';
import type {
  IngredientRow,
  JournalRow,
  JournalSummaryRow,
  PhotoRow,
  PressStageRow,
  ReadingRow,
  StepRow,
  WeighInRow,
} from '../repositories/journals.repository';
import { presentPhoto } from './photo.presenter';

/** A journal with everything the journal page shows, as the service gathers it. */
export type JournalAggregate = {
  journal: JournalRow;
  maker: MakerRef;
  style: StyleRef;
  ingredients: IngredientRow[];
  steps: StepRow[];
  pressStages: PressStageRow[];
  weighIns: WeighInRow[];
  readings: ReadingRow[];
  photos: PhotoRow[];
  source: { id: number; title: string; maker: MakerRef } | null;
};

/** Turns an ingredient row into its DTO. */
export function presentIngredient(
  row: Omit<IngredientRow, 'journalId' | 'position'>,
): IngredientDto {
  return {
    kind: row.kind,
    name: row.name,
    amount: row.amount,
    unit: row.unit,
    mlPerDrop: row.mlPerDrop,
    note: row.note,
    si: { dimension: row.siDimension, value: row.siValue },
  };
}

/** Turns a step row into its DTO. */
export function presentStep(row: Omit<StepRow, 'journalId' | 'position'>): StepDto {
  return {
    kind: row.kind,
    targetTempC: row.targetTempC,
    actualTempC: row.actualTempC,
    targetMinutes: row.targetMinutes,
    actualMinutes: row.actualMinutes,
    startedAt: row.startedAt ? row.startedAt.toISOString() : null,
    cutSizeMm: row.cutSizeMm,
    note: row.note,
  };
}

/** Turns a press stage row into its DTO. */
export function presentPressStage(
  row: Omit<PressStageRow, 'journalId' | 'position'>,
): PressStageDto {
  return { loadN: row.loadN, loadUnit: row.loadUnit, minutes: row.minutes };
}

/** Turns a weigh-in row into its DTO. */
export function presentWeighIn(row: Omit<WeighInRow, 'id' | 'journalId'>): WeighInDto {
  return { date: row.date, massKg: row.massKg, note: row.note };
}

/** Turns a vat reading row into its DTO. */
export function presentReading(row: ReadingRow): ReadingDto {
  return {
    id: row.id,
    takenAt: row.takenAt.toISOString(),
    tempC: row.tempC,
    ph: row.ph,
    stepIndex: row.stepIndex,
    note: row.note,
  };
}

/** A journal card for Discover, a profile or My journals. */
export function presentJournalSummary(
  row: JournalSummaryRow,
  cover: PhotoRow | null,
  now: Date = new Date(),
): JournalSummaryDto {
  const j = row.journal;
  return {
    id: j.id,
    title: j.title,
    style: { slug: row.style.slug, name: row.style.name, family: row.style.family },
    maker: { id: row.maker.id, handle: row.maker.handle, displayName: row.maker.displayName },
    makeDate: j.makeDate,
    status: j.status,
    visibility: j.visibility,
    wheelStatus: j.wheelStatus,
    species: j.species,
    heatTreatment: j.heatTreatment,
    rindTreatment: j.rindTreatment,
    milkVolumeL: j.milkVolumeL,
    agingTargetDays: j.agingTargetDays,
    ageDays: wheelAgeDays(j.makeDate, j, now),
    openedOn: cutOn(j),
    tastingCount: j.tastingCount,
    meanOverall: j.meanOverall,
    cover: cover ? presentPhoto(cover) : null,
    updatedAt: j.updatedAt.toISOString(),
  };
}

/** The input of the shared figures from a journal's rows. */
export function figuresInputOf(
  journal: JournalRow,
  children: Pick<
    JournalAggregate,
    'ingredients' | 'steps' | 'pressStages' | 'weighIns' | 'readings'
  >,
): JournalFiguresInput {
  return {
    makeDate: journal.makeDate,
    milk: {
      volumeL: journal.milkVolumeL,
      species: journal.species,
      heatTreatment: journal.heatTreatment,
      fatPercent: journal.fatPercent,
      proteinPercent: journal.proteinPercent,
    },
    mould: {
      shape: journal.mouldShape,
      diameterMm: journal.mouldDiameterMm,
      lengthMm: journal.mouldLengthMm,
      widthMm: journal.mouldWidthMm,
    },
    ingredients: children.ingredients,
    steps: children.steps,
    pressStages: children.pressStages,
    greenWeightKg: journal.greenWeightKg,
    weighIns: children.weighIns,
    readings: children.readings,
    aging: {
      targetDays: journal.agingTargetDays,
      openedOn: journal.openedOn,
      wheelStatus: journal.wheelStatus,
    },
  };
}

/** The whole journal with derived figures and rendered notes, as the journal page shows it. */
export function presentJournal(
  a: JournalAggregate,
  opts: { canEdit: boolean; now?: Date },
): Omit<JournalDto, 'version' | 'hidden'> {
  const now = opts.now ?? new Date();
  const j = a.journal;
  const photos = a.photos.map(presentPhoto);
  return {
    ...presentJournalSummary(
      { journal: j, maker: a.maker, style: a.style },
      a.photos[0] ?? null,
      now,
    ),
    notes: j.notes,
    notesHtml: renderNotes(j.notes),
    milk: {
      volumeL: j.milkVolumeL,
      volumeUnit: j.milkVolumeUnit,
      species: j.species,
      heatTreatment: j.heatTreatment,
      homogenised: j.homogenised,
      fatPercent: j.fatPercent,
      proteinPercent: j.proteinPercent,
    },
    mould: {
      shape: j.mouldShape,
      diameterMm: j.mouldDiameterMm,
      lengthMm: j.mouldLengthMm,
      widthMm: j.mouldWidthMm,
      unit: j.mouldUnit,
    },
    dryingDays: j.dryingDays,
    aging: {
      targetDays: j.agingTargetDays,
      tempC: j.agingTempC,
      humidityPercent: j.agingHumidityPercent,
      checkDate: j.agingCheckDate,
    },
    greenWeightKg: j.greenWeightKg,
    ingredients: a.ingredients.map(presentIngredient),
    steps: a.steps.map(presentStep),
    pressStages: a.pressStages.map(presentPressStage),
    weighIns: a.weighIns.map(presentWeighIn),
    readings: a.readings.map(presentReading),
    photos,
    source: a.source,
    derived: journalDerivedFigures(figuresInputOf(j, a), now),
    canEdit: opts.canEdit,
    createdAt: j.createdAt.toISOString(),
  };
}
