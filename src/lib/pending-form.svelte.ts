import type { SubmitFunction } from '@sveltejs/kit';

/** Tracks one enhanced form's round trip, so its button can say it is working. */
export class PendingForm {
	pending = $state(false);

	submit: SubmitFunction = ({ formElement }) => {
		this.pending = true;
		return async ({ result, update }) => {
			await update({ reset: false });
			// Typed values stay after a refusal, as without JavaScript; passwords never do.
			if (result.type === 'failure') {
				for (const input of formElement.querySelectorAll<HTMLInputElement>('input[type=password]')) input.value = '';
			}
			this.pending = false;
		};
	};
}
