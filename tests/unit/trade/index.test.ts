import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import * as trade from '../../../shared/trade';
import * as aging from '../../../shared/trade/aging';
import * as format from '../../../shared/trade/format';
import * as milk from '../../../shared/trade/milk';
import * as moisture from '../../../shared/trade/moisture';
import * as pressure from '../../../shared/trade/pressure';
import * as ramp from '../../../shared/trade/ramp';
import * as salt from '../../../shared/trade/salt';
import * as scaling from '../../../shared/trade/scaling';
import * as standards from '../../../shared/trade/standards';
import * as stats from '../../../shared/trade/stats';
import * as time from '../../../shared/trade/time';
import * as units from '../../../shared/trade/units';
import * as yieldModule from '../../../shared/trade/yield';

describe('the trade library index', () => {
  it('re-exports every module, with no name lost to a clash', () => {
    const modules = [
      aging,
      format,
      milk,
      moisture,
      pressure,
      ramp,
      salt,
      scaling,
      standards,
      stats,
      time,
      units,
      yieldModule,
    ];
    for (const mod of modules) {
      for (const [name, value] of Object.entries(mod)) {
        expect(trade[name as keyof typeof trade], name).toBe(value);
      }
    }
  });

  it('unit key arrays work as zod enums for schemas elsewhere', () => {
    const amount = z.object({ value: z.number(), unit: z.enum(trade.AMOUNT_UNITS) });
    expect(amount.parse({ value: 4, unit: 'drop' })).toEqual({ value: 4, unit: 'drop' });
    expect(amount.safeParse({ value: 1, unit: 'pinch' }).success).toBe(false);
    expect(z.enum(trade.UNIT_SYSTEMS).parse('us')).toBe('us');
    expect(z.enum(trade.MILK_SPECIES).parse('goat')).toBe('goat');
    expect(z.enum(trade.MOULD_SHAPES).parse('round')).toBe('round');
  });

  it('preferred units of each system are valid unit keys (metric: SI; us: US customary)', () => {
    for (const system of trade.UNIT_SYSTEMS) {
      const p = trade.PREFERRED_UNITS[system];
      expect(trade.VOLUME_UNITS).toContain(p.milk);
      expect(trade.MASS_UNITS).toContain(p.cheese);
      expect(trade.TEMPERATURE_UNITS).toContain(p.temperature);
      expect(trade.LENGTH_UNITS).toContain(p.mould);
      expect(trade.FORCE_UNITS).toContain(p.load);
      expect(trade.PRESSURE_UNITS).toContain(p.pressure);
    }
    for (const unit of [...trade.AMOUNT_UNITS, ...trade.FORCE_UNITS, ...trade.PRESSURE_UNITS]) {
      expect(trade.UNIT_SYMBOLS[unit], unit).toBeTruthy();
    }
  });
});
