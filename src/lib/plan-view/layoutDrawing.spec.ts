import { describe, expect, it } from 'vitest';
import { computePlan } from '$lib/plan';
import { layoutSheet } from '$lib/plan/layout-sheet';
import { buildCardItems } from './buildCard';
import { LABEL_SIZE, labelBox, layoutDrawing, PHONE_LABEL_SIZE, SCREEN_LABEL_SIZE, type LayoutDrawing } from './layoutDrawing';
import demoPlans from '../../../fixtures/demo-plans.json' with { type: 'json' };
import { cornerEll, rect, splitSquare } from '$lib/plan/test-plans';

const twoPours = computePlan({
	units: 'metric',
	sections: [
		{
			outline: [
				[0, 0],
				[2, 0],
				[2, 3],
				[0, 3]
			]
		},
		{
			outline: [
				[2, 0],
				[4, 0],
				[4, 3],
				[2, 3]
			]
		}
	]
});

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
		expect(texts('board')).toEqual(twoPours.forms.runs.filter((r) => r.formed).map((r) => r.id)); // the bulkhead too, as the cut list names it
		expect(texts('corner')).toEqual(expect.arrayContaining(['1A', '1B/2A', '1C/2D', '2B', '2C', '1D']));
		expect(d.coldJoints).toHaveLength(1);
		expect(d.diagonals).toHaveLength(4); // two per four-cornered pour
		expect(d.house).toHaveLength(1); // the default house edge, section 1 edge A–B
	});
});

describe("a freestanding pad's high edge", () => {
	// A 4 × 3 m shed pad, freestanding, high along edge C–D (vertex 2 to 3, the back).
	const pad = computePlan({
		units: 'metric',
		sections: [{ outline: rect(0, 0, 4, 3) }],
		houseEdge: null,
		slope: { highEdge: { section: 0, edge: 2 } }
	});
	const alongHouse = computePlan({
		units: 'metric',
		sections: [{ outline: rect(0, 0, 4, 3) }],
		slope: { highEdge: { section: 0, edge: 2 } }
	});

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
	const split = computePlan(splitSquare);

	it('draws its bulkheads and names every stake', () => {
		expect(split.forms.runs.some((r) => r.kind === 'bulkhead' && r.edge === -1)).toBe(true);
		const d = layoutDrawing(split, layoutSheet(split), { width: 500, height: 500 });
		const stakes = d.labels.filter((l) => l.kind === 'stake');
		expect(stakes.map((l) => l.text).sort()).toEqual(split.elevations.stakes.map((s) => s.id).sort());
		expect(stakes.every((l) => l.at.every(Number.isFinite))).toBe(true);
		// Each bulkhead inside the pour is drawn (as a cold joint) and carries its board id, so its stakes stand on a line.
		const inside = split.forms.runs.filter((r) => r.kind === 'bulkhead' && r.edge === -1);
		expect(d.coldJoints).toHaveLength(inside.length + split.geometry.coldJoints.length);
		const boards = d.labels.filter((l) => l.kind === 'board').map((l) => l.text);
		for (const run of inside) expect(boards).toContain(run.id);
	});
});

/** Whether segment a–b crosses box r: either end inside, or it cuts one of the box's sides. */
function crosses(a: readonly number[], b: readonly number[], r: { x0: number; y0: number; x1: number; y1: number }) {
	const inside = (p: readonly number[]) => p[0] > r.x0 && p[0] < r.x1 && p[1] > r.y0 && p[1] < r.y1;
	if (inside(a) || inside(b)) return true;
	const cut = (p: readonly number[], q: readonly number[], c: readonly number[], d: readonly number[]) => {
		const o = (u: readonly number[], v: readonly number[], w: readonly number[]) => Math.sign((v[0] - u[0]) * (w[1] - u[1]) - (v[1] - u[1]) * (w[0] - u[0]));
		return o(p, q, c) !== o(p, q, d) && o(c, d, p) !== o(c, d, q);
	};
	const [tl, tr, br, bl] = [
		[r.x0, r.y0],
		[r.x1, r.y0],
		[r.x1, r.y1],
		[r.x0, r.y1]
	];
	return cut(a, b, tl, tr) || cut(a, b, tr, br) || cut(a, b, br, bl) || cut(a, b, bl, tl);
}

/** Every clash in a drawing: a label on a drawn line, a stake, the start circle or another label. */
function clashes(d: LayoutDrawing): string[] {
	const lines = [
		...d.slabs.flatMap((o) => o.map((p, i) => ({ from: p, to: o[(i + 1) % o.length] }))),
		...d.house,
		...d.joints,
		...d.coldJoints,
		...d.diagonals,
		...(d.high ? [d.high] : [])
	];
	const boxes = d.labels.map((l) => ({ l, b: labelBox(l, d.labelSize) }));
	const out: string[] = [];
	for (const [i, { l, b }] of boxes.entries()) {
		if (lines.some((s) => crosses(s.from, s.to, b))) out.push(`${l.kind} ${l.text} on a line`);
		if (d.stakes.some((s) => s.at[0] > b.x0 - 2.5 && s.at[0] < b.x1 + 2.5 && s.at[1] > b.y0 - 2.5 && s.at[1] < b.y1 + 2.5))
			out.push(`${l.kind} ${l.text} on a stake`);
		if (d.start && d.start[0] > b.x0 - 8 && d.start[0] < b.x1 + 8 && d.start[1] > b.y0 - 8 && d.start[1] < b.y1 + 8)
			out.push(`${l.kind} ${l.text} on the start circle`);
		for (const o of boxes.slice(i + 1))
			if (b.x0 < o.b.x1 && o.b.x0 < b.x1 && b.y0 < o.b.y1 && o.b.y0 < b.y1) out.push(`${l.kind} ${l.text} on ${o.l.kind} ${o.l.text}`);
		if (b.x0 < 0 || b.y0 < 0 || b.x1 > d.width || b.y1 > d.height) out.push(`${l.kind} ${l.text} outside the drawing`);
	}
	return out;
}

describe('labels keep clear of each other and of the drawing', () => {
	const plans = [
		...demoPlans.plans.map((p) => [p.id, computePlan(p.input as never)] as const),
		['L around a house corner', computePlan(cornerEll)] as const,
		['two pours', twoPours] as const
	];
	// The PDF's box (a Letter page less its margins), the print copy's, and the plan page's at a
	// desktop's 768 px and a phone's 310 px column, where labels are drawn at screen sizes.
	for (const [name, plan] of plans)
		for (const box of [
			{ width: 504, height: 300 },
			{ width: 480, height: 360 },
			{ width: 768, height: 576, labelSize: SCREEN_LABEL_SIZE },
			{ width: 310, height: 465, labelSize: PHONE_LABEL_SIZE }
		])
			it(`${name}, ${box.width} × ${box.height}${box.labelSize ? ', screen labels' : ''}`, () => {
				const d = layoutDrawing(plan, layoutSheet(plan), box);
				expect(d.labels.length).toBeGreaterThan(8);
				expect(clashes(d)).toEqual([]);
			});
});

describe('label sizes', () => {
	it('draws stake ids at 12 units on screen (1 unit = 1 CSS px there) and at the paper sizes elsewhere', () => {
		const plan = computePlan(cornerEll);
		const screen = layoutDrawing(plan, layoutSheet(plan), { width: 768, height: 576, labelSize: SCREEN_LABEL_SIZE });
		expect(screen.labelSize.stake).toBe(12);
		expect(Math.min(...Object.values(screen.labelSize))).toBeGreaterThanOrEqual(12);
		// Larger labels leave a larger margin: the slab is drawn smaller in the same box.
		const paper = layoutDrawing(plan, layoutSheet(plan), { width: 768, height: 576 });
		expect(paper.labelSize).toEqual(LABEL_SIZE);
		expect(screen.scale).toBeLessThan(paper.scale);
	});
});
