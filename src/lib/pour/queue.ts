// The pour page's records on the device: every record made here is kept in localStorage (so the
// count survives a reload, a locked screen or a dead signal) and queued until the server has
// acknowledged its key. Sending is safe to repeat: the server stores each key once.

import { POUR_LOG_LIMITS, type PourRecord } from '$lib/plan/pour-log';

interface Saved {
	records: PourRecord[];
	/** Keys not yet acknowledged by the server. */
	pending: string[];
	/** Records the server refused, with its reason, so nothing is dropped silently. */
	refused: { key: string; message: string }[];
}

const storageKey = (planId: string) => `stakeline:pour:${planId}`;

export function readSaved(planId: string): Saved {
	try {
		const raw = localStorage.getItem(storageKey(planId));
		if (raw) {
			const s = JSON.parse(raw) as Partial<Saved>;
			return { records: s.records ?? [], pending: s.pending ?? [], refused: s.refused ?? [] };
		}
	} catch {
		// A private window or a full store: work from memory for this visit.
	}
	return { records: [], pending: [], refused: [] };
}

function write(planId: string, s: Saved) {
	try {
		localStorage.setItem(storageKey(planId), JSON.stringify(s));
	} catch {
		// As above; the queue still sends while the page is open.
	}
}

/** A key no other device or tab will make: random, with the time for readability. */
export function newKey(): string {
	return `${Date.now().toString(36)}-${crypto.randomUUID()}`;
}

export function addRecord(planId: string, r: PourRecord): Saved {
	const s = readSaved(planId);
	if (!s.records.some((x) => x.key === r.key)) {
		s.records.push(r);
		s.pending.push(r.key);
	}
	write(planId, s);
	return s;
}

/** Records acknowledged by the server are kept only until the server's own list holds them. */
export function forgetKnown(planId: string, serverKeys: Set<string>): Saved {
	const s = readSaved(planId);
	s.records = s.records.filter((r) => !serverKeys.has(r.key) || s.pending.includes(r.key));
	write(planId, s);
	return s;
}

export type SendResult = 'sent' | 'nothing' | 'offline' | 'refused' | 'signed-out';

let sending: Promise<SendResult> | null = null;

/** Sends what is queued, in chunks the server accepts; one send at a time per page. */
export function sendQueued(planId: string, fetcher: typeof fetch = fetch): Promise<SendResult> {
	if (sending) return sending;
	const run = drain(planId, fetcher);
	sending = run;
	// Cleared only after the assignment above, even when the queue was empty and drain ended at once.
	void run.finally(() => {
		if (sending === run) sending = null;
	});
	return run;
}

async function drain(planId: string, fetcher: typeof fetch): Promise<SendResult> {
	let result: SendResult = 'nothing';
	let refusedSome = false;
	for (;;) {
		const s = readSaved(planId);
		const batch = s.pending.flatMap((k) => s.records.filter((r) => r.key === k)).slice(0, POUR_LOG_LIMITS.perRequest);
		if (!batch.length) return refusedSome ? 'refused' : result;
		let res: Response;
		try {
			res = await fetcher(`/plans/${planId}/pour/records`, {
				method: 'POST',
				headers: { 'content-type': 'application/json' },
				body: JSON.stringify({ records: batch })
			});
		} catch {
			return 'offline';
		}
		if (res.status === 401 || res.status === 403) return 'signed-out';
		if (res.status >= 500) return 'offline';
		const body = (await res.json().catch(() => ({}))) as { keys?: string[]; errors?: { path: string; message: string }[] };
		const now = readSaved(planId);
		if (res.ok) {
			const done = new Set(body.keys ?? batch.map((r) => r.key));
			now.pending = now.pending.filter((k) => !done.has(k));
			write(planId, now);
			result = 'sent';
			continue;
		}
		// A refusal (a limit, a plan no longer there, a date the server's clock puts in the future) will
		// not change on a retry: set aside what it names, with the reason. Errors that each point at a
		// record of the batch (`records.3.date`) set aside those records only, and the rest go again.
		const errors = body.errors ?? [];
		const named = refusedRecords(errors, batch.length);
		const fallback = errors[0]?.message ?? `The server refused these records (${res.status}).`;
		const aside = named ? [...named].map(([i, message]) => ({ key: batch[i].key, message })) : batch.map((r) => ({ key: r.key, message: fallback }));
		const keys = new Set(aside.map((r) => r.key));
		now.pending = now.pending.filter((k) => !keys.has(k));
		now.refused.push(...aside);
		write(planId, now);
		if (!named) return 'refused';
		refusedSome = true;
	}
}

/** Each refused record's index in the batch and its first reason, when every error names one; else null. */
function refusedRecords(errors: readonly { path: string; message: string }[], size: number): Map<number, string> | null {
	const named = new Map<number, string>();
	for (const e of errors) {
		const at = /^records\.(\d+)(?:\.|$)/.exec(e.path);
		if (!at || Number(at[1]) >= size) return null;
		if (!named.has(Number(at[1]))) named.set(Number(at[1]), e.message);
	}
	return named.size ? named : null;
}
