import { beforeAll, describe, expect, it } from 'vitest';
import { defaultText, withUnit } from './fieldDefaults';
import { loadEngine } from './engine.svelte';

// The wizard loads the engine after its first paint; these specs use it loaded.
beforeAll(() => loadEngine());

describe('a field’s default as the wizard says it', () => {
	it('says one day, not one days, and leaves symbols as they are', () => {
		expect(withUnit(1, 'days')).toBe('1 day');
		expect(withUnit(2, 'days')).toBe('2 days');
		expect(withUnit(0.5, 'days')).toBe('0.5 days');
		expect(withUnit(1, 'people')).toBe('1 person');
		expect(withUnit(1, 'min')).toBe('1 min');
		expect(withUnit(1, 'in')).toBe('1 in');
		expect(withUnit(0.08)).toBe('0.08');
		expect(withUnit(1500, 'lb')).toBe('1,500 lb');
	});

	it('reads the engine’s default: the forms come off after 1 day', () => {
		expect(defaultText('imperial', 'milestones.formsOffDays', 'days')).toBe('Default: 1 day.');
		expect(defaultText('metric', 'milestones.walkDays', 'days')).toMatch(/^Default: [\d.]+ days\.$/);
	});
});
