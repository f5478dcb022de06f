import type { Defect, FlavourDescriptor } from '../constants/tasting';
import type { RawMilkReadyCheck } from '../trade/aging';
import type { HiddenMarkDto, MakerRef } from './journal';

export type TastingDto = {
  id: number;
  journalId: number;
  taster: MakerRef;
  tastedOn: string;
  /** Days from the make date to the tasting date. */
  ageDays: number;
  overall: number;
  appearance: number;
  aroma: number;
  flavour: number;
  texture: number;
  finish: number;
  descriptors: FlavourDescriptor[];
  defects: Defect[];
  notes: string;
  notesHtml: string;
  canEdit: boolean;
  createdAt: string;
  /** For its taster and staff, when a moderator hid it (others never receive it). */
  hidden?: HiddenMarkDto | null;
};

/** Mean scores of the tastings that fall in one age band. */
export type AgeBandDto = {
  label: string;
  fromDays: number;
  toDays: number | null;
  n: number;
  means: Record<'overall' | 'appearance' | 'aroma' | 'flavour' | 'texture' | 'finish', number>;
};

export type CaveWheelDto = {
  journalId: number;
  title: string;
  style: string;
  makeDate: string;
  wheelStatus: string;
  ageDays: number;
  targetDays: number | null;
  daysLeft: number | null;
  readyDate: string | null;
  /** 0 to 1 of the way to the target. */
  progress: number | null;
  conditions: { tempC: number | null; humidityPercent: number | null; rind: string };
  lastWeighIn: { date: string; massKg: number } | null;
  heatTreatment: string;
  styleSlug: string;
  /**
   * For unpasteurised milk: the 60-day mark (21 CFR 133.113) and whether the ready date
   * comes before it; null for pasteurised milk.
   */
  rawMilk: RawMilkReadyCheck | null;
};
