import { render } from 'svelte/server';
import { describe, expect, it } from 'vitest';
import { computePlan } from '$lib/plan';
import { formatSmall, formatVolume } from '$lib/plan-view';
import demo from '../../../../fixtures/demo-plans.json';
import { layoutSheet, tapeLength } from '$lib/plan/layout-sheet';
import { cornerEll, rect, smallPatio } from '$lib/plan/test-plans';
import BuildCard from './BuildCard.svelte';
import CautionList from './CautionList.svelte';
import LayoutSheet from './LayoutSheet.svelte';
import DayPlan from './DayPlan.svelte';
import MaterialsList from './MaterialsList.svelte';
import MixingPlan from './MixingPlan.svelte';
import PlanOutline2D from './PlanOutline2D.svelte';
import PlanSummary from './PlanSummary.svelte';
import StakeMarkTable from './StakeMarkTable.svelte';
import StrengthChart from './StrengthChart.svelte';
import { formatDate, formatPercent, materialRows, milestoneRows, strengthChartGeometry, summaryItems } from '$lib/plan-view';
import { buildCardItems } from '$lib/plan-view/buildCard';

const plans = demo.plans.map((p) => ({ id: p.id, result: computePlan(p.input) }));

/** Server-rendered HTML with tags and comments dropped and entities decoded, to search as text. */
function text(html: string): string {
	return html
		.replace(/<!--[\s\S]*?-->/g, '')
		.replace(/<[^>]+>/g, ' ')
		.replace(/&amp;/g, '&')
		.replace(/&lt;/g, '<')
		.replace(/&gt;/g, '>')
		.replace(/&#39;/g, "'")
		.replace(/&quot;/g, '"')
		.replace(/\s+/g, ' ');
}

describe.each(plans)('plan page components, $id', ({ result }) => {
	const u = result.units;

	it('PlanSummary shows area, volumes and every bag size', () => {
		const out = text(render(PlanSummary, { props: { items: summaryItems(result) } }).body);
		expect(out).toContain(formatVolume(result.volume.net, u));
		expect(out).toContain(formatVolume(result.volume.order, u));
		for (const b of result.bags) expect(out).toContain(`${b.size} ${b.unit} bags ${b.count} bags`);
	});

	it('BuildCard states the thickness and dig depth from the slab block', () => {
		const out = text(render(BuildCard, { props: { items: buildCardItems(result) } }).body);
		expect(out).toContain(`Slab thickness ${formatSmall(result.slab.thickness, u)}`);
		expect(out).toContain(`Dig depth ${formatSmall(result.slab.digDepth, u)}`);
	});

	it('LayoutSheet draws the top view and places every stake along its board', () => {
		const html = render(LayoutSheet, { props: { plan: result } }).body;
		// Two copies of the drawing, each with one outline per section: the screen's, and the print copy
		// laid out on a smaller canvas so its labels print larger.
		expect((html.match(/<svg/g) ?? []).length).toBe(2);
		expect((html.match(/<polygon/g) ?? []).length).toBe(2 * result.geometry.sections.length);
		const out = text(html);
		for (const s of layoutSheet(result).stakes) expect(out).toContain(`${s.id} ${s.board} ${s.from}, along ${s.along} ${tapeLength(s.distance, u)}`);
	});

	it('StakeMarkTable lists every stake with its mark, in an accessible table', () => {
		const html = render(StakeMarkTable, { props: { plan: result } }).body;
		expect(html).toContain('<caption');
		expect(html).toMatch(/<th[^>]*scope="col"/);
		const rows = [...html.matchAll(/<th[^>]*scope="row"[^>]*>([\s\S]*?)<\/th>/g)].map((m) => text(m[1]).trim());
		expect(rows.map((r) => r.split(' ')[0])).toEqual(result.elevations.stakes.map((s) => s.id));
		// Each row ends with the engine's distance below the level line.
		const cells = [...html.matchAll(/<tr[^>]*>([\s\S]*?)<\/tr>/g)].slice(1).map((m) => text(m[1]).trim());
		expect(cells.map((c) => c.split(' ').slice(-2).join(' '))).toEqual(result.elevations.stakes.map((s) => formatSmall(s.belowLevelLine, u)));
	});

	it('PlanOutline2D gives the joints’ depth as the day plan does (1¼ in, not 1.3 in)', () => {
		const depth = formatSmall(result.joints.depth, u);
		expect(text(render(PlanOutline2D, { props: { result } }).body)).toContain(`control joints (cut ${depth} deep)`);
		const day = text(render(DayPlan, { props: { plan: result } }).body);
		if (result.joints.sections.some((s) => s.lines.length)) expect(day).toContain(`control joints ${depth} deep`);
	});

	it('DayPlan shows every day and task', () => {
		const out = text(render(DayPlan, { props: { plan: result } }).body);
		for (const d of result.schedule.days) {
			expect(out).toContain(`Day ${d.day}`);
			for (const k of d.tasks) expect(out).toContain(k.text);
		}
	});

	it('the long parts opened in place (headed={false}) carry the same content without a card or heading of their own', () => {
		for (const [C, heading] of [
			[LayoutSheet, 'Layout sheet'],
			[StakeMarkTable, 'Stake marks'],
			[DayPlan, 'Day by day']
		] as const) {
			const headed = render(C, { props: { plan: result } }).body;
			const bare = render(C, { props: { plan: result, headed: false } }).body;
			expect(text(headed)).toContain(heading);
			expect(bare).not.toMatch(/<h2|<section/);
			expect(text(headed).replace(heading, '').replace(/\s+/g, ' ').trim()).toBe(text(bare).trim());
		}
	});

	it('StrengthChart draws its line, axes and milestone pins on the server, with the milestones and a data table', () => {
		const html = render(StrengthChart, { props: { plan: result } }).body;
		const chart = strengthChartGeometry(result.strength, milestoneRows(result));
		// The line and a dot a day pass through every day's strength, y measured down from the top of the plot.
		const y = (percent: number) => +(chart.y.max - percent).toFixed(2);
		const points = /<polyline points="([^"]+)"/.exec(html)![1].split(' ');
		expect(points).toHaveLength(result.strength.length);
		expect(points[7]).toBe(`${result.strength[7].day},${y(result.strength[7].percent)}`);
		const dots = /<path d="([^"]+)"/.exec(html)![1];
		expect(dots.match(/M[\d.]+,[\d.]+h0/g)).toHaveLength(result.strength.length);
		expect(dots).toContain(`M${result.strength[7].day},${y(result.strength[7].percent)}h0`);
		// A pin a milestone reached in the charted days, placed at its day and strength.
		const share = (v: number, max: number) => +((v / max) * 100).toFixed(2);
		const pin = chart.pins[0];
		expect(html).toContain(
			`title="${pin.n}: day ${pin.day}, ${formatPercent(pin.percent)}" style="left: ${share(pin.day, chart.x.max)}%; bottom: ${share(pin.percent, chart.y.max)}%;"`
		);
		expect([...html.matchAll(/title="\d+: day /g)]).toHaveLength(chart.pins.length);
		for (const t of [...chart.x.ticks, ...chart.y.ticks]) expect(text(html)).toContain(String(t));
		expect(html).not.toContain('<canvas');
		for (const m of result.milestones) expect(text(html)).toContain(m.title);
		const table = /<div class="sr-only">\s*<table>([\s\S]*?)<\/table>/.exec(html)![1];
		expect([...table.matchAll(/scope="row"/g)]).toHaveLength(result.strength.length);
		const day = result.strength[6];
		expect(text(table)).toContain(`${day.day} ${day.date ? formatDate(day.date) + ' ' : ''}${formatPercent(day.percent)}`);
	});

	it('MaterialsList shows each material with its quantity and cost, and the tools', () => {
		const out = text(render(MaterialsList, { props: { plan: result, reader: 'homeowner' } }).body);
		for (const m of materialRows(result)) expect(out).toContain(`${m.quantity} ${m.cost ?? '—'}`);
		for (const k of result.materials.tools) expect(out).toContain(k.name);
	});

	it('MixingPlan shows each section, whether it fits, and any split', () => {
		const out = text(render(MixingPlan, { props: { plan: result } }).body);
		for (const s of result.mixing.sections) {
			expect(out).toContain(`${s.bags} × ${result.mixing.bag.size} ${result.mixing.bag.unit}`);
			expect(out).toContain(s.fits ? 'Fits the working time' : 'Does not fit the working time');
			if (s.split) expect(out).toContain(s.split.note);
		}
	});

	it('CautionList shows every caution with its source, the deferral to local codes first', () => {
		const out = text(render(CautionList, { props: { cautions: result.cautions } }).body);
		for (const c of result.cautions) {
			expect(out).toContain(c.title);
			expect(out).toContain(`Source: ${c.source}`);
		}
		const local = result.cautions.find((c) => c.id === 'local-codes')!;
		for (const c of result.cautions) if (c !== local) expect(out.indexOf(local.title)).toBeLessThan(out.indexOf(c.title));
	});
});

it('CautionList keeps a deferral to local codes even without the engine caution', () => {
	const out = text(render(CautionList, { props: { cautions: [] } }).body);
	expect(out).toMatch(/local codes/i);
});

describe("the drawings' keys name only what is drawn, in whole sentences", () => {
	/** Text as a reader sees it: tags dropped without adding spaces, so a missing space shows. */
	const seen = (html: string) =>
		html
			.replace(/<!--[\s\S]*?-->/g, '')
			.replace(/<[^>]+>/g, '')
			.replace(/&nbsp;/g, ' ')
			.replace(/\s+/g, ' ');
	const pad = computePlan({ units: 'imperial', sections: [{ outline: rect(0, 0, 12, 10) }], houseEdge: null, slope: { highEdge: { section: 0, edge: 2 } } });
	const ell = computePlan(cornerEll);

	it('a freestanding pad: no house wall in either key, and a space between the sentences', () => {
		const sheet = seen(render(LayoutSheet, { props: { plan: pad } }).body);
		expect(sheet).toContain('named as in the cut list; the thick green dashes mark the high side, edge C–D');
		expect(sheet).not.toContain('house wall,');
		expect(sheet).toContain('grey dashes the diagonals');
		const outline = seen(render(PlanOutline2D, { props: { result: pad } }).body);
		expect(outline).toContain('Top view. Dashed lines are control joints');
		expect(outline).toContain('between pours. The green dashed edge is the high side');
		expect(outline).not.toContain('house walls');
	});

	it('an L around a house corner: the walls, and no diagonals (it has six corners)', () => {
		const sheet = seen(render(LayoutSheet, { props: { plan: ell } }).body);
		expect(sheet).toContain('the thick brown line is the house wall');
		expect(sheet).not.toContain('grey dashes');
		expect(sheet).toContain('control joints and blue lines cold joints.');
		expect(seen(render(PlanOutline2D, { props: { result: ell } }).body)).toContain('Top view. Brown edges are house walls; dashed lines');
	});
});

describe('StrengthChart on a phone', () => {
	it("lifts the label of a milestone a day after another, so the back patio's days 1, 2 and 3 do not read as 123", () => {
		const patio = plans.find((p) => p.id === 'lind-back-patio')!.result;
		const html = render(StrengthChart, { props: { plan: patio } }).body;
		const labels = [...html.matchAll(/<span class="absolute bottom-full -translate-x-1\/2 text-xs font-bold text-clay-700 ?([^"]*)">([^<]+)<\/span>/g)].map(
			(m) => [m[2], m[1]]
		);
		expect(labels).toEqual([
			['1', ''],
			['2', 'max-sm:pb-4'],
			['3', ''],
			['4', '']
		]);
		// The plot leaves room above it for the lifted row.
		expect(html).toContain('pr-3 pl-8 pt-5 max-sm:pt-9');
	});
});

describe('MaterialsList with no price entered', () => {
	const bare = computePlan(smallPatio());
	it('says the total is not priced, to the homeowner with where to price it, and never shows $0.00', () => {
		const owner = text(render(MaterialsList, { props: { plan: bare, reader: 'homeowner' } }).body);
		expect(owner).toContain("Do-it-yourself total Not priced add prices in the planner's Crew step");
		const pro = text(render(MaterialsList, { props: { plan: bare, reader: 'contractor' } }).body);
		expect(pro).toContain('Do-it-yourself total Not priced');
		expect(pro).not.toContain('Crew step');
		for (const out of [owner, pro]) expect(out).not.toContain('$0.00');
	});
});

describe('the outline drawing writes its numbers to a ten-thousandth', () => {
	// A corner that arithmetic left a hair off its value, as sums of decimal feet do (0.1 + 0.2).
	const noisy = 13.999999999999998;
	const result = computePlan({
		units: 'imperial',
		sections: [
			{
				outline: [
					[0, 0],
					[noisy, 0],
					[noisy, 0.1 + 0.2 + 9.7],
					[0, 10]
				]
			}
		],
		houseEdge: { section: 0, edge: 0 }
	});
	const svg = render(PlanOutline2D, { props: { result } }).body;
	const numbers = [...svg.matchAll(/\s(?:x1|x2|y1|y2|x|y|cx|cy|r|font-size|stroke-width|stroke-dasharray|points|viewBox)="([^"]*)"/g)].flatMap((m) =>
		m[1].split(/[\s,]+/).filter(Boolean)
	);

	it('every coordinate and size has at most four decimals', () => {
		expect(numbers.length).toBeGreaterThan(40);
		for (const n of numbers) expect(n).toMatch(/^-?\d+(\.\d{1,4})?$/);
	});

	it('the slab is drawn where its corners are, and grid lines fall on whole feet', () => {
		const points = /<polygon[^>]*points="([^"]*)"/.exec(svg)![1];
		expect(points).toBe('0,0 14,0 14,10 0,10');
		const grid = [...svg.matchAll(/<line x1="([^"]*)" x2="\1"/g)].map((m) => Number(m[1]));
		expect(grid).toContain(7);
		for (const x of grid) expect(Number.isInteger(x)).toBe(true);
	});
});
