/**
 * Runs `fn` once the browser has a quiet moment (at the latest after `timeout` ms), so work nobody
 * waits for stays out of the task that draws the page. Returns a cancel, for an effect's cleanup.
 * Browsers without `requestIdleCallback` (Safari) run it on a short timer instead.
 */
export function whenIdle(fn: () => void, timeout = 2000): () => void {
	if (typeof requestIdleCallback === 'function') {
		const id = requestIdleCallback(fn, { timeout });
		return () => cancelIdleCallback(id);
	}
	const id = setTimeout(fn, 200);
	return () => clearTimeout(id);
}
