// npm run db:backup / db:restore: a dump of the test database restored into a scratch database
// holds the same rows.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import postgres from 'postgres';
import { afterAll, expect, it } from 'vitest';
import { client } from './db';

const scratch = `stakeline_restore_${process.pid}`;
const dir = mkdtempSync(path.join(tmpdir(), 'stakeline-backup-'));
const source = process.env.DATABASE_URL!;
const target = Object.assign(new URL(source), { pathname: `/${scratch}` }).toString();

/**
 * Drops the scratch database. FORCE ends our own connections to it, but not an autovacuum worker
 * that has just opened the new database (that needs a superuser): then wait and try again.
 */
async function dropScratch() {
	for (let attempt = 1; ; attempt++) {
		try {
			await client.unsafe(`drop database if exists ${scratch} with (force)`);
			return;
		} catch (err) {
			if (attempt >= 20 || !/must be a member of the role|is being accessed by other users/.test(String(err))) throw err;
			await new Promise((r) => setTimeout(r, 250));
		}
	}
}

afterAll(async () => {
	await dropScratch();
	await client.end();
	rmSync(dir, { recursive: true, force: true });
});

const db = (url: string, ...args: string[]) =>
	execFileSync(process.execPath, ['scripts/db.mjs', ...args], { env: { ...process.env, DATABASE_URL: url }, encoding: 'utf8' });

/** Each table's row count and a digest of its rows in key order. */
async function fingerprint(sql: postgres.Sql) {
	const tables = ['user', 'plan', 'contractor_profile', 'lead', 'bid', 'message', 'audit_event'];
	const out: Record<string, string> = {};
	for (const t of tables) {
		const exists = await sql`select to_regclass(${`public."${t}"`}) as r`;
		if (!exists[0].r) continue;
		const [row] = await sql.unsafe(`select count(*)::int as n, md5(coalesce(string_agg(x::text, '|' order by x::text), '')) as h from "${t}" x`);
		out[t] = `${row.n}:${row.h}`;
	}
	return out;
}

it('restores a backup into a scratch database with the same rows', async () => {
	const file = path.join(dir, 'test.dump');
	db(source, 'backup', file);
	await dropScratch();
	await client.unsafe(`create database ${scratch}`);
	db(target, 'restore', file);
	const restored = postgres(target, { onnotice: () => {} });
	try {
		const [want, got] = [await fingerprint(client), await fingerprint(restored)];
		expect(Object.keys(want).length).toBeGreaterThan(3);
		expect(Number(want.user.split(':')[0])).toBeGreaterThan(0);
		expect(got).toEqual(want);
	} finally {
		await restored.end();
	}
}, 60_000);
