// The slab plan engine: one described slab in, every number for the job out. Plain TypeScript, so
// the browser and the server run the same code.

import { bagOption, compareCost, readyMix, type BagOption, type Comparison, type ReadyMixResult } from './bags';
import { computeCautions, type Caution } from './cautions';
import { formatSmall } from './format';
import { computeElevations, slopePlane, type ElevationResult } from './elevations';
import { layoutSections, PlanInputError, type Layout } from './geometry';
import { closerGrid, computeJoints, sectionGrids, type JointsResult, type SectionGrid } from './joints';
import { computeForms, type FormsResult } from './lumber';
import { computeMaterials, type MaterialsResult } from './materials';
import { computeMixing, type MixingResult } from './mixing';
import { airLowOn, airTempOn, toModel, type Model } from './model';
import type { Pt } from './polygon';
import { ageSeries, buildSchedule, milestones, pourOffsets, type Pour, strengthSeries, type Milestone, type ScheduleResult } from './schedule';
import { parsePlanInput, type EdgeRef, type ParsedPlan, type PlanInput } from './schema';
import type { StrengthDay } from './strength';
import { area, length, mToPlan } from './units';
import type { Area, Length, Units } from './units';
import { computeSlab, type SlabResult } from './slab';
import { computeVolume, thickenedEdges, type VolumeResult } from './volume';
import { assessWeather, type WeatherResult } from './weather';
import { mapList, mapNumbers } from './util';

export interface SectionArea extends Area {
	index: number;
	name: string;
	perimeter: Length;
}

export interface GeometryResult {
	sections: {
		index: number;
		name: string;
		/** Outline in the plan's units, as given. */
		outline: Pt[];
		edges: { index: number; length: Length; kind: 'outer' | 'house' | 'coldJoint' | 'partlyShared'; thickened: boolean }[];
	}[];
	coldJoints: { sections: [number, number]; edges: [number, number]; from: Pt; to: Pt; length: Length }[];
	highEdge: EdgeRef;
	houseEdges: EdgeRef[];
}

export interface PlanResult {
	units: Units;
	name?: string;
	/** ISO 4217 code of every price. */
	currency: string;
	area: Area & { perimeter: Length; sections: SectionArea[] };
	geometry: GeometryResult;
	/** Thickness, base, dig depths, trench, house gap and the finished surface, for every view. */
	slab: SlabResult;
	volume: VolumeResult;
	forms: FormsResult;
	elevations: ElevationResult;
	bags: BagOption[];
	readyMix: ReadyMixResult;
	cost: Comparison;
	mixing: MixingResult;
	joints: JointsResult;
	strength: StrengthDay[];
	milestones: Milestone[];
	schedule: ScheduleResult;
	weather: WeatherResult;
	materials: MaterialsResult;
	cautions: Caution[];
}

/**
 * The engine's version, stored beside every saved result (plan.engine_version). Raise it with any
 * change that gives a different result for the same input (a rule, a wording, a new field), so
 * recomputeOutdatedPlans (src/lib/server/plans.ts) brings the stored plans up to date.
 */
export const ENGINE_VERSION = 1;

/** Days of strength timeline returned. */
const TIMELINE_DAYS = 28;

function geometryResult(m: Model, layout: Layout, thick: boolean[][]): GeometryResult {
	const P = (p: Pt): Pt => [mToPlan(p[0], m.units), mToPlan(p[1], m.units)];
	const isHouse = (s: number, e: number) => m.houseEdges.some((h) => h.section === s && h.edge === e);
	return {
		sections: mapList(layout.sections, (s) => ({
			index: s.index,
			name: m.sections[s.index].name,
			outline: mapList(s.outline, P),
			edges: mapList(s.edges, (e) => ({
				index: e.index,
				length: length(e.length),
				kind: isHouse(s.index, e.index) ? 'house' : !e.shared.length ? 'outer' : e.free.length ? 'partlyShared' : 'coldJoint',
				thickened: thick[s.index][e.index]
			}))
		})),
		coldJoints: mapList(layout.coldJoints, (j) => ({ sections: j.sections, edges: j.edges, from: P(j.from), to: P(j.to), length: length(j.length) })),
		highEdge: m.highEdge,
		houseEdges: m.houseEdges
	};
}

/** Widest span a screed must bridge: the shorter side of the largest section, m. */
function screedSpan(grids: SectionGrid[]): number {
	let span = -Infinity;
	for (const g of grids) span = Math.max(span, Math.min(g.us[g.us.length - 1] - g.us[0], g.ws[g.ws.length - 1] - g.ws[0]));
	return span;
}

/** Longest run along the high edge's direction of any section's grid, m. */
function alongSpan(grids: SectionGrid[]): number {
	let span = -Infinity;
	for (const g of grids) span = Math.max(span, g.us[g.us.length - 1] - g.us[0]);
	return span;
}

/** The joint depth as the day plan states it. */
const jointDepthText = (m: Model, j: JointsResult) => formatSmall(j.depth, m.units);

/** Compute the plan from input already parsed by planInputSchema. */
export function computeParsedPlan(p: ParsedPlan): PlanResult {
	const m = toModel(p);
	const layout = layoutSections(mapList(m.sections, (s) => s.outline));
	const thick = thickenedEdges(m, layout);
	const volume = computeVolume(m, layout, thick);
	const plane = slopePlane(m, layout);
	const tempOn = (d: number) => airTempOn(m, d);
	// Working time is judged on each section's day as if none were split; splits then add pour days.
	const sectionDays = pourOffsets(m, layout.coldJoints, tempOn);
	// The joint lines are drawn once, after the pour splits are known: the split needs only the grids.
	const grids = sectionGrids(m, layout, plane.framed);
	const closer = new Map<number, Required<SectionGrid>>();
	const relay = (i: number, max: number) => {
		const g = closerGrid(plane.framed[i], max, m.thickness, layout.eps) as Required<SectionGrid>;
		closer.set(i, g);
		return g;
	};
	const orders = mapNumbers(volume.sections, (s) => s.order.cubicMeters);
	const { mixing, splits } = computeMixing(m, orders, grids, plane.frame, sectionDays, tempOn, layout.eps, relay);
	const cuts = new Map<number, { alongW: boolean; at: number[] }>();
	splits.forEach((sp, i) => {
		if (!sp?.segments.length) return;
		cuts.set(i, sp.cut);
	});
	// Only the re-laid sections change grid; the rest keep theirs.
	const prior = cuts.size ? mapList(grids, (g, i) => (splits[i]?.relaid ? closer.get(i)! : g)) : grids;
	const { joints, grids: laid } = computeJoints(m, layout, plane.frame, plane.framed, cuts.size ? { coldCuts: cuts, prior } : { prior });
	// Every pour in order, and its concrete (for the bag options below).
	const pours: Pour[] = [];
	const pourM3: number[] = [];
	for (const s of mixing.sections)
		for (let part = 0; part < s.pours.length; part++) {
			pours.push({ section: s.index, part, bags: s.pours[part].bags });
			pourM3.push(s.pours[part].cubicMeters);
		}
	const offsets = pourOffsets(m, layout.coldJoints, tempOn, pours);
	const bulkheads: { section: number; from: Pt; to: Pt }[] = [];
	for (let i = 0; i < splits.length; i++) for (const g of splits[i]?.segments ?? []) bulkheads.push({ section: i, from: g.from, to: g.to });
	const { forms, stakes } = computeForms(m, layout, bulkheads);
	const elevations = computeElevations(m, layout, plane, stakes);
	const bags = mapList(m.bags.offered, (b) => bagOption(b, pourM3, m));
	const mix = readyMix(volume.order.cubicMeters, m);
	const last = Math.max(...offsets);
	const stones = milestones(m, ageSeries(last, tempOn), last);
	const schedule = buildSchedule(m, pours, offsets, stones, jointDepthText(m, joints));
	const weather = assessWeather(
		mapList(schedule.pourDays, (d, i) => ({ section: d.section, part: d.part, bags: d.bags, day: d.day, date: d.date, offset: offsets[i] })),
		tempOn,
		{
			humidity: m.humidity,
			windKmh: m.windKmh,
			concreteTemp: m.concreteTemp,
			lowOn: (d) => airLowOn(m, d),
			cement: m.cement,
			designMpa: m.designStrengthMpa
		}
	);
	const slabArea = layout.sections.reduce((a, s) => a + s.area, 0);
	const total = area(slabArea);
	const planned = bags.find((b) => b.planned) ?? bags[0];
	const materials = computeMaterials(m, {
		volume,
		forms,
		planned,
		slabAreaM2: slabArea,
		screedSpanM: screedSpan(laid),
		hasJoints: joints.totalLength.meters > 0,
		framed: plane.framed,
		eps: layout.eps,
		unformedHouse: m.hasHouse && !m.houseEdgeFormed,
		alongSpanM: alongSpan(laid)
	});
	return {
		units: m.units,
		name: m.name,
		currency: p.currency,
		area: {
			squareFeet: total.squareFeet,
			squareMeters: total.squareMeters,
			perimeter: length(layout.outerPerimeter),
			sections: mapList(layout.sections, (s) => {
				const a = area(s.area);
				return { index: s.index, name: m.sections[s.index].name, squareFeet: a.squareFeet, squareMeters: a.squareMeters, perimeter: length(s.perimeter) };
			})
		},
		geometry: geometryResult(m, layout, thick),
		slab: computeSlab(m, plane, thick),
		volume,
		forms,
		elevations,
		bags,
		readyMix: mix,
		cost: compareCost(bags, mix, materials),
		mixing,
		joints,
		strength: strengthSeries(m, last, tempOn, TIMELINE_DAYS),
		milestones: stones,
		schedule,
		weather,
		materials,
		cautions: computeCautions({ m, volume, elevations, mixing, joints, weather, schedule })
	};
}

/**
 * Validate and compute. Throws PlanInputError (with path/message issues) for bad input, including
 * invalid geometry; use parsePlanInput first when you want the errors without a throw.
 */
export function computePlan(input: unknown | PlanInput): PlanResult {
	const parsed = parsePlanInput(input);
	if (!parsed.ok) throw new PlanInputError(parsed.errors);
	return computeParsedPlan(parsed.plan);
}

export type EstimateOutcome = { ok: true; plan: PlanResult } | { ok: false; errors: PlanInputError['issues'] };

/** computePlan without throwing for bad input: what the API and form actions need. */
export function estimate(input: unknown): EstimateOutcome {
	const parsed = parsePlanInput(input);
	if (!parsed.ok) return { ok: false, errors: parsed.errors };
	try {
		return { ok: true, plan: computeParsedPlan(parsed.plan) };
	} catch (e) {
		if (e instanceof PlanInputError) return { ok: false, errors: e.issues };
		throw e;
	}
}

export { PlanInputError, type PlanIssue } from './geometry';
export { parsePlanInput, planInputSchema, planInputJsonSchema } from './schema';
export { fieldLabel } from './messages';
export { EXAMPLE_PRICES } from './defaults';
export type { ParsedPlan, PlanInput, EdgeRef, ParseResult } from './schema';
export type { Area, Length, Mass, Small, Temperature, Units, Volume } from './units';
export type { BagOption, Comparison, ReadyMixResult } from './bags';
export type { Caution, Severity } from './cautions';
export type { ElevationResult, SlopeRate } from './elevations';
export type { JointsResult, JointLine, SectionJoints } from './joints';
export type { FormsResult } from './lumber';
export type { MaterialsResult, MaterialItem, Tool } from './materials';
export type { MixingResult, MixingSection, Split } from './mixing';
export type { Milestone, ScheduleResult, ScheduleDay } from './schedule';
export type { StrengthDay } from './strength';
export type { VolumeResult, SectionVolume } from './volume';
export type { SlabResult } from './slab';
export type { WeatherResult, PourWeather } from './weather';
