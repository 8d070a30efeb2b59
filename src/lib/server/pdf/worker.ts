// Runs in a worker thread of the PDF pool (pool.ts): drawing a plan is CPU work that must not
// block the server's event loop, and a thread can be stopped when it exceeds its time or memory.
import { planPdf } from './planPdf';

export default function render(plan: Parameters<typeof planPdf>[0]): Promise<Uint8Array> {
	return planPdf(plan);
}

/**
 * Where this module ended up: pool.ts imports it dynamically, so the build keeps it as its own
 * chunk with its export names, and the threads load that compiled file (or this .ts through tsx).
 */
export const workerUrl = import.meta.url;
