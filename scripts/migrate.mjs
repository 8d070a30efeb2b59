// Applies the committed Drizzle migrations in drizzle/ to DATABASE_URL (npm run db:migrate), then
// graphile-worker's own migrations (the job queue lives in its `graphile_worker` schema, which
// drizzle-kit leaves alone: drizzle.config.ts limits it to `public`).
// Safe to run from several app servers at once: a PostgreSQL advisory lock lets one apply them while
// the others wait, then find nothing left to do.
import { drizzle } from 'drizzle-orm/postgres-js';
import { migrate } from 'drizzle-orm/postgres-js/migrator';
import postgres from 'postgres';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';

/** Any fixed number shared by every copy of this script ("STKLMIG" in ASCII); shows in pg_locks. */
const MIGRATION_LOCK = 0x5354_4b4c_4d49_47n;

if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set');
// One connection: the lock is held by the session that runs the migrations.
const client = postgres(process.env.DATABASE_URL, { max: 1, onnotice: () => {} });
try {
	await client`select pg_advisory_lock(${String(MIGRATION_LOCK)}::bigint)`;
	try {
		await migrate(drizzle(client), { migrationsFolder: fileURLToPath(new URL('../drizzle', import.meta.url)) });
		const { runMigrations } = createRequire(import.meta.url)('graphile-worker');
		await runMigrations({ connectionString: process.env.DATABASE_URL });
	} finally {
		await client`select pg_advisory_unlock(${String(MIGRATION_LOCK)}::bigint)`;
	}
} finally {
	await client.end();
}
