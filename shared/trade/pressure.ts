// Pressure on the curd: the press load spread over the face of the mould (the follower).
// pressure = force / area (the definition of pressure; SI: 1 Pa = 1 N/m²).

import { fromKilopascals } from './units';

/** The face of a mould: round by its inside diameter, square or loaf-shaped by its sides. */
export type MouldFace =
  | { shape: 'round'; diameterMm: number }
  | { shape: 'rectangular'; widthMm: number; lengthMm: number };

export const MOULD_SHAPES = ['round', 'rectangular'] as const;

function assertLength(mm: number, what: string): void {
  if (!Number.isFinite(mm) || mm <= 0) throw new RangeError(`${what} must be a positive length`);
}

/** Returns the area of a mould face in m² (circle π d²/4, rectangle w × l; geometry). */
export function mouldFaceAreaM2(face: MouldFace): number {
  if (face.shape === 'round') {
    assertLength(face.diameterMm, 'Mould diameter');
    const d = face.diameterMm / 1000;
    return (Math.PI * d * d) / 4;
  }
  if (face.shape === 'rectangular') {
    assertLength(face.widthMm, 'Mould width');
    assertLength(face.lengthMm, 'Mould length');
    return (face.widthMm / 1000) * (face.lengthMm / 1000);
  }
  throw new RangeError('Unknown mould shape');
}

/** Returns the pressure on the curd in kPa from a load in newtons (force / area; SI definition). */
export function curdPressureKPa(loadN: number, face: MouldFace): number {
  if (!Number.isFinite(loadN) || loadN < 0) throw new RangeError('Load must be non-negative');
  return loadN / mouldFaceAreaM2(face) / 1000;
}

/** Pressure in both units members read. */
export interface CurdPressure {
  kPa: number;
  psi: number;
}

/** Returns the pressure on the curd in kPa and psi (force / area; NIST SP 811 for psi). */
export function curdPressure(loadN: number, face: MouldFace): CurdPressure {
  const kPa = curdPressureKPa(loadN, face);
  return { kPa, psi: fromKilopascals(kPa, 'psi') };
}

/** One stage of a press schedule: a load held for a time. */
export interface PressStage {
  loadN: number;
  minutes: number;
}

export interface PressStagePressure extends CurdPressure {
  stage: number;
  loadN: number;
  minutes: number;
  /** minutes from the start of pressing to the start and end of this stage */
  startMinute: number;
  endMinute: number;
}

/** Returns each press stage with its pressure (kPa, psi) and start/end minute (force / area). */
export function pressSchedulePressures(
  stages: readonly PressStage[],
  face: MouldFace,
): PressStagePressure[] {
  let elapsed = 0;
  return stages.map((s, i) => {
    if (!Number.isFinite(s.minutes) || s.minutes < 0) {
      throw new RangeError('Stage duration must be non-negative');
    }
    const startMinute = elapsed;
    elapsed += s.minutes;
    return {
      stage: i + 1,
      loadN: s.loadN,
      minutes: s.minutes,
      startMinute,
      endMinute: elapsed,
      ...curdPressure(s.loadN, face),
    };
  });
}
