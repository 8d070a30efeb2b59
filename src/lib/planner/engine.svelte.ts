// The engine (and its zod schema) as the wizard uses it: loaded once the wizard is on screen, not
// in the page's first load (docs/performance.md). Until it arrives the wizard's fields work, and
// the results say that they are being worked out; every use below reads the loaded engine, so
// anything derived from it updates the moment it is there.

type Engine = typeof import('$lib/plan');
type Convert = typeof import('./convert');

let loaded = $state.raw<Engine | null>(null);
let convert: Convert | null = null;
let pending: Promise<Engine> | null = null;

/** Starts loading the engine and the unit switch (once) and resolves with the engine. */
export function loadEngine(): Promise<Engine> {
	pending ??= Promise.all([import('$lib/plan'), import('./convert')]).then(
		([e, c]) => {
			convert = c;
			return (loaded = e);
		},
		(err) => {
			pending = null; // a failed fetch may be retried (a flaky connection)
			throw err;
		}
	);
	return pending;
}

/** The engine if it has loaded, else null (reactive: a reader re-runs once it loads). */
export const engine = (): Engine | null => loaded;

/** The unit switch (it parses with the engine), loaded with it. */
export const converter = (): Convert | null => (loaded ? convert : null);

/** Runs `fn` with the engine now when it is loaded, else as soon as it is. */
export function withEngine(fn: (e: Engine) => void): void {
	if (loaded) fn(loaded);
	else void loadEngine().then(fn);
}
