// The press schedule at the vat: each stage's load, time and the pressure it puts on the
// curd for the journal's mould (pressure = load / face area, worked out by shared/trade).

import type { MouldFace } from '@shared/trade';
import { pressSchedulePressures } from '@shared/trade';

export interface MouldSize {
  shape: 'round' | 'rectangular';
  diameterMm: number | null;
  lengthMm: number | null;
  widthMm: number | null;
}

/** The mould face the pressure formula needs, or null when the journal lacks its size. */
export function faceOfMould(mould: MouldSize): MouldFace | null {
  if (mould.shape === 'round') {
    return mould.diameterMm && mould.diameterMm > 0
      ? { shape: 'round', diameterMm: mould.diameterMm }
      : null;
  }
  return mould.lengthMm && mould.widthMm && mould.lengthMm > 0 && mould.widthMm > 0
    ? { shape: 'rectangular', lengthMm: mould.lengthMm, widthMm: mould.widthMm }
    : null;
}

export interface PressRow {
  stage: number;
  loadN: number;
  minutes: number;
  /** pressure on the curd, or null when the mould size is unknown */
  kPa: number | null;
  psi: number | null;
}

/** Returns the press stages with their pressure on the curd (kPa and psi) where known. */
export function pressRows(
  stages: readonly { loadN: number; minutes: number }[],
  mould: MouldSize,
): PressRow[] {
  const face = faceOfMould(mould);
  if (!face) {
    return stages.map((s, i) => ({
      stage: i + 1,
      loadN: s.loadN,
      minutes: s.minutes,
      kPa: null,
      psi: null,
    }));
  }
  return pressSchedulePressures(stages, face).map((p) => ({
    stage: p.stage,
    loadN: p.loadN,
    minutes: p.minutes,
    kPa: p.kPa,
    psi: p.psi,
  }));
}
