import { json } from '@sveltejs/kit';
import { sql } from 'drizzle-orm';
import { db, RETRY_AFTER_S } from '$lib/server/db';
import type { RequestHandler } from './$types';

const PROBE_MS = 2000;

/** Liveness for start scripts and load balancers, with the database's state: 503 while it is down. */
export const GET: RequestHandler = async () => {
	const t0 = performance.now();
	const probe = db.execute(sql`select 1`).then(() => 'up' as const);
	const timeout = new Promise<'down'>((r) => setTimeout(() => r('down'), PROBE_MS).unref());
	const database = await Promise.race([probe, timeout]).catch(() => 'down' as const);
	const ms = Math.round(performance.now() - t0);
	const headers: Record<string, string> = { 'cache-control': 'no-store' };
	if (database === 'up') return json({ ok: true, database, ms }, { headers });
	return json({ ok: false, database, ms }, { status: 503, headers: { ...headers, 'retry-after': String(RETRY_AFTER_S) } });
};
