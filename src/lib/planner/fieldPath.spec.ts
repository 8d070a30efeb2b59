import { beforeAll, describe, expect, it } from 'vitest';
import { starterInput } from './draft.svelte';
import { loadEngine } from './engine.svelte';
import { choiceAt, numberAt, setChoiceAt, setNumberAt, valueAt } from './fieldPath';

beforeAll(() => loadEngine());

describe('a field named by its path in the plan', () => {
	it('reads the number at a nested path and at a list item', () => {
		const plan = starterInput('imperial');
		plan.forms.stakeLength = 18;
		plan.bags.offered[0].price = 6.5;
		expect(numberAt(plan, 'forms.stakeLength')).toBe(18);
		expect(numberAt(plan, 'thickness')).toBe(plan.thickness);
		expect(numberAt(plan, 'bags.offered.0.price')).toBe(6.5);
	});

	it('writes there and nowhere else, keeping an emptied field empty', () => {
		const plan = starterInput('metric');
		const before = structuredClone(plan);
		setNumberAt(plan, 'thickness', 5);
		expect(plan.thickness).toBe(5);
		setNumberAt(plan, 'crew.people', 3);
		expect(plan.crew.people).toBe(3);
		setNumberAt(plan, 'crew.people', null);
		expect(plan.crew.people).toBeNull();
		setNumberAt(plan, 'readyMix.price', undefined);
		expect('price' in plan.readyMix && plan.readyMix.price === undefined).toBe(true);
		expect({ ...plan, thickness: before.thickness, crew: before.crew, readyMix: before.readyMix }).toEqual(before);
	});

	it('refuses a path whose holder is missing rather than writing a stray object', () => {
		const plan = starterInput('imperial');
		plan.fill = undefined;
		expect(() => setNumberAt(plan, 'fill.largestPiece', 4)).toThrow(/no fill/);
		expect(plan.fill).toBeUndefined();
	});

	it('reads and writes a choice at its path, and nowhere else', () => {
		const plan = starterInput('imperial');
		const before = structuredClone(plan);
		expect(choiceAt(plan, 'mix.cement')).toBe(plan.mix.cement);
		setChoiceAt(plan, 'mix.cement', 'typeIII');
		expect(plan.mix.cement).toBe('typeIII');
		setChoiceAt(plan, 'exposure', 'severe');
		expect(choiceAt(plan, 'exposure')).toBe('severe');
		expect({ ...plan, mix: before.mix, exposure: before.exposure }).toEqual(before);
	});

	it('gives undefined for a step that is missing or not an object', () => {
		expect(valueAt({ a: { b: 2 } }, 'a.b')).toBe(2);
		expect(valueAt({ a: 1 }, 'a.b')).toBeUndefined();
		expect(valueAt(undefined, 'a')).toBeUndefined();
	});
});
