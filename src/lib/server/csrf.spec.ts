import { describe, expect, it } from 'vitest';
import { crossSiteRefusal } from './csrf';

const url = (path: string) => new URL(`https://stakeline.test${path}`);
const req = (path: string, o: { method?: string; type?: string | null; origin?: string; accept?: string } = {}) => {
	const headers = new Headers();
	if (o.type !== null) headers.set('content-type', o.type ?? 'application/x-www-form-urlencoded');
	if (o.origin) headers.set('origin', o.origin);
	if (o.accept) headers.set('accept', o.accept);
	return new Request(url(path), { method: o.method ?? 'POST', headers, body: o.method === 'GET' ? undefined : 'a=1' });
};

describe('same-origin check for form posts', () => {
	it('lets a same-origin form post through', () => {
		expect(crossSiteRefusal(req('/signin', { origin: 'https://stakeline.test' }), url('/signin'))).toBeNull();
	});

	it('refuses a form post from another origin, or with none, for every write method and form type', async () => {
		for (const method of ['POST', 'PUT', 'PATCH', 'DELETE'])
			for (const type of ['application/x-www-form-urlencoded', 'multipart/form-data; boundary=x', 'text/plain;charset=UTF-8'])
				for (const origin of ['https://elsewhere.example', undefined]) {
					const res = crossSiteRefusal(req('/signin', { method, type, origin }), url('/signin'));
					expect(res?.status, `${method} ${type} ${origin}`).toBe(403);
					expect(await res!.text()).toBe(`Cross-site ${method} form submissions are forbidden`);
				}
		// A string body without a content type is sent as text/plain (the Request adds it): refused too.
		expect(crossSiteRefusal(req('/signin', { type: null }), url('/signin'))?.status).toBe(403);
	});

	it('leaves a write without a body or content type alone, as SvelteKit does (no form can send one)', () => {
		const bare = new Request(url('/api/plans/x'), { method: 'DELETE' });
		expect(bare.headers.get('content-type')).toBeNull();
		expect(crossSiteRefusal(bare, url('/api/plans/x'))).toBeNull();
		const sveltekitForm = new Request(url('/signin'), { method: 'POST', headers: { 'content-type': 'application/x-sveltekit-formdata' }, body: 'x' });
		expect(crossSiteRefusal(sveltekitForm, url('/signin'))?.status).toBe(403);
	});

	it('answers JSON to a client that asks for it', async () => {
		const res = crossSiteRefusal(req('/signin', { accept: 'application/json' }), url('/signin'))!;
		expect(await res.json()).toEqual({ message: 'Cross-site POST form submissions are forbidden' });
	});

	it('leaves JSON bodies and reads alone (the API checks its own callers)', () => {
		expect(crossSiteRefusal(req('/api/plans', { type: 'application/json' }), url('/api/plans'))).toBeNull();
		expect(crossSiteRefusal(req('/signin', { method: 'GET', type: null }), url('/signin'))).toBeNull();
	});

	it('takes a one-click unsubscribe post from a mail program (RFC 8058) at the stop link only', () => {
		expect(crossSiteRefusal(req('/reminders/stop?token=x'), url('/reminders/stop?token=x'))).toBeNull();
		expect(crossSiteRefusal(req('/reminders/stop/x'), url('/reminders/stop/x'))?.status).toBe(403);
		expect(crossSiteRefusal(req('/reminders'), url('/reminders'))?.status).toBe(403);
	});
});
