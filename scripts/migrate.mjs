// Applies the committed Drizzle migrations in drizzle/ to DATABASE_URL (npm run db:migrate), then
// graphile-worker's own migrations (the job queue lives in its `graphile_worker` schema, which
// drizzle-kit leaves alone: drizzle.config.ts limits it to `public`).
import { drizzle } from 'drizzle-orm/postgres-js';
import { migrate } from 'drizzle-orm/postgres-js/migrator';
import postgres from 'postgres';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';

if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set');
const client = postgres(process.env.DATABASE_URL, { max: 1, onnotice: () => {} });
try {
	await migrate(drizzle(client), { migrationsFolder: fileURLToPath(new URL('../drizzle', import.meta.url)) });
} finally {
	await client.end();
}
const { runMigrations } = createRequire(import.meta.url)('graphile-worker');
await runMigrations({ connectionString: process.env.DATABASE_URL });
