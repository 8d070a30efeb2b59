// Strength gain: ACI 209R-92 Eq. 2-1 on the equivalent age at 20 °C (ASTM C1074), so the timeline
// follows the expected temperatures.

import { MPA_PER_PSI } from './units';
import { mapList, mapNumbers } from './util';

/** ACI 209R-92 Eq. 2-1 constants, moist-cured concrete. */
export const ACI_209 = {
	typeI: { a: 4.0, b: 0.85 },
	typeIII: { a: 2.3, b: 0.92 }
} as const;

/** ASTM C1074 defaults (from memory): activation temperature Q = E/R, reference 20 °C, datum 0 °C. */
export const C1074 = { q: 5000, reference: 20, datum: 0 } as const;

const KELVIN = 273.15;

/** Fraction of 28-day strength at age t days: f(t)/f28 = t / (a + b·t). */
export function strengthRatio(t: number, cement: keyof typeof ACI_209): number {
	const { a, b } = ACI_209[cement];
	return t <= 0 ? 0 : t / (a + b * t);
}

/** Arrhenius age factor: exp[−Q(1/Ta − 1/Ts)], temperatures in kelvin. */
export function ageFactor(tempC: number, q: number = C1074.q, refC: number = C1074.reference): number {
	return Math.exp(-q * (1 / (tempC + KELVIN) - 1 / (refC + KELVIN)));
}

/** Equivalent age at the reference temperature after each whole day: tₑ = Σ factor·Δt. */
export function equivalentAges(dailyTempsC: number[]): number[] {
	let te = 0;
	// Forecasts hold their last value for weeks: reuse the factor (an exp) while the temperature repeats.
	let lastT = NaN;
	let f = 0;
	const out: number[] = [];
	for (const t of dailyTempsC) {
		if (t !== lastT) {
			f = ageFactor(t);
			lastT = t;
		}
		out.push((te += f));
	}
	return out;
}

/** Nurse-Saul temperature-time factor after each whole day, °C·h: M = Σ (Ta − T0)·Δt. */
export function maturity(dailyTempsC: number[], datum: number = C1074.datum): number[] {
	let m = 0;
	return mapNumbers(dailyTempsC, (t) => (m += Math.max(0, t - datum) * 24));
}

export interface StrengthDay {
	/** Days since the (last) pour. */
	day: number;
	date?: string;
	/** Percent of the 28-day design strength. */
	percent: number;
	equivalentAgeDays: number;
	maturityDegreeHours: number;
	psi: number;
	megapascals: number;
}

/** Day-by-day timeline for days 1..n, from the daily mean temperatures after the pour. */
export function strengthTimeline(dailyTempsC: number[], cement: keyof typeof ACI_209, designMpa: number): StrengthDay[] {
	const te = equivalentAges(dailyTempsC);
	const mt = maturity(dailyTempsC);
	return mapList(te, (age, i) => {
		const r = strengthRatio(age, cement);
		return {
			day: i + 1,
			percent: r * 100,
			equivalentAgeDays: age,
			maturityDegreeHours: mt[i],
			psi: (r * designMpa) / MPA_PER_PSI,
			megapascals: r * designMpa
		};
	});
}

/** First whole day on which a test holds, or null within the timeline. */
export function firstDay(days: StrengthDay[], ok: (d: StrengthDay) => boolean): number | null {
	return days.find(ok)?.day ?? null;
}
