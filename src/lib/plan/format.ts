// Display helpers: the engine returns raw numbers in both systems; these turn them into text.

import type { Length, Small, Units, Volume } from './units';

/** Values as a sentence lists them: "a, b or c" (or "and"); one alone, or '' for none. */
export function list(values: readonly unknown[], word = 'or'): string {
	const v = values.map(String);
	return v.length > 1 ? `${v.slice(0, -1).join(', ')} ${word} ${v[v.length - 1]}` : (v[0] ?? '');
}

const VULGAR: Record<number, string> = { 1: '⅛', 2: '¼', 3: '⅜', 4: '½', 5: '⅝', 6: '¾', 7: '⅞' };

/** Inches to the nearest eighth, as a tape reads: 1.375 → "1⅜ in". */
export function formatInches(inches: number): string {
	const sign = inches < 0 ? '−' : '';
	const eighths = Math.round(Math.abs(inches) * 8);
	const whole = Math.floor(eighths / 8);
	const frac = VULGAR[eighths % 8] ?? '';
	return `${sign}${whole || !frac ? whole : ''}${frac} in`;
}

/**
 * A tape reading, the one formatter for positions and distances on site: feet and inches to the
 * nearest 1/16 in ("7 ft 3 5/16 in"), or metres to the millimetre ("2.215 m").
 */
export function tapeLength(l: Length, u: Units): string {
	const sign = (u === 'metric' ? l.meters : l.feet) < 0 ? '−' : '';
	if (u === 'metric') {
		const mm = Math.round(Math.abs(l.meters) * 1000);
		return `${mm ? sign : ''}${(mm / 1000).toFixed(3)} m`;
	}
	const sixteenths = Math.round(Math.abs(l.feet) * 12 * 16);
	const feet = Math.floor(sixteenths / 192);
	const rest = sixteenths - feet * 192;
	const inches = Math.floor(rest / 16);
	let num = rest % 16;
	let den = 16;
	while (num && num % 2 === 0) [num, den] = [num / 2, den / 2];
	const inchText = `${inches || !num ? inches : ''}${inches && num ? ' ' : ''}${num ? `${num}/${den}` : ''} in`;
	return `${sixteenths ? sign : ''}${feet ? `${feet} ft ${inchText}` : inchText}`;
}

export const formatSmall = (s: Small, u: Units) => (u === 'imperial' ? formatInches(s.inches) : `${Math.round(s.millimeters)} mm`);

export const formatLength = (l: Length, u: Units) => (u === 'imperial' ? `${trim(l.feet, 2)} ft` : `${trim(l.meters, 2)} m`);

export const formatVolume = (v: Volume, u: Units) =>
	u === 'imperial' ? `${trim(v.cubicYards, 2)} yd³ (${trim(v.cubicFeet, 1)} ft³)` : `${trim(v.cubicMeters, 2)} m³`;

const trim = (x: number, digits: number) => String(Math.round(x * 10 ** digits) / 10 ** digits);

/** JSON text with every number rounded, so API answers read cleanly (4 places keeps 0.1 mm). */
export function toRoundedJson(value: unknown, digits = 4): string {
	const k = 10 ** digits;
	return JSON.stringify(value, (_key, v) => (typeof v === 'number' ? Math.round(v * k) / k : v));
}
