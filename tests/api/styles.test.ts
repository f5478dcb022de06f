import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { STYLE_FAMILIES } from '../../shared/constants/styles';
import { createTestApp, type TestApp } from '../support/app';

describe('GET /api/styles', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('lists at least 25 seeded styles, each with a known family', async () => {
    const res = await request(t.app).get('/api/styles').expect(200);
    expect(res.body.styles.length).toBeGreaterThanOrEqual(25);
    for (const style of res.body.styles) {
      expect(STYLE_FAMILIES).toContain(style.family);
      expect(style.typicalAgingDays.min).toBeLessThanOrEqual(style.typicalAgingDays.max);
    }
    expect(res.body.styles.map((s: { slug: string }) => s.slug)).toContain('cheddar');
  });
});
