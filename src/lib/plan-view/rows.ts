// Plan figures as people read them, step two: the rows each view lists (summary, stake marks,
// mixing, day plan, milestones, materials, cautions), built from the text in text.ts. The plan
// page and the PDF render these same rows, so the page and the download show the same numbers.

import type { Caution, PlanResult, Severity, StrengthDay } from '$lib/plan';
import { length, planToM } from '$lib/plan/units';
import { signal } from '$lib/palette';
import { formatMoney, toCents } from '$lib/money';
import { diyPricing, type DiyPricing, type PlanFigures } from '$lib/plan-figures';
import {
	formatArea,
	formatBagSize,
	formatCost,
	formatDate,
	formatElevation,
	formatLength,
	formatMass,
	formatMinutes,
	formatOrder,
	formatOrderVolume,
	formatPercent,
	formatQuantity,
	formatSmall,
	formatTemperature,
	formatVolume,
	magnitude,
	num,
	tapeLength
} from './text';

export interface SummaryItem {
	label: string;
	value: string;
	note?: string;
}

export type SummaryPlan = Pick<PlanResult, 'units' | 'area' | 'volume' | 'bags' | 'readyMix' | 'cost' | 'materials'> & { currency?: string };

export function summaryItems(p: SummaryPlan): SummaryItem[] {
	const u = p.units;
	const money = (x?: number) => (x === undefined ? '' : ` · ${formatCost(x, p.currency)}`);
	const items: SummaryItem[] = [
		{ label: 'Area', value: formatArea(p.area, u) },
		{ label: 'Outside edge', value: formatLength(p.area.perimeter, u) },
		{ label: 'Concrete in place', value: formatVolume(p.volume.net, u) },
		{ label: 'Concrete to order', value: formatVolume(p.volume.order, u), note: `includes ${num(p.volume.wastePercent, 1)} % for waste` },
		...p.bags.map((b) => ({
			label: `${formatBagSize(b)} bags`,
			value: `${b.count} bags${money(b.cost)}`,
			note: b.planned ? 'the size the mixing plan uses' : undefined
		})),
		{ label: 'Ready-mix', value: `${formatOrder(p.readyMix)}${money(p.readyMix.cost)}`, note: p.readyMix.note }
	];
	const cheaper = cheaperText(p);
	if (cheaper) items.push({ label: 'Costs less', value: cheaper });
	const total = planDiyTotal(p, 'homeowner');
	if (total) items.push({ label: 'Do-it-yourself total', value: total.value, note: total.detail });
	return items;
}

function cheaperText({ cost, bags, currency }: SummaryPlan): string | undefined {
	const formatMoneyIn = (x: number) => formatCost(x, currency);
	if (!cost.cheaper || cost.bagCost === undefined || cost.readyMixCost === undefined) return undefined;
	const bag = bags.find((b) => b.size === cost.bagSize);
	const bagLabel = bag ? `${formatBagSize(bag)} bags` : 'bags';
	return cost.cheaper === 'bags'
		? `${bagLabel}: ${formatMoneyIn(cost.bagCost)} against ${formatMoneyIn(cost.readyMixCost)} for ready-mix`
		: `Ready-mix: ${formatMoneyIn(cost.readyMixCost)} against ${formatMoneyIn(cost.bagCost)} for ${bagLabel}`;
}

/**
 * Who reads a DIY figure: the homeowner can still add prices in the planner; a contractor receiving
 * the plan can only be told there are none.
 */
export type DiyReader = 'homeowner' | 'contractor';

export interface DiyTotal {
	/** The total in cents, for comparing a bid with; null when nothing has a price. */
	cents: number | null;
	/** "$890.42", or "Not priced". */
	value: string;
	/** What the amount leaves out, or where prices go, in short. */
	note?: string;
	/** The note with the lines that have no price named, where there is room for them. */
	detail?: string;
}

/**
 * The do-it-yourself total as every view shows it: the page's summary and materials table, the
 * wizard's results, the PDF, the lead, and the bid comparison. With no price entered the engine's
 * sum is 0, so it says "Not priced" and gives nothing to compare a bid with; with some prices it is
 * the sum of those lines only, and says so. Undefined when the result carries no total at all.
 */
export function diyTotal(d: DiyPricing | undefined, reader: DiyReader, currency?: string): DiyTotal | undefined {
	if (!d) return undefined;
	if (!d.priced) {
		const note = reader === 'homeowner' ? "add prices in the planner's Crew step" : undefined;
		return { cents: null, value: 'Not priced', note, detail: note };
	}
	const cents = toCents(d.amount);
	const value = formatMoney(cents, currency);
	if (d.complete) return { cents, value };
	const note = 'sum of the priced items only';
	return { cents, value, note, detail: d.unpriced.length ? `${note}; no price for: ${d.unpriced.join('; ')}` : note };
}

/** The DIY total of a plan's own result (live or frozen), as `reader` is told it. */
export const planDiyTotal = (p: { materials: unknown; currency?: string }, reader: DiyReader) => diyTotal(diyPricing(p.materials), reader, p.currency);

/** One line of text: "$890.42 (sum of the priced items only; no price for: …)", "Not priced — add prices…". */
export const diyTotalText = (t: DiyTotal) => (t.detail === undefined ? t.value : t.cents === null ? `${t.value} — ${t.detail}` : `${t.value} (${t.detail})`);

/**
 * A whole-job bid less the DIY total, signed: "+$3,309.58". Undefined when the plan has no price to
 * compare with, so no figure is made up from a total of 0.
 */
export function overDiy(bidCents: number, t: DiyTotal | undefined, currency?: string): string | undefined {
	if (!t || t.cents === null) return undefined;
	const diff = bidCents - t.cents;
	return `${diff >= 0 ? '+' : '−'}${formatMoney(Math.abs(diff), currency)}`;
}

const RUN_KIND = { outer: 'Outer form', house: 'House side', bulkhead: 'Bulkhead' } as const;

export interface StakeRow {
	id: string;
	where: string;
	position: string;
	elevation: string;
	belowLine: string;
	high: boolean;
}

export type StakePlan = Pick<PlanResult, 'units' | 'elevations' | 'forms' | 'geometry'>;

export function stakeRows(p: StakePlan): StakeRow[] {
	const u = p.units;
	const runs = new Map(p.forms.runs.map((r) => [r.id, r]));
	const names = new Map(p.geometry.sections.map((s) => [s.index, s.name]));
	// Stake coordinates are in the plan's length unit; read them as a tape does.
	const len = (v: number) => tapeLength(length(planToM(v, u)), u);
	return p.elevations.stakes.map((s) => {
		const run = runs.get(s.run);
		return {
			id: s.id,
			where: run ? `${RUN_KIND[run.kind]} ${run.id}, ${names.get(run.section)}` : s.run,
			position: `${len(s.x)}, ${len(s.y)}`,
			elevation: formatElevation(s.elevation, u),
			belowLine: formatSmall(s.belowLevelLine, u),
			high: s.id === p.elevations.highStake
		};
	});
}

/** How to use the table, with the high stake's own mark. */
export function stakeIntro(p: StakePlan): string {
	const { highStake, stakes, reference } = p.elevations;
	const high = stakes.find((s) => s.id === highStake);
	if (!high) return 'This plan sets no form stakes.';
	const { text, zero } = magnitude(high.elevation, p.units);
	const side = zero ? 'level with' : `${text} ${high.elevation.millimeters < 0 ? 'below' : 'above'}`;
	return `Stake ${high.id} is the high stake: mark it ${side} the ${reference.label}. Stretch a line from that mark, level it, and on every other stake mark the distance shown below the line. The marks are the finished top of the slab.`;
}

export interface MixingRow {
	index: number;
	name: string;
	bags: string;
	mixing: string;
	placing: string;
	total: string;
	working: string;
	finish: string;
	spare: string;
	fits: boolean;
	split?: string;
	splitNote?: string;
}

export type MixingPlan = Pick<PlanResult, 'units' | 'mixing' | 'area'>;

export function mixingRows(p: MixingPlan): MixingRow[] {
	const bag = formatBagSize(p.mixing.bag);
	return p.mixing.sections.map((s) => ({
		index: s.index,
		name: p.area.sections.find((a) => a.index === s.index)?.name ?? `Section ${s.index + 1}`,
		bags: `${s.bags} × ${bag}${s.batches === undefined ? '' : ` in ${s.batches} batches`}`,
		mixing: formatMinutes(s.mixMinutes),
		placing: formatMinutes(s.placeMinutes),
		total: formatMinutes(s.totalMinutes),
		working: `${formatMinutes(s.workingMinutes)} at ${formatTemperature(s.temperature, p.units)}`,
		finish: formatMinutes(s.finishMinutes),
		spare: s.spareMinutes >= 0 ? `${formatMinutes(s.spareMinutes)} to spare` : `${formatMinutes(s.spareMinutes)} short`,
		fits: s.fits,
		split: s.split ? splitText(s.split.parts, s.split.bagsPerPart) : undefined,
		splitNote: s.split?.note
	}));
}

export const fitText = (r: MixingRow) => `${r.fits ? 'Fits' : 'Does not fit'} the working time, keeping ${r.finish} for finishing: ${r.spare}.`;

export const READY_MIX_HINT =
	'At least one section would stiffen before this crew could place it: split it as shown, add people or a mixer, or order ready-mix.';

function splitText(parts: number, bags: number[]): string {
	if (!bags.length) return `${parts} pours, too many to lay out`;
	const same = bags.every((b) => b === bags[0]);
	return same ? `${parts} parts of ${bags[0]} bags each` : `${parts} parts: ${bags.join(', ')} bags`;
}

export function crewItems(p: Pick<PlanResult, 'units' | 'mixing'>): SummaryItem[] {
	const m = p.mixing;
	const lift = m.heaviestLift;
	return [
		{ label: 'Mixing', value: m.method === 'drum' ? 'Drum mixer' : 'By hand, one tub or barrow each' },
		{ label: 'Crew', value: `${m.people} ${m.people === 1 ? 'person' : 'people'}` },
		{ label: 'Bags per person', value: `about ${m.bagsPerPerson}` },
		{
			label: 'Heaviest lift',
			value: `${formatMass(lift.mass, p.units)} bag`,
			note: `${lift.overLoadConstant ? 'over' : 'within'} the ${formatMass(lift.loadConstant, p.units)} lifting load constant`
		}
	];
}

export interface DayRow {
	day: number;
	label: string;
	date?: string;
	pour: boolean;
	tasks: { id: string; text: string }[];
}

export function dayRows({ schedule }: Pick<PlanResult, 'schedule'>, locale?: string): DayRow[] {
	const pours = new Set(schedule.pourDays.map((d) => d.day));
	return schedule.days.map((d) => ({
		day: d.day,
		label: `Day ${d.day}`,
		date: d.date ? formatDate(d.date, locale) : undefined,
		pour: pours.has(d.day),
		tasks: d.tasks
	}));
}

export interface MilestoneRow {
	id: string;
	title: string;
	/** Days after the last pour, or null when not reached in the forecast. */
	day: number | null;
	when: string;
	/** Strength on that day, when the charted timeline reaches it. */
	percent?: number;
	strength?: string;
	rule: string;
	source: string;
}

/** What the page draws and lists of a strength day (the engine's day also carries psi, MPa and maturity). */
export type StrengthPoint = Pick<StrengthDay, 'day' | 'date' | 'percent'>;

export function milestoneRows(p: Pick<PlanResult, 'milestones'> & { strength: readonly StrengthPoint[] }, locale?: string): MilestoneRow[] {
	return p.milestones.map((m) => {
		const percent = m.day === null ? undefined : p.strength.find((d) => d.day === m.day)?.percent;
		const when =
			m.day === null
				? 'not reached in the forecast period'
				: [`day ${m.day} after the last pour`, m.planDay === null ? '' : `plan day ${m.planDay}`, m.date ? formatDate(m.date, locale) : '']
						.filter(Boolean)
						.join(' · ');
		return {
			id: m.id,
			title: m.title,
			day: m.day,
			when,
			percent,
			strength: percent === undefined ? undefined : formatPercent(percent),
			rule: m.rule,
			source: m.source
		};
	});
}

export interface MaterialRow {
	id: string;
	name: string;
	quantity: string;
	cost?: string;
	note?: string;
}

export const materialRows = ({ materials, currency }: Pick<PlanResult, 'materials'> & { currency?: string }): MaterialRow[] =>
	materials.items.map((i) => ({
		id: i.id,
		name: i.name,
		quantity: formatQuantity(i.quantity, i.unit),
		cost: i.cost === undefined ? undefined : formatCost(i.cost, currency),
		note: i.note
	}));

/** Shown only if a result ever lacks the engine's own local-codes caution. */
export const DEFERRAL_FALLBACK = 'Local codes, permits and licensed professionals come before anything in this plan.';

/**
 * Signal words and colours per ANSI Z535.4 (hazard labels): DANGER on safety red, WARNING on safety
 * orange (CAUTION, yellow, is not used). Plain information takes a heading of our own, in blue.
 */
export const SEVERITY_LABEL: Record<Severity, string> = { danger: 'Danger', warning: 'Warning', info: 'Good to know' };
/** ANSI Z535.1 safety red and safety orange (approximate sRGB), and our own information blue. */
export const SEVERITY_COLOR: Record<Severity, string> = signal;
const SEVERITY_RANK: Record<Severity, number> = { danger: 0, warning: 1, info: 2 };

/** The deferral to local codes apart, the rest most severe first (stable within a level). */
export function sortCautions(cautions: Caution[]): { deferral?: Caution; rest: Caution[] } {
	return {
		deferral: cautions.find((c) => c.id === 'local-codes'),
		rest: cautions
			.filter((c) => c.id !== 'local-codes')
			.map((c, i) => ({ c, i }))
			.sort((a, b) => SEVERITY_RANK[a.c.severity] - SEVERITY_RANK[b.c.severity] || a.i - b.i)
			.map((x) => x.c)
	};
}

/**
 * The few figures a lead and the bid comparison show, from the frozen copy the lead keeps (any part
 * may be missing in an older copy, and is then left out).
 */
export function figureRows(f: PlanFigures, reader: DiyReader): [label: string, value: string][] {
	const u = f.units;
	const rows: [string, string][] = [];
	if (f.area) rows.push(['Area', formatArea(f.area, u)]);
	if (f.volume?.net) rows.push(['Concrete, net', formatOrderVolume(f.volume.net, u)]);
	if (f.volume?.order) rows.push(['Concrete to order', formatOrderVolume(f.volume.order, u)]);
	if (f.bags?.length) rows.push(['Bags', f.bags.map((b) => `${b.count} × ${formatBagSize(b)}`).join(', ')]);
	if (f.joints) rows.push(['Control joints at most', `${formatLength(f.joints.maxSpacing, u)} apart`]);
	const diy = diyTotal(f.materials?.diyTotal, reader, f.currency);
	if (diy) rows.push(['Materials if done yourself', diyTotalText(diy)]);
	return rows;
}
