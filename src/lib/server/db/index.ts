import { drizzle } from 'drizzle-orm/postgres-js';
import postgres from 'postgres';
import { building } from '$app/environment';
import { env } from '$env/dynamic/private';
import * as schema from './schema';

// The build imports server modules to analyse routes, without a database; nothing connects then.
if (!env.DATABASE_URL && !building) throw new Error('DATABASE_URL is not set');

export const client = postgres(env.DATABASE_URL ?? '', { onnotice: () => {} });
export const db = drizzle(client, { schema });
export type Db = typeof db;
