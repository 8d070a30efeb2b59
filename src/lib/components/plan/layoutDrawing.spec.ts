import { describe, expect, it } from 'vitest';
import { computePlan } from '$lib/plan';
import { layoutSheet } from '$lib/plan/layout-sheet';
import { buildCardItems } from './buildCard';
import { layoutDrawing } from './layoutDrawing';

const twoPours = computePlan({ units: 'metric', sections: [{ outline: [[0, 0], [2, 0], [2, 3], [0, 3]] }, { outline: [[2, 0], [4, 0], [4, 3], [2, 3]] }] });

describe('layout drawing', () => {
	it('fits the slab in the box at one scale and keeps its proportions', () => {
		const d = layoutDrawing(twoPours, layoutSheet(twoPours), { width: 500, height: 500 });
		const xs = d.slabs.flat().map((p) => p[0]);
		const ys = d.slabs.flat().map((p) => p[1]);
		// 4 m wide, 3 m deep: the drawn box keeps 4 : 3.
		expect((Math.max(...xs) - Math.min(...xs)) / (Math.max(...ys) - Math.min(...ys))).toBeCloseTo(4 / 3, 9);
		expect(Math.max(...xs)).toBeLessThanOrEqual(d.width);
		expect(Math.max(...ys)).toBeLessThanOrEqual(d.height);
	});

	it('names every stake and board, the cold joint, and a shared corner once for both pours', () => {
		const sheet = layoutSheet(twoPours);
		const d = layoutDrawing(twoPours, sheet, { width: 500, height: 400 });
		const texts = (kind: string) => d.labels.filter((l) => l.kind === kind).map((l) => l.text);
		expect(texts('stake').sort()).toEqual(twoPours.elevations.stakes.map((s) => s.id).sort());
		expect(texts('board')).toEqual(twoPours.forms.runs.filter((r) => r.formed && r.kind !== 'bulkhead').map((r) => r.id));
		expect(texts('corner')).toEqual(expect.arrayContaining(['1A', '1B/2A', '1C/2D', '2B', '2C', '1D']));
		expect(d.coldJoints).toHaveLength(1);
		expect(d.diagonals).toHaveLength(4); // two per four-cornered pour
		expect(d.house).toHaveLength(1); // the default house edge, section 1 edge A–B
	});
});

describe("a freestanding pad's high edge", () => {
	// A 4 × 3 m shed pad, freestanding, high along edge C–D (vertex 2 to 3, the back).
	const pad = computePlan({ units: 'metric', sections: [{ outline: [[0, 0], [4, 0], [4, 3], [0, 3]] }], houseEdge: null, slope: { highEdge: { section: 0, edge: 2 } } });
	const alongHouse = computePlan({ units: 'metric', sections: [{ outline: [[0, 0], [4, 0], [4, 3], [0, 3]] }], slope: { highEdge: { section: 0, edge: 2 } } });

	it('is drawn on the layout sheet along that edge, with its name', () => {
		const sheet = layoutSheet(pad);
		expect(sheet.highEdge).toBe('C–D');
		const d = layoutDrawing(pad, sheet, { width: 500, height: 400 });
		const [c, dd] = [d.slabs[0][2], d.slabs[0][3]];
		expect(d.high).toEqual({ from: c, to: dd });
		expect(d.labels.filter((l) => l.kind === 'high').map((l) => l.text)).toEqual(['HIGH SIDE']);
		// The label sits outside the slab, beyond the high edge (y grows down the page).
		expect(d.labels.find((l) => l.kind === 'high')!.at[1]).toBeGreaterThan(c[1]);
	});

	it('is named in the build card', () => {
		const item = buildCardItems(pad).find((i) => i.label === 'High side');
		expect(item?.value).toBe('edge C–D');
	});

	it('along a house, the wall is the high side and no other edge is marked', () => {
		const sheet = layoutSheet(alongHouse);
		expect(sheet.highEdge).toBeNull();
		expect(layoutDrawing(alongHouse, sheet, { width: 500, height: 400 }).high).toBeNull();
		expect(buildCardItems(alongHouse).map((i) => i.label)).not.toContain('High side');
	});
});

describe('a pour split inside one section', () => {
	// 6 × 6 ft at 70 °F: more bags than the default crew places before the mix stiffens, so the engine
	// splits the section with bulkheads that lie on no edge of the outline (edge −1).
	const split = computePlan({ units: 'imperial', sections: [{ outline: [[0, 0], [6, 0], [6, 6], [0, 6]] }], conditions: { airTemp: 70 } });

	it('draws its bulkheads and names every stake', () => {
		expect(split.forms.runs.some((r) => r.kind === 'bulkhead' && r.edge === -1)).toBe(true);
		const d = layoutDrawing(split, layoutSheet(split), { width: 500, height: 500 });
		const stakes = d.labels.filter((l) => l.kind === 'stake');
		expect(stakes.map((l) => l.text).sort()).toEqual(split.elevations.stakes.map((s) => s.id).sort());
		expect(stakes.every((l) => l.at.every(Number.isFinite))).toBe(true);
	});
});
