// Text a person types, as every schema accepts it. Pure TS with no server imports, so the engine's
// plan schema and the server's form schemas share it.
import { z } from 'zod';

/** Control characters other than tab, line feed and carriage return (NUL among them). */
// eslint-disable-next-line no-control-regex -- finding control characters is this pattern's job
const CONTROL = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F]/;
/** A high surrogate not followed by a low one, or a low one not preceded by a high one. */
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/**
 * False for text PostgreSQL cannot store or that is not really text: a NUL or other control
 * character, or half of a UTF-16 surrogate pair.
 */
export function isPlainText(s: string): boolean {
	return !CONTROL.test(s) && !LONE_SURROGATE.test(s);
}

export const PLAIN_TEXT_MESSAGE = 'Remove the control characters or broken symbols from this text.';

/** A string field that refuses control characters and lone surrogates; chain trim/min/max after it. */
export const plainText = () => z.string().refine(isPlainText, PLAIN_TEXT_MESSAGE);
