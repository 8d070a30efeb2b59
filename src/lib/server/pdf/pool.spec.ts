import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { createPool, PdfRefused } from './pool';

const hog = fileURLToPath(new URL('./fixtures/hog.mjs', import.meta.url));
const pool = createPool<string, string>(hog, { timeoutMs: 1500, heapMb: 32, threads: 1, queue: 1 });
afterAll(() => pool.close());

describe('PDF worker pool limits', () => {
	it('runs a task in a thread', async () => {
		expect(await pool.run('hello')).toBe('echo hello');
	});

	it('stops a task that runs past the time cap, with a 413 that names the limit', async () => {
		const err = await pool.run('spin').catch((e) => e);
		expect(err).toBeInstanceOf(PdfRefused);
		expect(err.status).toBe(413);
		expect(err.message).toMatch(/over 2 s/);
		// The stuck thread was replaced: the pool still answers.
		expect(await pool.run('after')).toBe('echo after');
	});

	it('stops a task that passes the memory cap', async () => {
		// A time cap far away, so on a busy machine only the memory cap can stop the task.
		const roomy = createPool<string, string>(hog, { timeoutMs: 60_000, heapMb: 32, threads: 1, queue: 1 });
		const err = await roomy.run('hoard').catch((e) => e);
		await roomy.close();
		expect(err).toBeInstanceOf(PdfRefused);
		expect(err.message).toMatch(/more than 32 MB/);
	});

	it('refuses with 503 instead of queueing without end', async () => {
		// One thread, one queue place: of four tasks at once, the last ones find no room.
		const small = createPool<string, string>(hog, { timeoutMs: 1000, heapMb: 32, threads: 1, queue: 1 });
		await small.run('warm');
		const answers = await Promise.all(['spin', 'a', 'b', 'c'].map((t) => small.run(t).catch((e) => e)));
		await small.close();
		const busy = answers.filter((a) => a instanceof PdfRefused && a.status === 503);
		expect(busy.length).toBeGreaterThan(0);
		expect(busy[0].message).toMatch(/try again/);
	});
});
