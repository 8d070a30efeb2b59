import { describe, expect, it } from 'vitest';
import { computePlan } from '$lib/plan';
import { rect } from '$lib/plan/test-plans';
import { buildCardItems } from './buildCard';

describe('the build card', () => {
	it('digs the thickened edges to slab plus trench, with no base under them, as the materials list says', () => {
		const r = computePlan({
			units: 'imperial',
			sections: [{ outline: rect(0, 0, 12, 10) }],
			thickness: 4,
			base: { depth: 4 },
			thickenedEdge: { edges: 'free', width: 12, extraDepth: 4 }
		});
		const row = buildCardItems(r).find((x) => x.label === 'Dig at thickened edges')!;
		expect(row.value).toBe('8 in'); // 4 in slab + 4 in trench, no base
		expect(row.note).toMatch(/no base under it/);
		expect(row.note).not.toMatch(/with base under it/);
		expect(r.volume.base.note).toMatch(/No base under the thickened edges/);
	});

	it('gives a joint depth only when joints are cut: a pad small enough for none says so without one', () => {
		const small = buildCardItems(computePlan({ units: 'imperial', sections: [{ outline: rect(0, 0, 12, 8) }], thickness: 4 })).find(
			(x) => x.label === 'Control joints'
		)!;
		expect(small.value).toBe('none needed');
		expect(small.note).not.toMatch(/deep|sawn|tooled/);
		expect(small.note).toContain('small enough to need none');
		const large = buildCardItems(computePlan({ units: 'imperial', sections: [{ outline: rect(0, 0, 30, 20) }], thickness: 4 })).find(
			(x) => x.label === 'Control joints'
		)!;
		expect(large.value).toMatch(/^at most .* apart$/);
		expect(large.note).toMatch(/deep, (sawn|tooled)$/);
	});
});
