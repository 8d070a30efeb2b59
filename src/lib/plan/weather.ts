// Cold and hot weather per ACI 306R / 305R, and the evaporation rate of bleed water (Uno 1998).

import { ACI_209, ageFactor } from './strength';
import { KG_PER_LB, MPA_PER_PSI, M_PER_FT, temperature } from './units';
import { mapList } from './util';
import type { Temperature } from './units';

export const ACI_306 = {
	/** Cold weather: air that falls to 40 °F (4.4 °C) during the protection period. */
	coldAir: ((40 - 32) * 5) / 9,
	/** Strength that survives a single freeze, 500 psi (3.45 MPa) (after Powers). */
	freezeSafeMpa: 500 * MPA_PER_PSI,
	/** Thin sections kept at least 13 °C (55 °F) as placed (Table 3.1). */
	minPlaced: 13,
	/** Days after each pour checked for cold air; from memory. */
	protectionDays: 3
} as const;

/** ACI 318-19 §26.5.3.1: kept above 50 °F (10 °C) and moist for the first 7 days (3 high-early). */
export const ACI_318_CURING = { minC: 10, days: { typeI: 7, typeIII: 3 } } as const;

export const ACI_305 = {
	/** Concrete above about 35 °C (95 °F) as placed; from memory. */
	maxPlaced: 35,
	/** 0.2 lb/ft²/h (ACI 305R rounds it to 1.0 kg/m²/h; the stricter value is used). */
	evaporationLimit: (0.2 * KG_PER_LB) / M_PER_FT ** 2
} as const;

/** Uno (1998), SI: E = 5[(Tc+18)^2.5 − r(Ta+18)^2.5](V+4)·10⁻⁶ kg/m²/h. */
export function evaporationRate(concreteC: number, airC: number, rhPercent: number, windKmh: number): number {
	const r = rhPercent / 100;
	const e = 5 * ((concreteC + 18) ** 2.5 - r * (airC + 18) ** 2.5) * (windKmh + 4) * 1e-6;
	return Math.max(0, e);
}

export const toLbPerFt2h = (kgPerM2h: number) => (kgPerM2h * M_PER_FT ** 2) / KG_PER_LB;

export interface PourWeather {
	section: number;
	day: number;
	date?: string;
	air: Temperature;
	concrete: Temperature;
	concreteEstimated: boolean;
	/** Coldest air over the protection period after this pour: the daily lows when given, else the means. */
	coldestAir: Temperature;
	/** Coldest daily mean over the ACI 318 curing days after this pour. */
	coldestCuringMean: Temperature;
	/** Any of those means at or below 50 °F (10 °C). */
	coolCuring: boolean;
	/** Hours after placing until the concrete reaches 500 psi (3.45 MPa), from the equivalent-age timeline; null past 60 days. */
	freezeSafeHours: number | null;
	/** Days after the pour day (0 = the pour day itself) on which that happens. */
	freezeSafeDay: number | null;
	evaporation: { kgPerSquareMeterHour: number; lbPerSquareFootHour: number };
	cold: boolean;
	coldPlaced: boolean;
	hot: boolean;
	highEvaporation: boolean;
}

export interface WeatherResult {
	pours: PourWeather[];
	evaporationLimit: { kgPerSquareMeterHour: number; lbPerSquareFootHour: number };
	cold: boolean;
	coolCuring: boolean;
	hot: boolean;
	highEvaporation: boolean;
}

export interface PourDay {
	section: number;
	/** Plan day, for display. */
	day: number;
	/** Days after the first pour, for the temperature series. */
	offset: number;
	date?: string;
}

/**
 * Hours after placing until the strength ratio reaches target ÷ f'c: ACI 209R-92 Eq. 2-1 inverted,
 * t = a·r / (1 − b·r), on the ASTM C1074 equivalent age of the daily means (linear within a day).
 */
export function hoursToStrength(
	targetMpa: number,
	designMpa: number,
	cement: keyof typeof ACI_209,
	meanOn: (dayAfterPour: number) => number,
	maxDays = 60
): number | null {
	const r = targetMpa / designMpa;
	const { a, b } = ACI_209[cement];
	if (r >= 1 / b) return null;
	let need = (a * r) / (1 - b * r);
	for (let d = 0; d < maxDays; d++) {
		const f = ageFactor(meanOn(d));
		if (f >= need) return (d + need / f) * 24;
		need -= f;
	}
	return null;
}

export interface WeatherConditions {
	humidity: number;
	windKmh: number;
	concreteTemp?: number;
	/** Daily low on a day from the first pour; the mean when no lows were given. */
	lowOn?: (day: number) => number;
	cement?: keyof typeof ACI_209;
	designMpa?: number;
}

export function assessWeather(pours: PourDay[], tempOn: (day: number) => number, conditions: WeatherConditions): WeatherResult {
	const lowOn = conditions.lowOn ?? tempOn;
	const cement = conditions.cement ?? 'typeI';
	const out = mapList(pours, (p): PourWeather => {
		const air = tempOn(p.offset);
		const concrete = conditions.concreteTemp ?? air;
		let coldest = Infinity;
		for (let k = 0; k < ACI_306.protectionDays; k++) coldest = Math.min(coldest, lowOn(p.offset + k));
		let coolest = Infinity;
		for (let k = 0; k < ACI_318_CURING.days[cement]; k++) coolest = Math.min(coolest, tempOn(p.offset + k));
		const hours = hoursToStrength(ACI_306.freezeSafeMpa, conditions.designMpa ?? 20.68, cement, (d) => tempOn(p.offset + d));
		const e = evaporationRate(concrete, air, conditions.humidity, conditions.windKmh);
		return {
			section: p.section,
			day: p.day,
			date: p.date,
			air: temperature(air),
			concrete: temperature(concrete),
			concreteEstimated: conditions.concreteTemp === undefined,
			coldestAir: temperature(coldest),
			coldestCuringMean: temperature(coolest),
			coolCuring: coolest <= ACI_318_CURING.minC,
			freezeSafeHours: hours,
			freezeSafeDay: hours === null ? null : Math.floor(hours / 24),
			evaporation: { kgPerSquareMeterHour: e, lbPerSquareFootHour: toLbPerFt2h(e) },
			cold: coldest <= ACI_306.coldAir,
			coldPlaced: concrete < ACI_306.minPlaced && (conditions.concreteTemp !== undefined || coldest <= ACI_306.coldAir),
			hot: concrete > ACI_305.maxPlaced,
			highEvaporation: e >= ACI_305.evaporationLimit
		};
	});
	return {
		pours: out,
		evaporationLimit: {
			kgPerSquareMeterHour: ACI_305.evaporationLimit,
			lbPerSquareFootHour: toLbPerFt2h(ACI_305.evaporationLimit)
		},
		cold: out.some((p) => p.cold || p.coldPlaced),
		coolCuring: out.some((p) => p.coolCuring),
		hot: out.some((p) => p.hot),
		highEvaporation: out.some((p) => p.highEvaporation)
	};
}
