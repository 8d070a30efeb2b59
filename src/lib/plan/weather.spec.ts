import { describe, expect, it } from 'vitest';
import { ACI_305, ACI_306, assessWeather, evaporationRate, toLbPerFt2h } from './weather';

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

describe('cold and hot weather', () => {
	const pour = { section: 0, day: 3, offset: 0 };
	const at = (temps: number[]) => (d: number) => temps[Math.min(d, temps.length - 1)];

	it('flags air at or below 5 °C in the days after a pour', () => {
		expect(ACI_306.coldAir).toBe(5); // ACI 306R, 40 °F
		const w = assessWeather([pour], at([12, 8, 5]), { humidity: 60, windKmh: 5 });
		expect(w.cold).toBe(true); // 5 °C on the third day, ACI 306R
		expect(assessWeather([pour], at([12, 8, 6, 2]), { humidity: 60, windKmh: 5 }).cold).toBe(false); // day 4 is outside the 3-day check (from memory)
	});

	it('flags a thin slab placed below 13 °C', () => {
		expect(ACI_306.minPlaced).toBe(13); // ACI 306R Table 3.1, 55 °F
		expect(assessWeather([pour], at([15]), { humidity: 60, windKmh: 5, concreteTemp: 10 }).cold).toBe(true);
	});

	it('flags concrete above 35 °C and high evaporation', () => {
		expect(ACI_305.maxPlaced).toBe(35); // ACI 305R, 95 °F (from memory)
		const w = assessWeather([pour], at([33]), { humidity: 20, windKmh: 20, concreteTemp: 36 });
		expect(w.hot).toBe(true);
		expect(w.highEvaporation).toBe(true); // well above 0.2 lb/ft²/h, ACI 305R
	});
});
