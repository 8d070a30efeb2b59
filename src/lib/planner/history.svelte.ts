/**
 * Undo and redo over whole-plan snapshots (serialised). Edits that come in quick succession —
 * the keystrokes of one number, the moves of one drag — are one step.
 */
export class EditHistory {
	#entries = $state<string[]>([]);
	#at = $state(0);
	#lastAt = 0;
	#limit: number;
	#quiet: number;
	/** A gesture (a drag) is going on: 'start' until its first change, then 'on'. */
	#gesture: 'none' | 'start' | 'on' = 'none';

	constructor(first: string, o: { limit?: number; quietMs?: number } = {}) {
		this.#entries = [first];
		this.#limit = o.limit ?? 100;
		this.#quiet = o.quietMs ?? 600;
	}

	canUndo = $derived(this.#at > 0);
	canRedo = $derived(this.#at < this.#entries.length - 1);

	/** Note the plan as it now stands; a snapshot equal to the current step is not a change. */
	record(snapshot: string, now = Date.now()) {
		if (snapshot === this.#entries[this.#at]) return;
		const kept = this.#entries.slice(0, this.#at + 1);
		if (this.#gesture !== 'none') {
			// One drag is one step however long it takes: its first change starts the step, the rest join it.
			if (this.#gesture === 'on' && this.#at > 0 && this.#at === this.#entries.length - 1) kept[kept.length - 1] = snapshot;
			else kept.push(snapshot);
			this.#gesture = 'on';
			this.#lastAt = 0;
			this.#entries = kept.slice(-this.#limit);
			this.#at = this.#entries.length - 1;
			return;
		}
		// Merge with the step before when typing goes on, but never into the first, so it stays reachable.
		if (now - this.#lastAt < this.#quiet && this.#at > 0 && this.#at === this.#entries.length - 1) kept[kept.length - 1] = snapshot;
		else kept.push(snapshot);
		this.#lastAt = now;
		this.#entries = kept.slice(-this.#limit);
		this.#at = this.#entries.length - 1;
	}

	/** Ends the current step, so the next edit starts a new one (after undo, a button, a drag). */
	cut() {
		this.#lastAt = 0;
	}

	/** A drag begins: its changes become one step of their own, never merged into the edit before. */
	begin() {
		this.#gesture = 'start';
		this.#lastAt = 0;
	}

	/** The drag is over: the next edit starts a new step. */
	end() {
		this.#gesture = 'none';
		this.#lastAt = 0;
	}

	undo(): string | null {
		if (!this.canUndo) return null;
		this.#at -= 1;
		this.#lastAt = 0;
		return this.#entries[this.#at];
	}

	redo(): string | null {
		if (!this.canRedo) return null;
		this.#at += 1;
		this.#lastAt = 0;
		return this.#entries[this.#at];
	}
}
