// Materials to buy with quantities and prices, the tools for the job, and a do-it-yourself total.

import type { BagOption } from './bags';
import type { FormsResult } from './lumber';
import type { Model } from './model';
import * as unitsLib from './units';
import type { Length } from './units';
import type { VolumeResult } from './volume';

// Bound once: under the test runner every call through an import is a getter call.
const { M2_PER_FT2, length, m3ToOrderVolume } = unitsLib;

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

export interface MaterialsInput {
	volume: VolumeResult;
	forms: FormsResult;
	planned: BagOption;
	slabAreaM2: number;
	/** Widest span between forms that a screed must bridge, m. */
	screedSpanM: number;
	hasJoints: boolean;
}

const priced = (qty: number, each?: number) => (each === undefined ? undefined : qty * each);

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
		items.push({
			id: 'gravel',
			name: 'Crushed stone or gravel base (loose)',
			quantity: m3ToOrderVolume(loose, m.units),
			unit: imp ? 'yd³' : 'm³',
			cost: priced(loose, p.gravelPerM3)
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
	items.push(
		{ id: 'stakes', name: `Form stakes, ${Math.round(imp ? x.forms.stakes.length.inches : x.forms.stakes.length.millimeters)} ${imp ? 'in' : 'mm'}`, quantity: x.forms.stakes.count, unit: 'stakes', cost: priced(x.forms.stakes.count, p.stake) },
		{ id: 'screws', name: 'Exterior screws for stakes and splices', quantity: x.forms.screws, unit: 'screws', cost: priced(x.forms.screws, p.screw) },
		{ id: 'release-agent', name: 'Form release agent (not motor oil)', quantity: 1, unit: 'container', cost: p.releaseAgent }
	);
	if (x.forms.isolationStrip.meters > 0)
		items.push({ id: 'isolation-strip', name: 'Isolation-joint strip against the house', quantity: L(x.forms.isolationStrip), unit: lu, cost: priced(x.forms.isolationStrip.meters, p.isolationStripPerM) });
	if (m.reinforcement === 'mesh')
		items.push({ id: 'mesh', name: 'Welded wire mesh and supports', quantity: area, unit: `${lu}²`, cost: priced(x.slabAreaM2, p.meshPerM2), note: 'Add laps where sheets meet.' });
	if (m.reinforcement === 'fiber')
		items.push({ id: 'fiber', name: 'Fiber for the mix', quantity: x.planned.count, unit: 'bags treated', note: 'Dose as its label directs.' });
	if (m.reinforcement === 'rebar')
		items.push({ id: 'rebar', name: 'Rebar and supports', quantity: 0, unit: 'per your layout', note: 'Size and spacing come from the design, not from this plan.' });
	items.push({ id: 'curing-cover', name: 'Plastic sheet or curing cover', quantity: area, unit: `${lu}²`, cost: priced(x.slabAreaM2, p.curingCoverPerM2) });
	return { items, tools: tools(m, x), diyTotal: total(items) };
}

function total(items: MaterialItem[]): MaterialsResult['diyTotal'] {
	const free = new Set(['water', 'rebar', 'fiber']);
	const unpriced = items.filter((i) => i.cost === undefined && !free.has(i.id)).map((i) => i.id);
	const amount = items.reduce((a, i) => a + (i.cost ?? 0), 0);
	return { amount, complete: unpriced.length === 0, unpriced };
}

function tools(m: Model, x: MaterialsInput): Tool[] {
	const imp = m.units === 'imperial';
	const screed = length(x.screedSpanM + SCREED_OVERHANG_M);
	const list: Tool[] = [
		m.crew.method === 'drum'
			? { id: 'drum-mixer', name: 'Drum mixer', count: 1, why: 'Mixes the bags in batches.' }
			: { id: 'mixing-tub', name: 'Mixing tub and hoe', count: m.crew.people, why: 'One per person mixing.' },
		{ id: 'wheelbarrow', name: 'Wheelbarrow', count: Math.max(1, m.crew.people - 1), why: 'Moves mix from the mixer to the forms.' },
		{ id: 'shovel', name: 'Shovels and a rake', count: m.crew.people, why: 'Digging, spreading base and concrete.' },
		{ id: 'tamper', name: 'Hand tamper or plate compactor', count: 1, why: 'Compacts the base in lifts.' },
		{ id: 'line-level', name: "Mason's line, line level, tape and a 4 ft level", count: 1, why: 'Sets the forms to the level-line table.' },
		{ id: 'driver', name: 'Drill-driver and a sledge', count: 1, why: 'Drives stakes, screws the forms.' },
		{ id: 'screed', name: `Straight screed board at least ${imp ? Math.ceil(screed.feet) + ' ft' : Math.ceil(screed.meters * 10) / 10 + ' m'}`, count: 1, why: 'Strikes the surface off the forms.' },
		{ id: 'floats', name: 'Bull float or magnesium float, edger', count: 1, why: 'Finishing.' },
		{ id: 'ppe', name: 'Alkali-resistant gloves, rubber boots, eye protection', count: m.crew.people, why: 'Wet cement burns skin and eyes (OSHA 3351-07).' }
	];
	if (x.hasJoints)
		list.push(
			m.jointMethod === 'saw'
				? { id: 'saw', name: 'Concrete saw with water feed, and a respirator', count: 1, why: 'Cuts the control joints; water keeps silica dust down (OSHA 29 CFR 1926.1153).' }
				: { id: 'groover', name: 'Groover deep enough for the joint depth', count: 1, why: 'Tools the control joints.' }
		);
	return list;
}
