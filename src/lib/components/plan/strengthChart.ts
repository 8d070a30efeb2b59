// The strength line chart for StrengthChart.svelte. chart.js touches canvas and window, so it is
// imported here on demand, in the browser only, with just the parts a line chart needs.

import type { Plugin } from 'chart.js';
import { formatPercent } from '$lib/plan-view';
import { tokens } from '$lib/palette';

export interface Pin {
	day: number;
	percent: number;
	/** The milestone's number in the list under the chart. */
	n: number;
}

const token = (el: Element, name: string, fallback: string) => getComputedStyle(el).getPropertyValue(name).trim() || fallback;

/** Numbered dashed lines at each milestone day; two milestones on one day share a line. */
function milestoneLines(pins: Pin[], color: string): Plugin<'line'> {
	return {
		id: 'milestoneLines',
		afterDatasetsDraw({ ctx, chartArea, scales }) {
			const byDay = new Map<number, number[]>();
			for (const p of pins) byDay.set(p.day, [...(byDay.get(p.day) ?? []), p.n]);
			ctx.save();
			ctx.strokeStyle = ctx.fillStyle = color;
			ctx.setLineDash([4, 4]);
			ctx.font = 'bold 12px Nunito, sans-serif';
			ctx.textAlign = 'center';
			for (const [day, ns] of byDay) {
				const x = scales.x.getPixelForValue(day);
				ctx.beginPath();
				ctx.moveTo(x, chartArea.top + 14);
				ctx.lineTo(x, chartArea.bottom);
				ctx.stroke();
				ctx.fillText(ns.join('·'), x, chartArea.top + 10);
			}
			ctx.restore();
		}
	};
}

/** Draws the chart; resolves to a function that removes it. */
export async function drawStrengthChart(canvas: HTMLCanvasElement, points: { x: number; y: number }[], pins: Pin[]): Promise<() => void> {
	const { Chart, LineController, LineElement, PointElement, LinearScale, Tooltip } = await import('chart.js');
	Chart.register(LineController, LineElement, PointElement, LinearScale, Tooltip);
	Chart.defaults.font.family = 'Nunito, sans-serif';
	const moss = token(canvas, '--color-moss-600', tokens['moss-600']);
	const clay = token(canvas, '--color-clay-500', tokens['clay-500']);
	const ink = token(canvas, '--color-ink-soft', tokens['ink-soft']);
	const grid = { color: token(canvas, '--color-line', tokens.line) };
	const axis = (text: string) => ({ display: true, text, color: ink });
	// An effect that re-ran while chart.js was loading may have drawn here first: one chart per canvas.
	Chart.getChart(canvas)?.destroy();
	const chart = new Chart(canvas, {
		type: 'line',
		data: {
			datasets: [
				{ label: '% of 28-day strength', data: points, borderColor: moss, backgroundColor: moss, pointRadius: 2, tension: 0.25 },
				{
					label: 'Milestone',
					data: pins.map((p) => ({ x: p.day, y: p.percent })),
					showLine: false,
					pointStyle: 'rectRot',
					pointRadius: 7,
					borderColor: clay,
					backgroundColor: clay
				}
			]
		},
		options: {
			animation: false,
			maintainAspectRatio: false,
			scales: {
				x: { type: 'linear', min: 0, max: points.length, title: axis('Days after the last pour'), ticks: { stepSize: 7, color: ink }, grid },
				// Warm weather can pass 100 % of the 28-day strength before day 28: let the axis grow.
				y: { type: 'linear', min: 0, suggestedMax: 100, title: axis('% of 28-day strength'), ticks: { color: ink }, grid }
			},
			plugins: { tooltip: { callbacks: { label: (i) => `Day ${i.parsed.x}: ${formatPercent(i.parsed.y ?? 0)}` } } }
		},
		plugins: [milestoneLines(pins, clay)]
	});
	return () => chart.destroy();
}
