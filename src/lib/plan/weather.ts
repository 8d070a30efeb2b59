// Cold and hot weather per ACI 306R / 305R, and the evaporation rate of bleed water (Uno 1998).

import * as unitsLib from './units';
import type { Temperature } from './units';

// Bound once: under the test runner every call through an import is a getter call.
const { KG_PER_LB, M_PER_FT, temperature } = unitsLib;

export const ACI_306 = {
	/** Cold weather: air at or below 5 °C (40 °F) during the protection period. */
	coldAir: 5,
	/** Thin sections kept at least 13 °C (55 °F) as placed (Table 3.1). */
	minPlaced: 13,
	/** Days after each pour checked for cold air; from memory. */
	protectionDays: 3
} as const;

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
	/** Coldest air over the protection period after this pour. */
	coldestAir: Temperature;
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

export function assessWeather(
	pours: PourDay[],
	tempOn: (day: number) => number,
	conditions: { humidity: number; windKmh: number; concreteTemp?: number }
): WeatherResult {
	const out = pours.map((p): PourWeather => {
		const air = tempOn(p.offset);
		const concrete = conditions.concreteTemp ?? air;
		let coldest = Infinity;
		for (let k = 0; k < ACI_306.protectionDays; k++) coldest = Math.min(coldest, tempOn(p.offset + k));
		const e = evaporationRate(concrete, air, conditions.humidity, conditions.windKmh);
		return {
			section: p.section,
			day: p.day,
			date: p.date,
			air: temperature(air),
			concrete: temperature(concrete),
			concreteEstimated: conditions.concreteTemp === undefined,
			coldestAir: temperature(coldest),
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
		hot: out.some((p) => p.hot),
		highEvaporation: out.some((p) => p.highEvaporation)
	};
}
