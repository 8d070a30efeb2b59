// Bagged concrete per offered size, ready-mix to order, and which costs less.

import type { BagOffer, Model } from './model';
import * as unitsLib from './units';
import type { Mass, Volume } from './units';

// Bound once: under the test runner every call through an import is a getter call.
const {
	L_PER_US_GAL,
	countUp,
	m3ToOrderVolume,
	orderVolumeToM3,
	mass,
	roundUpTo,
	volume
} = unitsLib;

export interface BagOption {
	size: number;
	unit: 'lb' | 'kg';
	count: number;
	yield: Volume;
	dryMass: Mass;
	water: { liters: number; gallons: number };
	/** Vehicle loads to haul the dry mass at the crew's payload. */
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
	bagCost?: number;
	readyMixCost?: number;
}

export function bagOption(b: BagOffer, orderM3: number, m: Model): BagOption {
	const count = countUp(orderM3 / b.yieldM3);
	const dryKg = count * b.kg;
	const waterL = dryKg * m.bags.waterRatio; // 1 kg of water is 1 L
	return {
		size: b.size,
		unit: m.units === 'imperial' ? 'lb' : 'kg',
		count,
		yield: volume(b.yieldM3),
		dryMass: mass(dryKg),
		water: { liters: waterL, gallons: waterL / L_PER_US_GAL },
		trips: countUp(dryKg / m.crew.payloadKg),
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
	const cost =
		price === undefined
			? undefined
			: price * orderVolumeToM3(order, u) + (shortLoad ? (m.readyMix.shortLoadFee ?? 0) : 0);
	const note = shortLoad
		? `${fmt(order)} ${unit} is under the plant's ${fmt(minimum)} ${unit} minimum: expect a short-load fee, or ask whether they deliver this little at all.`
		: `Order ${fmt(order)} ${unit}, rounded up to the ${fmt(inc)} ${unit} increment.`;
	return { order, unit, volume: volume(orderM3), minimum, shortLoad, note, cost };
}

const fmt = (x: number) => String(Math.round(x * 100) / 100);

export function compareCost(bags: BagOption[], mix: ReadyMixResult): Comparison {
	const priced = bags.filter((b) => b.cost !== undefined);
	const best = priced.reduce<BagOption | undefined>((a, b) => (!a || b.cost! < a.cost! ? b : a), undefined);
	const bagCost = best?.cost;
	const readyMixCost = mix.cost;
	const cheaper =
		bagCost === undefined || readyMixCost === undefined ? null : bagCost <= readyMixCost ? 'bags' : 'readyMix';
	return { cheaper, bagSize: best?.size, bagCost, readyMixCost };
}
