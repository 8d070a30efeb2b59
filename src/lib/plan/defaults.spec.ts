import { describe, expect, it } from 'vitest';
import { COMMON, DEFAULTS } from './defaults';

describe('defaults follow the published rules', () => {
	it('meets the code minimums', () => {
		expect(DEFAULTS.imperial.thickness).toBeGreaterThanOrEqual(3.5); // IRC R506.1
		expect(DEFAULTS.metric.thickness).toBeGreaterThanOrEqual(89); // IRC R506.1, 3½ in = 88.9 mm
		expect(DEFAULTS.imperial.baseDepth).toBe(4); // IRC R506.2.2
		expect(COMMON.slopePercent).toBe(2); // IRC R401.3
	});

	it('stays inside the common-practice ranges', () => {
		expect(COMMON.wastePercent).toBeGreaterThanOrEqual(5); // common practice, 5–10 %
		expect(COMMON.wastePercent).toBeLessThanOrEqual(10); // common practice, 5–10 %
		expect(COMMON.baseBulking).toBeGreaterThanOrEqual(1.15); // common practice, 1.15–1.30
		expect(COMMON.baseBulking).toBeLessThanOrEqual(1.3); // common practice, 1.15–1.30
		expect(COMMON.dryMixLbPerFt3).toBeCloseTo(133.33, 2); // common practice, 80 lb / 0.60 ft³
		expect(COMMON.handMixMinutesPer80lb).toBeLessThanOrEqual(8); // common practice, 5–8 min
		expect(COMMON.drumBatch80lbBags).toBe(2); // common practice, two 80 lb bags a batch
		expect(COMMON.vehiclePercent).toBe(70); // common practice, ~70 % of design strength
		expect(DEFAULTS.imperial.stakeSpacing).toBeLessThanOrEqual(4); // common practice, 3–4 ft
	});
});
