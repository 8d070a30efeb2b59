import { describe, expect, it } from 'vitest';
import { offlinePage, planNameFromPage } from './offline-page';

describe('offline page', () => {
	it('names a kept plan from its plan page or pour-day page title, entities read back', () => {
		expect(planNameFromPage('<head><title>Back patio &amp; walk · Stakeline</title></head>')).toBe('Back patio & walk');
		expect(planNameFromPage('<title>Pour day · Shed pad · Stakeline</title>')).toBe('Shed pad');
		expect(planNameFromPage('<p>no title</p>')).toBeNull();
	});

	it('links each kept plan, and its pour day when kept, sorted by name, with names escaped', () => {
		const html = offlinePage('/plans/x', [
			{ id: 'b', name: 'Walk <b>', pour: false },
			{ id: 'a', name: 'Apron', pour: true }
		]);
		expect(html).toContain('<li><a href="/plans/a">Apron</a> · <a href="/plans/a/pour">pour day</a></li><li><a href="/plans/b">Walk &lt;b&gt;</a></li>');
		expect(html).not.toContain('<b>');
		expect(html).toContain('<a class="again" href="/plans/x">Try again</a>');
	});

	it('says when no plan is kept yet', () => {
		const html = offlinePage('/plans', []);
		expect(html).toContain('No plan yet. Open a plan once with a connection and it stays readable here.');
		expect(html).not.toContain('<ul');
	});
});
