// A backend that ends while it answers a query (a PostgreSQL restart does this to every busy
// connection) must not pass its error on: the next query on that pooled connection reconnects and
// runs. postgres.js 3.4.9 kept the old backend's error and handed it to the first query after the
// reconnect, however much later (a plan page answered 503 a minute after a restart);
// vite-plugins/postgres-write-guard.ts clears it when the socket closes.
import postgres from 'postgres';
import { afterAll, expect, it } from 'vitest';

const url = process.env.DATABASE_URL!;
// One connection, so the next query surely reuses the one whose backend was ended.
const sql = postgres(url, { max: 1, onnotice: () => {}, backoff: () => 0.05 });
const admin = postgres(url, { max: 1, onnotice: () => {} });

afterAll(async () => {
	await sql.end({ timeout: 1 });
	await admin.end({ timeout: 1 });
});

async function endBackendDuring(query: PromiseLike<unknown>, pid: number) {
	// A query runs once it is awaited: start it, wait until it is running on that backend, then end
	// the backend as a shutdown would.
	const outcome = query.then(
		() => null,
		(e: { code?: string }) => e
	);
	await expect.poll(async () => (await admin`select state from pg_stat_activity where pid = ${pid}`)[0]?.state, { timeout: 10_000 }).toBe('active');
	await admin`select pg_terminate_backend(${pid})`;
	return outcome;
}

it('runs the next query after its backend was ended mid-query', async () => {
	const [{ pid }] = await sql<{ pid: number }[]>`select pg_backend_pid() as pid`;
	const err = await endBackendDuring(sql`select pg_sleep(30)`, pid);
	expect(err).not.toBeNull(); // the query in flight fails: its backend is gone
	const [{ one }] = await sql<{ one: number }[]>`select 1 as one`;
	expect(one).toBe(1);
	const [{ pid: next }] = await sql<{ pid: number }[]>`select pg_backend_pid() as pid`;
	expect(next).not.toBe(pid); // a new backend
});

it('keeps working through several ends in a row', async () => {
	for (let i = 0; i < 3; i++) {
		const [{ pid }] = await sql<{ pid: number }[]>`select pg_backend_pid() as pid`;
		expect(await endBackendDuring(sql`select pg_sleep(30)`, pid)).not.toBeNull();
		expect((await sql<{ n: number }[]>`select ${i}::int as n`)[0].n).toBe(i);
	}
});
