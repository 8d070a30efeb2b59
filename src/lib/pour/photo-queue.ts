// The pour page's photos on the device: each photo chosen there is kept in IndexedDB (localStorage
// holds only text, and too little of it for photos) until the server has it, so a photo taken
// without a signal survives a reload or a closed tab and is sent, oldest first, when the connection
// returns. Each carries its own Idempotency-Key: a send whose answer was lost is sent again under the
// same key, and the server stores it once.

import { createStore, del, entries, set, type UseStore } from 'idb-keyval';
import { MAX_PHOTOS_PER_PLAN, refuseFile, uploadRules } from '$lib/upload-rules';

export interface QueuedPhoto {
	/** The Idempotency-Key sent with the photo, and its key here. */
	key: string;
	planId: string;
	/** When it was chosen: the queue sends oldest first. */
	at: number;
	name: string;
	size: number;
	/** The photo; dropped once the server has refused it. */
	file?: Blob;
	/** A small copy for the list, made when it was chosen (none if the browser could not read it). */
	thumb?: Blob;
	/** The server's reason for refusing it, kept until the homeowner has read it. */
	refused?: string;
}

export interface PhotoStore {
	/** Whether what is kept outlives the page (IndexedDB), or only this visit (memory). */
	readonly lasting: boolean;
	list(planId: string): Promise<QueuedPhoto[]>;
	put(p: QueuedPhoto): Promise<void>;
	remove(p: Pick<QueuedPhoto, 'key' | 'planId'>): Promise<void>;
}

/** Kept in memory: for tests, and for a browser that refuses IndexedDB (some private windows). */
export function memoryStore(): PhotoStore {
	const held = new Map<string, QueuedPhoto>();
	return {
		lasting: false,
		list: async (planId) => [...held.values()].filter((p) => p.planId === planId).sort(byAge),
		put: async (p) => void held.set(p.key, p),
		remove: async (p) => void held.delete(p.key)
	};
}

const byAge = (a: QueuedPhoto, b: QueuedPhoto) => a.at - b.at || a.key.localeCompare(b.key);
const idbKey = (p: Pick<QueuedPhoto, 'key' | 'planId'>) => `${p.planId}/${p.key}`;

/** IndexedDB when the browser allows it (checked with one read), else memory. */
export async function openPhotoStore(): Promise<PhotoStore> {
	try {
		const db: UseStore = createStore('stakeline-photos', 'queue');
		await entries(db);
		return {
			lasting: true,
			list: async (planId) =>
				(await entries<string, QueuedPhoto>(db))
					.map(([, p]) => p)
					.filter((p) => p.planId === planId)
					.sort(byAge),
			put: (p) => set(idbKey(p), p, db),
			remove: (p) => del(idbKey(p), db)
		};
	} catch {
		return memoryStore();
	}
}

/** A key no other device or tab will make (the server's rule: 8 to 100 of A–Z a–z 0–9 _ . : -). */
export const newPhotoKey = (): string => `photo-${crypto.randomUUID()}`;

/**
 * Why this file is not kept to send, or null: the upload rules the server applies (type, size), and
 * room on the plan for it beside the photos it holds and those already waiting here.
 */
export function refuseToQueue(file: { name: string; size: number; type: string }, onPlan: number, waiting: number): string | null {
	const refused = refuseFile(file, uploadRules.photo);
	if (refused) return refused;
	if (onPlan + waiting >= MAX_PHOTOS_PER_PLAN)
		return `“${file.name}” was not added: a plan holds at most ${MAX_PHOTOS_PER_PLAN} photos, and this one has ${onPlan}${waiting ? ` with ${waiting} more waiting to send` : ''}.`;
	return null;
}

/** What the server said to one send; a network failure rejects instead. */
export type Answer = { status: number; body: { message?: string; photo?: { id: string; name: string } } };
export type Poster = (url: string, p: QueuedPhoto, progress: (fraction: number) => void) => Promise<Answer>;

export interface DrainEvents {
	sending?(p: QueuedPhoto): void;
	progress?(p: QueuedPhoto, fraction: number): void;
	sent?(p: QueuedPhoto, photo: { id: string; name: string } | undefined): void;
	refused?(p: QueuedPhoto): void;
}

/** Why a run stopped: nothing left to send, no connection (or a failing server), or no session. */
export type DrainResult = 'done' | 'offline' | 'signed-out';

/** The text shown for a refused photo: which one and why. */
export const refusalText = (p: Pick<QueuedPhoto, 'name' | 'refused'>) => `“${p.name}” was not sent: ${p.refused}`;

/** Each plan's run in progress, and whether it was asked for again while running. */
const runs = new Map<string, { run: Promise<DrainResult>; again: boolean }>();

/**
 * Sends the plan's waiting photos one at a time, oldest first; one run per plan, and a call during a
 * run makes it look again when it ends (a photo added meanwhile is not left waiting).
 */
export function sendPhotos(planId: string, store: PhotoStore, post: Poster = xhrPost, on: DrainEvents = {}): Promise<DrainResult> {
	const current = runs.get(planId);
	if (current) {
		current.again = true;
		return current.run;
	}
	const state = { run: Promise.resolve<DrainResult>('done'), again: false };
	state.run = (async () => {
		let result: DrainResult;
		do {
			state.again = false;
			result = await drain(planId, store, post, on);
		} while (state.again && result === 'done');
		return result;
	})().finally(() => runs.delete(planId));
	runs.set(planId, state);
	return state.run;
}

async function drain(planId: string, store: PhotoStore, post: Poster, on: DrainEvents): Promise<DrainResult> {
	for (;;) {
		const next = (await store.list(planId)).find((p) => p.file && !p.refused);
		if (!next) return 'done';
		on.sending?.(next);
		let answer: Answer;
		try {
			answer = await post(`/plans/${planId}/photos`, next, (f) => on.progress?.(next, f));
		} catch {
			return 'offline';
		}
		if (answer.status === 401 || answer.status === 403) return 'signed-out';
		// No answer, a busy or failing server, a timeout: the same photo goes again later, under its key.
		if (answer.status === 0 || answer.status >= 500 || answer.status === 408 || answer.status === 429) return 'offline';
		if (answer.status === 200 || answer.status === 201) {
			await store.remove(next);
			on.sent?.(next, answer.body.photo);
			continue;
		}
		// A refusal (too large, not an image, the plan full or gone) will not change on a retry: the photo
		// leaves the queue, and the reason stays until it is read.
		const refused: QueuedPhoto = { ...next, file: undefined, refused: answer.body.message ?? `the server answered ${answer.status}.` };
		await store.put(refused);
		on.refused?.(refused);
	}
}

/** The browser's send: XMLHttpRequest, the one that reports upload progress. */
export const xhrPost: Poster = (url, p, progress) =>
	new Promise((resolve, reject) => {
		const xhr = new XMLHttpRequest();
		xhr.open('POST', url);
		xhr.setRequestHeader('idempotency-key', p.key);
		xhr.upload.onprogress = (e) => e.lengthComputable && progress(e.loaded / e.total);
		xhr.onload = () => {
			let body: Answer['body'] = {};
			try {
				body = JSON.parse(xhr.responseText);
			} catch {
				// Not JSON (a proxy's error page): the status says enough.
			}
			resolve({ status: xhr.status, body });
		};
		xhr.onerror = xhr.ontimeout = xhr.onabort = () => reject(new Error('network'));
		const form = new FormData();
		form.append('photo', p.file!, p.name);
		xhr.send(form);
	});

/** A small JPEG of the photo for the list (about 160 px), so a page of waiting photos does not hold each one decoded. */
export async function thumbnail(file: Blob): Promise<Blob | undefined> {
	try {
		const bitmap = await createImageBitmap(file);
		const scale = Math.min(1, 160 / Math.max(bitmap.width, bitmap.height));
		const canvas = document.createElement('canvas');
		canvas.width = Math.max(1, Math.round(bitmap.width * scale));
		canvas.height = Math.max(1, Math.round(bitmap.height * scale));
		canvas.getContext('2d')?.drawImage(bitmap, 0, 0, canvas.width, canvas.height);
		bitmap.close();
		return await new Promise<Blob | undefined>((resolve) => canvas.toBlob((b) => resolve(b ?? undefined), 'image/jpeg', 0.7));
	} catch {
		return undefined;
	}
}
