import { describe, expect, it } from 'vitest';
import { computePlan, planInputJsonSchema, type PlanResult } from './index';
import type { PlanInput } from './schema';
import { rect } from './test-plans';

// "from memory" marks a figure in code comments and docs; what a person reads (screen, PDF, mail,
// the API's schema) says "common practice" or names the published source instead.

/** Every string anywhere in a value: the text the views, the PDF and the mails are built from. */
function strings(v: unknown, out: string[] = []): string[] {
	if (typeof v === 'string') out.push(v);
	else if (Array.isArray(v)) for (const x of v) strings(x, out);
	else if (v && typeof v === 'object') for (const x of Object.values(v)) strings(x, out);
	return out;
}

const base: PlanInput = { units: 'imperial', sections: [{ outline: rect(0, 0, 20, 12) }] };

/** Plans that reach the lines once marked "from memory": fibre dose, release agent, dug soil, the
 * furniture and curing milestones, the bleed-water step, and the cautions on permits, de-icers,
 * oil, steep falls, cold curing and hot concrete. */
const plans: [string, PlanInput][] = [
	[
		'fibre without a label dose, release agent, severe exposure',
		{ ...base, reinforcement: 'fiber', forms: { release: 'agent' }, exposure: 'severe', prices: { haulSoil: 40 } }
	],
	[
		'oil release, steep fall, cold week, vehicles',
		{
			...base,
			forms: { release: 'oil' },
			slope: { fall: { value: 8, unit: 'percent' } },
			loads: { vehicles: true },
			conditions: { airTemp: 42, airLow: 30, pourDate: '2027-03-01' }
		}
	],
	[
		'hot concrete, saw-cut joints, compound cure, metric',
		{
			units: 'metric',
			sections: [{ outline: rect(0, 0, 6, 4) }],
			conditions: { airTemp: 36, concreteTemp: 38 },
			joints: { method: 'saw' },
			curing: { method: 'compound' },
			reinforcement: 'mesh'
		}
	],
	['rebar, thickened edge, drum', { ...base, reinforcement: 'rebar', thickenedEdge: { edges: 'free' }, crew: { method: 'drum' }, mix: { cement: 'typeIII' } }]
];
const results: [string, PlanResult][] = plans.map(([name, input]) => [name, computePlan(input)]);

/** "a 80 lb bag", "an 4 in slab": the article before a number that does not match its sound. */
function articleSlips(text: string): string[] {
	const slips: string[] = [];
	for (const m of text.matchAll(/\b(a|an) (\d[\d.,]*)/gi)) {
		const n = m[2].replace(/[.,].*$/, '');
		// "eight", "eleven", "eighteen", "eighty", "eight hundred": an; every other number: a.
		const vowel = /^8/.test(n) || n === '11' || n === '18' || /^1[18]\d{3}$/.test(n) || /^1[18]\d{6}$/.test(n);
		if ((m[1].toLowerCase() === 'an') !== vowel) slips.push(m[0]);
	}
	return slips;
}

describe('text a person reads', () => {
	it('the plans reach the lines that were once marked "from memory"', () => {
		const all = results.flatMap(([, r]) => strings(r)).join('\n');
		expect(all).toMatch(/fiber label/); // fibre dose without a label dose
		expect(all).toMatch(/of form face/); // release agent coverage
		expect(all).toMatch(/in the ground, about/); // dug soil
		expect(all).toMatch(/bleed water/);
		const ids = new Set(results.flatMap(([, r]) => r.cautions.map((c) => c.id)));
		for (const id of ['first-winter-deicer', 'form-release-oil']) expect(ids).toContain(id);
		expect(ids.size).toBeGreaterThan(8);
	});

	it.each(results)('never says "from memory": %s', (_, r) => {
		const said = strings(r).filter((s) => /from memory/i.test(s));
		expect(said).toEqual([]);
	});

	it('the public JSON Schema never says "from memory"', () => {
		expect(strings(planInputJsonSchema()).filter((s) => /from memory/i.test(s))).toEqual([]);
	});

	it.each(results)('uses "a" and "an" before numbers as they are said: %s', (_, r) => {
		expect(strings(r).flatMap(articleSlips)).toEqual([]);
	});

	it.each(results)('no "day(s)" and no quantity rounded to nothing ("About 0 gal"): %s', (_, r) => {
		expect(strings(r).filter((t) => /\w\(s\)|\bAbout 0 /.test(t))).toEqual([]);
	});

	it("milestone rules speak the plan's temperature unit, in plain words", () => {
		const imp = computePlan(base)
			.milestones.map((x) => x.rule)
			.join('\n');
		expect(imp).toMatch(/as if at 68 °F/);
		expect(imp).not.toMatch(/°C|equivalent age/);
		const met = computePlan({ units: 'metric', sections: [{ outline: rect(0, 0, 6, 4) }] })
			.milestones.map((x) => x.rule)
			.join('\n');
		expect(met).toMatch(/as if at 20 °C/);
		expect(met).not.toMatch(/°F/);
	});

	it('the article check itself catches the slips it is for', () => {
		expect(articleSlips('carry a 80 lb bag, an 4 in slab, an 18 in stake, a 60 lb bag, an 8 ft board, a 1.2 m level')).toEqual(['a 80', 'an 4']);
	});
});
