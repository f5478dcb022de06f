import { describe, expect, it } from 'vitest';
import { decideRamp, rampApplies } from '../../../client/lib/vat/ramp';
import { DEFAULT_RAMP_LIMIT_C_PER_5_MIN } from '../../../shared/trade';

const at = (minute: number) =>
  new Date(Date.UTC(2026, 2, 14, 10, 0) + minute * 60_000).toISOString();
const r = (minute: number, tempC: number | null, stepIndex: number | null = 4) => ({
  takenAt: at(minute),
  tempC,
  stepIndex,
});
const cooking = { stepIndex: 4, stepKind: 'cooking' as const };

describe('the heating-ramp warning', () => {
  it('is watched only while warming the milk or cooking the curd', () => {
    expect(rampApplies('cooking')).toBe(true);
    expect(rampApplies('warming')).toBe(true);
    expect(rampApplies('cheddaring')).toBe(false);
    expect(rampApplies(null)).toBe(false);
    const fast = [r(0, 31), r(5, 35), r(10, 39)];
    expect(decideRamp(fast, { stepIndex: 4, stepKind: 'pressing' }).level).toBe('off');
    expect(decideRamp(fast, { stepIndex: null, stepKind: 'cooking' }).level).toBe('off');
  });

  it('uses the common-practice limit of 2 °F per 5 minutes by default', () => {
    const d = decideRamp([r(0, 31), r(5, 32)], cooking);
    expect(d.limitCPer5Min).toBeCloseTo(DEFAULT_RAMP_LIMIT_C_PER_5_MIN, 12);
    expect(d.limitCPer5Min).toBeCloseTo(10 / 9, 12);
    expect(d.level).toBe('ok');
    expect(d.rateCPer5Min).toBeCloseTo(1, 9);
  });

  it('warns when the heat comes up too fast and shows the rate', () => {
    const d = decideRamp([r(0, 31), r(5, 33), r(10, 35)], cooking);
    expect(d.level).toBe('too-fast');
    expect(d.rateCPer5Min).toBeCloseTo(2, 9);
    expect(d.fastestCPer5Min).toBeCloseTo(2, 9);
    expect(d.count).toBe(3);
  });

  it('does not warn for a ramp exactly at the limit (2 °F in 5 min)', () => {
    const limit = 10 / 9;
    const d = decideRamp([r(0, 31), r(5, 31 + limit), r(10, 31 + 2 * limit)], cooking);
    expect(d.level).toBe('ok');
  });

  it('says when it ran too fast earlier though it is fine now', () => {
    const d = decideRamp([r(0, 31), r(5, 34), r(10, 34.5), r(15, 35)], cooking);
    expect(d.level).toBe('ok');
    expect(d.exceededEarlier).toBe(true);
    expect(d.fastestCPer5Min).toBeCloseTo(3, 9);
  });

  it('counts only the current step and only temperatures', () => {
    const d = decideRamp(
      [r(0, 20, 1), r(5, 31), r(6, null), r(10, 31.5), r(12, 45, 5), r(15, 32)],
      cooking,
    );
    expect(d.count).toBe(3);
    expect(d.level).toBe('ok');
    expect(d.rateCPer5Min).toBeCloseTo(0.5, 9);
  });

  it('waits for two readings at least a minute apart before giving a rate', () => {
    expect(decideRamp([], cooking).level).toBe('waiting');
    expect(decideRamp([r(0, 31)], cooking)).toMatchObject({ level: 'waiting', count: 1 });
    // A thermometer wobble over 20 seconds is no runaway ramp.
    expect(decideRamp([r(0, 31), r(1 / 3, 31.3)], cooking).level).toBe('waiting');
    expect(decideRamp([r(0, 31), r(1, 33)], cooking).level).toBe('too-fast');
  });

  it('follows a limit the maker sets', () => {
    const readings = [r(0, 31), r(5, 32.5)];
    expect(decideRamp(readings, cooking).level).toBe('too-fast');
    expect(decideRamp(readings, { ...cooking, limitCPer5Min: 2 }).level).toBe('ok');
  });
});
