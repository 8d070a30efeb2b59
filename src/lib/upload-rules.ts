/**
 * What each upload may be, shared by the browser (checked before sending, so a wrong or oversized
 * file costs no upload and loses nothing typed) and the server (which still sniffs the bytes).
 */
export const MB = 1024 * 1024;

const images = { 'image/jpeg': ['a JPEG', 'jpg', 'jpeg'], 'image/png': ['a PNG', 'png'], 'image/webp': ['a WebP image', 'webp'] } as const;
const pdf = { 'application/pdf': ['a PDF', 'pdf'] } as const;

export type UploadRule = { what: string; maxBytes: number; types: Record<string, readonly string[]> };

export const uploadRules = {
	photo: { what: 'photo', maxBytes: 12 * MB, types: images },
	document: { what: 'document', maxBytes: 5 * MB, types: { ...pdf, ...images } }
} as const satisfies Record<string, UploadRule>;

/** Site photos a plan holds; the pour page's queue counts against it before keeping one on the phone. */
export const MAX_PHOTOS_PER_PLAN = 20;

export const formatMb = (n: number) => `${(n / MB).toFixed(n < 10 * MB ? 1 : 0)} MB`;

/** The `accept` attribute of the file input. */
export const acceptAttr = (rule: UploadRule) => Object.keys(rule.types).join(',');

const orList = new Intl.ListFormat('en', { type: 'disjunction' });

/** "a PDF, a JPEG, a PNG, or a WebP image" */
export const typeList = (rule: UploadRule) => orList.format(Object.values(rule.types).map((t) => t[0]));

/** "PDF, JPEG, PNG, or WebP", for a hint. */
export const shortTypeList = (rule: UploadRule) => orList.format(Object.values(rule.types).map((t) => t[0].replace(/^an? /, '').replace(/ image$/, '')));

/**
 * Why the browser should not send this file, or null. Reads the claimed type and, when the browser
 * gives none, the name's extension; the server decides by the bytes.
 */
export function refuseFile(file: { name: string; size: number; type: string }, rule: UploadRule, what: string = rule.what): string | null {
	if (file.size === 0) return `The ${what} file “${file.name}” is empty.`;
	if (file.size > rule.maxBytes)
		return `The ${what} “${file.name}” is ${formatMb(file.size)}; the limit is ${formatMb(rule.maxBytes)}. Please choose a smaller file.`;
	const ext = file.name.split('.').pop()?.toLowerCase() ?? '';
	const known = file.type ? file.type in rule.types : Object.values(rule.types).some((t) => t.slice(1).includes(ext));
	if (!known) return `The ${what} must be ${typeList(rule)}; “${file.name}” is not.`;
	return null;
}
