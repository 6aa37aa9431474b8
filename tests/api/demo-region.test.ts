/** Plumbing checks of the demo generator (invented data: not a correctness reference). */
import { DEMO_DISTRICTS, generateDemoRegion } from '../../api/demo/generate';

describe('demo region generator', () => {
  it('is deterministic for a seed and changes with the seed', () => {
    expect(generateDemoRegion()).toEqual(generateDemoRegion());
    expect(generateDemoRegion(1).observations[0].value).not.toBe(generateDemoRegion(2).observations[0].value);
  });

  it('covers every shape, a short series and gap years', () => {
    const shapes = new Set(DEMO_DISTRICTS.map((d) => d.shape));
    expect([...shapes].sort()).toEqual(['decreasing', 'flat', 'increasing', 'inverted_u', 'turn_beyond_range', 'u']);
    expect(DEMO_DISTRICTS.some((d) => (d.firstYear ?? 1995) >= 2015)).toBe(true);
    expect(DEMO_DISTRICTS.some((d) => (d.missingYears ?? []).length > 0)).toBe(true);
    expect(DEMO_DISTRICTS.length).toBeGreaterThanOrEqual(20);
  });

  it('writes only positive, finite values', () => {
    for (const o of generateDemoRegion().observations) {
      expect(Number.isFinite(o.value)).toBe(true);
      expect(o.value).toBeGreaterThan(0);
    }
  });
});
