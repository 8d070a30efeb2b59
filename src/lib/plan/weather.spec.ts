import { describe, expect, it } from 'vitest';
import { ACI_305, assessWeather, evaporationRate, hoursToStrength, toLbPerFt2h } from './weather';

describe('evaporation, Uno (1998)', () => {
	it('works the SI formula', () => {
		// 5 × [(30 + 18)^2.5 − 0.5 × (30 + 18)^2.5] × (16 + 4) × 10⁻⁶ = 5 × 7981.29 × 20 × 10⁻⁶ = 0.79813 (Uno 1998)
		expect(evaporationRate(30, 30, 50, 16)).toBeCloseTo(0.798129, 6);
		expect(evaporationRate(20, 25, 100, 10)).toBe(0); // air wetter and warmer than the concrete: none
	});

	it('compares with 0.2 lb/ft²/h', () => {
		expect(toLbPerFt2h(1)).toBeCloseTo(0.204816, 6); // 0.3048² / 0.45359237
		expect(ACI_305.evaporationLimit).toBeCloseTo(0.976486, 6); // 0.2 lb/ft²/h in kg/m²/h, ACI 305R
	});
});

describe('cold weather, ACI 306R', () => {
	const pour = { section: 0, day: 6, offset: 0 };
	const at = (temps: number[]) => (d: number) => temps[Math.min(d, temps.length - 1)];
	const still = { humidity: 60, windKmh: 5 };

	it('flags air that falls to 40 °F (4.4 °C), not 5 °C', () => {
		// ACI 306R: cold weather exists when the air falls to, or is expected to fall below, 40 °F.
		expect(assessWeather([pour], at([12, 8, 5]), still).cold).toBe(false); // 5 °C = 41 °F
		expect(assessWeather([pour], at([12, 8, 4.4]), still).cold).toBe(true); // 39.9 °F
	});

	it('judges the nightly lows when they are given, not only the means', () => {
		// Means of 12 °C with a low of 2 °C on the second night: cold by ACI 306R.
		const w = assessWeather([pour], at([12]), { ...still, lowOn: at([6, 2, 6]) });
		expect(w.cold).toBe(true);
		expect(w.pours[0].coldestAir.fahrenheit).toBeCloseTo(35.6, 9); // 2 × 9/5 + 32
	});

	it('flags a thin slab placed below 13 °C', () => {
		// ACI 306R Table 3.1: thin sections at least 55 °F (13 °C) as placed.
		expect(assessWeather([pour], at([15]), { ...still, concreteTemp: 10 }).cold).toBe(true);
	});

	it('flags curing days at or below 50 °F (10 °C)', () => {
		// ACI 318-19 §26.5.3.1: above 50 °F for the first 7 days (3 high-early).
		expect(assessWeather([pour], at([15, 12, 11, 12, 14, 13, 9]), still).coolCuring).toBe(true); // 9 °C on day 7
		expect(assessWeather([pour], at([15, 12, 11, 12, 14, 13, 9]), { ...still, cement: 'typeIII' }).coolCuring).toBe(false); // only 3 days count
	});
});

describe('the 500 psi date', () => {
	it('inverts ACI 209R-92 on the equivalent age', () => {
		// 500 / 3000 psi = 1/6; Type I: t = 4 × (1/6) / (1 − 0.85/6) = 0.66667 / 0.858333 = 0.776699 days = 18.64 h
		// at 20 °C (ACI 209R-92 Eq. 2-1; 500 psi: ACI 306R after Powers).
		expect(hoursToStrength(500, 3000, 'typeI', () => 20)).toBeCloseTo(18.6408, 3);
		// At 10 °C a day counts 0.547512 (ASTM C1074): 0.776699 / 0.547512 = 1.418597 days = 34.05 h.
		expect(hoursToStrength(500, 3000, 'typeI', () => 10)).toBeCloseTo(34.0463, 3);
		// A cold first day then 20 °C: 0.547512 of the 0.776699 on day 1, the 0.229187 rest on day 2 → 29.50 h.
		expect(hoursToStrength(500, 3000, 'typeI', (d) => (d === 0 ? 10 : 20))).toBeCloseTo(29.5005, 3);
	});

	it('reports it per pour', () => {
		const w = assessWeather([{ section: 0, day: 6, offset: 0 }], () => 10, { humidity: 50, windKmh: 5, designMpa: 3000 * 0.00689475729 });
		expect(w.pours[0].freezeSafeHours).toBeCloseTo(34.0463, 3);
		expect(w.pours[0].freezeSafeDay).toBe(1);
	});
});

describe('hot weather', () => {
	it('flags concrete above 35 °C and high evaporation', () => {
		const w = assessWeather([{ section: 0, day: 6, offset: 0 }], () => 33, { humidity: 20, windKmh: 20, concreteTemp: 36 });
		expect(w.hot).toBe(true); // 36 °C > 35 °C (95 °F), ACI 305R (95 °F from memory)
		// Uno: 5 × [54^2.5 − 0.2 × 51^2.5] × 24 × 10⁻⁶ = 5 × (21428.6 − 3715.0) × 24 × 10⁻⁶ = 2.126 > 0.976
		expect(w.pours[0].evaporation.kgPerSquareMeterHour).toBeCloseTo(2.1256, 3);
		expect(w.highEvaporation).toBe(true);
	});
});
