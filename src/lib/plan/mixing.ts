// Mixing plan: bags per section against the working time of the mix, and where to split a section
// (at a control-joint line) when the crew cannot place it before the first batch stiffens.

import type { SectionGrid } from './joints';
import type { BagOffer, Model } from './model';
import { areaLeftOf, clipVertical, fromFrame, signedArea } from './polygon';
import type { Frame, Pt } from './polygon';
import { countUp, KG_PER_LB, mass, mToPlan, temperature } from './units';
import { mapList, mapNumbers } from './util';
import type { Mass, Temperature } from './units';

/** Beyond this many pours a section belongs to ready-mix; no cold-joint lines are drawn (engine choice). */
export const MAX_PRACTICAL_PARTS = 3;

/** NIOSH Revised Lifting Equation load constant, 23 kg (51 lb) (NIOSH Pub. 94-110). */
export const NIOSH_LOAD_CONSTANT_KG = 23;

/**
 * Working time at a temperature: the given time at 70 °F, halving every 20 °F warmer (common
 * practice: 1½–2 h at 70 °F, about half at 90 °F), held between ¼× and 2×.
 */
export function workingMinutes(at70F: number, tempC: number): number {
	const f = (tempC * 9) / 5 + 32;
	return at70F * Math.min(2, Math.max(0.25, 2 ** (-(f - 70) / 20)));
}

export interface CrewTime {
	mixMinutes: number;
	placeMinutes: number;
	totalMinutes: number;
	batches?: number;
}

/** Elapsed time for a crew to mix and place a number of bags. */
export function crewTime(bags: number, bag: BagOffer, crew: Model['crew']): CrewTime {
	const place = bags * crew.placeMinutesPer80lb * (bag.kg / (80 * KG_PER_LB));
	if (crew.method === 'hand') {
		// Everyone mixes and places their own tub or barrow.
		const mix = bags * crew.handMinutesPerKg * bag.kg;
		return { mixMinutes: mix / crew.people, placeMinutes: place / crew.people, totalMinutes: (mix + place) / crew.people };
	}
	const perBatch = Math.max(1, Math.floor(crew.drumBatchKg / bag.kg + 1e-9));
	const batches = countUp(bags / perBatch);
	const mix = batches * crew.drumMinutesPerBatch;
	// One person runs the mixer; the rest wheel and spread while it turns.
	const placing = crew.people > 1 ? place / (crew.people - 1) : place;
	const total = crew.people > 1 ? Math.max(mix, placing) : mix + placing;
	return { mixMinutes: mix, placeMinutes: placing, totalMinutes: total, batches };
}

export interface Split {
	parts: number;
	/** Bags in each part; empty when there are more parts than MAX_PRACTICAL_PARTS. */
	bagsPerPart: number[];
	/** Where the new cold joints go, in plan coordinates; empty when impractical. */
	coldJoints: { from: Pt; to: Pt }[];
	/** true when the control joints of this section were re-laid closer so a cold joint could sit on one. */
	relaid: boolean;
	note: string;
}

/** A split as the engine uses it: the cuts in metres and each part's volume. */
export interface SplitPlan extends Split {
	/** Cold-joint segments in metres (plan frame), for the bulkhead forms. */
	segments: { from: Pt; to: Pt }[];
	partsM3: number[];
	/** Cut positions in the frame and whether they are w (true) or u values, for the joint layout. */
	cut: { alongW: boolean; at: number[] };
}

/**
 * Greedy cuts on joint lines: from one end, each part runs to the farthest line that keeps it within
 * maxBags. Returns the cut positions, or null when one strip between neighbouring lines is too big.
 */
export function cutsOnLines(poly: readonly Pt[], lines: number[], bagsFor: (area: number) => number, maxBags: number): number[] | null {
	const total = Math.abs(signedArea(poly));
	const left = mapNumbers(lines, (l) => areaLeftOf(poly, l)); // each O(n), worked out once
	const cuts: number[] = [];
	let before = 0;
	let from = 0;
	for (;;) {
		if (bagsFor(total - before) <= maxBags) return cuts;
		let best = -1;
		for (let k = from; k < lines.length; k++) if (left[k] - before > 0 && bagsFor(left[k] - before) <= maxBags) best = k;
		if (best < 0) return null;
		cuts.push(lines[best]);
		before = left[best];
		from = best + 1;
	}
}

/**
 * More pours than a crew should attempt: the count and no cold joints drawn, and not laid out part
 * by part, since a list per part would grow with the bag count, not the slab's size.
 */
function impractical(parts: number, bags: number, sectionM3: number, across: boolean): SplitPlan {
	return {
		parts,
		bagsPerPart: [],
		coldJoints: [],
		segments: [],
		partsM3: [sectionM3],
		cut: { alongW: across, at: [] },
		relaid: false,
		note: `The crew would need ${parts} separate pours of about ${countUp(bags / parts)} bags for this section; ready-mix or more hands is the practical answer.`
	};
}

/**
 * Split into pours of at most maxBags, with every cold joint on a control-joint line (ACI 302.1R
 * panels stay ≤ 1.5 : 1). When no line falls where a cut must go, relay(maxSpacing) lays the
 * section's joints closer and the cut is tried again.
 */
export function splitSection(
	grid: SectionGrid,
	sectionM3: number,
	yieldM3: number,
	maxBags: number,
	frame: Frame,
	units: Model['units'],
	eps: number,
	relay?: (maxSpacing: number) => SectionGrid
): SplitPlan {
	const bags = countUp(sectionM3 / yieldM3);
	const fewest = countUp(bags / maxBags);
	if (fewest > MAX_PRACTICAL_PARTS) return impractical(fewest, bags, sectionM3, false);
	const uSpan = grid.us[grid.us.length - 1] - grid.us[0];
	const wSpan = grid.ws[grid.ws.length - 1] - grid.ws[0];
	// Cut across the longer direction; work with x as that direction. A square cuts across u, whatever
	// float noise a turned outline brings.
	const across = wSpan > uSpan * (1 + 1e-9);
	const flip = (g: SectionGrid) => (across ? mapList(g.poly, (q): Pt => [q[1], q[0]]) : g.poly);
	const poly = flip(grid);
	const total = Math.abs(signedArea(poly));
	const bagsFor = (a: number) => countUp(((a / total) * sectionM3) / yieldM3);
	const span = across ? wSpan : uSpan;
	let lines = (across ? grid.ws : grid.us).slice(1, -1);
	let cuts = cutsOnLines(poly, lines, bagsFor, maxBags);
	let relaid = false;
	if ((cuts === null || cuts.length + 1 > MAX_PRACTICAL_PARTS) && relay) {
		// Strips narrow enough that each holds at most maxBags, with 10 % to spare for rounding.
		const g = relay((span * maxBags * 0.9) / bags);
		lines = (across ? g.ws : g.us).slice(1, -1);
		const again = cutsOnLines(flip(g), lines, bagsFor, maxBags);
		if (again !== null && (cuts === null || again.length < cuts.length)) {
			cuts = again;
			relaid = true;
		}
	}
	if (cuts === null || cuts.length + 1 > MAX_PRACTICAL_PARTS) return impractical(Math.max(fewest, (cuts?.length ?? 0) + 1), bags, sectionM3, across);
	const ends = mapNumbers(cuts, (c) => areaLeftOf(poly, c));
	ends.push(total);
	const partsM3 = mapNumbers(ends, (a, i) => ((a - (i ? ends[i - 1] : 0)) / total) * sectionM3);
	const toPlane = (q: Pt): Pt => fromFrame(frame, across ? [q[1], q[0]] : q);
	const segments: SplitPlan['segments'] = [];
	for (const c of cuts) for (const [a, b] of clipVertical(poly, c, eps)) segments.push({ from: toPlane([c, a]), to: toPlane([c, b]) });
	const P = (p: Pt): Pt => [mToPlan(p[0], units), mToPlan(p[1], units)];
	return {
		parts: cuts.length + 1,
		bagsPerPart: mapNumbers(partsM3, (v) => countUp(v / yieldM3)),
		coldJoints: mapList(segments, (j) => ({ from: P(j.from), to: P(j.to) })),
		segments,
		partsM3,
		cut: { alongW: across, at: cuts },
		relaid,
		note: `Pour this section as ${cuts.length + 1} parts on separate days, each cold joint on a control-joint line with a bulkhead board${relaid ? ' (the control joints are laid closer for this)' : ''}; or order ready-mix.`
	};
}

export interface MixingSection extends CrewTime {
	index: number;
	bags: number;
	temperature: Temperature;
	workingMinutes: number;
	finishMinutes: number;
	spareMinutes: number;
	fits: boolean;
	split?: Split;
	/** The pours this section is placed in, in order: one, or the parts of a split. */
	pours: { bags: number; cubicMeters: number }[];
}

export interface MixingResult {
	bag: { size: number; unit: 'lb' | 'kg'; mass: Mass };
	method: 'hand' | 'drum';
	people: number;
	sections: MixingSection[];
	/** Bags poured over every pour: the same count as the planned bag size bought. */
	totalBags: number;
	fits: boolean;
	readyMixSuggested: boolean;
	bagsPerPerson: number;
	heaviestLift: { mass: Mass; loadConstant: Mass; overLoadConstant: boolean };
}

export function computeMixing(
	m: Model,
	orderM3: number[],
	grids: SectionGrid[],
	frame: Frame,
	pourDays: number[],
	tempOn: (day: number) => number,
	eps: number,
	relay?: (section: number, maxSpacing: number) => SectionGrid
): { mixing: MixingResult; splits: (SplitPlan | undefined)[] } {
	const bag = m.bags.plan;
	const splits: (SplitPlan | undefined)[] = [];
	const sections = mapList(orderM3, (v, i): MixingSection => {
		const whole = countUp(v / bag.yieldM3);
		const time = crewTime(whole, bag, m.crew);
		const t = m.concreteTemp ?? tempOn(pourDays[i]);
		const working = workingMinutes(m.crew.workingMinutesAt21C, t);
		const spare = working - time.totalMinutes - m.crew.finishMinutes;
		const s: MixingSection = {
			index: i,
			bags: whole,
			mixMinutes: time.mixMinutes,
			placeMinutes: time.placeMinutes,
			totalMinutes: time.totalMinutes,
			batches: time.batches,
			temperature: temperature(t),
			workingMinutes: working,
			finishMinutes: m.crew.finishMinutes,
			spareMinutes: spare,
			fits: spare >= 0,
			pours: [{ bags: whole, cubicMeters: v }]
		};
		const perBag = whole ? time.totalMinutes / whole : 0;
		const maxBags = perBag ? Math.floor((working - m.crew.finishMinutes) / perBag + 1e-9) : whole;
		if (!s.fits && maxBags >= 1) {
			const plan = splitSection(grids[i], v, bag.yieldM3, maxBags, frame, m.units, eps, relay && ((max) => relay(i, max)));
			const { parts, bagsPerPart, coldJoints, relaid, note } = plan;
			s.split = { parts, bagsPerPart, coldJoints, relaid, note };
			splits[i] = plan;
			if (plan.segments.length) {
				// One rounding rule: each pour is rounded up to whole bags, and the section is their sum.
				s.pours = mapList(plan.partsM3, (p) => ({ bags: countUp(p / bag.yieldM3), cubicMeters: p }));
				s.bags = s.pours.reduce((a, p) => a + p.bags, 0);
			}
		}
		return s;
	});
	const totalBags = sections.reduce((a, s) => a + s.bags, 0);
	const mixing: MixingResult = {
		bag: { size: bag.size, unit: m.units === 'imperial' ? 'lb' : 'kg', mass: mass(bag.kg) },
		method: m.crew.method,
		people: m.crew.people,
		sections,
		totalBags,
		fits: sections.every((s) => s.fits),
		readyMixSuggested: sections.some((s) => !s.fits),
		bagsPerPerson: countUp(totalBags / m.crew.people),
		heaviestLift: {
			mass: mass(bag.kg),
			loadConstant: mass(NIOSH_LOAD_CONSTANT_KG),
			overLoadConstant: bag.kg > NIOSH_LOAD_CONSTANT_KG
		}
	};
	return { mixing, splits };
}
