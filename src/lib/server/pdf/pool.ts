import Piscina from 'piscina';
import type { planPdf } from './planPdf';

/** Why a PDF was not drawn; the route answers with `status` and this message. */
export class PdfRefused extends Error {
	constructor(
		message: string,
		readonly status: 413 | 503
	) {
		super(message);
	}
}

export interface PoolLimits {
	/** Wall time one render may take before its thread is stopped. */
	timeoutMs: number;
	/** V8 heap cap of each worker thread (old generation), in MB. */
	heapMb: number;
	threads: number;
	/** Renders waiting for a thread; more are refused with 503 rather than queued without end. */
	queue: number;
}

export const PDF_LIMITS: PoolLimits = { timeoutMs: 10_000, heapMb: 256, threads: 2, queue: 16 };

/** A pool of worker threads running `filename`'s default export under `limits`. */
export function createPool<In, Out>(filename: string, limits: PoolLimits) {
	const pool = new Piscina({
		filename,
		minThreads: 0,
		maxThreads: limits.threads,
		idleTimeout: 30_000,
		resourceLimits: { maxOldGenerationSizeMb: limits.heapMb, maxYoungGenerationSizeMb: 32 },
		// In dev and tests the worker is TypeScript; tsx compiles it (the build gives plain JS).
		execArgv: /\.ts$/.test(filename) ? ['--import', 'tsx'] : []
	});
	const seconds = Math.round(limits.timeoutMs / 1000);
	// Tasks running or waiting in this process; a thread pool is local, so the count is too.
	let inFlight = 0;
	async function run(input: In): Promise<Out> {
		if (inFlight >= limits.threads + limits.queue) throw new PdfRefused('Too many PDFs are being drawn right now; try again in a few seconds.', 503);
		inFlight++;
		const signal = AbortSignal.timeout(limits.timeoutMs);
		try {
			return (await pool.run(input, { signal })) as Out;
		} catch (err) {
			if (signal.aborted)
				throw new PdfRefused(`This plan took over ${seconds} s to draw as a PDF; make it smaller (fewer pours or corners) and try again.`, 413);
			const code = (err as { code?: string }).code;
			if (code === 'ERR_WORKER_OUT_OF_MEMORY')
				throw new PdfRefused(`This plan needs more than ${limits.heapMb} MB to draw as a PDF; make it smaller and try again.`, 413);
			throw err;
		} finally {
			inFlight--;
		}
	}
	return { run, close: () => pool.close({ force: true }) };
}

type PdfInput = Parameters<typeof planPdf>[0];
let shared: Promise<ReturnType<typeof createPool<PdfInput, Uint8Array>>> | undefined;

/** The plan PDF, drawn in the shared pool off the main event loop. */
export async function renderPlanPdf(plan: PdfInput): Promise<Uint8Array> {
	shared ??= import('./worker').then((worker) => {
		// Naming the export keeps the build from dropping it: the threads call it, this thread does not.
		if (typeof worker.default !== 'function') throw new Error('The PDF worker has no renderer.');
		return createPool<PdfInput, Uint8Array>(worker.workerUrl, PDF_LIMITS);
	});
	return (await shared).run(plan);
}
