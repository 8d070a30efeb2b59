// A change detector, not a check of any number: every output of computePlan for the demo plans and
// the benchmark's plan, pinned bit for bit, so speed work on the engine cannot change a result
// unnoticed. The numbers are checked against their sources in each topic's own spec. Update
// deliberately (vitest -u) only when a result is meant to change, and read the diff: one JSON file
// per plan and per part of the result under __snapshots__/results/<plan>/, keys sorted, a point or
// a short record on one line.

import { createHash } from 'node:crypto';
import { existsSync, readdirSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import demo from '../../../fixtures/demo-plans.json';
import { computePlan, type PlanInput, type PlanResult } from './index';
import { wavyPad } from './test-plans';

const cases: { id: string; input: PlanInput }[] = [
	...demo.plans.map((p) => ({ id: p.id, input: p.input as PlanInput })),
	{ id: 'bench-wavy-pad', input: wavyPad() }
];

/** The result's parts, one file each; the short ones share `overview`. Every key of PlanResult is in one. */
const parts: Record<string, (keyof PlanResult)[]> = {
	overview: ['name', 'units', 'currency', 'area', 'slab', 'readyMix', 'cost'],
	geometry: ['geometry'],
	volume: ['volume'],
	forms: ['forms'],
	elevations: ['elevations'],
	joints: ['joints'],
	bags: ['bags'],
	mixing: ['mixing'],
	materials: ['materials'],
	strength: ['strength', 'milestones'],
	schedule: ['schedule'],
	weather: ['weather'],
	cautions: ['cautions']
};

const WIDTH = 120;

/**
 * Readable JSON: keys sorted (the API's key order is pinned by the hash below), an array or object
 * on one line when it fits in WIDTH columns, else one entry a line. A key holding undefined is left
 * out, as JSON.stringify leaves it out of what the API sends; -0 is written -0 (valid JSON, and
 * Intl prints it "-0"), where JSON.stringify would write 0.
 */
function readable(value: unknown, indent = ''): string {
	if (Object.is(value, -0)) return '-0';
	if (value === null || typeof value !== 'object') {
		if (typeof value === 'number' && !Number.isFinite(value)) throw new Error(`${value} has no JSON form`);
		return JSON.stringify(value);
	}
	const inner = indent + '  ';
	const entries = Array.isArray(value)
		? value.map((v) => readable(v, inner))
		: Object.keys(value)
				.filter((k) => (value as Record<string, unknown>)[k] !== undefined)
				.sort()
				.map((k) => `${JSON.stringify(k)}: ${readable((value as Record<string, unknown>)[k], inner)}`);
	const [open, close] = Array.isArray(value) ? ['[', ']'] : ['{', '}'];
	if (entries.length === 0) return open + close;
	const line = Array.isArray(value) ? `[${entries.join(', ')}]` : `{ ${entries.join(', ')} }`;
	if (!line.includes('\n') && indent.length + line.length <= WIDTH) return line;
	return `${open}\n${entries.map((e) => inner + e).join(',\n')}\n${indent}${close}`;
}

describe('computePlan output', () => {
	it('names every part of the result once', () => {
		const named = Object.values(parts).flat().sort();
		expect(named).toEqual(Object.keys(computePlan(cases[0].input)).sort());
		expect(new Set(named).size).toBe(named.length);
	});

	describe.each(cases)('$id', ({ id, input }) => {
		const r = computePlan(input);

		it('is the same for the same input: the engine keeps no state between calls', () => {
			expect(computePlan(input)).toStrictEqual(r);
		});

		it.each(Object.entries(parts))('%s', async (part, keys) => {
			const picked = Object.fromEntries(keys.map((k) => [k, r[k]]));
			await expect(readable(keys.length === 1 ? picked[keys[0]] : picked) + '\n').toMatchFileSnapshot(`__snapshots__/results/${id}/${part}.json`);
		});

		it('sends the same JSON text (key order included)', () => {
			expect(createHash('sha256').update(JSON.stringify(r)).digest('hex')).toMatchSnapshot();
		});

		it('keeps no file for a part that is gone', () => {
			const dir = new URL(`__snapshots__/results/${id}/`, import.meta.url);
			const files = existsSync(dir) ? readdirSync(dir) : []; // a new plan's files are written after its first run with -u
			expect(files.filter((f) => !Object.hasOwn(parts, f.replace(/\.json$/, '')))).toEqual([]);
		});
	});
});
