// Changing the unit a fall is given in keeps the slope: 2 % becomes 0.24 in per ft, and a total
// drop is worked out over the run the engine spreads it across (elevations.ts slopePlane: the
// extent of all pours across the high edge for the fall, along it for the cross fall).
import type { ParsedPlan } from '$lib/plan';

export type Rate = ParsedPlan['slope']['fall'];
export type RateUnit = Rate['unit'];

/** The extents of the plan across and along its high edge, in plan length units (ft or m). */
export function rateSpans(input: Pick<ParsedPlan, 'sections' | 'slope' | 'houseEdge'>): { across: number; along: number } {
	const ref = input.slope.highEdge ?? input.houseEdge ?? { section: 0, edge: 0 };
	const o = input.sections[ref.section]?.outline;
	if (!o || o.length < 2) return { across: 0, along: 0 };
	const a = o[ref.edge % o.length];
	const b = o[(ref.edge + 1) % o.length];
	const len = Math.hypot(b[0] - a[0], b[1] - a[1]) || 1;
	const t = [(b[0] - a[0]) / len, (b[1] - a[1]) / len];
	let [uMin, uMax, wMin, wMax] = [Infinity, -Infinity, Infinity, -Infinity];
	for (const s of input.sections)
		for (const p of s.outline) {
			const dx = p[0] - a[0];
			const dy = p[1] - a[1];
			const u = dx * t[0] + dy * t[1];
			const w = -dx * t[1] + dy * t[0];
			[uMin, uMax, wMin, wMax] = [Math.min(uMin, u), Math.max(uMax, u), Math.min(wMin, w), Math.max(wMax, w)];
		}
	return { across: wMax - wMin, along: uMax - uMin };
}

/** Display precision per unit: enough that a converted value converts back to what was typed. */
const DIGITS: Record<'imperial' | 'metric', Record<RateUnit, number>> = {
	imperial: { percent: 2, inPerFt: 3, mmPerM: 1, totalDrop: 2 },
	metric: { percent: 2, inPerFt: 3, mmPerM: 1, totalDrop: 0 }
};

/** Small units per plan length unit: inches per foot, millimetres per metre. */
const smallPerLength = (units: 'imperial' | 'metric') => (units === 'imperial' ? 12 : 1000);

/** The same slope in another unit; `span` is the run a total drop spreads over, in ft or m. */
export function convertRate(r: Rate, to: RateUnit, span: number, units: 'imperial' | 'metric'): Rate {
	if (r.unit === to) return { ...r };
	const ratio =
		r.unit === 'percent'
			? r.value / 100
			: r.unit === 'inPerFt'
				? r.value / 12
				: r.unit === 'mmPerM'
					? r.value / 1000
					: span > 0
						? r.value / smallPerLength(units) / span
						: 0;
	const value = to === 'percent' ? ratio * 100 : to === 'inPerFt' ? ratio * 12 : to === 'mmPerM' ? ratio * 1000 : ratio * span * smallPerLength(units);
	const k = 10 ** DIGITS[units][to];
	return { value: Math.round(value * k) / k || 0, unit: to };
}

/**
 * A unit switch that remembers what was typed: going back to the unit the value was typed in,
 * without an edit in between, gives back that value exactly instead of a twice-rounded one.
 */
export class RateUnitSwitch {
	private memo: { typed: Rate; shown: Rate } | null = null;
	switch(current: Rate, to: RateUnit, span: number, units: 'imperial' | 'metric'): Rate {
		const m = this.memo;
		if (m && m.shown.unit === current.unit && m.shown.value === current.value && m.typed.unit === to) {
			this.memo = null;
			return { ...m.typed };
		}
		const typed = m && m.shown.unit === current.unit && m.shown.value === current.value ? m.typed : { ...current };
		const shown = convertRate(current, to, span, units);
		this.memo = { typed, shown };
		return shown;
	}
}
