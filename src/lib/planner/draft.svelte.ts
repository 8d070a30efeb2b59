import type { EdgeRef, EstimateOutcome, ParsedPlan, PlanInput, Units } from '$lib/plan';
import type { UnitMemory } from './convert';
import { editableCopy } from './editable';
import { converter, engine, loadEngine, withEngine } from './engine.svelte';
import { detectPreset, type Preset } from './presets';
import { edgesAfter, lShape, rectangle, removeVertex, splitEdge, type Pt } from './shapes';

type Parse = typeof import('$lib/plan').parsePlanInput;

/**
 * A new plan: a rectangle along the house with every engine default filled in, so every field
 * binds. Parsed by the loaded engine (`loadEngine()`), or by the parse given (the server's own).
 */
export function starterInput(units: Units = 'imperial', name = 'My slab', parse: Parse | undefined = engine()?.parsePlanInput): ParsedPlan {
	if (!parse) throw new Error('starterInput needs the engine: await loadEngine() first');
	const outline = units === 'imperial' ? rectangle(12, 10) : rectangle(3.6, 3);
	const parsed = parse({ units, name, sections: [{ outline }], reference: { label: 'door sill', below: units === 'imperial' ? 1 : 25 } });
	if (!parsed.ok) throw new Error(`starter plan is invalid: ${parsed.errors[0].message}`);
	return editableCopy(parsed.plan);
}

/**
 * Fills in defaults for an input saved earlier (older inputs may lack newer fields); null when the
 * engine refuses it. Needs the engine loaded (`loadEngine()`); before that the input is taken as it
 * is, which is right for what the server stored (the server completed it).
 */
export function completeInput(input: unknown): ParsedPlan | null {
	const e = engine();
	if (!e) return editableCopy(input) as ParsedPlan;
	const parsed = e.parsePlanInput(input);
	return parsed.ok ? editableCopy(parsed.plan) : null;
}

/** What the draft shows while the engine is still loading: no result and no errors yet. */
export type DraftOutcome = EstimateOutcome | { ok: false; pending: true; errors: [] };
const PENDING: DraftOutcome = { ok: false, pending: true, errors: [] };

export { lShape, rectangle };

export type DraftData = { name: string; postcode: string; input: PlanInput };

const sameRef = (a: EdgeRef, b: EdgeRef) => a.section === b.section && a.edge === b.edge;

/**
 * The plan being edited in the browser. Results are derived by the same engine the server runs,
 * so the panel updates on every keystroke; the server recomputes on save.
 */
export class PlanDraft {
	name = $state('');
	postcode = $state('');
	#input = $state() as ParsedPlan;
	/** The "start from a shape" form: kept here so revisiting the step shows what was typed. */
	preset = $state() as Preset;
	/** Why the last unit switch was refused, shown beside the unit choice. */
	unitsMessage = $state('');
	#unitMemory: UnitMemory | null = null;
	/** The shape form as last seen in each unit system, so switching back shows what was typed. */
	#presets: Partial<Record<Units, Preset>> = {};

	constructor(data: { name: string; postcode?: string; input: ParsedPlan }) {
		this.name = data.name;
		this.postcode = data.postcode ?? '';
		this.input = data.input;
		this.preset = detectPreset(this.#input);
		if (typeof window !== 'undefined') void loadEngine().catch(() => (this.engineFailed = true));
	}

	/** The engine could not be fetched (offline on first visit): the results say so. */
	engineFailed = $state(false);

	/** Every plan put here is copied first: edited state never shares or holds a frozen object. */
	get input(): ParsedPlan {
		return this.#input;
	}
	set input(v: ParsedPlan) {
		this.#input = editableCopy(v);
	}

	outcome = $derived.by((): DraftOutcome => engine()?.estimate(this.#input) ?? PENDING);
	/** True until the engine has loaded and given its first answer. */
	pending = $derived('pending' in this.outcome);
	result = $derived(this.outcome.ok ? this.outcome.plan : null);
	/** Engine messages by dotted path ("sections.0.outline"), for the field that caused them. */
	errors = $derived(this.outcome.ok ? {} : (Object.fromEntries(this.outcome.errors.map((e) => [e.path, e.message])) as Record<string, string>));
	/**
	 * Whether any edge is thickened, so chunk fill has a trench to go in: the engine's answer while
	 * the plan computes; while it does not, a plan whose every edge is a house wall has none.
	 */
	hasTrench = $derived.by(() => {
		const spec = this.#input.thickenedEdge.edges;
		if (spec === 'none') return false;
		if (Array.isArray(spec)) return spec.length > 0;
		if (this.result) return this.result.geometry.sections.some((s) => s.edges.some((e) => e.thickened));
		return this.#input.sections.some((s, section) => s.outline.some((_, edge) => !this.isHouseEdge({ section, edge })));
	});

	/** Messages whose path starts with one of the prefixes: what a wizard step shows. */
	errorsUnder(...prefixes: string[]): [string, string][] {
		return Object.entries(this.errors).filter(([p]) => prefixes.some((x) => p === x || p.startsWith(`${x}.`)));
	}

	snapshot(): DraftData {
		return { name: this.name, postcode: this.postcode, input: editableCopy(this.#input) as PlanInput };
	}

	/**
	 * Puts back a snapshot this draft gave (undo, redo) exactly as it was taken. Not through the
	 * engine's parse: it puts keys in the schema's order, while a field first set during editing sits
	 * last, so the draft would serialise unlike the history's step and the undo be recorded as an edit.
	 */
	restore(d: DraftData) {
		this.name = d.name;
		this.postcode = d.postcode;
		this.input = d.input as ParsedPlan;
		this.preset = detectPreset(this.#input, this.preset);
	}

	/** Switch units, or leave them and say why; returns whether the switch happened. */
	switchUnits(to: Units): boolean {
		const c = converter();
		if (!c) {
			this.unitsMessage = 'The planner is still loading; try again in a moment.';
			return false;
		}
		const r = c.switchUnits(this.snapshot().input, to, this.#unitMemory);
		if (!r.ok) {
			this.unitsMessage = r.reason;
			return false;
		}
		this.unitsMessage = '';
		this.#unitMemory = r.memory;
		const from = this.#input.units;
		this.#presets[from] = editableCopy(this.preset);
		this.input = r.plan;
		// The form as last typed in these units, else the shape of the outline, else the sizes typed
		// in the other units, converted.
		const remembered = this.#presets[to];
		this.preset = remembered ? editableCopy(remembered) : detectPreset(this.#input, from === to ? undefined : c.convertPreset(this.#presets[from]!, to));
		return true;
	}

	/** A new starter plan in the same units; the name and postcode stay. */
	startOver() {
		withEngine((e) => {
			this.input = starterInput(this.#input.units, undefined, e.parsePlanInput);
			this.preset = detectPreset(this.#input);
			this.unitsMessage = '';
		});
	}

	// ---- House edges: houseEdge is the first wall, otherHouseEdges the rest; none is freestanding.

	get houseEdges(): EdgeRef[] {
		return this.#input.houseEdge ? [this.#input.houseEdge, ...this.#input.otherHouseEdges] : [];
	}
	set houseEdges(refs: EdgeRef[]) {
		const copy = refs.slice(0, 9).map((r) => ({ section: r.section, edge: r.edge }));
		this.#input.houseEdge = copy[0] ?? null;
		this.#input.otherHouseEdges = copy.slice(1);
	}
	isHouseEdge(ref: EdgeRef) {
		return this.houseEdges.some((h) => sameRef(h, ref));
	}
	toggleHouseEdge(ref: EdgeRef) {
		const list = this.houseEdges;
		this.houseEdges = list.some((h) => sameRef(h, ref)) ? list.filter((h) => !sameRef(h, ref)) : [...list, ref];
	}

	/**
	 * Replaces the outlines and carries every edge reference (walls, high edge, thickened edges)
	 * to the new edges that lie along the old ones. `fallback` maps a reference whose edge is gone
	 * (a removed corner merges two edges). `names` gives each new section its name; without it the
	 * names stay where they were when the number of sections does not change.
	 */
	setOutlines(next: Pt[][], fallback?: (r: EdgeRef) => EdgeRef | null, names?: (string | undefined)[]) {
		const before = this.#input.sections.map((s) => s.outline as Pt[]);
		const move = (refs: EdgeRef[]) =>
			refs.flatMap((r) => {
				const found = edgesAfter(before, next, [r]);
				if (found.length) return found;
				const f = fallback?.(r);
				return f ? [f] : [];
			});
		const dedupe = (refs: EdgeRef[]) => refs.filter((r, i) => refs.findIndex((x) => sameRef(x, r)) === i);
		const house = dedupe(move(this.houseEdges));
		const high = this.#input.slope.highEdge ? move([this.#input.slope.highEdge])[0] : undefined;
		const thick = this.#input.thickenedEdge.edges;
		const was = this.#input.sections.map((s) => s.name);
		const named = names ?? (next.length === before.length ? was : []);
		this.#input.sections = next.map((outline, i) => ({ name: named[i] || undefined, outline: outline.map((p) => [p[0], p[1]] as Pt) }));
		this.houseEdges = house;
		this.#input.slope.highEdge = high ? { ...high } : undefined;
		if (Array.isArray(thick)) this.#input.thickenedEdge.edges = dedupe(move(thick));
	}

	/** Cuts section s in two along a straight line; its name goes with both halves ("Walk", "Walk, part 2"). */
	splitSection(s: number, pieces: [Pt[], Pt[]]) {
		const names = this.#input.sections.flatMap((x, i) => (i === s ? [x.name, x.name ? `${x.name}, part 2` : undefined] : [x.name]));
		this.setOutlines(
			this.#input.sections.flatMap((x, i) => (i === s ? pieces : [x.outline as Pt[]])),
			undefined,
			names
		);
	}

	/** Removes section s; the other sections keep their names. */
	removeSection(s: number) {
		if (this.#input.sections.length <= 1) return;
		const keep = (_: unknown, i: number) => i !== s;
		this.setOutlines(this.#input.sections.map((x) => x.outline as Pt[]).filter(keep), undefined, this.#input.sections.map((x) => x.name).filter(keep));
	}

	/** A new corner halves an edge: a wall stays a wall on both halves. (Same corner count: assign.) */
	addCorner(section: number, edge: number) {
		const next = splitEdge(this.#input.sections[section].outline as Pt[], edge);
		this.setOutlines(this.#input.sections.map((s, i) => (i === section ? next : (s.outline as Pt[]))));
	}

	removeCorner(section: number, v: number) {
		const o = this.#input.sections[section].outline as Pt[];
		if (o.length <= 3) return;
		const n = o.length;
		// The two edges meeting at the corner become one: edge v−1 (or the new last edge, for corner 0).
		const merged = v - 1;
		const after = (e: number) => (e === v ? (v === 0 ? n - 2 : merged) : e > v ? e - 1 : e);
		this.setOutlines(
			this.#input.sections.map((s, i) => (i === section ? removeVertex(o, v) : (s.outline as Pt[]))),
			(r) => (r.section === section ? { section, edge: after(r.edge) } : null)
		);
	}
}
