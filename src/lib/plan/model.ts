// The parsed input converted once to SI, so every topic module works in metres, kilograms and °C.

import { COMMON } from './defaults';
import type { Pt } from './polygon';
import type { EdgeRef, ParsedPlan } from './schema';
import {
	KG_PER_LB,
	L_PER_US_GAL,
	M2_PER_FT2,
	MPA_PER_PSI,
	M3_PER_FT3,
	M3_PER_YD3,
	M_PER_IN,
	massToKg,
	orderVolumeToM3,
	planToM,
	planVolumeToM3,
	smallToM,
	tempToC,
	windToKmh
} from './units';
import type { Units } from './units';
import { ascending, mapList, mapNumbers } from './util';

/** PS 20 dressed (dry) depth of each nominal board, inches (DOC PS 20). */
export const DRESSED_DEPTH_IN = { '2x4': 3.5, '2x6': 5.5, '2x8': 7.25, '2x10': 9.25, '2x12': 11.25 } as const;
/** PS 20 dressed thickness of a nominal 2-in board, inches (DOC PS 20). */
export const DRESSED_THICKNESS_IN = 1.5;

/** A fall as a ratio (m per m), or a total drop (m) still to be spread over the slab. */
export type Rate = { ratio: number } | { drop: number };

export interface BagOffer {
	/** Size as the person entered it (lb or kg). */
	size: number;
	kg: number;
	yieldM3: number;
	price?: number;
}

export interface Model {
	units: Units;
	name?: string;
	sections: { index: number; name: string; outline: Pt[] }[];
	houseEdges: EdgeRef[];
	highEdge: EdgeRef;
	hasHouse: boolean;
	gapToHouse: number;
	houseEdgeFormed: boolean;
	reference: { label: string; below: number };
	fall: Rate;
	crossFall: Rate;
	thickness: number;
	forms: {
		lumber: ParsedPlan['forms']['lumber'];
		depth: number;
		stakeSpacing: number;
		stakeLength: number;
		release: 'agent' | 'oil' | 'none';
		stockLengths: number[];
		boardThickness: number;
	};
	thickened: { edges: 'none' | 'free' | EdgeRef[]; width: number; extraDepth: number; profile: 'rectangular' | 'tapered' };
	/** Densities in kg/m³. */
	base: { depth: number; bulking: number; overhang: number; stoneDensity: number; soilDensity: number };
	fill: null | { volume?: number; share?: number; largestPiece: number };
	reinforcement: ParsedPlan['reinforcement'];
	loads: { vehicles: boolean; pointLoads: boolean };
	cement: 'typeI' | 'typeIII';
	designStrengthMpa: number;
	wastePercent: number;
	bags: { offered: BagOffer[]; plan: BagOffer; waterRatio: number };
	/** Prices per SI unit (per m³, per m, per m², each). */
	readyMix: { pricePerM3?: number; incrementM3: number; minimumM3: number; shortLoadFee?: number };
	prices: {
		gravelPerM3?: number;
		lumberPerM?: number;
		stake?: number;
		screw?: number;
		meshPerM2?: number;
		releaseAgent?: number;
		isolationStripPerM?: number;
		curingCoverPerM2?: number;
		/** Per litre. */
		curingCompoundPerL?: number;
		fiberPerKg?: number;
		rebarPerM?: number;
		chair?: number;
		tools?: number;
		haulSoil?: number;
	};
	exposure: 'negligible' | 'moderate' | 'severe';
	/** coverage in m² per litre. */
	curing: { method: 'cover' | 'wet' | 'compound'; coverage: number };
	reinforcing: {
		meshForm: 'sheet' | 'roll';
		meshWidth: number;
		meshLength: number;
		wireSpacing: number;
		chairSpacing: number;
		barSpacing: number;
		barDiameter: number;
		barStock: number;
		lapDiameters: number;
		/** kg of fiber per bag of the plan's size, when the label's dose is given. */
		fiberPerBagKg?: number;
	};
	crew: {
		people: number;
		method: 'hand' | 'drum';
		handMinutesPerKg: number;
		drumMinutesPerBatch: number;
		drumBatchKg: number;
		/** Per 80 lb of dry mix: placing time goes with the concrete wheeled and spread. */
		placeMinutesPer80lb: number;
		workingMinutesAt21C: number;
		finishMinutes: number;
		payloadKg: number;
	};
	/** Daily mean air temperature from the first pour day on, °C. */
	airTemps: number[];
	/** Daily low air temperature from the first pour day on, °C; empty when not given, null on a day without its own. */
	airLows: (number | null)[];
	humidity: number;
	windKmh: number;
	concreteTemp?: number;
	pourDate?: string;
	milestones: { formsOffDays: number; walkDays: number; furnitureDays: number; vehiclePercent: number };
	jointMethod: 'tool' | 'saw';
}

const rate = (r: { value: number; unit: ParsedPlan['slope']['fall']['unit'] }, u: Units): Rate => {
	switch (r.unit) {
		case 'percent':
			return { ratio: r.value / 100 };
		case 'inPerFt':
			return { ratio: r.value / 12 };
		case 'mmPerM':
			return { ratio: r.value / 1000 };
		case 'totalDrop':
			return { drop: smallToM(r.value, u) };
	}
};

/** Default yield from the bag-label ratio, 80 lb → 0.60 ft³ (common practice). */
export const defaultYieldM3 = (kg: number) => (kg / KG_PER_LB / COMMON.dryMixLbPerFt3) * M3_PER_FT3;

function bagOffers(p: ParsedPlan): BagOffer[] {
	return mapList(p.bags.offered, (b) => {
		const kg = massToKg(b.size, p.units);
		return {
			size: b.size,
			kg,
			yieldM3: b.yield === undefined ? defaultYieldM3(kg) : planVolumeToM3(b.yield, p.units),
			price: b.price
		};
	});
}

export function toModel(p: ParsedPlan): Model {
	const u = p.units;
	const L = (v: number) => planToM(v, u);
	const S = (v: number) => smallToM(v, u);
	const perL = (price?: number) => (price === undefined ? undefined : price / L(1));
	const offered = bagOffers(p);
	const largest = offered.reduce((a, b) => (b.kg > a.kg ? b : a));
	const houseEdges = p.houseEdge ? [p.houseEdge, ...p.otherHouseEdges] : [];
	const temps = Array.isArray(p.conditions.airTemp) ? p.conditions.airTemp : [p.conditions.airTemp];
	const depth = p.forms.lumber === 'custom' ? S(p.forms.customDepth ?? 0) : DRESSED_DEPTH_IN[p.forms.lumber] * M_PER_IN;
	return {
		units: u,
		name: p.name,
		sections: mapList(p.sections, (s, i) => ({
			index: i,
			name: s.name ?? `Section ${i + 1}`,
			outline: mapList(s.outline, (q): Pt => [L(q[0]), L(q[1])])
		})),
		houseEdges,
		highEdge: p.slope.highEdge ?? p.houseEdge ?? { section: 0, edge: 0 },
		hasHouse: houseEdges.length > 0,
		gapToHouse: S(p.gapToHouse),
		houseEdgeFormed: p.houseEdgeFormed,
		reference: { label: p.reference.label.trim() || 'reference mark', below: S(p.reference.below) },
		fall: rate(p.slope.fall, u),
		crossFall: rate(p.slope.crossFall, u),
		thickness: S(p.thickness),
		forms: {
			lumber: p.forms.lumber,
			depth,
			stakeSpacing: L(p.forms.stakeSpacing),
			stakeLength: S(p.forms.stakeLength),
			release: p.forms.release,
			stockLengths: mapNumbers(p.forms.stockLengths, L).sort(ascending),
			boardThickness: DRESSED_THICKNESS_IN * M_PER_IN
		},
		thickened: {
			edges: p.thickenedEdge.edges,
			width: S(p.thickenedEdge.width),
			extraDepth: p.thickenedEdge.extraDepth === undefined ? S(p.thickness) : S(p.thickenedEdge.extraDepth),
			profile: p.thickenedEdge.profile
		},
		base: {
			depth: S(p.base.depth),
			bulking: p.base.bulking,
			overhang: S(p.base.overhang),
			stoneDensity: density(p.base.stoneDensity, u),
			soilDensity: density(p.base.soilDensity, u)
		},
		fill: p.fill
			? {
					volume: p.fill.volume === undefined ? undefined : planVolumeToM3(p.fill.volume, u),
					share: p.fill.shareOfTrench,
					largestPiece: S(p.fill.largestPiece)
				}
			: null,
		reinforcement: p.reinforcement,
		loads: p.loads,
		cement: p.mix.cement,
		designStrengthMpa: u === 'imperial' ? p.mix.designStrength * MPA_PER_PSI : p.mix.designStrength,
		wastePercent: p.wastePercent,
		bags: {
			offered,
			plan: offered.find((b) => b.size === p.bags.planSize) ?? largest,
			waterRatio: p.bags.waterRatio
		},
		readyMix: {
			pricePerM3: p.readyMix.price === undefined ? undefined : p.readyMix.price / orderVolumeToM3(1, u),
			incrementM3: orderVolumeToM3(p.readyMix.increment, u),
			minimumM3: orderVolumeToM3(p.readyMix.minimum, u),
			shortLoadFee: p.readyMix.shortLoadFee
		},
		prices: {
			gravelPerM3: p.prices.gravel === undefined ? undefined : p.prices.gravel / orderVolumeToM3(1, u),
			lumberPerM: perL(p.prices.lumber),
			stake: p.prices.stake,
			screw: p.prices.screw,
			meshPerM2: p.prices.mesh === undefined ? undefined : p.prices.mesh / L(1) ** 2,
			releaseAgent: p.prices.releaseAgent,
			isolationStripPerM: perL(p.prices.isolationStrip),
			curingCoverPerM2: p.prices.curingCover === undefined ? undefined : p.prices.curingCover / L(1) ** 2,
			curingCompoundPerL:
				p.prices.curingCompound === undefined ? undefined : u === 'imperial' ? p.prices.curingCompound / L_PER_US_GAL : p.prices.curingCompound,
			fiberPerKg: p.prices.fiber === undefined ? undefined : p.prices.fiber / massToKg(1, u),
			rebarPerM: perL(p.prices.rebar),
			chair: p.prices.chair,
			tools: p.prices.tools,
			haulSoil: p.prices.haulSoil
		},
		exposure: p.exposure,
		curing: {
			method: p.curing.method,
			// ft²/gal → m²/L: × 0.3048² / 3.785411784
			coverage: u === 'imperial' ? (p.curing.coverage * M2_PER_FT2) / L_PER_US_GAL : p.curing.coverage
		},
		reinforcing: {
			meshForm: p.reinforcing.meshForm,
			meshWidth: L(p.reinforcing.meshWidth),
			meshLength: L(p.reinforcing.meshLength),
			wireSpacing: S(p.reinforcing.wireSpacing),
			chairSpacing: L(p.reinforcing.chairSpacing),
			barSpacing: S(p.reinforcing.barSpacing),
			barDiameter: S(p.reinforcing.barDiameter),
			barStock: L(p.reinforcing.barStock),
			lapDiameters: p.reinforcing.lapDiameters,
			fiberPerBagKg:
				p.reinforcing.fiberPerBag === undefined ? undefined : u === 'imperial' ? (p.reinforcing.fiberPerBag / 16) * KG_PER_LB : p.reinforcing.fiberPerBag / 1000
		},
		crew: {
			people: p.crew.people,
			method: p.crew.method,
			handMinutesPerKg: p.crew.handMixMinutes / (80 * KG_PER_LB),
			drumMinutesPerBatch: p.crew.drumMinutesPerBatch,
			drumBatchKg: massToKg(p.crew.drumBatchMass, u),
			placeMinutesPer80lb: p.crew.placeMinutesPerBag,
			workingMinutesAt21C: p.crew.workingMinutes,
			finishMinutes: p.crew.finishMinutes,
			payloadKg: massToKg(p.crew.payload, u)
		},
		airTemps: mapNumbers(temps, (t) => tempToC(t, u)),
		airLows: mapList(p.conditions.airLow === undefined ? [] : Array.isArray(p.conditions.airLow) ? p.conditions.airLow : [p.conditions.airLow], (t) =>
			t === null ? null : tempToC(t, u)
		),
		humidity: p.conditions.humidity,
		windKmh: windToKmh(p.conditions.wind, u),
		concreteTemp: p.conditions.concreteTemp === undefined ? undefined : tempToC(p.conditions.concreteTemp, u),
		pourDate: p.conditions.pourDate,
		milestones: p.milestones,
		jointMethod: p.joints.method
	};
}

/** Short tons per yd³ (2000 lb each) or t per m³, to kg/m³. */
function density(v: number, u: Units): number {
	return u === 'imperial' ? (v * 2000 * KG_PER_LB) / M3_PER_YD3 : v * 1000;
}

/** Daily low on a day counted from the first pour, holding the last given value; that day's mean where no low was given for it. */
export const airLowOn = (m: Model, day: number) => (m.airLows.length ? m.airLows[Math.min(day, m.airLows.length - 1)] : null) ?? airTempOn(m, day);

/** Air temperature on a day counted from the first pour (0), holding the last given value. */
export const airTempOn = (m: Model, day: number) => m.airTemps[Math.min(day, m.airTemps.length - 1)];
