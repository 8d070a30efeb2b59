// Switching a plan between imperial and metric: the same physical slab, re-expressed. Sizes that
// depend on the market (bag sizes, lumber stock lengths, ready-mix increments) take the new
// system's usual values instead of odd conversions.
import { fieldLabel, parsePlanInput, type ParsedPlan, type Units } from '$lib/plan';
import { G_PER_OZ, KG_PER_LB, KG_PER_SHORT_TON, KM_PER_MILE, L_PER_US_GAL, M3_PER_FT3, M3_PER_YD3, MM_PER_IN, MPA_PER_PSI, M_PER_FT } from '$lib/plan/units';
import { sameData } from './editable';
import type { Preset } from './presets';

// The engine's unit constants, with their sources (lib/plan/units.ts).
const FT = M_PER_FT;
const IN = MM_PER_IN;
const LB = KG_PER_LB;
const GAL = L_PER_US_GAL;

const r = (v: number, digits = 3) => Math.round(v * 10 ** digits) / 10 ** digits;

/**
 * A site length (ft or m) as a person would type it: metres to the millimetre, feet to the
 * sixteenth of an inch (kept to 4 decimals, finer than 1/16 in = 0.0052 ft). Clears float noise
 * such as 3.0480000000000005.
 */
export function tidyLength(v: number, units: Units): number {
	return units === 'metric' ? r(v, 3) : r(Math.round(v * 192) / 192, 4);
}

export function convertPlan(p: ParsedPlan, to: Units): ParsedPlan {
	if (p.units === to) return p;
	const metric = to === 'metric';
	// Lengths land on what a tape reads in the new units: whole millimetres, or sixteenths of an
	// inch. Half a millimetre is less than half a sixteenth (0.79 mm), so a value typed in
	// sixteenths comes back exactly even without the switch's memory.
	const len = (v: number) => (metric ? tidyLength(v * FT, 'metric') : tidyLength(v / FT, 'imperial'));
	const small = (v: number) => (metric ? r(v * IN, 0) : Math.round((v / IN) * 16) / 16);
	const mass = (v: number) => r(metric ? v * LB : v / LB, 1);
	const temp = (v: number) => r(metric ? ((v - 32) * 5) / 9 : (v * 9) / 5 + 32, 1);
	const opt = <T>(v: T | undefined, f: (x: T) => T) => (v === undefined ? undefined : f(v));
	// Prices per unit of length, area or volume scale by the inverse of the unit.
	const perLen = (v: number) => r(metric ? v / FT : v * FT, 2);
	const perArea = (v: number) => r(metric ? v / FT ** 2 : v * FT ** 2, 2);
	const perVol = (v: number) => r(metric ? v / M3_PER_YD3 : v * M3_PER_YD3, 2);
	// Short tons per yd³ ↔ tonnes per m³ (2000 lb = 907.18474 kg).
	const dens = (v: number) => r(metric ? (v * KG_PER_SHORT_TON) / 1000 / M3_PER_YD3 : (v * M3_PER_YD3 * 1000) / KG_PER_SHORT_TON, 2);
	const rate = (x: { value: number; unit: 'percent' | 'inPerFt' | 'mmPerM' | 'totalDrop' }) => {
		if (x.unit === 'percent') return x;
		if (x.unit === 'totalDrop') return { ...x, value: small(x.value) };
		return metric ? { value: r(x.value * (1000 / 12), 1), unit: 'mmPerM' as const } : { value: r(x.value * (12 / 1000), 3), unit: 'inPerFt' as const };
	};
	const sections = p.sections.map((s) => ({ ...s, outline: s.outline.map(([x, y]) => [len(x), len(y)] as [number, number]) }));
	// The new system's market sizes (bags, boards, ready-mix steps) come from its own defaults.
	const fresh = parsePlanInput({ units: to, sections });
	if (!fresh.ok) throw new Error(`the outline does not fit in ${to} units: ${fresh.errors[0].message}`);
	const d = fresh.plan;

	const converted = {
		...p,
		units: to,
		sections,
		gapToHouse: small(p.gapToHouse),
		reference: { ...p.reference, below: small(p.reference.below) },
		slope: { ...p.slope, fall: rate(p.slope.fall), crossFall: rate(p.slope.crossFall) },
		thickness: small(p.thickness),
		forms: {
			...p.forms,
			customDepth: opt(p.forms.customDepth, small),
			stakeSpacing: len(p.forms.stakeSpacing),
			stakeLength: small(p.forms.stakeLength),
			stockLengths: d.forms.stockLengths
		},
		thickenedEdge: { ...p.thickenedEdge, width: small(p.thickenedEdge.width), extraDepth: opt(p.thickenedEdge.extraDepth, small) },
		base: {
			...p.base,
			depth: small(p.base.depth),
			overhang: small(p.base.overhang),
			stoneDensity: dens(p.base.stoneDensity),
			soilDensity: dens(p.base.soilDensity)
		},
		curing: { ...p.curing, coverage: r(metric ? (p.curing.coverage * FT ** 2) / GAL : (p.curing.coverage * GAL) / FT ** 2, metric ? 2 : 0) },
		reinforcing: {
			...p.reinforcing,
			meshWidth: len(p.reinforcing.meshWidth),
			meshLength: len(p.reinforcing.meshLength),
			chairSpacing: len(p.reinforcing.chairSpacing),
			barStock: len(p.reinforcing.barStock),
			wireSpacing: small(p.reinforcing.wireSpacing),
			barSpacing: small(p.reinforcing.barSpacing),
			barDiameter: r(metric ? p.reinforcing.barDiameter * IN : p.reinforcing.barDiameter / IN, 3),
			fiberPerBag: opt(p.reinforcing.fiberPerBag, (v) => r(metric ? v * G_PER_OZ : v / G_PER_OZ, 2))
		},
		fill: p.fill && {
			...p.fill,
			volume: opt(p.fill.volume, (v) => r(metric ? v * M3_PER_FT3 : v / M3_PER_FT3, 3)),
			largestPiece: small(p.fill.largestPiece)
		},
		mix: { ...p.mix, designStrength: r(metric ? p.mix.designStrength * MPA_PER_PSI : p.mix.designStrength / MPA_PER_PSI, 0) },
		bags: { ...p.bags, offered: d.bags.offered, planSize: undefined },
		readyMix: { ...p.readyMix, price: opt(p.readyMix.price, perVol), increment: d.readyMix.increment, minimum: d.readyMix.minimum },
		prices: {
			...p.prices,
			gravel: opt(p.prices.gravel, perVol),
			lumber: opt(p.prices.lumber, perLen),
			mesh: opt(p.prices.mesh, perArea),
			isolationStrip: opt(p.prices.isolationStrip, perLen),
			curingCover: opt(p.prices.curingCover, perArea),
			rebar: opt(p.prices.rebar, perLen),
			curingCompound: opt(p.prices.curingCompound, (v) => r(metric ? v / GAL : v * GAL, 2)),
			fiber: opt(p.prices.fiber, (v) => r(metric ? v / LB : v * LB, 2))
		},
		crew: { ...p.crew, drumBatchMass: mass(p.crew.drumBatchMass), payload: mass(p.crew.payload) },
		conditions: {
			...p.conditions,
			airTemp: Array.isArray(p.conditions.airTemp) ? p.conditions.airTemp.map(temp) : temp(p.conditions.airTemp),
			concreteTemp: opt(p.conditions.concreteTemp, temp),
			airLow:
				p.conditions.airLow === undefined
					? undefined
					: Array.isArray(p.conditions.airLow)
						? p.conditions.airLow.map((t) => (t === null ? null : temp(t)))
						: temp(p.conditions.airLow),
			wind: r(metric ? p.conditions.wind * KM_PER_MILE : p.conditions.wind / KM_PER_MILE, 1)
		}
	};
	const out = parsePlanInput(converted);
	if (!out.ok) throw new Error(`converted plan is invalid: ${out.errors[0].path} ${out.errors[0].message}`);
	return out.plan;
}

/** The shape form's sizes in other units, as a tape reads them (4.267 m for 14 ft). */
export function convertPreset(p: Preset, to: Units): Preset {
	const len = (v: number) => (Number.isFinite(v) ? tidyLength(to === 'metric' ? v * FT : v / FT, to) : v);
	return { ...p, length: len(p.length), width: len(p.width), notchLength: len(p.notchLength), notchWidth: len(p.notchWidth) };
}

/** The last switch: the plan as it was before, and what the switch made of it. */
export type UnitMemory = { before: ParsedPlan; after: ParsedPlan };
export type UnitSwitch = { ok: true; plan: ParsedPlan; memory: UnitMemory } | { ok: false; reason: string };

/**
 * Switches the plan being edited to other units. Refuses, saying why, when the plan cannot be
 * converted as it stands. Switching back restores every value that was not edited in between
 * exactly as typed, instead of converting it twice (4 in → 102 mm → 4.02 in).
 */
export function switchUnits(current: unknown, to: Units, memory: UnitMemory | null): UnitSwitch {
	const parsed = parsePlanInput(current);
	if (!parsed.ok) {
		const e = parsed.errors[0];
		// The field in plain words ("the outline of pour 1"), never the engine's path.
		return { ok: false, reason: `The units stay as they are until ${fieldLabel(e.path)} is fixed: ${e.message}` };
	}
	if (parsed.plan.units === to) return { ok: true, plan: parsed.plan, memory: memory ?? { before: parsed.plan, after: parsed.plan } };
	let plan: ParsedPlan;
	try {
		plan = convertPlan(parsed.plan, to);
	} catch (e) {
		return { ok: false, reason: `The plan cannot be shown in ${to === 'metric' ? 'metric' : 'imperial'} units: ${(e as Error).message}.` };
	}
	if (memory && memory.before.units === to && memory.after.units === parsed.plan.units) {
		const restored = parsePlanInput(restoreTyped(plan, parsed.plan, memory.after, memory.before));
		if (restored.ok) plan = restored.plan;
	}
	return { ok: true, plan, memory: { before: parsed.plan, after: plan } };
}

type Tree = Record<string, unknown>;
const isObj = (v: unknown): v is Tree => v !== null && typeof v === 'object' && !Array.isArray(v);

/**
 * Walks the plan converted back (`back`) beside the current plan (`cur`), what the last switch
 * produced (`made`) and what was there before it (`was`): any part left as the switch made it
 * takes its earlier value; edited parts keep their conversion.
 */
function restoreTyped(back: unknown, cur: unknown, made: unknown, was: unknown): unknown {
	if (sameData(cur, made)) return was;
	if (Array.isArray(back) && Array.isArray(cur) && Array.isArray(made) && Array.isArray(was)) {
		if (back.length === cur.length && made.length === cur.length && was.length === cur.length)
			return back.map((b, i) => restoreTyped(b, cur[i], made[i], was[i]));
		return back;
	}
	if (isObj(back) && isObj(cur) && isObj(made) && isObj(was)) {
		const out: Tree = {};
		for (const k of new Set([...Object.keys(back), ...Object.keys(was)])) out[k] = restoreTyped(back[k], cur[k], made[k], was[k]);
		return out;
	}
	return back;
}
