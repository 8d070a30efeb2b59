// Switching a plan between imperial and metric: the same physical slab, re-expressed. Sizes that
// depend on the market (bag sizes, lumber stock lengths, ready-mix increments) take the new
// system's usual values instead of odd conversions.
import { parsePlanInput, type ParsedPlan, type Units } from '$lib/plan';

const FT = 0.3048;
const IN = 25.4;
const LB = 0.45359237;
const PSI_PER_MPA = 145.0377;
const KMH_PER_MPH = 1.609344;
const M3_PER_YD3 = 0.764554857984;
const M3_PER_FT3 = 0.028316846592;
const GAL = 3.785411784; // L per US gallon
const OZ_G = 28.349523125; // g per avoirdupois ounce

const r = (v: number, digits = 3) => Math.round(v * 10 ** digits) / 10 ** digits;

export function convertPlan(p: ParsedPlan, to: Units): ParsedPlan {
	if (p.units === to) return p;
	const metric = to === 'metric';
	const len = (v: number) => r(metric ? v * FT : v / FT, metric ? 4 : 3); // 0.1 mm keeps round trips exact
	const small = (v: number) => r(metric ? v * IN : v / IN, metric ? 0 : 2);
	const mass = (v: number) => r(metric ? v * LB : v / LB, 1);
	const temp = (v: number) => r(metric ? ((v - 32) * 5) / 9 : (v * 9) / 5 + 32, 1);
	const opt = <T>(v: T | undefined, f: (x: T) => T) => (v === undefined ? undefined : f(v));
	// Prices per unit of length, area or volume scale by the inverse of the unit.
	const perLen = (v: number) => r(metric ? v / FT : v * FT, 2);
	const perArea = (v: number) => r(metric ? v / FT ** 2 : v * FT ** 2, 2);
	const perVol = (v: number) => r(metric ? v / M3_PER_YD3 : v * M3_PER_YD3, 2);
	// Short tons per yd³ ↔ tonnes per m³ (2000 lb = 907.18474 kg).
	const dens = (v: number) => r(metric ? (v * 0.90718474) / M3_PER_YD3 : (v * M3_PER_YD3) / 0.90718474, 2);
	const rate = (x: { value: number; unit: 'percent' | 'inPerFt' | 'mmPerM' | 'totalDrop' }) => {
		if (x.unit === 'percent') return x;
		if (x.unit === 'totalDrop') return { ...x, value: small(x.value) };
		return metric ? { value: r(x.value * (1000 / 12), 1), unit: 'mmPerM' as const } : { value: r(x.value * (12 / 1000), 3), unit: 'inPerFt' as const };
	};
	const fresh = parsePlanInput({ units: to, sections: p.sections });
	if (!fresh.ok) throw new Error('conversion lost the outline');
	const d = fresh.plan;

	const converted = {
		...p,
		units: to,
		sections: p.sections.map((s) => ({ ...s, outline: s.outline.map(([x, y]) => [len(x), len(y)] as [number, number]) })),
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
		base: { ...p.base, depth: small(p.base.depth), overhang: small(p.base.overhang), stoneDensity: dens(p.base.stoneDensity), soilDensity: dens(p.base.soilDensity) },
		curing: { ...p.curing, coverage: r(metric ? p.curing.coverage * FT ** 2 / GAL : (p.curing.coverage * GAL) / FT ** 2, metric ? 2 : 0) },
		reinforcing: {
			...p.reinforcing,
			meshWidth: len(p.reinforcing.meshWidth),
			meshLength: len(p.reinforcing.meshLength),
			chairSpacing: len(p.reinforcing.chairSpacing),
			barStock: len(p.reinforcing.barStock),
			wireSpacing: small(p.reinforcing.wireSpacing),
			barSpacing: small(p.reinforcing.barSpacing),
			barDiameter: r(metric ? p.reinforcing.barDiameter * IN : p.reinforcing.barDiameter / IN, 3),
			fiberPerBag: opt(p.reinforcing.fiberPerBag, (v) => r(metric ? v * OZ_G : v / OZ_G, 2))
		},
		fill: p.fill && {
			...p.fill,
			volume: opt(p.fill.volume, (v) => r(metric ? v * M3_PER_FT3 : v / M3_PER_FT3, 3)),
			largestPiece: small(p.fill.largestPiece)
		},
		mix: { ...p.mix, designStrength: r(metric ? p.mix.designStrength / PSI_PER_MPA : p.mix.designStrength * PSI_PER_MPA, 0) },
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
			airLow: p.conditions.airLow === undefined ? undefined : Array.isArray(p.conditions.airLow) ? p.conditions.airLow.map(temp) : temp(p.conditions.airLow),
			wind: r(metric ? p.conditions.wind * KMH_PER_MPH : p.conditions.wind / KMH_PER_MPH, 1)
		}
	};
	const out = parsePlanInput(converted);
	if (!out.ok) throw new Error(`converted plan is invalid: ${out.errors[0].path} ${out.errors[0].message}`);
	return out.plan;
}
