// The strength-over-time chart, worked out once: the page draws it as server-rendered markup
// (StrengthChart.svelte) and the PDF by hand, both from this geometry.
import type { MilestoneRow } from './rows';

export interface StrengthChart {
	/** The line: percent of the 28-day strength by day after the last pour. */
	points: { day: number; percent: number }[];
	/** Days after the last pour, from 0 to the last charted day's count, a tick each week. */
	x: { max: number; ticks: number[]; title: string };
	/** Percent, from 0 to at least 100, grown in 25 % steps where warm weather passes 100 % before day 28. */
	y: { max: number; ticks: number[]; title: string };
	/** Each milestone inside the charted days, with its number in the list under the chart. */
	pins: { day: number; percent: number; n: number }[];
	/** One dashed line a milestone day, naming every milestone on that day ("1·2"). */
	lines: { day: number; label: string }[];
}

const WEEK = 7;
const STEP = 25;
const range = (max: number, step: number) => Array.from({ length: Math.floor(max / step) + 1 }, (_, i) => i * step);

/** From the plan's strength series (`result.strength`) and its milestone rows. */
export function strengthChartGeometry(strength: readonly { day: number; percent: number }[], milestones: readonly MilestoneRow[]): StrengthChart {
	const points = strength.map((d) => ({ day: d.day, percent: d.percent }));
	const xMax = strength.length;
	const yMax = Math.max(100, Math.ceil(Math.max(0, ...points.map((p) => p.percent)) / STEP) * STEP);
	// Milestones not reached in the forecast, or past the charted days, are only listed.
	const pins = milestones.flatMap((m, i) => (m.day !== null && m.percent !== undefined ? [{ day: m.day, percent: m.percent, n: i + 1 }] : []));
	const byDay = new Map<number, number[]>();
	for (const p of pins) byDay.set(p.day, [...(byDay.get(p.day) ?? []), p.n]);
	return {
		points,
		x: { max: xMax, ticks: range(xMax, WEEK), title: 'Days after the last pour' },
		y: { max: yMax, ticks: range(yMax, STEP), title: '% of 28-day strength' },
		pins,
		lines: [...byDay].map(([day, ns]) => ({ day, label: ns.join('·') }))
	};
}

/**
 * The row each milestone line's label sits in, 0 on the plot's top edge, 1 a line above it, so
 * labels of milestones a day or two apart do not run together ("123") in a plot `plotPx` wide. A
 * label goes in the lowest row where it clears the label before it by a few pixels; `charPx` is a
 * generous width of one character of the label's type.
 */
export function labelRows(lines: readonly { day: number; label: string }[], xMax: number, plotPx: number, charPx = 7): number[] {
	const GAP_PX = 4;
	const last: { day: number; label: string }[] = [];
	return lines.map((l) => {
		let row = 0;
		for (; last[row]; row++) {
			const apart = ((l.day - last[row].day) / xMax) * plotPx;
			if (apart >= ((l.label.length + last[row].label.length) / 2) * charPx + GAP_PX) break;
		}
		last[row] = l;
		return row;
	});
}
