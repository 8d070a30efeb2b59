import type { Units } from '$lib/plan';

/** Unit labels for the wizard's fields, by plan unit system. */
export function unitLabels(u: Units) {
	return u === 'imperial'
		? { length: 'ft', small: 'in', temp: '°F', mass: 'lb', volume: 'yd³', smallVolume: 'ft³', wind: 'mph', strength: 'psi', area: 'ft²' }
		: { length: 'm', small: 'mm', temp: '°C', mass: 'kg', volume: 'm³', smallVolume: 'm³', wind: 'km/h', strength: 'MPa', area: 'm²' };
}

/** Corner letters as the edge table and the drawing use them: A, B, … Z, A1, B1, … */
export const cornerName = (i: number) => String.fromCharCode(65 + (i % 26)) + (i >= 26 ? Math.floor(i / 26) : '');
