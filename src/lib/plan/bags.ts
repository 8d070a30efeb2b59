// Bagged concrete per offered size, ready-mix to order, and which costs less.

import type { BagOffer, Model } from './model';
import { L_PER_US_GAL, countUp, m3ToOrderVolume, orderVolumeToM3, mass, roundUpTo, volume } from './units';
import { filterList, mapList } from './util';
import type { Mass, Volume } from './units';

export interface BagOption {
	size: number;
	unit: 'lb' | 'kg';
	count: number;
	yield: Volume;
	dryMass: Mass;
	water: { liters: number; gallons: number };
	/** Whole bags one vehicle load carries at the crew's payload. */
	bagsPerTrip: number;
	/** Vehicle loads to haul the bags: whole bags per load. */
	trips: number;
	cost?: number;
	/** The size the mixing plan uses. */
	planned: boolean;
}

export interface ReadyMixResult {
	/** Volume to order in the plant's unit (yd³ or m³), rounded up to the increment. */
	order: number;
	unit: 'yd³' | 'm³';
	volume: Volume;
	minimum: number;
	shortLoad: boolean;
	note: string;
	cost?: number;
}

export interface Comparison {
	cheaper: 'bags' | 'readyMix' | null;
	bagSize?: number;
	/** Concrete alone. */
	bagCost?: number;
	readyMixCost?: number;
	/** Everything else on the materials list (forms, base, tools, reinforcement, curing, hauling), in both totals. */
	sharedCost?: number;
	/** Concrete plus the shared lines: the two ways compared on the same basis. */
	bagTotal?: number;
	readyMixTotal?: number;
	/** Shared lines with no price yet, so neither total is complete. */
	unpriced?: string[];
}

export function bagOption(b: BagOffer, pourM3: readonly number[], m: Model): BagOption {
	let count = 0;
	for (const v of pourM3) count += countUp(v / b.yieldM3);
	const perTrip = Math.max(1, Math.floor(m.crew.payloadKg / b.kg + 1e-9));
	const dryKg = count * b.kg;
	const waterL = dryKg * m.bags.waterRatio; // 1 kg of water is 1 L
	return {
		size: b.size,
		unit: m.units === 'imperial' ? 'lb' : 'kg',
		count,
		yield: volume(b.yieldM3),
		dryMass: mass(dryKg),
		water: { liters: waterL, gallons: waterL / L_PER_US_GAL },
		bagsPerTrip: perTrip,
		trips: countUp(count / perTrip),
		cost: b.price === undefined ? undefined : count * b.price,
		planned: b === m.bags.plan
	};
}

export function readyMix(orderM3: number, m: Model): ReadyMixResult {
	const u = m.units;
	const unit = u === 'imperial' ? 'yd³' : 'm³';
	const inc = m3ToOrderVolume(m.readyMix.incrementM3, u);
	const order = roundUpTo(m3ToOrderVolume(orderM3, u), inc);
	const minimum = m3ToOrderVolume(m.readyMix.minimumM3, u);
	const shortLoad = order < minimum - 1e-9;
	const price = m.readyMix.pricePerM3;
	const cost = price === undefined ? undefined : price * orderVolumeToM3(order, u) + (shortLoad ? (m.readyMix.shortLoadFee ?? 0) : 0);
	const note = shortLoad
		? `${fmt(order)} ${unit} is under the plant's ${fmt(minimum)} ${unit} minimum: expect a short-load fee, or ask whether they deliver this little at all.`
		: `Order ${fmt(order)} ${unit}, rounded up to the ${fmt(inc)} ${unit} increment.`;
	return { order, unit, volume: volume(orderM3), minimum, shortLoad, note, cost };
}

const fmt = (x: number) => String(Math.round(x * 100) / 100);

/** Bags against ready-mix with the same forms, base, tools and other materials in both (mixing water left out). */
export function compareCost(bags: BagOption[], mix: ReadyMixResult, materials?: { items: { id: string; cost?: number }[] }): Comparison {
	const priced = filterList(bags, (b) => b.cost !== undefined);
	const best = priced.reduce<BagOption | undefined>((a, b) => (!a || b.cost! < a.cost! ? b : a), undefined);
	const bagCost = best?.cost;
	const readyMixCost = mix.cost;
	const shared = filterList(materials?.items ?? [], (i) => i.id !== 'concrete-bags' && i.id !== 'water');
	const sharedCost = shared.reduce((a, i) => a + (i.cost ?? 0), 0);
	const cheaper = bagCost === undefined || readyMixCost === undefined ? null : bagCost <= readyMixCost ? 'bags' : 'readyMix';
	return {
		cheaper,
		bagSize: best?.size,
		bagCost,
		readyMixCost,
		sharedCost,
		bagTotal: bagCost === undefined ? undefined : bagCost + sharedCost,
		readyMixTotal: readyMixCost === undefined ? undefined : readyMixCost + sharedCost,
		unpriced: mapList(
			filterList(shared, (i) => i.cost === undefined),
			(i) => i.id
		)
	};
}
