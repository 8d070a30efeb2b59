// Faults and retries on the real PostgreSQL test database: fast 503s, idempotent creates, the log.
import { Writable } from 'node:stream';
import postgres from 'postgres';
import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { client, databaseUnavailable, db } from './db';
import { plan } from './db/schema';
import { createPlanOnce } from './idempotency';
import { createLogger, safePath } from './log';
import { requestHandle, serverErrorHandler, UNAVAILABLE } from './requests';
import { createUser } from './users';
import { useTestDatabase } from './integration-setup';
import { smallPatio } from '$lib/plan/test-plans';

useTestDatabase();

const input = smallPatio();
const owner = () => createUser({ name: 'Retry Owner', email: `retry-${crypto.randomUUID()}@it.stakeline.test`, password: 'retry-password', role: 'homeowner' });

function capture() {
	const lines: Record<string, unknown>[] = [];
	const dest = new Writable({
		write(chunk, _enc, done) {
			for (const l of String(chunk).split('\n').filter(Boolean)) lines.push(JSON.parse(l));
			done();
		}
	});
	return { logger: createLogger(dest), lines };
}

function fakeEvent(url: string, accept = 'application/json') {
	const request = new Request(url, { headers: { accept } });
	return { request, url: new URL(url), route: { id: '/api/plans' }, locals: { user: null } } as never;
}

describe('database faults', () => {
	it('a refused connection is recognised as the database being down', async () => {
		// Port 1 on loopback: nothing listens, the connect is refused at once.
		const dead = postgres('postgres://x:y@127.0.0.1:1/none', { connect_timeout: 2, max: 1 });
		const err = await dead`select 1`.catch((e) => e);
		await dead.end();
		expect(databaseUnavailable(err)).toBe(true);
		expect(databaseUnavailable(new Error('ordinary bug'))).toBe(false);
		expect(databaseUnavailable(Object.assign(new Error('unique'), { code: '23505' }))).toBe(false);
	});

	it('every connection carries a statement timeout, so a stuck query cannot hold a request', async () => {
		const [row] = await client`show statement_timeout`;
		expect(row.statement_timeout).toBe('10s');
	});

	it('a hook that fails because the database is down answers 503 JSON with Retry-After, logged once', async () => {
		const { logger, lines } = capture();
		const down = Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:5432'), { code: 'ECONNREFUSED' });
		const res = await requestHandle(logger)({ event: fakeEvent('http://x/api/plans?token=abc'), resolve: () => Promise.reject(down) });
		expect(res.status).toBe(503);
		expect(res.headers.get('retry-after')).toBe('5');
		expect((await res.json()).message).toBe(UNAVAILABLE);
		const reqLines = lines.filter((l) => 'status' in l);
		expect(reqLines).toHaveLength(1);
		expect(reqLines[0]).toMatchObject({ status: 503, method: 'GET', path: '/api/plans' });
		expect(typeof reqLines[0].requestId).toBe('string');
		expect(res.headers.get('x-request-id')).toBe(reqLines[0].requestId);
	});

	it('a page whose load failed on the database keeps its error page but is sent as 503', async () => {
		const { logger } = capture();
		const event = fakeEvent('http://x/plans', 'text/html');
		const down = Object.assign(new Error('terminating connection due to administrator command'), { code: '57P01' });
		const res = await requestHandle(logger)({
			event,
			resolve: async () => {
				serverErrorHandler(logger)({ error: down, event, status: 500, message: 'Internal Error' });
				return new Response('<p>error page</p>', { status: 500, headers: { 'content-type': 'text/html' } });
			}
		});
		expect(res.status).toBe(503);
		expect(res.headers.get('retry-after')).toBe('5');
		expect(await res.text()).toContain('error page');
	});
});

describe('log lines', () => {
	it('carry no secrets, tokens, links or query strings', () => {
		const { logger, lines } = capture();
		logger.info({ password: 'hunter2-secret', body: { token: 'tok-secret', link: 'https://x/reset?token=tok-secret' }, url: 'https://x/?q=1' });
		const text = JSON.stringify(lines);
		expect(text).not.toMatch(/hunter2|tok-secret|q=1/);
		expect(text).toContain('[redacted]');
		expect(safePath(new URL('http://x/verify-email/ABCDEFGHIJKLMNOPQRSTUVWXYZ234567?token=zzz'))).toBe('/verify-email/[redacted]');
		expect(safePath(new URL('http://x/plans/72485377-8348-43a8-b841-791feb0a809c'))).toBe('/plans/72485377-8348-43a8-b841-791feb0a809c');
	});

	it('never include a failed query parameters', () => {
		const { logger, lines } = capture();
		const err = new Error('Failed query: insert into "user" values ($1, $2)\nparams: a@b.example,$argon2id$v=19$secret-hash', {
			cause: Object.assign(new Error('null character not permitted'), { code: '22021' })
		});
		serverErrorHandler(logger)({ error: err, event: fakeEvent('http://x/signup'), status: 500, message: 'Internal Error' });
		const text = JSON.stringify(lines);
		expect(text).not.toMatch(/argon2id|a@b\.example/);
		expect(text).toContain('22021');
	});
});

describe('the error hook', () => {
	it('logs an address nothing answers as info with its path, and a failure as an error', () => {
		const { logger, lines } = capture();
		logger.level = 'info'; // whatever LOG_LEVEL this run has
		const missing = serverErrorHandler(logger)({
			error: new Error('Not found: /favicon.ico'),
			event: fakeEvent('http://x/favicon.ico'),
			status: 404,
			message: 'Not Found'
		});
		expect(missing).toMatchObject({ message: 'Not Found' });
		const broke = serverErrorHandler(logger)({ error: new Error('boom'), event: fakeEvent('http://x/plans'), status: 500, message: 'Internal Error' });
		expect(broke).toMatchObject({ message: 'Something broke on our side.' });
		// pino levels: 30 info, 50 error.
		expect(lines.map((l) => [l.level, l.msg, l.path ?? null])).toEqual([
			[30, 'not found', '/favicon.ico'],
			[50, 'unexpected error', null]
		]);
	});
});

describe('idempotent plan create', () => {
	it('ten parallel retries with one key make one plan and all get it back', async () => {
		const me = await owner();
		const key = `key-${crypto.randomUUID()}`;
		const answers = await Promise.all(Array.from({ length: 10 }, () => createPlanOnce(me.id, key, { name: 'Retried', input })));
		expect(new Set(answers.map((a) => a.plan.id)).size).toBe(1);
		expect(answers.filter((a) => !a.replayed)).toHaveLength(1);
		expect(await db.select().from(plan).where(eq(plan.ownerId, me.id))).toHaveLength(1);
		// Another key is another plan.
		await createPlanOnce(me.id, `key-${crypto.randomUUID()}`, { name: 'Second', input });
		expect(await db.select().from(plan).where(eq(plan.ownerId, me.id))).toHaveLength(2);
	});

	it('the same key from another owner is not theirs to replay', async () => {
		const [a, b] = [await owner(), await owner()];
		const key = `shared-${crypto.randomUUID()}`;
		const first = await createPlanOnce(a.id, key, { name: 'A', input });
		const second = await createPlanOnce(b.id, key, { name: 'B', input });
		expect(second.plan.id).not.toBe(first.plan.id);
		expect(second.plan.ownerId).toBe(b.id);
	});
});
