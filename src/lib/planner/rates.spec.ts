import { describe, expect, it } from 'vitest';
import { convertRate, rateSpans, RateUnitSwitch } from './rates';
import { rectangle } from './shapes';

const plan = { sections: [{ outline: rectangle(20, 12) }], houseEdge: null, slope: { highEdge: undefined } } as never;

describe('changing the unit of a fall keeps the slope', () => {
	it('percent, in per ft and mm per m', () => {
		expect(convertRate({ value: 2, unit: 'percent' }, 'inPerFt', 12, 'imperial')).toEqual({ value: 0.24, unit: 'inPerFt' }); // 2 % × 12 in
		expect(convertRate({ value: 0.25, unit: 'inPerFt' }, 'percent', 12, 'imperial')).toEqual({ value: 2.08, unit: 'percent' }); // ¼ ÷ 12
		expect(convertRate({ value: 2, unit: 'percent' }, 'mmPerM', 3, 'metric')).toEqual({ value: 20, unit: 'mmPerM' });
	});

	it('a total drop spreads over the run across (fall) or along (cross fall) the high edge', () => {
		const s = rateSpans(plan);
		expect(s).toEqual({ across: 12, along: 20 }); // high edge A–B is the 20 ft side
		expect(convertRate({ value: 2, unit: 'percent' }, 'totalDrop', s.across, 'imperial')).toEqual({ value: 2.88, unit: 'totalDrop' }); // 0.02 × 144 in
		expect(convertRate({ value: 2.88, unit: 'totalDrop' }, 'percent', s.across, 'imperial')).toEqual({ value: 2, unit: 'percent' });
		expect(convertRate({ value: 60, unit: 'totalDrop' }, 'mmPerM', 3, 'metric')).toEqual({ value: 20, unit: 'mmPerM' });
	});

	it('switching back without an edit returns exactly what was typed', () => {
		const sw = new RateUnitSwitch();
		const a = sw.switch({ value: 0.3, unit: 'inPerFt' }, 'percent', 12, 'imperial');
		expect(a).toEqual({ value: 2.5, unit: 'percent' });
		const b = sw.switch(a, 'totalDrop', 12, 'imperial');
		expect(b).toEqual({ value: 3.6, unit: 'totalDrop' });
		expect(sw.switch(b, 'inPerFt', 12, 'imperial')).toEqual({ value: 0.3, unit: 'inPerFt' });
		const c = new RateUnitSwitch();
		const d = c.switch({ value: 0.13, unit: 'inPerFt' }, 'percent', 12, 'imperial');
		expect(d.value).toBe(1.08);
		expect(c.switch({ value: 1.5, unit: 'percent' }, 'inPerFt', 12, 'imperial')).toEqual({ value: 0.18, unit: 'inPerFt' }); // edited: converted, not restored
	});
});
