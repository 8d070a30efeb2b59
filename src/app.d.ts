// See https://svelte.dev/docs/kit/types#app.d.ts
declare global {
	/** True only in the dev server and in builds made for the local fake mail server (vite.config.ts). */
	const __DEV_MAILBOX__: boolean;
	namespace App {
		interface Locals {
			user: import('$lib/server/auth').SessionValidationResult['user'];
			session: import('$lib/server/auth').SessionValidationResult['session'];
			reader: import('$lib/reader').Reader;
		}
		interface Error {
			message: string;
			/** The id in the request's log line, for support. */
			requestId?: string;
			/** The database was down: the page says so and the status is 503. */
			unavailable?: boolean;
		}
		interface PageState {
			/** The planner wizard's step, kept in history so back/forward walk the steps. */
			step?: number;
		}
	}
}

export {};
