// Every output of computePlan for the demo plans and the benchmark's plan, pinned bit for bit, so
// speed work on the engine cannot change a result unnoticed. Update deliberately (vitest -u) only
// when a result is meant to change.

import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import demo from '../../../fixtures/demo-plans.json';
import { computePlan, type PlanInput } from './index';
import { wavyPad } from './test-plans';

const cases: { id: string; input: PlanInput }[] = [
	...demo.plans.map((p) => ({ id: p.id, input: p.input as PlanInput })),
	{ id: 'bench-wavy-pad', input: wavyPad() }
];

describe('computePlan output', () => {
	it.each(cases)('$id', ({ input }) => {
		const r = computePlan(input);
		// Same input, same answer: the engine keeps no state between calls.
		expect(computePlan(input)).toStrictEqual(r);
		expect(r).toMatchSnapshot();
		// The snapshot sorts keys; the JSON the API sends does not, so pin its exact text too.
		expect(createHash('sha256').update(JSON.stringify(r)).digest('hex')).toMatchSnapshot('json sha256');
	});
});
