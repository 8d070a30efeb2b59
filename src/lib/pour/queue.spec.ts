import { beforeEach, describe, expect, it } from 'vitest';
import { futureTempMessage, type PourRecord } from '$lib/plan/pour-log';
import { addRecord, readSaved, sendQueued } from './queue';

// localStorage as the browser has it, for node.
const store = new Map<string, string>();
Object.assign(globalThis, {
	localStorage: { getItem: (k: string) => store.get(k) ?? null, setItem: (k: string, v: string) => void store.set(k, v) }
});

const plan = '00000000-0000-4000-8000-000000000001';
const batch = (i: number): PourRecord => ({ kind: 'batch', key: `batch-key-${i}`, at: 1_800_000_000_000 + i, tz: 0, pour: 0 });

/** A server that stores each key once and counts what it stored. */
function server() {
	const held = new Set<string>();
	let down = false;
	const fetcher = (async (_url: string, init?: RequestInit) => {
		if (down) throw new TypeError('Failed to fetch');
		const { records } = JSON.parse(String(init!.body)) as { records: PourRecord[] };
		for (const r of records) held.add(r.key);
		return new Response(JSON.stringify({ keys: records.map((r) => r.key) }), { status: 200 });
	}) as typeof fetch;
	return { held, fetcher, setDown: (d: boolean) => (down = d) };
}

beforeEach(() => store.clear());

describe('the device queue', () => {
	it('keeps records while offline and sends each once when back', async () => {
		const s = server();
		s.setDown(true);
		addRecord(plan, batch(1));
		addRecord(plan, batch(2));
		addRecord(plan, batch(2)); // the same record twice (a double tap on a slow page) is one
		expect(await sendQueued(plan, s.fetcher)).toBe('offline');
		expect(readSaved(plan).pending).toEqual(['batch-key-1', 'batch-key-2']);
		s.setDown(false);
		expect(await sendQueued(plan, s.fetcher)).toBe('sent');
		expect(readSaved(plan).pending).toEqual([]);
		expect([...s.held]).toEqual(['batch-key-1', 'batch-key-2']);
		expect(await sendQueued(plan, s.fetcher)).toBe('nothing');
	});

	it('sends in chunks of at most 50 records', async () => {
		const sizes: number[] = [];
		const fetcher = (async (_u: string, init?: RequestInit) => {
			const { records } = JSON.parse(String(init!.body)) as { records: PourRecord[] };
			sizes.push(records.length);
			return new Response(JSON.stringify({ keys: records.map((r) => r.key) }), { status: 200 });
		}) as typeof fetch;
		for (let i = 0; i < 120; i++) addRecord(plan, batch(i));
		expect(await sendQueued(plan, fetcher)).toBe('sent');
		expect(sizes).toEqual([50, 50, 20]);
	});

	it('sets a refused batch aside with the server’s reason, and keeps it on a 5xx', async () => {
		addRecord(plan, batch(1));
		const answer = (status: number) =>
			(async () =>
				new Response(JSON.stringify({ errors: [{ path: 'records', message: 'A plan’s pour log can hold at most 2000 records.' }] }), {
					status
				})) as typeof fetch;
		expect(await sendQueued(plan, answer(503))).toBe('offline');
		expect(readSaved(plan).pending).toEqual(['batch-key-1']);
		expect(await sendQueued(plan, answer(413))).toBe('refused');
		expect(readSaved(plan).pending).toEqual([]);
		expect(readSaved(plan).refused).toEqual([{ key: 'batch-key-1', message: 'A plan’s pour log can hold at most 2000 records.' }]);
	});

	it('sets aside only the records a refusal names, and sends the rest again', async () => {
		// The server's answer to a temperature its own clock puts in the future: `records.<i>.date`
		// (src/routes/(app)/plans/[id=uuid]/pour/records/+server.ts, futureTemp).
		const late = futureTempMessage('2027-06-01');
		const held: string[] = [];
		const sent: string[][] = [];
		const fetcher = (async (_u: string, init?: RequestInit) => {
			const { records } = JSON.parse(String(init!.body)) as { records: PourRecord[] };
			sent.push(records.map((r) => r.key));
			const bad = records.findIndex((r) => r.key === 'batch-key-2' || r.key === 'batch-key-4');
			if (bad >= 0) return new Response(JSON.stringify({ errors: [{ path: `records.${bad}.date`, message: late }] }), { status: 400 });
			held.push(...records.map((r) => r.key));
			return new Response(JSON.stringify({ keys: records.map((r) => r.key) }), { status: 200 });
		}) as typeof fetch;
		for (let i = 1; i <= 5; i++) addRecord(plan, batch(i));
		expect(await sendQueued(plan, fetcher)).toBe('refused');
		expect(held).toEqual(['batch-key-1', 'batch-key-3', 'batch-key-5']);
		expect(sent).toHaveLength(3);
		expect(readSaved(plan).pending).toEqual([]);
		expect(readSaved(plan).refused).toEqual([
			{ key: 'batch-key-2', message: late },
			{ key: 'batch-key-4', message: late }
		]);
	});

	it('sets the whole batch aside when a refusal names no record, or one the batch does not have', async () => {
		for (let i = 1; i <= 2; i++) addRecord(plan, batch(i));
		const answer = (path: string) => (async () => new Response(JSON.stringify({ errors: [{ path, message: 'Refused.' }] }), { status: 400 })) as typeof fetch;
		expect(await sendQueued(plan, answer('records.7.date'))).toBe('refused');
		expect(readSaved(plan).refused.map((r) => r.key)).toEqual(['batch-key-1', 'batch-key-2']);
		expect(readSaved(plan).pending).toEqual([]);
	});
});

/**
 * The queue as a table: its state (nothing pending, or records A and B pending) against each answer
 * the server or the network can give. Each answer is a function of what was sent, so a resend after
 * a partial refusal meets the same server. Every row: what sendQueued says, and where A and B end up.
 */
describe('the device queue, every state against every answer', () => {
	type Sent = PourRecord[];
	const reply = (status: number, body: unknown) => new Response(JSON.stringify(body), { status });
	const refuseB = (records: Sent, path: (i: number) => string) => {
		const i = records.findIndex((r) => r.key === 'batch-key-2');
		return i < 0 ? reply(200, { keys: records.map((r) => r.key) }) : reply(400, { errors: [{ path: path(i), message: 'B refused.' }] });
	};
	const answers: Record<string, (records: Sent) => Response | never> = {
		'stores all': (records) => reply(200, { keys: records.map((r) => r.key) }),
		'network down': () => {
			throw new TypeError('Failed to fetch');
		},
		'503': () => reply(503, {}),
		'401': () => reply(401, {}),
		'403': () => reply(403, {}),
		'400 naming B': (records) => refuseB(records, (i) => `records.${i}.date`),
		'400 naming B whole': (records) => refuseB(records, (i) => `records.${i}`),
		'400 naming a record not sent': () => reply(400, { errors: [{ path: 'records.9.date', message: 'Refused.' }] }),
		'400 naming none': () => reply(400, { errors: [{ path: 'records', message: 'Refused.' }] }),
		'404 plan gone': () => reply(404, { errors: [{ path: '', message: 'No such plan.' }] }),
		'413 log full': () => reply(413, { errors: [{ path: 'records', message: 'Full.' }] })
	};
	type End = { result: string; pending: string[]; refused: string[] };
	const A = 'batch-key-1';
	const B = 'batch-key-2';
	const unchanged = (result: string): End => ({ result, pending: [A, B], refused: [] });
	const allAside: End = { result: 'refused', pending: [], refused: [A, B] };
	const table: Record<'nothing pending' | 'A and B pending', Record<keyof typeof answers, End>> = {
		'nothing pending': Object.fromEntries(Object.keys(answers).map((k) => [k, { result: 'nothing', pending: [], refused: [] }])) as Record<string, End>,
		'A and B pending': {
			'stores all': { result: 'sent', pending: [], refused: [] },
			'network down': unchanged('offline'),
			'503': unchanged('offline'),
			'401': unchanged('signed-out'),
			'403': unchanged('signed-out'),
			'400 naming B': { result: 'refused', pending: [], refused: [B] },
			'400 naming B whole': { result: 'refused', pending: [], refused: [B] },
			'400 naming a record not sent': allAside,
			'400 naming none': allAside,
			'404 plan gone': allAside,
			'413 log full': allAside
		}
	};

	it('has a row for every state and every answer', () => {
		for (const row of Object.values(table)) expect(Object.keys(row).sort()).toEqual(Object.keys(answers).sort());
	});

	for (const [state, row] of Object.entries(table))
		for (const [answer, end] of Object.entries(row))
			it(`${state}, server answers ${answer}: ${end.result}`, async () => {
				if (state === 'A and B pending') [1, 2].forEach((i) => addRecord(plan, batch(i)));
				let calls = 0;
				const fetcher = (async (_u: string, init?: RequestInit) => {
					calls++;
					return answers[answer]((JSON.parse(String(init!.body)) as { records: Sent }).records);
				}) as typeof fetch;
				expect(await sendQueued(plan, fetcher)).toBe(end.result);
				const saved = readSaved(plan);
				expect(saved.pending).toEqual(end.pending);
				expect(saved.refused.map((r) => r.key)).toEqual(end.refused);
				if (state === 'nothing pending') expect(calls).toBe(0);
			});
});
