import { describe, expect, it } from 'vitest';
import { memoryStore, newPhotoKey, refusalText, refuseToQueue, sendPhotos, type Answer, type Poster, type QueuedPhoto } from './photo-queue';

const plan = '00000000-0000-4000-8000-000000000001';
const MB = 1024 * 1024;
const photo = (i: number, o: Partial<QueuedPhoto> = {}): QueuedPhoto => ({
	key: `photo-key-${i}`,
	planId: plan,
	at: 1_800_000_000_000 + i,
	name: `pour-${i}.jpg`,
	size: 2 * MB,
	file: new Blob([`photo ${i}`], { type: 'image/jpeg' }),
	...o
});

/**
 * A server that stores each key once, like the upload route, and can be cut off, lose its answer
 * after storing, or refuse a named photo with a message.
 */
function server() {
	const held = new Map<string, string>();
	const keysSeen: string[] = [];
	const s: { held: typeof held; keysSeen: string[]; down: boolean; loseAnswer: boolean; status: number; refuse: Map<string, Answer>; post: Poster } = {
		held,
		keysSeen,
		down: false,
		loseAnswer: false,
		status: 0,
		refuse: new Map<string, Answer>(),
		post: async (url, p) => {
			expect(url).toBe(`/plans/${plan}/photos`);
			if (s.down) throw new Error('network');
			keysSeen.push(p.key);
			if (s.status) return { status: s.status, body: {} };
			const refusal = s.refuse.get(p.name);
			if (refusal) return refusal;
			const replay = held.has(p.key);
			if (!replay) held.set(p.key, p.name);
			if (s.loseAnswer) {
				s.loseAnswer = false;
				throw new Error('network');
			}
			return { status: replay ? 200 : 201, body: { photo: { id: `id-${p.key}`, name: p.name } } };
		}
	};
	return s;
}

describe('the photo queue on the device', () => {
	it('keeps photos while offline and sends each once, oldest first, when back', async () => {
		const store = memoryStore();
		const s = server();
		await store.put(photo(2));
		await store.put(photo(1));
		s.down = true;
		expect(await sendPhotos(plan, store, s.post)).toBe('offline');
		expect((await store.list(plan)).map((p) => p.key)).toEqual(['photo-key-1', 'photo-key-2']);
		s.down = false;
		const sent: string[] = [];
		expect(await sendPhotos(plan, store, s.post, { sent: (p, stored) => sent.push(`${p.name}→${stored?.id}`) })).toBe('done');
		expect(sent).toEqual(['pour-1.jpg→id-photo-key-1', 'pour-2.jpg→id-photo-key-2']);
		expect([...s.held.keys()]).toEqual(['photo-key-1', 'photo-key-2']);
		expect(await store.list(plan)).toEqual([]);
	});

	it('sends a photo again under the same key when the answer was lost, and the server keeps one', async () => {
		const store = memoryStore();
		const s = server();
		await store.put(photo(1));
		s.loseAnswer = true;
		expect(await sendPhotos(plan, store, s.post)).toBe('offline');
		expect(await store.list(plan)).toHaveLength(1); // still waiting: the phone never heard back
		expect(await sendPhotos(plan, store, s.post)).toBe('done');
		expect(s.keysSeen).toEqual(['photo-key-1', 'photo-key-1']);
		expect(s.held.size).toBe(1);
		expect(await store.list(plan)).toEqual([]);
	});

	it('keeps the queue on a failing server or a lost session, and sends it later', async () => {
		const store = memoryStore();
		const s = server();
		await store.put(photo(1));
		for (const [status, result] of [
			[503, 'offline'],
			[500, 'offline'],
			[429, 'offline'],
			[408, 'offline'],
			[401, 'signed-out'],
			[403, 'signed-out']
		] as const) {
			s.status = status;
			expect(await sendPhotos(plan, store, s.post)).toBe(result);
			expect((await store.list(plan)).map((p) => [p.key, p.refused])).toEqual([['photo-key-1', undefined]]);
		}
		s.status = 0;
		expect(await sendPhotos(plan, store, s.post)).toBe('done');
		expect(s.held.size).toBe(1);
	});

	it('drops a refused photo from the queue, keeps the reason with its name, and sends the rest', async () => {
		const store = memoryStore();
		const s = server();
		s.refuse.set('pour-2.jpg', { status: 400, body: { message: 'A plan holds at most 20 photos.' } });
		s.refuse.set('pour-3.jpg', { status: 413, body: {} });
		for (const i of [1, 2, 3, 4]) await store.put(photo(i));
		const refused: string[] = [];
		expect(await sendPhotos(plan, store, s.post, { refused: (p) => refused.push(refusalText(p)) })).toBe('done');
		expect(refused).toEqual(['“pour-2.jpg” was not sent: A plan holds at most 20 photos.', '“pour-3.jpg” was not sent: the server answered 413.']);
		expect([...s.held.values()]).toEqual(['pour-1.jpg', 'pour-4.jpg']);
		const left = await store.list(plan);
		expect(left.map((p) => [p.name, p.file, p.refused])).toEqual([
			['pour-2.jpg', undefined, 'A plan holds at most 20 photos.'],
			['pour-3.jpg', undefined, 'the server answered 413.']
		]);
		// Nothing refused is sent again.
		s.keysSeen.length = 0;
		expect(await sendPhotos(plan, store, s.post)).toBe('done');
		expect(s.keysSeen).toEqual([]);
	});

	it('runs once per plan at a time, and a photo added during a run is sent by it', async () => {
		const store = memoryStore();
		const s = server();
		await store.put(photo(1));
		let release!: () => void;
		const gate = new Promise<void>((r) => (release = r));
		const slow: Poster = async (url, p, progress) => {
			await gate;
			return s.post(url, p, progress);
		};
		const first = sendPhotos(plan, store, slow);
		await store.put(photo(2));
		const second = sendPhotos(plan, store, slow);
		expect(second).toBe(first);
		release();
		expect(await first).toBe('done');
		expect(s.keysSeen).toEqual(['photo-key-1', 'photo-key-2']);
		// Another plan's queue is its own.
		const other = '00000000-0000-4000-8000-000000000002';
		await store.put({ ...photo(3), planId: other });
		expect(await sendPhotos(plan, store, s.post)).toBe('done');
		expect((await store.list(other)).map((p) => p.key)).toEqual(['photo-key-3']);
	});
});

describe('what is kept to send', () => {
	const jpeg = { name: 'slab.jpg', size: 3 * MB, type: 'image/jpeg' };
	it('follows the upload rules and the plan’s room, naming the limit', () => {
		expect(refuseToQueue(jpeg, 0, 0)).toBeNull();
		expect(refuseToQueue(jpeg, 19, 0)).toBeNull();
		expect(refuseToQueue(jpeg, 20, 0)).toBe('“slab.jpg” was not added: a plan holds at most 20 photos, and this one has 20.');
		expect(refuseToQueue(jpeg, 17, 3)).toBe('“slab.jpg” was not added: a plan holds at most 20 photos, and this one has 17 with 3 more waiting to send.');
		expect(refuseToQueue({ ...jpeg, size: 13 * MB }, 0, 0)).toBe('The photo “slab.jpg” is 13 MB; the limit is 12 MB. Please choose a smaller file.');
		expect(refuseToQueue({ name: 'plan.pdf', size: MB, type: 'application/pdf' }, 0, 0)).toBe(
			'The photo must be a JPEG, a PNG, or a WebP image; “plan.pdf” is not.'
		);
	});

	it('keys each photo within the server’s key rule', () => {
		const keys = new Set(Array.from({ length: 50 }, newPhotoKey));
		expect(keys.size).toBe(50);
		for (const k of keys) expect(k).toMatch(/^[A-Za-z0-9_.:-]{8,100}$/);
	});
});
