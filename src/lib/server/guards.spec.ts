import { describe, expect, it } from 'vitest';
import { safeRedirect } from './guards';

describe('safeRedirect', () => {
	it('keeps paths on this site', () => {
		expect(safeRedirect('/plans/new', '/')).toBe('/plans/new');
		expect(safeRedirect('/plans?x=1#top', '/')).toBe('/plans?x=1#top');
	});

	it('refuses anything a browser would send elsewhere', () => {
		for (const t of [
			'//evil.example',
			'/\t/evil.example',
			'/\\evil.example',
			'/\n/evil.example',
			'https://evil.example',
			'evil.example',
			'',
			null,
			undefined
		]) {
			expect(safeRedirect(t, '/home')).toBe('/home');
		}
	});

	it('refuses the forms that normalise to another site', () => {
		// As the sign-in page reads them: URLSearchParams percent-decodes the query once.
		const query = [
			'%2F.%2F%2Fevil.example',
			'%2F%2Fevil.example',
			'%2F%5Cevil.example',
			'%2F%09%2Fevil.example',
			'%2F%0A%2Fevil.example',
			'%2F%0D%2Fevil.example',
			'/./%2F/evil.example',
			'%2F..%2F%2Fevil.example',
			'/a/..//evil.example',
			'/%00//evil.example',
			'http:%2F%2Fevil.example',
			'%2F%2F%2Fevil.example'
		];
		for (const q of query) {
			const target = new URLSearchParams(`redirectTo=${q}`).get('redirectTo');
			const result = safeRedirect(target, '/home');
			expect(new URL(result, 'https://stakeline.example').origin, `${q} → ${result}`).toBe('https://stakeline.example');
			expect(result.startsWith('//'), `${q} → ${result}`).toBe(false);
		}
		expect(safeRedirect('/./plans', '/home')).toBe('/plans');
	});
});
