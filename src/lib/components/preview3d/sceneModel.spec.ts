import { describe, expect, it } from 'vitest';
import { computePlan, type PlanInput } from '$lib/plan';
import { rect, splitSquare } from '$lib/plan/test-plans';
import { M_PER_FT, M_PER_IN } from '$lib/plan/units';
import { buildScene, LABEL_CLEARANCE_M, LAWN_OVERLAP_M, spreadLabels, LINE_LIFT_M, signedArea, surfaceAt, type Prism } from './sceneModel';
import { prismTriangles, triangulate } from './meshes';

// A 3 × 2 m pad against a wall along y = 0, falling 2 % away from it.
const pad: PlanInput = {
	units: 'metric',
	sections: [{ outline: rect(0, 0, 3, 2) }],
	houseEdge: { section: 0, edge: 0 },
	gapToHouse: 12,
	slope: { fall: { value: 2, unit: 'percent' } },
	thickness: 100,
	forms: { lumber: '2x4', stakeSpacing: 0.9 }
};

// Two pours side by side, 22 × 14 ft, thickened on the open edges.
const patio: PlanInput = {
	units: 'imperial',
	sections: [{ outline: rect(0, 0, 12, 14) }, { outline: rect(12, 0, 10, 14) }],
	houseEdge: { section: 0, edge: 0 },
	otherHouseEdges: [{ section: 1, edge: 0 }],
	slope: { fall: { value: 2, unit: 'percent' } },
	thickness: 4,
	thickenedEdge: { edges: 'free', width: 8 }
};

// A freestanding L, wound clockwise, thickened all round (so one mitre is at a re-entrant corner).
const ell: PlanInput = {
	units: 'imperial',
	sections: [
		{
			outline: [
				[0, 0],
				[0, 16],
				[6, 16],
				[6, 6],
				[18, 6],
				[18, 0]
			]
		}
	],
	houseEdge: null,
	slope: { fall: { value: 0.25, unit: 'inPerFt' } },
	thickness: 4,
	thickenedEdge: { edges: 'free', width: 8, extraDepth: 6 }
};

/** Enclosed volume of a closed, outward-wound triangle soup (divergence theorem). */
function volumeOf(tri: number[]): number {
	let v = 0;
	for (let i = 0; i < tri.length; i += 9) {
		const [ax, ay, az, bx, by, bz, cx, cy, cz] = tri.slice(i, i + 9);
		v += ax * (by * cz - bz * cy) - ay * (bx * cz - bz * cx) + az * (bx * cy - by * cx);
	}
	return v / 6;
}

const depths = (p: Prism) => p.top.map((t, i) => t - p.bottom[i]);

describe('buildScene', () => {
	it('drops the top by fall × distance × exaggeration away from the high edge', () => {
		const result = computePlan(pad);
		for (const k of [1, 10]) {
			const scene = buildScene(result, { exaggeration: k });
			const { footprint, top } = scene.sections[0].solid;
			const high = Math.max(...top);
			footprint.forEach(([, y], i) => expect(high - top[i]).toBeCloseTo(0.02 * y * k, 9));
			expect(high - surfaceAt(scene.surface, [1.2, 1.5])).toBeCloseTo(0.02 * 1.5 * k, 9);
		}
	});

	it('keeps the true slab thickness, board depth and trench depth at any exaggeration', () => {
		for (const k of [1, 10]) {
			const scene = buildScene(computePlan(patio), { exaggeration: k });
			for (const s of scene.sections) depths(s.solid).forEach((d) => expect(d).toBeCloseTo(4 * M_PER_IN, 9));
			// A 2x4 dresses to 3½ in (DOC PS 20).
			for (const f of scene.forms) depths(f.solid).forEach((d) => expect(d).toBeCloseTo(3.5 * M_PER_IN, 9));
			// extraDepth defaults to the thickness.
			for (const t of scene.thickened) depths(t.solid).forEach((d) => expect(d).toBeCloseTo(4 * M_PER_IN, 9));
		}
	});

	it('encloses area × thickness of concrete in each section solid, L shape included', () => {
		const result = computePlan(ell);
		const scene = buildScene(result, { exaggeration: 10 });
		const vol = scene.sections.reduce((a, s) => a + volumeOf(prismTriangles(s.solid)), 0);
		expect(vol).toBeCloseTo(result.volume.slab.cubicMeters, 9);
	});

	it('lays thickened strips of the true width whose plan area is the engine trench area', () => {
		const result = computePlan(ell);
		const scene = buildScene(result);
		expect(scene.thickened).toHaveLength(6);
		const area = scene.thickened.reduce((a, t) => a + signedArea(t.solid.footprint), 0);
		expect(area).toBeCloseTo(result.volume.trenchArea.squareMeters, 9);
		for (const t of scene.thickened) depths(t.solid).forEach((d) => expect(d).toBeCloseTo(6 * M_PER_IN, 9));
		// Each strip's far side sits 8 in inside its edge: edge 0 runs along x = 0.
		const xs = scene.thickened.find((t) => t.edge === 0)!.solid.footprint.map((p) => p[0]);
		expect(Math.max(...xs)).toBeCloseTo(8 * M_PER_IN, 9);
	});

	it('places one stake per stake in the result, just below the top, as long as specified', () => {
		const result = computePlan(patio);
		const scene = buildScene(result, { exaggeration: 10 });
		expect(result.elevations.stakes.length).toBeGreaterThan(4);
		expect(scene.stakes.map((s) => s.id)).toEqual(result.elevations.stakes.map((s) => s.id));
		scene.stakes.forEach((s, i) => {
			const r = result.elevations.stakes[i];
			const at: [number, number] = [r.x * M_PER_FT, r.y * M_PER_FT];
			expect(s.solid.top[0]).toBeCloseTo(surfaceAt(scene.surface, at) - 0.01, 9);
			depths(s.solid).forEach((d) => expect(d).toBeCloseTo(result.forms.stakes.length.millimeters / 1000, 9));
		});
	});

	it('bounds the slab by its outline', () => {
		const scene = buildScene(computePlan(patio));
		expect(scene.bounds.min[0]).toBeCloseTo(0, 9);
		expect(scene.bounds.min[1]).toBeCloseTo(0, 9);
		expect(scene.bounds.max[0]).toBeCloseTo(22 * M_PER_FT, 9);
		expect(scene.bounds.max[1]).toBeCloseTo(14 * M_PER_FT, 9);
		expect(scene.ground.min[0]).toBeLessThan(scene.bounds.min[0]);
		expect(scene.ground.max[1]).toBeGreaterThan(scene.bounds.max[1]);
		// The lawn is banked to the board bottoms: boards stand on it, the slab top stays above it.
		const lawn = (p: readonly [number, number]) => surfaceAt(scene.surface, p) - scene.ground.below;
		for (const f of scene.forms) f.solid.footprint.forEach((p, i) => expect(f.solid.bottom[i] - lawn(p)).toBeCloseTo(-LAWN_OVERLAP_M, 9));
		for (const s of scene.sections) s.solid.footprint.forEach((p, i) => expect(s.solid.top[i]).toBeGreaterThan(lawn(p)));
	});

	it('steepens only the pitch: 10× shows ten times the drop, same high edge and labels', () => {
		const result = computePlan(pad);
		const one = buildScene(result, { exaggeration: 1 });
		const ten = buildScene(result, { exaggeration: 10 });
		const drop = (s: typeof one) => Math.max(...s.sections[0].solid.top) - Math.min(...s.sections[0].solid.top);
		expect(drop(one)).toBeCloseTo(result.elevations.totalDrop.millimeters / 1000, 9);
		expect(drop(ten)).toBeCloseTo(10 * drop(one), 9);
		expect(Math.max(...ten.sections[0].solid.top)).toBeCloseTo(Math.max(...one.sections[0].solid.top), 9);
		expect(ten.labels.map((l) => l.text)).toEqual(one.labels.map((l) => l.text));
		expect(one.labels.map((l) => l.text)).toEqual(['3 m', '2 m', '3 m', '2 m', 'House wall', 'Falls 2 % · 40 mm']);
	});

	it('draws control and cold joints on the top surface', () => {
		const result = computePlan(patio);
		const scene = buildScene(result, { exaggeration: 10 });
		const lines = result.joints.sections.flatMap((s) => s.lines);
		expect(lines.length).toBeGreaterThan(0);
		expect(scene.controlJoints).toHaveLength(lines.length);
		expect(scene.coldJoints).toHaveLength(1);
		for (const j of [...scene.controlJoints, ...scene.coldJoints, ...scene.thickenedLines, scene.fallArrow!])
			for (const p of [j.from, j.to]) expect(p[2]).toBeCloseTo(surfaceAt(scene.surface, [p[0], p[1]]) + LINE_LIFT_M, 9);
	});

	it('sets the house wall back from each house edge by the typed gap', () => {
		const scene = buildScene(computePlan(pad));
		expect(scene.house).toHaveLength(1);
		const ys = scene.house[0].footprint.map((p) => p[1]);
		expect(Math.max(...ys)).toBeCloseTo(-0.012, 9);
		expect(Math.min(...ys)).toBeCloseTo(-0.312, 9);
		const wide = buildScene(computePlan({ ...pad, gapToHouse: 40 })).house[0].footprint.map((p) => p[1]);
		expect(Math.max(...wide)).toBeCloseTo(-0.04, 9); // the typed 40 mm, not a default
		expect(Math.max(...scene.house[0].top)).toBeGreaterThan(scene.bounds.max[2]);
	});

	it('leaves the house edge unformed and forms the three open edges', () => {
		const result = computePlan(pad);
		const scene = buildScene(result);
		expect(scene.forms.map((f) => f.run)).toEqual(result.forms.runs.filter((r) => r.formed && r.kind === 'outer').map((r) => r.id));
		expect(scene.forms).toHaveLength(3);
		// Boards stand outside the slab: nothing of them is inside the 3 × 2 m outline.
		for (const f of scene.forms) for (const [x, y] of f.solid.footprint) expect(x <= 1e-9 || x >= 3 - 1e-9 || y <= 1e-9 || y >= 2 - 1e-9).toBe(true);
	});

	it('keeps labels apart: none within the clearance of another at the same height', () => {
		const small = computePlan({
			...pad,
			sections: [
				{
					outline: [
						[0, 0],
						[1, 0],
						[1, 0.8],
						[0, 0.8]
					]
				}
			]
		});
		for (const scene of [buildScene(small), buildScene(computePlan(patio)), buildScene(computePlan(pad))]) {
			const ls = scene.labels;
			for (let i = 0; i < ls.length; i++)
				for (let j = 0; j < i; j++) {
					const near = Math.hypot(ls[i].at[0] - ls[j].at[0], ls[i].at[1] - ls[j].at[1]) < LABEL_CLEARANCE_M;
					if (near) expect(Math.abs(ls[i].at[2] - ls[j].at[2])).toBeGreaterThanOrEqual(0.3 - 1e-9);
				}
		}
		// Two labels on one spot: the second is lifted.
		const pair = [
			{ text: 'a', at: [0, 0, 0] as const, kind: 'edge' as const },
			{ text: 'b', at: [0.1, 0, 0] as const, kind: 'edge' as const }
		];
		spreadLabels(pair);
		expect(pair[1].at[2]).toBeCloseTo(0.3, 9);
	});
});

describe('triangulate', () => {
	it('covers a counter-clockwise L exactly, every triangle wound as the outline', () => {
		const L: [number, number][] = [
			[0, 0],
			[18, 0],
			[18, 6],
			[6, 6],
			[6, 16],
			[0, 16]
		]; // 18·6 + 6·10 = 168
		const tris = triangulate(L);
		expect(tris).toHaveLength(L.length - 2); // a simple n-gon has n − 2 triangles
		const areas = tris.map((t) => signedArea(t.map((i) => L[i])));
		expect(areas.every((a) => a > 0)).toBe(true);
		expect(areas.reduce((a, b) => a + b, 0)).toBeCloseTo(168, 9);
	});
});

describe('a pour split inside one section', () => {
	it('builds the scene with bulkheads that lie on no edge', () => {
		const split = computePlan(splitSquare);
		expect(split.forms.runs.some((r) => r.edge === -1)).toBe(true);
		const scene = buildScene(split);
		expect(scene.stakes).toHaveLength(split.elevations.stakes.length);
	});
});
