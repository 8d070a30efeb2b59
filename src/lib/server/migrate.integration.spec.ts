// Two app servers started together both run scripts/migrate.mjs: the advisory lock lets one apply
// the migrations and the other find them done, so each runs exactly once.
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import postgres from 'postgres';
import { afterAll, expect, it } from 'vitest';
import { client } from './db';

const scratch = `stakeline_migrate_${process.pid}`;
const target = Object.assign(new URL(process.env.DATABASE_URL!), { pathname: `/${scratch}` }).toString();
const journal = JSON.parse(readFileSync('drizzle/meta/_journal.json', 'utf8')) as { entries: { tag: string }[] };

afterAll(async () => {
	await client.unsafe(`drop database if exists ${scratch} with (force)`);
	await client.end();
});

function migrate(): Promise<{ code: number | null; output: string }> {
	return new Promise((resolve) => {
		const child = spawn(process.execPath, ['scripts/migrate.mjs'], { env: { ...process.env, DATABASE_URL: target } });
		let output = '';
		child.stdout.on('data', (d) => (output += d));
		child.stderr.on('data', (d) => (output += d));
		child.on('exit', (code) => resolve({ code, output }));
	});
}

it('two migrate runs started together on an empty database both succeed and apply each migration once', async () => {
	await client.unsafe(`drop database if exists ${scratch} with (force)`);
	await client.unsafe(`create database ${scratch}`);
	const runs = await Promise.all([migrate(), migrate()]);
	for (const r of runs) expect(r, r.output).toMatchObject({ code: 0 });
	const sql = postgres(target, { onnotice: () => {} });
	try {
		const rows = await sql<{ hash: string; n: number }[]>`select hash, count(*)::int as n from drizzle.__drizzle_migrations group by hash`;
		expect(rows.length).toBe(journal.entries.length);
		expect(rows.every((r) => r.n === 1)).toBe(true);
		// The schema really is there, once: the newest migration's tables answer.
		const [{ users }] = await sql<{ users: number }[]>`select count(*)::int as users from "user"`;
		expect(users).toBe(0);
		// A third run later (the next release's step with nothing new) changes nothing.
		expect((await migrate()).code).toBe(0);
		const [{ total }] = await sql<{ total: number }[]>`select count(*)::int as total from drizzle.__drizzle_migrations`;
		expect(total).toBe(journal.entries.length);
	} finally {
		await sql.end();
	}
}, 120_000);
