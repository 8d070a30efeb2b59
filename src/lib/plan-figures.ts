import type { PlanResult, Units } from '$lib/plan';

/**
 * The few plan numbers the handoff shows, read from a stored plan result as docs/api.md documents
 * them (area, net and order volume, bags, joint spacing, the DIY total, cautions). The lead keeps a
 * frozen copy of whatever the engine wrote then, so anything missing or shaped differently is left
 * out rather than guessed. The shapes are the engine's own types, picked, not described again.
 */
type R = PlanResult;
export interface PlanFigures {
	units: Units;
	/** ISO 4217; a result without one was priced in US dollars. */
	currency?: R['currency'];
	area?: Pick<R['area'], 'squareFeet' | 'squareMeters'>;
	volume?: { net?: R['volume']['net']; order?: R['volume']['order'] };
	bags?: Pick<R['bags'][number], 'size' | 'unit' | 'count'>[];
	joints?: { maxSpacing: R['joints']['maxSpacing'] };
	materials?: { diyTotal: DiyPricing };
	cautions?: Pick<R['cautions'][number], 'id' | 'title' | 'source'>[];
}

/**
 * What a plan says about its do-it-yourself cost, live or frozen: the engine's total (the sum of the
 * priced lines, 0 when none is), whether every line has a price, whether any has one, and the names of
 * the lines without one. Read by diyPricing and shown only through diyTotal (lib/plan-view/rows.ts).
 */
export interface DiyPricing {
	amount: number;
	complete: boolean;
	priced: boolean;
	unpriced: string[];
}

/** For each field of T, the JavaScript type its stored value must have; the compiler checks it against T. */
type Kinds<T> = { [K in keyof T]-?: T[K] extends number ? 'number' : T[K] extends string ? 'string' : T[K] extends boolean ? 'boolean' : never };

/** The fields of a stored part, when each one has its kind (numbers finite); undefined otherwise. */
function part<T>(v: unknown, kinds: Kinds<T>): T | undefined {
	if (!v || typeof v !== 'object') return undefined;
	const out: Record<string, unknown> = {};
	for (const [k, kind] of Object.entries(kinds) as [string, string][]) {
		const x = (v as Record<string, unknown>)[k];
		if (typeof x !== kind || (kind === 'number' && !Number.isFinite(x))) return undefined;
		out[k] = x;
	}
	return out as T;
}

/** A stored list whose every item is a whole part; undefined when any is not. */
function parts<T>(v: unknown, kinds: Kinds<T>): T[] | undefined {
	if (!Array.isArray(v)) return undefined;
	const items = v.map((x) => part(x, kinds));
	return items.every((x) => x !== undefined) ? (items as T[]) : undefined;
}

type Figure<K extends keyof PlanFigures> = NonNullable<PlanFigures[K]>;

const volume: Kinds<R['volume']['net']> = { cubicFeet: 'number', cubicYards: 'number', cubicMeters: 'number' };
const get = (v: unknown, key: string): unknown => (v && typeof v === 'object' ? (v as Record<string, unknown>)[key] : undefined);

export function planFigures(input: unknown, result: unknown): PlanFigures {
	const r = result ?? {};
	const units = get(input, 'units');
	const currency = get(r, 'currency');
	const net = part(get(get(r, 'volume'), 'net'), volume);
	const order = part(get(get(r, 'volume'), 'order'), volume);
	const maxSpacing = part<R['joints']['maxSpacing']>(get(get(r, 'joints'), 'maxSpacing'), { feet: 'number', meters: 'number' });
	const diyTotal = diyPricing(get(r, 'materials'));
	const figures: PlanFigures = {
		currency: typeof currency === 'string' && /^[A-Z]{3}$/.test(currency) ? currency : undefined,
		area: part<Figure<'area'>>(get(r, 'area'), { squareFeet: 'number', squareMeters: 'number' }),
		volume: get(r, 'volume') && typeof get(r, 'volume') === 'object' ? { net, order } : undefined,
		bags: parts<Figure<'bags'>[number]>(get(r, 'bags'), { size: 'number', unit: 'string', count: 'number' }),
		joints: maxSpacing && { maxSpacing },
		materials: diyTotal && { diyTotal },
		cautions: parts<Figure<'cautions'>[number]>(get(r, 'cautions'), { id: 'string', title: 'string', source: 'string' }),
		units: units === 'metric' ? 'metric' : 'imperial'
	};
	return Object.fromEntries(Object.entries(figures).filter(([, v]) => v !== undefined)) as PlanFigures;
}

/**
 * The DIY pricing of a result's materials (a live PlanResult's or a frozen copy's); undefined when the
 * total is missing or malformed. With no price entered the engine's total is 0, which is not a cost:
 * `priced` tells the two apart.
 */
export function diyPricing(materials: unknown): DiyPricing | undefined {
	const total = get(materials, 'diyTotal');
	const t = part<Pick<R['materials']['diyTotal'], 'amount' | 'complete'>>(total, { amount: 'number', complete: 'boolean' });
	if (!t) return undefined;
	const list = get(materials, 'items');
	const items = Array.isArray(list) ? list : [];
	const nameOf = (id: string) => {
		const name = get(
			items.find((i) => get(i, 'id') === id),
			'name'
		);
		return typeof name === 'string' ? name : id;
	};
	const ids = get(total, 'unpriced');
	const unpriced = Array.isArray(ids) ? ids.filter((id): id is string => typeof id === 'string').map(nameOf) : [];
	// A copy without its items still shows a price through a non-zero or complete total.
	const priced = t.complete || t.amount !== 0 || items.some((i) => typeof get(i, 'cost') === 'number');
	return { ...t, priced, unpriced };
}

/** Every top-level part of the engine's result, as src/lib/plan/index.ts defines PlanResult. */
const RESULT_PARTS = [
	'units',
	'area',
	'geometry',
	'volume',
	'forms',
	'elevations',
	'bags',
	'readyMix',
	'cost',
	'mixing',
	'joints',
	'strength',
	'milestones',
	'schedule',
	'weather',
	'materials',
	'cautions'
] as const;

/**
 * The frozen result as a whole PlanResult when it has every part, so the planner's views (outline,
 * 3D, stake marks, day plan) can draw it; null for anything older or partial, which then shows
 * only the figures above.
 */
export function fullResult(result: unknown): PlanResult | null {
	return hasEveryPart(result) ? result : null;
}

function hasEveryPart(result: unknown): result is PlanResult {
	if (!result || typeof result !== 'object') return false;
	const r = result as Record<string, unknown>;
	return RESULT_PARTS.every((k) => r[k] !== undefined && r[k] !== null);
}
