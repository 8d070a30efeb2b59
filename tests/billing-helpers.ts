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
