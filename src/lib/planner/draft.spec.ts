import { beforeAll, describe, expect, it } from 'vitest';
import { computePlan } from '$lib/plan';
import { completeInput, PlanDraft, starterInput, type DraftData } from './draft.svelte';
import { editableCopy, overlay, sameData } from './editable';
import { EditHistory } from './history.svelte';
import { detectPreset, presetCrossFall, presetHouse, presetOutline, presetProblem } from './presets';
import { lShape } from './shapes';
import { loadEngine } from './engine.svelte';

// The wizard loads the engine after its first paint; these specs use it loaded.
beforeAll(() => loadEngine());

/** Every object and array reachable from v, v included. */
function objects(v: unknown, out: object[] = []): object[] {
	if (v !== null && typeof v === 'object') {
		out.push(v);
		for (const x of Object.values(v)) objects(x, out);
	}
	return out;
}

describe('the plan the wizard edits', () => {
	it('is a deep copy with nothing frozen, so every field can be written', () => {
		for (const input of [
			starterInput('imperial'),
			starterInput('metric'),
			completeInput({ units: 'imperial', sections: [{ outline: lShape(16, 12, 6, 5) }] })!
		]) {
			const all = objects(input);
			expect(all.length).toBeGreaterThan(20);
			expect(all.filter((o) => Object.isFrozen(o) || !Object.isExtensible(o))).toEqual([]);
			// The fields that threw on a new plan: fall, cross fall, bag prices.
			input.slope.fall.value = 0.25;
			input.slope.fall.unit = 'inPerFt';
			input.slope.crossFall.value = 1;
			input.bags.offered[0].price = 6.5;
			expect(input.slope.fall).toEqual({ value: 0.25, unit: 'inPerFt' });
		}
		// Two new plans share no object.
		const a = objects(starterInput());
		const b = new Set(objects(starterInput()));
		expect(a.some((o) => b.has(o))).toBe(false);
	});

	it('a fall of ¼ in per ft on the starter’s 10 ft run is 2.08 % and 2.5 in', () => {
		const input = starterInput();
		input.slope.fall = { value: 0.25, unit: 'inPerFt' };
		const r = computePlan(input);
		expect(r.elevations.steepest.percent).toBeCloseTo((0.25 / 12) * 100, 6); // ¼ in ÷ 12 in = 2.083 % (definition of percent grade)
		expect(r.elevations.totalDrop.inches).toBeCloseTo(2.5, 6); // 10 ft × ¼ in/ft
	});

	it('editableCopy copies frozen data and sameData ignores absent keys', () => {
		const frozen: { a: number[]; b: { c: number } } = Object.freeze({ a: Object.freeze([1, 2]) as number[], b: Object.freeze({ c: 3 }) });
		const copy = editableCopy(frozen);
		copy.b.c = 4;
		expect(copy).toEqual({ a: [1, 2], b: { c: 4 } });
		expect(sameData({ a: 1, b: undefined }, { a: 1 })).toBe(true);
		expect(sameData({ a: [1, 2] }, { a: [1, 2, 3] })).toBe(false);
	});

	it('overlay keeps what was typed, out of range or emptied, and fills what a damaged draft lacks', () => {
		const starter = starterInput();
		const typed = editableCopy(starter);
		typed.units = 'metric';
		typed.thickness = 9000; // out of range: the engine refuses it
		(typed.crew as { people: unknown }).people = null; // an emptied number field
		typed.sections.push({
			outline: [
				[0, 0],
				[5, 0],
				[5, 2],
				[3, 2],
				[3, 4],
				[0, 4]
			]
		});
		expect(completeInput(typed)).toBeNull();
		expect(overlay(starter, typed)).toEqual(typed);
		// A draft that lost a whole part, or holds text where a number goes, gets the template's.
		const damaged = editableCopy(typed) as Record<string, unknown>;
		delete damaged.crew;
		damaged.wastePercent = 'ten';
		(damaged.sections as { outline: unknown }[])[1].outline = 'square';
		const mended = overlay(starter, damaged);
		expect(mended.crew).toEqual(starter.crew);
		expect(mended.wastePercent).toBe(starter.wastePercent);
		expect(mended.sections[1].outline).toEqual(starter.sections[0].outline);
		expect(mended.thickness).toBe(9000);
		expect(overlay(starter, 'not a plan')).toEqual(starter);
	});
});

describe('edit history', () => {
	it('undoes and redoes, merges quick edits, and drops redo after a new edit', () => {
		const h = new EditHistory('a', { quietMs: 500 });
		expect(h.canUndo).toBe(false);
		h.record('b', 1000);
		h.record('bc', 1200); // typing on: the same step
		h.record('bcd', 2000); // a pause: a new step
		expect(h.undo()).toBe('bc');
		expect(h.undo()).toBe('a');
		expect(h.canUndo).toBe(false);
		expect(h.redo()).toBe('bc');
		h.record('x', 5000);
		expect(h.canRedo).toBe(false);
		expect(h.undo()).toBe('bc');
		h.record('bc', 6000); // the restored snapshot is not a new step
		expect(h.canRedo).toBe(true);
	});

	it('keeps the first snapshot reachable even when edits come fast', () => {
		const h = new EditHistory('start', { quietMs: 500 });
		h.record('one', 10);
		h.record('two', 20); // within the quiet time of 'one': merged into it, not into 'start'
		expect(h.undo()).toBe('start');
		expect(h.redo()).toBe('two');
	});

	it('a drag is one step, however slow, and never merges into the edit before it', () => {
		const h = new EditHistory('start', { quietMs: 500 });
		h.record('typed', 10);
		h.begin();
		h.record('moved-1', 20); // right after the typing: still a step of its own
		h.record('moved-2', 2000); // a pause mid-drag: the same step
		h.record('moved-3', 5000);
		h.end();
		h.record('after', 5100);
		expect(h.undo()).toBe('moved-3');
		expect(h.undo()).toBe('typed'); // the outline exactly as before the drag
		expect(h.undo()).toBe('start');
	});
});

describe('undo in the wizard', () => {
	/** The wizard's loop: every change of the draft is recorded (DraftWatch), undo and redo put a step back. */
	function wizard() {
		const draft = new PlanDraft({ name: 'My slab', input: starterInput() });
		const text = () => JSON.stringify(draft.snapshot());
		const history = new EditHistory(text(), { quietMs: 500 });
		let seen = text();
		let t = 0;
		const changed = () => {
			if (text() !== seen) history.record((seen = text()), (t += 5000));
		};
		const apply = (s: string | null) => {
			if (s) draft.restore(JSON.parse(s) as DraftData);
			changed();
		};
		return {
			draft,
			history,
			edit(f: (d: PlanDraft) => void) {
				f(draft);
				changed();
			},
			undo: () => apply(history.undo()),
			redo: () => apply(history.redo())
		};
	}

	it('puts a step back exactly as recorded, so applying it is not a new edit', () => {
		const w = wizard();
		const before = JSON.stringify(w.draft.snapshot());
		w.edit((d) => (d.input.conditions.airLow = 30)); // a field absent from the starter
		w.undo();
		w.redo();
		expect(w.history.canRedo).toBe(false);
		w.undo();
		expect(JSON.stringify(w.draft.snapshot())).toBe(before);
		w.redo();
		w.edit((d) => (d.input.conditions.airLow = undefined)); // the field cleared
		w.undo();
		expect(w.draft.input.conditions.airLow).toBe(30);
		w.undo();
		expect(w.draft.input.conditions.airLow).toBeUndefined(); // back to the start, not the same step again
		expect(w.history.canUndo).toBe(false);
		w.edit((d) => ((d.input.conditions as { humidity: number | null }).humidity = null));
		w.undo();
		expect(w.draft.input.conditions.humidity).toBe(50);
		expect(w.history.canRedo).toBe(true);
		w.redo();
		expect(w.draft.input.conditions.humidity).toBeNull();
	});
});

describe('shape presets', () => {
	it('read their sizes and walls back from the plan, so a revisit shows what was applied', () => {
		const p = { shape: 'l' as const, length: 24, width: 18, notchLength: 8, notchWidth: 6, house: 'corner' as const };
		const input = starterInput();
		input.sections = [{ outline: presetOutline(p) }];
		const walls = presetHouse(p);
		input.houseEdge = walls[0];
		input.otherHouseEdges = walls.slice(1);
		expect(detectPreset(input)).toEqual(p);
		expect(walls).toEqual([
			{ section: 0, edge: 2 },
			{ section: 0, edge: 3 }
		]);
		input.houseEdge = null;
		input.otherHouseEdges = [];
		expect(detectPreset(input).house).toBe('none');
		expect(detectPreset(starterInput())).toMatchObject({ shape: 'rectangle', length: 12, width: 10, house: 'side' });
	});
});

describe('the preset form says which size to fix', () => {
	it('names the field and the limit', () => {
		const rect = { shape: 'rectangle' as const, length: 0, width: 10, notchLength: 6, notchWidth: 5, house: 'side' as const };
		expect(presetProblem(rect, 'imperial')).toBe('Enter the length (A–B), above 0 ft.');
		expect(presetProblem({ ...rect, length: 12, width: Number.NaN }, 'metric')).toBe('Enter the width (B–C side), above 0 m.');
		expect(presetProblem({ ...rect, length: 12, notchLength: 40 }, 'imperial')).toBeNull(); // a rectangle has no notch
		const l = { ...rect, shape: 'l' as const, length: 12 };
		expect(presetProblem(l, 'imperial')).toBeNull();
		expect(presetProblem({ ...l, notchLength: 12 }, 'imperial')).toBe('The notch length (C–D) must be less than the length (A–B), 12 ft.');
		expect(presetProblem({ ...l, notchWidth: 0 }, 'imperial')).toBe('Enter the notch width (D–E), above 0 ft.');
	});
});

describe('the house-corner preset', () => {
	it.each([
		{ value: 2, unit: 'percent' as const },
		{ value: 0.25, unit: 'inPerFt' as const },
		{ value: 3, unit: 'totalDrop' as const }
	])('falls away from both walls (IRC R401.3) with the fall as %o', (fall) => {
		const p = { shape: 'l' as const, length: 16, width: 12, notchLength: 6, notchWidth: 5, house: 'corner' as const };
		const [houseEdge, ...otherHouseEdges] = presetHouse(p);
		const r = computePlan(
			completeInput({
				units: 'imperial',
				sections: [{ outline: presetOutline(p) }],
				houseEdge,
				otherHouseEdges,
				slope: { fall, crossFall: presetCrossFall(p, fall) }
			})!
		);
		expect(r.elevations.houseEdges).toHaveLength(2);
		for (const h of r.elevations.houseEdges) expect(h.fallAway.percent).toBeGreaterThan(0);
		expect(r.cautions.map((c) => c.id)).not.toContain('water-toward-foundation');
	});
});

describe('walls through outline changes', () => {
	it('a split keeps both notch walls of an L; removing a corner keeps the wall on the merged edge', () => {
		const draft = new PlanDraft({
			name: 'L',
			input: completeInput({
				units: 'imperial',
				sections: [{ outline: lShape(24, 18, 8, 6) }],
				houseEdge: { section: 0, edge: 2 },
				otherHouseEdges: [{ section: 0, edge: 3 }]
			})!
		});
		draft.addCorner(0, 2); // C–D halved: both halves are wall
		expect(draft.houseEdges).toEqual([
			{ section: 0, edge: 2 },
			{ section: 0, edge: 3 },
			{ section: 0, edge: 4 }
		]);
		draft.removeCorner(0, 3); // the new middle corner goes: one wall C–D again
		expect(draft.houseEdges).toEqual([
			{ section: 0, edge: 2 },
			{ section: 0, edge: 3 }
		]);
		draft.removeCorner(0, 0); // A goes: F–A and A–B merge; walls C–D, D–E renumber to 1, 2
		expect(draft.houseEdges).toEqual([
			{ section: 0, edge: 1 },
			{ section: 0, edge: 2 }
		]);
		expect(draft.outcome.ok).toBe(true);
	});
});

describe('the thickened-edge trench', () => {
	it('is there while an edge away from the house is thickened, and gone once every edge is a wall', () => {
		const draft = new PlanDraft({
			name: 'Pad',
			input: completeInput({
				units: 'imperial',
				sections: [
					{
						outline: [
							[0, 0],
							[10, 0],
							[10, 8],
							[0, 8]
						]
					}
				]
			})!
		});
		expect(draft.hasTrench).toBe(false); // thickened edges: none
		draft.input.thickenedEdge.edges = 'free';
		expect(draft.hasTrench).toBe(true);
		draft.houseEdges = [0, 1, 2, 3].map((edge) => ({ section: 0, edge }));
		expect(draft.outcome.ok).toBe(true);
		expect(draft.hasTrench).toBe(false);
		// Chunks in that plan are refused by the engine; the draft still knows there is no trench.
		draft.input.fill = { shareOfTrench: 0.3, largestPiece: 4 } as never;
		expect(draft.errors.fill).toBe('Chunk fill goes in a thickened-edge trench, and this plan has none.');
		expect(draft.hasTrench).toBe(false);
		draft.houseEdges = [{ section: 0, edge: 0 }];
		expect(draft.hasTrench).toBe(true);
	});
});

describe('section names', () => {
	const twoPours = () =>
		new PlanDraft({
			name: 'Names',
			input: completeInput({
				units: 'imperial',
				sections: [
					{
						name: 'Front walk',
						outline: [
							[0, 0],
							[10, 0],
							[10, 4],
							[0, 4]
						]
					},
					{
						name: 'Landing',
						outline: [
							[10, 0],
							[14, 0],
							[14, 4],
							[10, 4]
						]
					}
				]
			})!
		});

	it('survive splitting a pour: the split one names both halves, the others keep theirs', () => {
		const d = twoPours();
		d.splitSection(0, [
			[
				[0, 0],
				[5, 0],
				[5, 4],
				[0, 4]
			],
			[
				[5, 0],
				[10, 0],
				[10, 4],
				[5, 4]
			]
		]);
		expect(d.input.sections.map((s) => s.name)).toEqual(['Front walk', 'Front walk, part 2', 'Landing']);
		expect(d.result?.area.sections.length).toBe(3);
	});

	it('survive removing a pour: the rest keep their own names', () => {
		const d = twoPours();
		d.removeSection(0);
		expect(d.input.sections.map((s) => s.name)).toEqual(['Landing']);
		const e = twoPours();
		e.splitSection(1, [
			[
				[10, 0],
				[12, 0],
				[12, 4],
				[10, 4]
			],
			[
				[12, 0],
				[14, 0],
				[14, 4],
				[12, 4]
			]
		]);
		e.removeSection(0);
		expect(e.input.sections.map((s) => s.name)).toEqual(['Landing', 'Landing, part 2']);
	});

	it('survive moving a corner (same number of pours)', () => {
		const d = twoPours();
		d.addCorner(1, 0);
		d.removeCorner(1, 1);
		expect(d.input.sections.map((s) => s.name)).toEqual(['Front walk', 'Landing']);
	});
});
