import type { Runner } from 'graphile-worker';

/** The job workers started in this process (one in an app server; tests may start two). */
export const running = new Set<Runner>();

/** Stops this process's workers once the jobs they are running finish. */
export async function stopLocalWorkers(): Promise<void> {
	const all = [...running];
	running.clear();
	await Promise.allSettled(all.map((r) => r.stop()));
}
