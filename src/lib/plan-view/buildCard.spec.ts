import { describe, expect, it } from 'vitest';
import { computePlan } from '$lib/plan';
import { rect } from '$lib/plan/test-plans';
import { buildCardItems } from './buildCard';

describe('the build card', () => {
	it('digs the thickened edges to slab plus trench, with no base under them, as the materials list says', () => {
		const r = computePlan({ units: 'imperial', sections: [{ outline: rect(0, 0, 12, 10) }], thickness: 4, base: { depth: 4 }, thickenedEdge: { edges: 'free', width: 12, extraDepth: 4 } });
		const row = buildCardItems(r).find((x) => x.label === 'Dig at thickened edges')!;
		expect(row.value).toBe('8 in'); // 4 in slab + 4 in trench, no base
		expect(row.note).toMatch(/no base under it/);
		expect(row.note).not.toMatch(/with base under it/);
		expect(r.volume.base.note).toMatch(/No base under the thickened edges/);
	});
});
