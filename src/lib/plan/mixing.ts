// Mixing plan: bags per section against the working time of the mix, and where to split a section
// (at a control-joint line) when the crew cannot place it before the first batch stiffens.

import type { SectionGrid } from './joints';
import type { BagOffer, Model } from './model';
import * as polygonLib from './polygon';
import type { Frame, Pt } from './polygon';
import * as utilLib from './util';
import * as unitsLib from './units';
import type { Mass, Temperature } from './units';

// Bound once: under the test runner every call through an import is a getter call.
const { areaLeftOf, clipVertical, fromFrame, signedArea } = polygonLib;
const { times } = utilLib;
const { countUp, mass, mToPlan, temperature } = unitsLib;

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
	const place = bags * crew.placeMinutesPerBag;
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
	note: string;
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
}

export interface MixingResult {
	bag: { size: number; unit: 'lb' | 'kg'; mass: Mass };
	method: 'hand' | 'drum';
	people: number;
	sections: MixingSection[];
	fits: boolean;
	readyMixSuggested: boolean;
	bagsPerPerson: number;
	heaviestLift: { mass: Mass; loadConstant: Mass; overLoadConstant: boolean };
}

/**
 * Cut positions x = c leaving the given shares of area to the left. Between two vertex x's the
 * chord length is linear, so the area is quadratic in c: bracket with the area at each vertex x,
 * fit the quadratic from one midpoint, and solve it.
 */
export function cutsAt(poly: readonly Pt[], shares: number[]): number[] {
	const xs = [...new Set(poly.map((p) => p[0]))].sort((a, b) => a - b);
	// Area left of each vertex x, worked out only as far as the scans below reach (each is O(n)).
	const known: number[] = [];
	const at = (k: number) => (known[k] ??= areaLeftOf(poly, xs[k]));
	const total = at(xs.length - 1);
	return shares.map((share) => {
		const target = share * total;
		let k = 0;
		while (k + 2 < xs.length && at(k + 1) < target) k++;
		const h = xs[k + 1] - xs[k];
		const d1 = at(k + 1) - at(k);
		const dm = areaLeftOf(poly, xs[k] + h / 2) - at(k);
		const s = (4 * (d1 - 2 * dm)) / (h * h); // d(chord)/dx
		const l0 = (d1 - (s * h * h) / 2) / h; // chord at xs[k]
		const r = target - at(k);
		const root = Math.sqrt(Math.max(0, l0 * l0 + 2 * s * r));
		const t = l0 + root > 0 ? (2 * r) / (l0 + root) : 0;
		return xs[k] + Math.min(h, Math.max(0, t));
	});
}

/** Split into parts of at most maxBags, cutting across the section's longer direction. */
export function splitSection(
	grid: SectionGrid,
	bags: number,
	maxBags: number,
	frame: Frame,
	units: Model['units'],
	eps: number
): Split {
	const parts = countUp(bags / maxBags);
	if (parts > MAX_PRACTICAL_PARTS)
		// Not laid out part by part: a list per part would grow with the bag count, not the slab's size.
		return {
			parts,
			bagsPerPart: [],
			coldJoints: [],
			note: `The crew would need ${parts} separate pours of about ${countUp(bags / parts)} bags for this section; ready-mix or more hands is the practical answer.`
		};
	const uSpan = grid.us[grid.us.length - 1] - grid.us[0];
	const wSpan = grid.ws[grid.ws.length - 1] - grid.ws[0];
	// Cut across the longer direction; work with x as that direction.
	const across = wSpan > uSpan;
	const poly = across ? grid.poly.map((q): Pt => [q[1], q[0]]) : grid.poly;
	const lines = across ? grid.ws : grid.us;
	const total = Math.abs(signedArea(poly));
	const bagsIn = (a: number) => countUp((a / total) * bags);
	const exacts = cutsAt(poly, times(parts - 1, (k) => (k + 1) / parts));
	const cuts: number[] = [];
	let before = 0;
	const inner = lines.slice(1, -1);
	exacts.forEach((exact, k) => {
		// Move the cut onto the nearest control-joint line if both parts beside it still fit.
		let snap = exact;
		for (const l of inner) if (Math.abs(l - exact) < Math.abs(snap - exact)) snap = l;
		const a = areaLeftOf(poly, snap);
		const after = k + 1 < exacts.length ? areaLeftOf(poly, exacts[k + 1]) : total;
		const fits = a > before && after > a && bagsIn(a - before) <= maxBags && bagsIn(after - a) <= maxBags;
		cuts.push(fits ? snap : exact);
		before = fits ? a : areaLeftOf(poly, exact);
	});
	const ends = [...cuts.map((c) => areaLeftOf(poly, c)), total];
	const bagsPerPart = ends.map((a, i) => bagsIn(a - (i ? ends[i - 1] : 0)));
	const P = (q: Pt): Pt => {
		const p = fromFrame(frame, across ? [q[1], q[0]] : q);
		return [mToPlan(p[0], units), mToPlan(p[1], units)];
	};
	const coldJoints: Split['coldJoints'] = [];
	for (const c of cuts) for (const [a, b] of clipVertical(poly, c, eps)) coldJoints.push({ from: P([c, a]), to: P([c, b]) });
	return {
		parts,
		bagsPerPart,
		coldJoints,
		note: `Pour this section as ${parts} parts with a bulkhead at each new cold joint (on a control-joint line where one is near), or order ready-mix.`
	};
}

export function computeMixing(
	m: Model,
	orderM3: number[],
	grids: SectionGrid[],
	frame: Frame,
	pourDays: number[],
	tempOn: (day: number) => number,
	eps: number
): MixingResult {
	const bag = m.bags.plan;
	const sections = orderM3.map((v, i): MixingSection => {
		const bags = countUp(v / bag.yieldM3);
		const time = crewTime(bags, bag, m.crew);
		const t = m.concreteTemp ?? tempOn(pourDays[i]);
		const working = workingMinutes(m.crew.workingMinutesAt21C, t);
		const spare = working - time.totalMinutes - m.crew.finishMinutes;
		const s: MixingSection = {
			index: i,
			bags,
			...time,
			temperature: temperature(t),
			workingMinutes: working,
			finishMinutes: m.crew.finishMinutes,
			spareMinutes: spare,
			fits: spare >= 0
		};
		const perBag = bags ? time.totalMinutes / bags : 0;
		const maxBags = perBag ? Math.floor((working - m.crew.finishMinutes) / perBag + 1e-9) : bags;
		if (!s.fits && maxBags >= 1) s.split = splitSection(grids[i], bags, maxBags, frame, m.units, eps);
		return s;
	});
	const totalBags = sections.reduce((a, s) => a + s.bags, 0);
	return {
		bag: { size: bag.size, unit: m.units === 'imperial' ? 'lb' : 'kg', mass: mass(bag.kg) },
		method: m.crew.method,
		people: m.crew.people,
		sections,
		fits: sections.every((s) => s.fits),
		readyMixSuggested: sections.some((s) => !s.fits),
		bagsPerPerson: countUp(totalBags / m.crew.people),
		heaviestLift: {
			mass: mass(bag.kg),
			loadConstant: mass(NIOSH_LOAD_CONSTANT_KG),
			overLoadConstant: bag.kg > NIOSH_LOAD_CONSTANT_KG
		}
	};
}
