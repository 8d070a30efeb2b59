export type FieldErrors = Record<string, string | undefined>;

/**
 * What a refused form action sends back (`parseForm` and `formError` in $lib/server/forms): a message
 * per field, the values to show again, and one sentence for the whole form.
 */
export type FormFailure = { errors: FieldErrors; values: Record<string, string>; message: string };

/** The action's answer when it is such a refusal, else null. */
export const formFailure = (form: object | null | undefined): FormFailure | null =>
	form && 'errors' in form && form.errors ? (form as unknown as FormFailure) : null;
