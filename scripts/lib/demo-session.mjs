// The demo homeowner's session, for scripts that measure signed-in pages (load, lighthouse).
import fs from 'node:fs';
import path from 'node:path';
import { root } from './settings.mjs';
import { fail } from './run.mjs';

/** Signs in the first demo homeowner through the sign-in form; the session cookie ("name=value"). */
export async function signInDemo(appUrl) {
	const demo = JSON.parse(fs.readFileSync(path.join(root, 'fixtures', 'demo.json'), 'utf8'));
	const who = demo.users.find((u) => u.role === 'homeowner');
	const res = await fetch(`${appUrl}/signin`, {
		method: 'POST',
		redirect: 'manual',
		headers: { origin: appUrl, 'content-type': 'application/x-www-form-urlencoded', 'x-forwarded-for': '127.0.0.1' },
		body: new URLSearchParams({ email: who.email, password: demo.password, redirectTo: '' })
	});
	const set = res.headers.getSetCookie().find((c) => c.startsWith('stakeline_session='));
	if (!set) fail(`Signing in ${who.email} gave no session cookie (status ${res.status}).`);
	return set.split(';')[0];
}

/** The id of the first plan on the signed-in homeowner's list. */
export async function firstPlanId(appUrl, cookie) {
	const html = await (await fetch(`${appUrl}/plans`, { headers: { cookie } })).text();
	const id = /\/plans\/([0-9a-f-]{36})/.exec(html)?.[1];
	if (!id) fail('The demo homeowner has no plan to load; was the demo data seeded?');
	return id;
}
