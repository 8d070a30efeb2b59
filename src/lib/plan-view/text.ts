// Plan figures as people read them, step one: numbers to text in the plan's own units. The plan
// page, the wizard's results panel, the contractor's lead and the PDF all read their figures
// through this module (and its rows, in rows.ts), so the same number reads the same everywhere.
// The engine's own tape and size formatters (it writes sentences with them) are re-exported here,
// so a view imports text from one place.

import type { Area, Mass, PlanResult, Small, Temperature, Units, Volume } from '$lib/plan';
import { formatMoney, toCents } from '$lib/money';

import { formatInches, formatSmall } from '$lib/plan/format';

export { formatInches, formatLength, formatSmall, formatVolume, tapeLength } from '$lib/plan/format';

// One number formatter per digit count (building one per call is slow): grouped thousands, no
// trailing zeros, no sign on a value that rounds to zero.
const numberFormats: Intl.NumberFormat[] = [];
/** A plain figure to at most `digits` decimals: 1234.56 → "1,234.6". */
export const figure = (v: number, digits = 1) =>
	(numberFormats[digits] ??= new Intl.NumberFormat('en-US', { maximumFractionDigits: digits, signDisplay: 'negative' })).format(v);

/** An engine amount (main currency unit) in the plan's currency: "$1,683.20". */
export const formatCost = (amount: number, currency?: string) => formatMoney(toCents(amount), currency);

/** Concrete as it is ordered, without the ft³ aside: "2.4 yd³", "1.85 m³". */
export const formatOrderVolume = (v: Volume, u: Units) => (u === 'imperial' ? `${num(v.cubicYards, 2)} yd³` : `${num(v.cubicMeters, 2)} m³`);

/** `figure` with the digits spelled out, as the formatters below use it. */
export const num = (x: number, digits: number) => figure(x, digits);

export const formatArea = (a: Area, u: Units) => (u === 'imperial' ? `${num(a.squareFeet, 1)} ft²` : `${num(a.squareMeters, 2)} m²`);

export const formatMass = (m: Mass, u: Units) => (u === 'imperial' ? `${num(m.pounds, 0)} lb` : `${num(m.kilograms, 1)} kg`);

export const formatTemperature = (t: Temperature, u: Units) => (u === 'imperial' ? `${num(t.fahrenheit, 0)} °F` : `${num(t.celsius, 0)} °C`);

export const formatPercent = (p: number) => `${num(p, 0)} %`;

/** A height without its sign, and whether it rounds to nothing in the plan's unit. */
export function magnitude(s: Small, u: Units): { text: string; zero: boolean } {
	const text = formatSmall({ inches: Math.abs(s.inches), millimeters: Math.abs(s.millimeters) }, u);
	return { text, zero: text.startsWith('0 ') };
}

/** Signed height: "+⅜ in", "−1½ in", "0 mm"; no sign when it rounds to nothing. */
export function formatElevation(s: Small, u: Units): string {
	const { text, zero } = magnitude(s, u);
	return zero ? text : `${s.millimeters < 0 ? '−' : '+'}${text}`;
}

/** Minutes as a crew reads a clock: "45 min", "2 h", "5 h 6 min". */
export function formatMinutes(minutes: number): string {
	const m = Math.round(Math.abs(minutes));
	if (m < 60) return `${m} min`;
	const rest = m % 60;
	return `${Math.floor(m / 60)} h${rest ? ` ${rest} min` : ''}`;
}

/** "1 board", "3 boards". */
export const plural = (n: number, word: string) => `${n} ${n === 1 ? word : `${word}s`}`;

/**
 * Why the strength curve may pass 100 %, or nothing when it stays below. 100 % is the 28-day
 * strength at the standard temperature; ACI 209R-92 Eq. 2-1 (moist-cured Type I, a = 4.0, b = 0.85)
 * gives 28 / (4 + 0.85 × 28) = 100.7 % at day 28, and warm days age concrete faster (ASTM C1074).
 */
export function strengthNote(strength: { percent: number }[]): string | undefined {
	if (!strength.some((d) => d.percent > 100)) return undefined;
	return 'The curve passes 100 %: 100 % is the design (28-day) strength, and concrete keeps gaining after day 28. The strength-gain formula (ACI 209R-92 Eq. 2-1) gives about 100.7 % at day 28 for ordinary cement, and warm weather makes concrete age faster than the calendar (ASTM C1074).';
}

/** A material quantity; a zero quantity means the unit text says it all ("per your layout"). */
export function formatQuantity(quantity: number, unit: string): string {
	if (quantity <= 0) return unit;
	return `${num(quantity, quantity >= 10 ? 1 : 2)} ${unit}`;
}

// Dates live in $lib/reader (the reader's locale, today and every date format); re-exported for
// the plan views and the PDF that import them from here.
import { formatDayLong as formatDate } from '$lib/reader';
export { readerLocale } from '$lib/reader';
export { formatDate };

export const formatBagSize = (b: { size: number; unit: string }) => `${b.size} ${b.unit}`;

export const formatOrder = (r: PlanResult['readyMix']) => `${num(r.order, 2)} ${r.unit}`;

/** Fall per foot as a tape fraction when it is one (¼ in reads better than 0.25), or per metre in mm. */
export function formatFall(rate: PlanResult['elevations']['fall'], u: Units): string {
	if (u === 'metric') return `${num(rate.millimetersPerMeter, 1)} mm per m (${num(rate.percent, 2)} %)`;
	const eighths = rate.inchesPerFoot * 8;
	const inch = Math.abs(eighths - Math.round(eighths)) < 1e-6 ? formatInches(rate.inchesPerFoot) : `${num(rate.inchesPerFoot, 3)} in`;
	return `${inch} per ft (${num(rate.percent, 2)} %)`;
}
