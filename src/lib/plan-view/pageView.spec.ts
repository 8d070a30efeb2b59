import { describe, expect, it } from 'vitest';
import { computePlan } from '$lib/plan';
import demo from '../../../fixtures/demo-plans.json';
import { buildCardItems } from './buildCard';
import { planPageView, planSheets } from './pageView';
import { milestoneRows, summaryItems } from './rows';

const plans = demo.plans.map((p) => ({ id: p.id, result: computePlan(p.input) }));
const size = (x: unknown) => JSON.stringify(x).length;

describe.each(plans)('what the plan page sends, $id', ({ result }) => {
	const view = planPageView(result);

	it('carries the build card and summary as the rows the page shows, not the fields behind them', () => {
		expect(view.buildCard).toEqual(buildCardItems(result));
		expect(view.summary).toEqual(summaryItems(result));
		for (const behind of ['forms', 'elevations', 'schedule', 'volume', 'bags', 'weather', 'slab', 'readyMix', 'cost'])
			expect(Object.keys(view), behind).not.toContain(behind);
	});

	it('keeps each strength day’s day, date and percent, so the chart and milestones read the same', () => {
		expect(view.strength.map((d) => [d.day, d.date, d.percent])).toEqual(result.strength.map((d) => [d.day, d.date, d.percent]));
		expect(milestoneRows(view)).toEqual(milestoneRows(result));
	});

	it('counts what the on-demand parts hold, and those parts carry what they draw', () => {
		expect(view.counts).toEqual({ stakes: result.elevations.stakes.length, days: result.schedule.days.length });
		const sheets = planSheets(result);
		for (const k of ['units', 'geometry', 'joints', 'forms', 'elevations', 'schedule', 'slab', 'volume'] as const) expect(sheets[k]).toBe(result[k]);
	});

	it('is well under the whole result', () => {
		// The demo plans' results are 31–35 kB as JSON; the page's part is what is left after the long
		// tables, the drawing's inputs and the engine's working fields.
		expect(size(view)).toBeLessThan(0.6 * size(result));
	});
});
