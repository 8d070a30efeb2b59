import fs from 'node:fs/promises';
import path from 'node:path';
import { expect, type Page } from '@playwright/test';
import postgres from 'postgres';
import sharp from 'sharp';
import zipcodes from 'zipcodes';
import demoPlans from '../fixtures/demo-plans.json' with { type: 'json' };
import { computePlan, type PlanInput, type PlanResult } from '../src/lib/plan/index';
import { grantActivePlan } from './billing-helpers';
import { continueAs, demoUser, dropSession, signUp } from './helpers';

export const pdf = (label: string) => ({
	name: `${label}.pdf`,
	mimeType: 'application/pdf',
	buffer: Buffer.from(`%PDF-1.4\n1 0 obj\n<< /Type /Catalog >>\nendobj\n% ${label}\ntrailer\n<< /Root 1 0 R >>\n%%EOF\n`)
});

export const pngCertificate = async () => ({
	name: 'insurance-certificate.png',
	mimeType: 'image/png',
	buffer: await sharp({ create: { width: 40, height: 30, channels: 3, background: '#d6e8da' } })
		.png()
		.toBuffer()
});

/** The ISO day `days` from today (UTC), as a date field takes it. */
export const daysFromNow = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

export async function fillProfile(
	page: Page,
	business: string,
	o: { zip?: string; radius?: string; unit?: 'mi' | 'km'; wholeJob?: boolean; licenceExpiresOn?: string; insuranceExpiresOn?: string } = {}
) {
	await page.getByLabel('Business name').fill(business);
	await page.getByLabel('Phone').fill('(541) 555-0123');
	await page.getByLabel('Public description').fill('Shed pads and short walks, formed and poured by two of us.');
	await page.getByLabel('Years in the trade').fill('9');
	await page.getByLabel('Pour and finish').check();
	await page.getByLabel('Base preparation').check();
	if (o.wholeJob) await page.getByLabel('The whole job').check();
	await page.getByLabel('Licence number').fill('FH-CC-55120');
	await page.getByLabel('Issued by').fill('Fernhollow County Contractors Board');
	await page.getByLabel('Licence expires on').fill(o.licenceExpiresOn ?? daysFromNow(400));
	await page.getByLabel('Insurance expires on').fill(o.insuranceExpiresOn ?? daysFromNow(200));
	await page.getByLabel('ZIP code').fill(o.zip ?? '97322');
	await page.getByLabel('Distance').fill(o.radius ?? '25');
	await page.getByLabel('Unit').selectOption(o.unit ?? 'km');
}

/** A new contractor, onboarded with both documents and approved by the demo admin; ends signed out. */
export async function approvedNewContractor(page: Page, o: { name: string; email: string; password: string; business: string; zip: string; plan?: boolean }) {
	await signUp(page, { name: o.name, email: o.email, password: o.password, role: 'contractor' });
	await expect(page).toHaveURL(/\/pro$/);
	await page.goto('/pro/profile');
	await fillProfile(page, o.business, { zip: o.zip, radius: '20', unit: 'mi', wholeJob: true });
	await page.getByLabel('Licence document').setInputFiles(pdf('licence'));
	await page.getByLabel('Insurance certificate').setInputFiles(await pngCertificate());
	await page.getByRole('button', { name: 'Send for review' }).click();
	await expect(page.getByText('is checking your licence and insurance')).toBeVisible();
	await continueAs(page, demoUser('admin').email);
	await page.getByTestId('vetting-queue').getByRole('link', { name: o.business }).click();
	await page.getByRole('button', { name: 'Approve' }).click();
	await expect(page.getByTestId('contractor-status')).toHaveText('Approved');
	await dropSession(page);
	// A running plan, so lead tests open lead details (tests/billing.e2e.ts starts without one and pays for it).
	if (o.plan !== false) await grantActivePlan({ email: o.email });
}

/**
 * Stores a plan for `email` straight in the database, computed by the real engine from the first
 * demo plan's input (or `input`), so the handoff can be tested without driving the wizard.
 */
export async function insertPlan(email: string, o: { name: string; postcode: string; photo?: boolean; input?: PlanInput }) {
	if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set');
	const sql = postgres(process.env.DATABASE_URL, { max: 1, onnotice: () => {} });
	try {
		const input = { ...(o.input ?? demoPlans.plans[0].input), name: o.name };
		const result = JSON.parse(JSON.stringify(computePlan(input as never)));
		const [row] = await sql`
			INSERT INTO plan (owner_id, name, postcode, input, result)
			SELECT id, ${o.name}, ${o.postcode}, ${sql.json(input)}, ${sql.json(result)} FROM "user" WHERE email = ${email}
			RETURNING id`;
		if (o.photo) await insertPhoto(sql, row.id);
		return { id: row.id as string, result: result as PlanResult };
	} finally {
		await sql.end();
	}
}

/**
 * An approved contractor for the whole job, serving `radiusMi` around the centroid of `zip`, stored
 * straight in the database (vetting is driven in contractor-vetting.e2e.ts). Nobody signs in as it:
 * the password hash is not one. Returns the business name.
 */
export async function insertApprovedContractor(o: { business: string; zip: string; radiusMi: number }) {
	const place = zipcodes.lookup(o.zip);
	if (!place) throw new Error(`unknown ZIP code ${o.zip}`);
	const sql = postgres(process.env.DATABASE_URL!, { max: 1, onnotice: () => {} });
	try {
		const email = `firm-${Date.now()}-${Math.floor(Math.random() * 1e6)}@e2e.stakeline.test`;
		const [u] = await sql`
			INSERT INTO "user" (email, name, role, password_hash, email_verified_at)
			VALUES (${email}, ${o.business}, 'contractor', 'not-a-hash', now()) RETURNING id`;
		await sql`
			INSERT INTO contractor (user_id, business_name, status, contact_name, phone, description, years_in_trade, services,
				licence_number, licence_authority, service_postcode, service_radius, service_radius_unit, service_lat, service_lon, submitted_at)
			VALUES (${u.id}, ${o.business}, 'approved', ${o.business}, '(406) 555-0100', 'Test firm far from the demo firms.', 6,
				${['whole_job']}::service_kind[], 'TEST-1', 'Test licensing board', ${o.zip}, ${o.radiusMi}, 'mi', ${place.latitude}, ${place.longitude}, now())`;
		return o.business;
	} finally {
		await sql.end();
	}
}

/** A site photo and its thumbnail, written where the app's storage module reads them. */
async function insertPhoto(sql: postgres.Sql, planId: string) {
	const dir = process.env.UPLOAD_DIR;
	if (!dir) throw new Error('UPLOAD_DIR is not set');
	// The planner's formats: the photo as JPEG, its thumbnail as WebP.
	const image = (w: number) => sharp({ create: { width: w, height: Math.round(w * 0.75), channels: 3, background: '#8cbf9b' } });
	const keys = { full: `plans/${planId}/photos/yard.jpg`, thumb: `plans/${planId}/photos/yard-thumb.webp` };
	for (const [key, bytes] of [
		[keys.full, await image(800).jpeg().toBuffer()],
		[keys.thumb, await image(160).webp().toBuffer()]
	] as const) {
		await fs.mkdir(path.dirname(path.join(dir, key)), { recursive: true });
		await fs.writeFile(path.join(dir, key), bytes);
	}
	await sql`
		INSERT INTO plan_photo (plan_id, storage_key, thumb_key, content_type, bytes, width, height, original_name)
		VALUES (${planId}, ${keys.full}, ${keys.thumb}, 'image/jpeg', 1000, 800, 600, 'yard.jpg')`;
}

export async function bumpPlanRevision(planId: string) {
	const sql = postgres(process.env.DATABASE_URL!, { max: 1, onnotice: () => {} });
	try {
		await sql`UPDATE plan SET revision = revision + 1, name = name || ' (wider)' WHERE id = ${planId}`;
	} finally {
		await sql.end();
	}
}

/**
 * A bid from the contractor at `contractorEmail` on the lead of `planId`, stored straight in the
 * database (the contractor's side is driven in contractor-bid.e2e.ts). Dates are days from today.
 */
export async function insertBid(
	planId: string,
	contractorEmail: string,
	o: { dollars: number; days: number; startIn?: number; validFor?: number; inclusions?: string }
) {
	const sql = postgres(process.env.DATABASE_URL!, { max: 1, onnotice: () => {} });
	const day = (n: number) => new Date(Date.now() + n * 86_400_000).toISOString().slice(0, 10);
	try {
		const [l] = await sql`
			SELECT lead.id, lead.contractor_id FROM lead JOIN "user" u ON u.id = lead.contractor_id
			WHERE lead.plan_id = ${planId} AND u.email = ${contractorEmail}`;
		if (!l) throw new Error(`no lead of ${contractorEmail} on plan ${planId}`);
		await sql`
			INSERT INTO bid (lead_id, plan_id, contractor_id, total_cents, earliest_start, duration_days, valid_until, inclusions)
			VALUES (${l.id}, ${planId}, ${l.contractor_id}, ${o.dollars * 100}, ${day(o.startIn ?? 7)}, ${o.days}, ${day(o.validFor ?? 30)}, ${o.inclusions ?? ''})`;
		await sql`UPDATE lead SET status = 'bid_sent' WHERE id = ${l.id}`;
		return l.id as string;
	} finally {
		await sql.end();
	}
}
