import { describe, expect, it } from 'vitest';
import { safeRedirect } from './guards';

describe('safeRedirect', () => {
	it('keeps paths on this site', () => {
		expect(safeRedirect('/plans/new', '/')).toBe('/plans/new');
		expect(safeRedirect('/plans?x=1#top', '/')).toBe('/plans?x=1#top');
	});

	it('refuses anything a browser would send elsewhere', () => {
		for (const t of ['//evil.example', '/\t/evil.example', '/\\evil.example', '/\n/evil.example', 'https://evil.example', 'evil.example', '', null, undefined]) {
			expect(safeRedirect(t, '/home')).toBe('/home');
		}
	});
});
