import { defineConfig } from 'drizzle-kit';

if (!process.env.DATABASE_URL) throw new Error('DATABASE_URL is not set');

export default defineConfig({
	schema: './src/lib/server/db/schema/index.ts',
	out: './drizzle',
	dialect: 'postgresql',
	// The job queue's tables (schema graphile_worker) belong to graphile-worker and its migrations.
	schemaFilter: ['public'],
	dbCredentials: { url: process.env.DATABASE_URL },
	strict: true,
	verbose: true
});
