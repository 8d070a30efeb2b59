// What every integration spec (`*.integration.spec.ts`) shares: the test database's connection is
// closed after the file, once the mail it queued has been handed over, and, when asked, the job
// worker an app server runs is started in the test process so queued mail is really sent.
import { afterAll, beforeAll } from 'vitest';
import { client } from './db';
import { mailIdle } from './mail';

export function useTestDatabase({ worker = false }: { worker?: boolean } = {}) {
	if (worker)
		beforeAll(async () => {
			const { startWorker } = await import('./jobs');
			await startWorker({ origin: 'http://stakeline.test', cron: false });
		});
	// Registered first, so it runs after each file's own afterAll (Vitest runs them as a stack).
	afterAll(async () => {
		await mailIdle();
		await client.end();
	});
}

/** An address no other test run has used: `label-<uuid>@it.stakeline.test`. */
export const uniqueEmail = (label: string) => `${label}-${crypto.randomUUID()}@it.stakeline.test`;
