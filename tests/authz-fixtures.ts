// The people and records the authorization matrix needs: two homeowners with a plan and a site
// photo each, four contractors (awaiting review, approved with a lead, approved without one,
// suspended), an admin, and on homeowner A's plan a lead with a bid and a message. Accounts and
// contractor records go straight into the database (with a real argon2 hash); the lead, bid and
// message go through the app's own forms, and every actor signs in through the sign-in form.
import fs from 'node:fs/promises';
import path from 'node:path';
import { expect, type APIRequestContext } from '@playwright/test';
import postgres from 'postgres';
import zipcodes from 'zipcodes';
import { hashPassword } from '../src/lib/server/password';
import { demoPassword, demoUser } from './helpers';
import { insertPlan, pdf } from './pro-helpers';

export const actors = ['anon', 'ownerA', 'ownerB', 'pending', 'withLead', 'noLead', 'suspended', 'admin'] as const;
export type Actor = (typeof actors)[number];

export type Fixtures = {
	planA: string;
	planB: string;
	photoA: string;
	photoB: string;
	leadA: string;
	bidA: string;
	/** Each contractor's licence document, and each actor's user id. */
	doc: Record<'pending' | 'withLead' | 'noLead' | 'suspended', string>;
	userId: Record<Exclude<Actor, 'anon'>, string>;
};

const PASSWORD = 'matrix-password-1';
const ZIP = '97322';
const sql = () => postgres(process.env.DATABASE_URL!, { max: 1, onnotice: () => {} });

/** Creates every fixture and one signed-in request context per actor. */
export async function setUpMatrix(newContext: () => Promise<APIRequestContext>, base: string) {
	const run = `${Date.now()}-${Math.floor(Math.random() * 1e6)}`;
	const email = (a: Actor) => `authz-${a.toLowerCase()}-${run}@e2e.stakeline.test`;
	const db = sql();
	const userId = {} as Fixtures['userId'];
	const doc = {} as Fixtures['doc'];
	try {
		const hash = await hashPassword(PASSWORD);
		const place = zipcodes.lookup(ZIP)!;
		const status = { pending: 'awaiting_review', withLead: 'approved', noLead: 'approved', suspended: 'suspended' } as const;
		for (const a of ['ownerA', 'ownerB', 'pending', 'withLead', 'noLead', 'suspended'] as const) {
			const role = a.startsWith('owner') ? 'homeowner' : 'contractor';
			const [u] = await db`
				INSERT INTO "user" (email, name, role, password_hash, email_verified_at)
				VALUES (${email(a)}, ${`Matrix ${a}`}, ${role}, ${hash}, now()) RETURNING id`;
			userId[a] = u.id;
			if (role === 'homeowner') continue;
			const c = a as keyof typeof status;
			await db`
				INSERT INTO contractor (user_id, business_name, status, suspended_from, contact_name, phone, description, years_in_trade, services,
					licence_number, licence_authority, service_postcode, service_radius, service_radius_unit, service_lat, service_lon, submitted_at)
				VALUES (${u.id}, ${`Matrix ${a} Flatwork ${run}`}, ${status[c]}, ${c === 'suspended' ? 'approved' : null}, ${`Matrix ${a}`},
					'(541) 555-0100', 'Test firm for the authorization matrix.', 5, ${['whole_job']}::service_kind[], ${`FH-${run}`},
					'Fernhollow County Contractors Board', ${ZIP}, 30, 'mi', ${place.latitude}, ${place.longitude}, now())`;
			const key = `contractors/${u.id}/licence-matrix.pdf`;
			const bytes = pdf(`licence ${a}`).buffer;
			await fs.mkdir(path.dirname(path.join(process.env.UPLOAD_DIR!, key)), { recursive: true });
			await fs.writeFile(path.join(process.env.UPLOAD_DIR!, key), bytes);
			const [d] = await db`
				INSERT INTO contractor_document (contractor_id, kind, storage_key, content_type, bytes, original_name)
				VALUES (${u.id}, 'licence', ${key}, 'application/pdf', ${bytes.length}, 'licence.pdf') RETURNING id`;
			doc[c] = d.id;
			if (status[c] === 'approved' || c === 'suspended')
				await db`INSERT INTO billing_account (contractor_id, status, period_start, period_end) VALUES (${u.id}, 'active', now(), now() + interval '30 days')`;
		}
		const [admin] = await db`SELECT id FROM "user" WHERE email = ${demoUser('admin').email}`;
		userId.admin = admin.id;
	} finally {
		await db.end();
	}

	const planA = (await insertPlan(email('ownerA'), { name: 'Matrix patio A', postcode: ZIP, photo: true })).id;
	const planB = (await insertPlan(email('ownerB'), { name: 'Matrix patio B', postcode: ZIP, photo: true })).id;

	const ctx = {} as Record<Actor, APIRequestContext>;
	await Promise.all(
		actors.map(async (a) => {
			ctx[a] = await newContext();
			if (a === 'anon') return;
			const who = a === 'admin' ? demoUser('admin').email : email(a);
			const res = await ctx[a].post('/signin', {
				form: { email: who, password: a === 'admin' ? demoPassword : PASSWORD },
				headers: { origin: base, accept: 'text/html' },
				maxRedirects: 0
			});
			expect(res.status(), `sign-in of ${a}: ${(await res.text()).slice(0, 300)}`).toBe(303);
		})
	);

	// The lead, its bid and a message, through the app's forms.
	const form = (c: APIRequestContext, url: string, data: Record<string, string>) =>
		c.post(url, { form: data, headers: { origin: base, accept: 'application/json', 'x-sveltekit-action': 'true' } }).then(async (r) => {
			const body = await r.json();
			expect(body.type, `${url}: ${JSON.stringify(body)}`).toBe('success');
		});
	await form(ctx.ownerA, `/plans/${planA}/bids?/send`, { scope: 'whole_job', timeframe: 'flexible', contractors: userId.withLead });
	const day = (d: number) => new Date(Date.now() + d * 86_400_000).toISOString().slice(0, 10);
	const db2 = sql();
	try {
		const [l] = await db2`SELECT id FROM lead WHERE plan_id = ${planA}`;
		await form(ctx.withLead, `/pro/leads/${l.id}?/bid`, { total: '2400', earliestStart: day(7), durationDays: '2', validUntil: day(30) });
		await form(ctx.ownerA, `/plans/${planA}/bids/${l.id}?/message`, { body: 'The gate is on the left.' });
		const [b] = await db2`SELECT id FROM bid WHERE lead_id = ${l.id}`;
		const photos = await db2`SELECT id, plan_id FROM plan_photo WHERE plan_id IN (${planA}, ${planB})`;
		const photoOf = (p: string) => photos.find((r) => r.plan_id === p)!.id as string;
		return { ctx, fx: { planA, planB, photoA: photoOf(planA), photoB: photoOf(planB), leadA: l.id, bidA: b.id, doc, userId } satisfies Fixtures };
	} finally {
		await db2.end();
	}
}

/** Whether a fixture row still exists (a refused delete must leave it). */
export async function stillThere(table: 'plan_photo' | 'plan' | 'bid', id: string) {
	const db = sql();
	try {
		const rows = await db`SELECT 1 FROM ${db(table)} WHERE id = ${id}`;
		return rows.length === 1;
	} finally {
		await db.end();
	}
}
