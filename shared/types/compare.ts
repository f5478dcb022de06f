import type { CompareOutcomeKey, CompareParameterKey } from '../constants/compare';

export type ComparePointDto = {
  x: number;
  y: number;
  journalId: number;
  title: string;
  maker: string;
  tastingId: number | null;
};

export type CompareFitDto = {
  slope: number;
  intercept: number;
  r: number | null;
  rSquared: number | null;
  slopeStandardError: number;
  slopeInterval95: [number, number];
};

export type CompareGroupDto = {
  group: string;
  label: string;
  n: number;
  mean: number;
  median: number;
  q1: number;
  q3: number;
  min: number;
  max: number;
};

export type CompareResultDto = {
  x: CompareParameterKey;
  y: CompareOutcomeKey;
  per: 'tasting' | 'journal';
  kind: 'numeric' | 'categorical';
  n: number;
  meaningful: boolean;
  /** Why the fit is not meaningful, in plain words, when it is not. */
  caution: string | null;
  points: ComparePointDto[];
  fit: CompareFitDto | null;
  groups: CompareGroupDto[];
};

export type SideBySideRowDto = {
  key: string;
  label: string;
  unit: string | null;
  kind: string;
  values: (number | string | null)[];
  differs: boolean;
};

export type SideBySideDto = {
  journals: { id: number; title: string; maker: string; style: string; makeDate: string }[];
  rows: SideBySideRowDto[];
  /** Mean overall liking per age band and journal (null where a journal has no tasting). */
  scoresByAge: { band: string; values: (number | null)[] }[];
};
