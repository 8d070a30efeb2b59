// Unit conversions. The engine works in SI; every quantity a person reads is returned in both
// systems so the views never convert on their own.

export type Units = 'imperial' | 'metric';

// Exact by definition (international yard and pound agreement, 1959; NIST SP 811 App. B).
export const M_PER_FT = 0.3048;
export const M_PER_IN = 0.0254;
export const KG_PER_LB = 0.45359237;
export const FT3_PER_YD3 = 27;
export const M3_PER_FT3 = M_PER_FT ** 3;
export const M3_PER_YD3 = M3_PER_FT3 * FT3_PER_YD3;
export const M2_PER_FT2 = M_PER_FT ** 2;
export const KM_PER_MILE = 1.609344;
export const L_PER_US_GAL = 3.785411784;
export const MM_PER_IN = 25.4;
/** The avoirdupois ounce, 1/16 lb (same agreement). */
export const G_PER_OZ = 28.349523125;
/** The short ton, 2,000 lb. */
export const KG_PER_SHORT_TON = 2000 * KG_PER_LB;
// 1 lbf/in² = 4.4482216152605 N (exact) / 0.00064516 m² = 6,894.757 Pa (NIST SP 811 App. B.8),
// kept to 9 significant digits.
export const MPA_PER_PSI = 0.00689475729;

export interface Volume {
	cubicFeet: number;
	cubicYards: number;
	cubicMeters: number;
}
export interface Area {
	squareFeet: number;
	squareMeters: number;
}
/** A plan length (site dimensions). */
export interface Length {
	feet: number;
	meters: number;
}
/** A small dimension (thickness, depth, height difference). */
export interface Small {
	inches: number;
	millimeters: number;
}
export interface Mass {
	pounds: number;
	kilograms: number;
}
export interface Temperature {
	fahrenheit: number;
	celsius: number;
}

export const volume = (m3: number): Volume => ({
	cubicFeet: m3 / M3_PER_FT3,
	cubicYards: m3 / M3_PER_YD3,
	cubicMeters: m3
});
export const area = (m2: number): Area => ({ squareFeet: m2 / M2_PER_FT2, squareMeters: m2 });
export const length = (m: number): Length => ({ feet: m / M_PER_FT, meters: m });
export const small = (m: number): Small => ({ inches: m / M_PER_IN, millimeters: m * 1000 });
export const mass = (kg: number): Mass => ({ pounds: kg / KG_PER_LB, kilograms: kg });
export const temperature = (c: number): Temperature => ({
	fahrenheit: (c * 9) / 5 + 32,
	celsius: c
});

/** Plan length (ft or m) to metres. */
export const planToM = (v: number, u: Units) => (u === 'imperial' ? v * M_PER_FT : v);
/** Metres back to the plan's length unit, for coordinates handed to the views. */
export const mToPlan = (m: number, u: Units) => (u === 'imperial' ? m / M_PER_FT : m);
/** Small dimension (in or mm) to metres. */
export const smallToM = (v: number, u: Units) => (u === 'imperial' ? v * M_PER_IN : v / 1000);
export const tempToC = (v: number, u: Units) => (u === 'imperial' ? ((v - 32) * 5) / 9 : v);
export const massToKg = (v: number, u: Units) => (u === 'imperial' ? v * KG_PER_LB : v);
/** Plan volume (ft³ or m³) to m³. */
export const planVolumeToM3 = (v: number, u: Units) => (u === 'imperial' ? v * M3_PER_FT3 : v);
/** Bulk order volume (yd³ or m³) to m³ — ready-mix and gravel are sold by these. */
export const orderVolumeToM3 = (v: number, u: Units) => (u === 'imperial' ? v * M3_PER_YD3 : v);
export const m3ToOrderVolume = (m3: number, u: Units) => (u === 'imperial' ? m3 / M3_PER_YD3 : m3);
export const windToKmh = (v: number, u: Units) => (u === 'imperial' ? v * KM_PER_MILE : v);

/** Round a count up, forgiving float noise so 2.0000000001 panels stays 2. */
export function countUp(x: number): number {
	return Math.max(0, Math.ceil(x - 1e-9));
}

/** Round up to a multiple of step, with the same float forgiveness. */
export function roundUpTo(x: number, step: number): number {
	return countUp(x / step) * step;
}
