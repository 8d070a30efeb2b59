import { untrack } from 'svelte';
import type { PlanRecord } from './types';
import { completeInput, type DraftData, type PlanDraft } from './draft.svelte';

export type SaveStatus = 'idle' | 'pending' | 'saving' | 'saved' | 'invalid' | 'offline' | 'conflict' | 'local';

const DRAFT_KEY = 'stakeline:draft';

/** The signed-out visitor's plan lives in this browser until they sign up or sign in. */
export const localDraft = {
	read(): DraftData | null {
		try {
			const raw = localStorage.getItem(DRAFT_KEY);
			return raw ? (JSON.parse(raw) as DraftData) : null;
		} catch {
			return null;
		}
	},
	/** False when the browser would not keep it (storage full or blocked). */
	write(d: DraftData): boolean {
		try {
			localStorage.setItem(DRAFT_KEY, JSON.stringify(d));
			return true;
		} catch {
			return false;
		}
	},
	clear() {
		localStorage.removeItem(DRAFT_KEY);
	}
};

/**
 * Watches a draft (create it during component set-up): after every change, not the first read nor
 * a change announced with `skip()`, it calls `onedit` with the draft as text and its verdict. Until
 * the engine has loaded an edit cannot be judged ('pending'); it is judged once the engine arrives.
 * The wizard keeps its undo history by it, with or without a saver.
 */
export class DraftWatch {
	#draft: PlanDraft;
	#skip = false;
	/** The draft as text, as it is saved and compared with what was stored. */
	serialised = $derived.by(() => JSON.stringify(this.#draft.snapshot()));

	constructor(draft: PlanDraft, onedit: (now: string, verdict: 'valid' | 'invalid' | 'pending') => void) {
		this.#draft = draft;
		let first = true;
		let last = '';
		// An edit made before the engine loaded, still to be judged.
		let held = false;
		$effect(() => {
			const now = this.serialised;
			const pending = this.#draft.pending;
			const ok = this.#draft.outcome.ok;
			if (first || this.#skip) {
				first = this.#skip = false;
				last = now;
				return;
			}
			// The engine arriving is not an edit, unless one waits for it.
			if (now === last && !(held && !pending)) return;
			last = now;
			held = pending;
			// What onedit changes (the saver's status) is untracked, so it cannot re-trigger it.
			untrack(() => onedit(now, pending ? 'pending' : ok ? 'valid' : 'invalid'));
		});
	}

	/** The next change is not an edit (the draft was replaced by a stored version). */
	skip() {
		this.#skip = true;
	}
}

/**
 * Autosave for a signed-in homeowner's plan through the JSON API. Saves are debounced and
 * serialised; each carries the revision it was based on, and a 409 stops saving until the user
 * chooses to reload, so a second tab never silently overwrites the first.
 */
export class PlanSaver {
	status = $state<SaveStatus>('idle');
	id = $state<string | null>(null);
	revision = $state(0);
	conflict = $state<PlanRecord | null>(null);
	message = $state('');
	/** The plan exactly as the server last stored it (serialised); "Saved" is only said for it. */
	stored = $state<string | null>(null);

	#timer: ReturnType<typeof setTimeout> | undefined;
	#inFlight: Promise<void> | null = null;
	#again = false;
	#read: () => DraftData;
	#onCreated: (id: string) => void;

	constructor(o: { id: string | null; revision: number; read: () => DraftData; onCreated: (id: string) => void }) {
		this.id = o.id;
		this.revision = o.revision;
		this.#read = o.read;
		this.#onCreated = o.onCreated;
	}

	#watch: DraftWatch | null = null;

	/**
	 * Save the draft as it is edited (call during component set-up): every valid edit schedules a
	 * save, an invalid one shows as such; `onedit` also hears of each edit.
	 */
	watch(draft: PlanDraft, onedit?: (now: string) => void): DraftWatch {
		this.#watch = new DraftWatch(draft, (now, verdict) => {
			onedit?.(now);
			if (verdict === 'valid') this.schedule();
			else if (verdict === 'invalid') this.status = 'invalid';
		});
		return this.#watch;
	}

	/**
	 * Take a stored version into the draft (the newer one after a conflict, or the plan as a page
	 * loaded it): the draft shows it, the next save builds on its revision, and it counts as saved.
	 */
	adopt(remote: Pick<PlanRecord, 'name' | 'postcode' | 'revision' | 'input'>, draft: PlanDraft) {
		const input = completeInput(remote.input);
		if (input) draft.input = input;
		draft.name = remote.name;
		draft.postcode = remote.postcode;
		this.revision = remote.revision;
		this.conflict = null;
		this.stored = JSON.stringify(draft.snapshot());
		this.status = 'saved';
		this.#watch?.skip();
	}

	/** Call on every edit; the save goes out once typing pauses. */
	schedule(delay = 700) {
		if (this.status === 'conflict') return;
		this.status = 'pending';
		clearTimeout(this.#timer);
		this.#timer = setTimeout(() => void this.flush(), delay);
	}

	async flush(): Promise<void> {
		clearTimeout(this.#timer);
		if (this.#inFlight) {
			this.#again = true;
			return this.#inFlight;
		}
		this.#inFlight = this.#save().finally(() => (this.#inFlight = null));
		await this.#inFlight;
		if (this.#again) {
			this.#again = false;
			await this.flush();
		}
	}

	async #save() {
		if (this.status === 'conflict') return;
		const data = this.#read();
		const sent = JSON.stringify(data);
		this.status = 'saving';
		try {
			const res = this.id
				? await fetch(`/api/plans/${this.id}`, {
						method: 'PATCH',
						headers: { 'content-type': 'application/json' },
						body: JSON.stringify({ ...data, revision: this.revision })
					})
				: await fetch('/api/plans', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(data) });
			if (res.ok) {
				const { plan } = (await res.json()) as { plan: PlanRecord };
				this.revision = plan.revision;
				this.stored = sent;
				// An edit made while this save was on its way is not stored yet.
				this.status = JSON.stringify(this.#read()) === sent ? 'saved' : 'pending';
				if (!this.id) {
					this.id = plan.id;
					this.#onCreated(plan.id);
				}
			} else if (res.status === 409) {
				this.conflict = ((await res.json()) as { current: PlanRecord }).current;
				this.status = 'conflict';
			} else if (res.status === 400) {
				const body = (await res.json()) as { errors: { message: string }[] };
				this.status = 'invalid';
				this.message = body.errors[0]?.message ?? 'Some fields need attention.';
			} else {
				this.status = 'offline';
				this.message = `The server answered ${res.status}.`;
			}
		} catch {
			this.status = 'offline';
			this.message = 'No connection; your changes are kept here and saved when you edit again.';
		}
	}

	/** What the indicator may say: never "Saved" while the plan differs from what was stored. */
	shown(current: string): SaveStatus {
		return this.status === 'saved' && this.stored !== current ? 'pending' : this.status;
	}
}
