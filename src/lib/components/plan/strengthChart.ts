// The strength line chart for StrengthChart.svelte. chart.js touches canvas and window, so it is
// imported here on demand, in the browser only, with just the parts a line chart needs.

import type { Plugin } from 'chart.js';
import { formatPercent, type StrengthChart } from '$lib/plan-view';
import { tokens } from '$lib/palette';

const token = (el: Element, name: string, fallback: string) => getComputedStyle(el).getPropertyValue(name).trim() || fallback;

/** The numbered dashed milestone lines (two milestones on one day share a line). */
function milestoneLines(lines: StrengthChart['lines'], color: string): Plugin<'line'> {
	return {
		id: 'milestoneLines',
		afterDatasetsDraw({ ctx, chartArea, scales }) {
			ctx.save();
			ctx.strokeStyle = ctx.fillStyle = color;
			ctx.setLineDash([4, 4]);
			ctx.font = 'bold 12px Nunito, sans-serif';
			ctx.textAlign = 'center';
			for (const { day, label } of lines) {
				const x = scales.x.getPixelForValue(day);
				ctx.beginPath();
				ctx.moveTo(x, chartArea.top + 14);
				ctx.lineTo(x, chartArea.bottom);
				ctx.stroke();
				ctx.fillText(label, x, chartArea.top + 10);
			}
			ctx.restore();
		}
	};
}

/** Draws the chart; resolves to a function that removes it. */
export async function drawStrengthChart(canvas: HTMLCanvasElement, chart: StrengthChart): Promise<() => void> {
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
	const drawn = new Chart(canvas, {
		type: 'line',
		data: {
			datasets: [
				{
					label: chart.y.title,
					data: chart.points.map((p) => ({ x: p.day, y: p.percent })),
					borderColor: moss,
					backgroundColor: moss,
					pointRadius: 2,
					tension: 0.25
				},
				{
					label: 'Milestone',
					data: chart.pins.map((p) => ({ x: p.day, y: p.percent })),
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
				x: { type: 'linear', min: 0, max: chart.x.max, title: axis(chart.x.title), ticks: { stepSize: chart.x.step, color: ink }, grid },
				y: { type: 'linear', min: 0, max: chart.y.max, title: axis(chart.y.title), ticks: { stepSize: chart.y.step, color: ink }, grid }
			},
			plugins: { tooltip: { callbacks: { label: (i) => `Day ${i.parsed.x}: ${formatPercent(i.parsed.y ?? 0)}` } } }
		},
		plugins: [milestoneLines(chart.lines, clay)]
	});
	return () => drawn.destroy();
}
