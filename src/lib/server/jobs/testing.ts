import { sql } from 'drizzle-orm';
import { db } from '../db';

/**
 * For integration specs that run a worker: start from an empty queue. Spec files that run no worker
 * leave their queued mail behind in the shared test database; a worker started later would work
 * through all of it before the mail its own test waits for.
 */
export async function emptyJobQueue() {
	await db.execute(sql`DELETE FROM graphile_worker._private_jobs`);
}
