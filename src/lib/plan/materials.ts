// Materials to buy with quantities and prices, the tools for the job, and a do-it-yourself total.

import type { BagOption } from './bags';
import type { FormsResult } from './lumber';
import type { Model } from './model';
import { clipVertical, signedArea } from './polygon';
import type { Pt } from './polygon';
import { KG_PER_LB, L_PER_US_GAL, M2_PER_FT2, M3_PER_YD3, M_PER_IN, countUp, length, m3ToOrderVolume } from './units';
import { filterList, mapList } from './util';
import type { Length } from './units';
import type { VolumeResult } from './volume';

export interface MaterialItem {
	id: string;
	name: string;
	quantity: number;
	unit: string;
	cost?: number;
	note?: string;
}

export interface Tool {
	id: string;
	name: string;
	count: number;
	why: string;
}

export interface MaterialsResult {
	items: MaterialItem[];
	tools: Tool[];
	diyTotal: { amount: number; complete: boolean; unpriced: string[] };
}

/** Screed board overhang past the forms, about 1 ft; common practice. */
const SCREED_OVERHANG_M = 0.3;
/** Form release agent: about 400 ft² of form face per US gal (≈ 10 m²/L); from memory — the label rules. */
export const RELEASE_M2_PER_L = (400 * M2_PER_FT2) / L_PER_US_GAL;
/** Release agent sold by the US gallon (about 4 L); common practice. */
const RELEASE_CONTAINER_L = L_PER_US_GAL;
/** Welded wire sheets lap one wire spacing plus 2 in (50 mm); common practice (wire reinforcement industry guidance, from memory). */
export const MESH_EXTRA_LAP_M = 2 * M_PER_IN;
/** Bars kept 3 in (75 mm) in from the slab edge; from memory (ACI 318 cover for concrete cast against earth). */
export const BAR_EDGE_M = 3 * M_PER_IN;
/** Fiber dose when the label's is not given: 1.5 lb per yd³ (0.9 kg/m³); from memory — follow the label. */
export const FIBER_KG_PER_M3 = (1.5 * KG_PER_LB) / M3_PER_YD3;

export interface MaterialsInput {
	volume: VolumeResult;
	forms: FormsResult;
	planned: BagOption;
	slabAreaM2: number;
	/** Widest span between forms that a screed must bridge, m. */
	screedSpanM: number;
	hasJoints: boolean;
	/** Section outlines in the high-edge frame (u along it), for the rebar grid. */
	framed?: Pt[][];
	eps?: number;
	/** A house side with no form: the screed must ride the side forms, or a rail. */
	unformedHouse?: boolean;
	/** Longest run along the high edge, m: what a screed spanning the side forms must bridge. */
	alongSpanM?: number;
}

const priced = (qty: number, each?: number) => (each === undefined ? undefined : qty * each);

/** Welded wire: sheets or rolls lapped one wire spacing + 2 in, and chairs on a grid. */
export function meshQuantities(m: Model, areaM2: number) {
	const r = m.reinforcing;
	const lap = r.wireSpacing + MESH_EXTRA_LAP_M;
	const cover = r.meshForm === 'sheet' ? (r.meshWidth - lap) * (r.meshLength - lap) : (r.meshWidth - lap) * r.meshLength;
	const pieces = cover > 0 ? countUp(areaM2 / cover) : 0;
	return { pieces, boughtM2: pieces * r.meshWidth * r.meshLength, lap, chairs: countUp(areaM2 / r.chairSpacing ** 2) };
}

/**
 * A rebar grid both ways at the bar spacing, kept in from the edges; a bar longer than stock gets a
 * lap of lapDiameters × its diameter at each splice. Sticks are the total length over stock length.
 */
export function rebarQuantities(m: Model, framed: Pt[][], eps: number) {
	const r = m.reinforcing;
	const lap = r.lapDiameters * r.barDiameter;
	let bars = 0;
	let total = 0;
	let splices = 0;
	for (const poly of framed)
		for (const p of [poly, mapList(poly, (q): Pt => [q[1], q[0]])]) {
			let lo = Infinity;
			let hi = -Infinity;
			for (const q of p) {
				lo = Math.min(lo, q[0]);
				hi = Math.max(hi, q[0]);
			}
			for (let x = lo + BAR_EDGE_M; x <= hi - BAR_EDGE_M + 1e-9; x += r.barSpacing)
				for (const [a, b] of clipVertical(p, x, eps)) {
					const len = b - a - 2 * BAR_EDGE_M;
					if (len <= 0) continue;
					const n = Math.max(0, countUp((len - r.barStock) / (r.barStock - lap)));
					bars++;
					splices += n;
					total += len + n * lap;
				}
		}
	const area = framed.reduce((a, p) => a + Math.abs(signedArea(p)), 0);
	return { bars, splices, lengthM: total, sticks: countUp(total / r.barStock), chairs: countUp(area / r.chairSpacing ** 2), lap };
}

export function computeMaterials(m: Model, x: MaterialsInput): MaterialsResult {
	const imp = m.units === 'imperial';
	const L = (v: Length) => (imp ? v.feet : v.meters);
	const lu = imp ? 'ft' : 'm';
	const area = imp ? x.slabAreaM2 / M2_PER_FT2 : x.slabAreaM2;
	const p = m.prices;
	const items: MaterialItem[] = [
		{
			id: 'concrete-bags',
			name: `Bagged concrete mix, ${x.planned.size} ${x.planned.unit}`,
			quantity: x.planned.count,
			unit: 'bags',
			cost: x.planned.cost
		},
		{ id: 'water', name: 'Clean mixing water', quantity: imp ? x.planned.water.gallons : x.planned.water.liters, unit: imp ? 'gal' : 'L' }
	];
	if (m.base.depth > 0) {
		const loose = x.volume.base.loose.cubicMeters;
		const w = x.volume.base.weight;
		items.push({
			id: 'gravel',
			name: 'Crushed stone or gravel base (loose)',
			quantity: m3ToOrderVolume(loose, m.units),
			unit: imp ? 'yd³' : 'm³',
			cost: priced(loose, p.gravelPerM3),
			note: `About ${round1(imp ? w.shortTons : w.tonnes)} ${imp ? 'short tons' : 't'} compacted (density an editable common-practice value). ${x.volume.base.note}`
		});
	}
	for (const b of x.forms.buy)
		items.push({
			id: `board-${L(b.stock)}`,
			name: `${m.forms.lumber === 'custom' ? 'Form board' : m.forms.lumber} × ${L(b.stock)} ${lu}`,
			quantity: b.count,
			unit: 'boards',
			cost: priced(b.count * b.stock.meters, p.lumberPerM)
		});
	const faceM2 = x.forms.formLength.meters * m.forms.depth;
	const releaseL = faceM2 / RELEASE_M2_PER_L;
	items.push(
		{
			id: 'stakes',
			name: `Form stakes, ${Math.round(imp ? x.forms.stakes.length.inches : x.forms.stakes.length.millimeters)} ${imp ? 'in' : 'mm'}`,
			quantity: x.forms.stakes.count,
			unit: 'stakes',
			cost: priced(x.forms.stakes.count, p.stake)
		},
		{
			id: 'screws',
			name: 'Exterior screws for stakes, splice cleats and corners',
			quantity: x.forms.screws,
			unit: 'screws',
			cost: priced(x.forms.screws, p.screw)
		}
	);
	if (m.forms.release === 'agent') {
		const containers = Math.max(1, countUp(releaseL / RELEASE_CONTAINER_L));
		items.push({
			id: 'release-agent',
			name: 'Form release agent (not motor oil)',
			quantity: containers,
			unit: imp ? 'gal containers' : '4 L containers',
			cost: priced(containers, p.releaseAgent),
			note: `About ${round1(imp ? releaseL / L_PER_US_GAL : releaseL, releaseL < 3.8 ? 2 : 1)} ${imp ? 'gal' : 'L'} for ${Math.round(imp ? faceM2 / M2_PER_FT2 : faceM2)} ${lu}² of form face (common practice coverage; the label rules).` // coverage from memory
		});
	}
	if (x.forms.isolationStrip.meters > 0)
		items.push({
			id: 'isolation-strip',
			name: 'Isolation-joint strip against the house',
			quantity: L(x.forms.isolationStrip),
			unit: lu,
			cost: priced(x.forms.isolationStrip.meters, p.isolationStripPerM)
		});
	if (m.reinforcement === 'mesh') {
		const q = meshQuantities(m, x.slabAreaM2);
		items.push(
			{
				id: 'mesh',
				name: `Welded wire mesh, ${round1(L(length(m.reinforcing.meshWidth)))} × ${round1(L(length(m.reinforcing.meshLength)))} ${lu} ${m.reinforcing.meshForm}s`,
				quantity: q.pieces,
				unit: `${m.reinforcing.meshForm}s`,
				cost: priced(q.boughtM2, p.meshPerM2),
				note: `Lap each ${round1(imp ? q.lap / M_PER_IN : q.lap * 1000)} ${imp ? 'in' : 'mm'} (one wire spacing plus 2 in, common practice); ${round1(imp ? q.boughtM2 / M2_PER_FT2 : q.boughtM2)} ${lu}² bought.`
			},
			{
				id: 'chairs',
				name: 'Chairs to hold the mesh in the upper half',
				quantity: q.chairs,
				unit: 'chairs',
				cost: priced(q.chairs, p.chair),
				note: 'One per grid square at the chair spacing (WRI: supports at most 3 ft apart).'
			}
		);
	}
	if (m.reinforcement === 'rebar') {
		const q = rebarQuantities(m, x.framed ?? [], x.eps ?? 1e-9);
		items.push(
			{
				id: 'rebar',
				name: `Rebar, ${round1(imp ? m.reinforcing.barDiameter / M_PER_IN : m.reinforcing.barDiameter * 1000)} ${imp ? 'in' : 'mm'} bars in ${round1(L(length(m.reinforcing.barStock)))} ${lu} lengths`,
				quantity: q.sticks,
				unit: 'bars',
				cost: priced(q.lengthM, p.rebarPerM),
				note: `${q.bars} runs both ways at ${round1(imp ? m.reinforcing.barSpacing / M_PER_IN : m.reinforcing.barSpacing * 1000)} ${imp ? 'in' : 'mm'}, ${q.splices} lap splices of ${round1(imp ? q.lap / M_PER_IN : q.lap * 1000)} ${imp ? 'in' : 'mm'}; ${round1(L(length(q.lengthM)))} ${lu} in all. The bar size and spacing come from a design, not from this plan.`
			},
			{ id: 'chairs', name: 'Chairs to hold the bars at mid-depth', quantity: q.chairs, unit: 'chairs', cost: priced(q.chairs, p.chair) }
		);
	}
	if (m.reinforcement === 'fiber') {
		const perBag = m.reinforcing.fiberPerBagKg ?? FIBER_KG_PER_M3 * x.planned.yield.cubicMeters;
		const kg = perBag * x.planned.count;
		items.push({
			id: 'fiber',
			name: 'Fiber for the mix',
			quantity: imp ? kg / KG_PER_LB : kg,
			unit: imp ? 'lb' : 'kg',
			cost: priced(kg, p.fiberPerKg),
			note: `${round1(imp ? (perBag / KG_PER_LB) * 16 : perBag * 1000, 2)} ${imp ? 'oz' : 'g'} in each of ${x.planned.count} bags${m.reinforcing.fiberPerBagKg === undefined ? ' (1.5 lb/yd³, common practice: use the dose on the fiber label)' : ', as its label gives it'}.`
		});
	}
	if (m.curing.method === 'cover')
		items.push({
			id: 'curing-cover',
			name: 'Plastic sheet or wet burlap for curing',
			quantity: area,
			unit: `${lu}²`,
			cost: priced(x.slabAreaM2, p.curingCoverPerM2)
		});
	if (m.curing.method === 'compound') {
		const liters = x.slabAreaM2 / m.curing.coverage;
		items.push({
			id: 'curing-compound',
			name: 'Curing compound (ASTM C309)',
			quantity: imp ? liters / L_PER_US_GAL : liters,
			unit: imp ? 'gal' : 'L',
			cost: priced(liters, p.curingCompoundPerL)
		});
	}
	const dig = x.volume.dig;
	items.push({
		id: 'haul-soil',
		name: 'Hauling the dug soil away',
		quantity: dig.loads,
		unit: 'loads',
		cost: priced(dig.loads, p.haulSoil),
		note: `${round1(imp ? dig.volume.cubicYards : dig.volume.cubicMeters)} ${imp ? 'yd³' : 'm³'} in the ground, about ${round1(imp ? dig.weight.shortTons : dig.weight.tonnes)} ${imp ? 'short tons' : 't'} at the vehicle's payload (soil density: common practice, no published source). ${dig.note}` // soil density from memory
	});
	items.push({
		id: 'tools',
		name: 'Tools (bought or hired)',
		quantity: 1,
		unit: 'set',
		cost: p.tools,
		note: 'The tool list below; counted for bags and ready-mix alike.'
	});
	return { items, tools: tools(m, x), diyTotal: total(items) };
}

const round1 = (v: number, d = 1) => Math.round(v * 10 ** d) / 10 ** d;

function total(items: MaterialItem[]): MaterialsResult['diyTotal'] {
	// Mixing water comes from the tap: it has no price, shown as "—", and never leaves the total incomplete.
	const unpriced = mapList(
		filterList(items, (i) => i.cost === undefined && i.id !== 'water'),
		(i) => i.id
	);
	const amount = items.reduce((a, i) => a + (i.cost ?? 0), 0);
	return { amount, complete: unpriced.length === 0, unpriced };
}

function tools(m: Model, x: MaterialsInput): Tool[] {
	const imp = m.units === 'imperial';
	const railed = x.unformedHouse && x.alongSpanM !== undefined;
	const screed = length((railed ? x.alongSpanM! : x.screedSpanM) + SCREED_OVERHANG_M);
	const screedLen = imp ? Math.ceil(screed.feet) + ' ft' : Math.ceil(screed.meters * 10) / 10 + ' m';
	const list: Tool[] = [
		m.crew.method === 'drum'
			? { id: 'drum-mixer', name: 'Drum mixer', count: 1, why: 'Mixes the bags in batches.' }
			: { id: 'mixing-tub', name: 'Mixing tub and hoe', count: m.crew.people, why: 'One per person mixing.' },
		{ id: 'wheelbarrow', name: 'Wheelbarrow', count: Math.max(1, m.crew.people - 1), why: 'Moves mix from the mixer to the forms.' },
		{ id: 'shovel', name: 'Shovels and a rake', count: m.crew.people, why: 'Digging, spreading base and concrete.' },
		{ id: 'tamper', name: 'Hand tamper or plate compactor', count: 1, why: 'Compacts the base in lifts.' },
		{
			id: 'line-level',
			name: imp ? "Mason's line, line level, tape and a 4 ft level" : "Mason's line, line level, tape and a 1.2 m level",
			count: 1,
			why: 'Sets the forms to the level-line table.'
		},
		{ id: 'driver', name: 'Drill-driver and a sledge', count: 1, why: 'Drives stakes, screws the forms.' },
		{
			id: 'screed',
			name: `Straight screed board at least ${screedLen}`,
			count: 1,
			why: railed
				? 'The house side has no form: the board spans the side forms, parallel to the house; or set a screed rail (a straight board on stakes, pulled as you go) along the house and strike off the short way.'
				: 'Strikes the surface off the forms.'
		},
		{ id: 'floats', name: 'Bull float or magnesium float, edger, broom', count: 1, why: 'Finishing.' },
		{ id: 'ppe', name: 'Alkali-resistant gloves, rubber boots, eye protection', count: m.crew.people, why: 'Wet cement burns skin and eyes (OSHA 3351-07).' }
	];
	if (m.curing.method === 'wet')
		list.push({ id: 'hose', name: 'Hose with a sprinkler or soaker', count: 1, why: 'Keeps the slab wet through curing (ACI 308R).' });
	if (m.curing.method === 'compound') list.push({ id: 'sprayer', name: 'Pump sprayer', count: 1, why: 'Sprays the curing compound evenly.' });
	if (x.hasJoints)
		list.push(
			m.jointMethod === 'saw'
				? {
						id: 'saw',
						name: 'Concrete saw with water feed, and a respirator',
						count: 1,
						why: 'Cuts the control joints; water keeps silica dust down (OSHA 29 CFR 1926.1153).'
					}
				: { id: 'groover', name: 'Groover deep enough for the joint depth', count: 1, why: 'Tools the control joints.' }
		);
	return list;
}
