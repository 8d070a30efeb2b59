// Billing for test contractors: an approved contractor in a test gets a running plan (as the
// demo firms do), so tests about leads see the details; the billing tests start without one.
import postgres from 'postgres';

/** Gives the contractor (by e-mail or user id) a running plan with no provider record, like the demo seed. */
export async function grantActivePlan(who: { email?: string; userId?: string }) {
	if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set');
	const sql = postgres(process.env.DATABASE_URL, { max: 1, onnotice: () => {} });
	try {
		const [u] = who.userId ? [{ id: who.userId }] : await sql`SELECT id FROM "user" WHERE email = ${who.email!.toLowerCase()}`;
		if (!u) throw new Error(`no such user ${who.email}`);
		await sql`
			INSERT INTO billing_account (contractor_id, status, period_start, period_end)
			VALUES (${u.id}, 'active', now(), now() + interval '30 days')
			ON CONFLICT (contractor_id) DO UPDATE SET status = 'active', period_start = now(), period_end = now() + interval '30 days', leads_used = 0`;
	} finally {
		await sql.end();
	}
}

/** A lead on `planId` for the contractor at `contractorEmail`, stored straight in the database as sending would. */
export async function insertLead(planId: string, contractorEmail: string, o: { town: string; respondInDays: number }) {
	const sql = postgres(process.env.DATABASE_URL!, { max: 1, onnotice: () => {} });
	try {
		const [row] = await sql`
			INSERT INTO lead (plan_id, homeowner_id, contractor_id, scope, timeframe, plan_revision, latest_revision, snapshot, town, distance_km, respond_by)
			SELECT p.id, p.owner_id, u.id, 'whole_job', 'within_month', p.revision, p.revision,
				jsonb_build_object('name', p.name, 'postcode', p.postcode, 'input', p.input, 'result', p.result, 'photoIds', '[]'::jsonb),
				${o.town}, 3.2, (now() + make_interval(days => ${o.respondInDays}))::date
			FROM plan p, "user" u WHERE p.id = ${planId} AND u.email = ${contractorEmail.toLowerCase()}
			RETURNING id`;
		return row.id as string;
	} finally {
		await sql.end();
	}
}

/** Sets how many included leads the contractor used this period and how many credits they hold (to reach the end of the included leads). */
export async function setUsage(email: string, o: { leadsUsed: number; credits: number }) {
	const sql = postgres(process.env.DATABASE_URL!, { max: 1, onnotice: () => {} });
	try {
		await sql`UPDATE billing_account SET leads_used = ${o.leadsUsed}, credits = ${o.credits}
			WHERE contractor_id = (SELECT id FROM "user" WHERE email = ${email.toLowerCase()})`;
	} finally {
		await sql.end();
	}
}
