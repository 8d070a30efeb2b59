import { fileTypeFromBuffer } from 'file-type';

import { MB, formatMb, uploadRules } from '$lib/upload-rules';

export { MB };

export type SniffedUpload = { bytes: Uint8Array; mime: string; ext: string; name: string };
export type UploadCheck = ({ ok: true } & SniffedUpload) | { ok: false; message: string };

/** A file input left empty arrives as a nameless, empty File. */
export const isEmptyUpload = (v: FormDataEntryValue | null): boolean => !(v instanceof File) || (v.size === 0 && !v.name);

/**
 * Checks an uploaded file by what its bytes are, not by its name or the browser's claimed type:
 * a text file renamed `.pdf` is refused. The size is checked before the bytes are read.
 */
export async function sniffUpload(file: File, o: { maxBytes: number; accept: Record<string, string>; what: string }): Promise<UploadCheck> {
	if (file.size === 0) return { ok: false, message: `The ${o.what} file is empty.` };
	if (file.size > o.maxBytes)
		return { ok: false, message: `The ${o.what} is ${formatMb(file.size)}; the limit is ${formatMb(o.maxBytes)}. Please send a smaller file.` };
	const bytes = new Uint8Array(await file.arrayBuffer());
	const type = await fileTypeFromBuffer(bytes);
	if (!type || !(type.mime in o.accept))
		return {
			ok: false,
			message: `The ${o.what} must be ${new Intl.ListFormat('en', { type: 'disjunction' }).format(Object.values(o.accept))}; this file is ${type ? type.ext.toUpperCase() : 'not one of them'}.`
		};
	return { ok: true, bytes, mime: type.mime, ext: type.ext, name: file.name.slice(0, 200) || `upload.${type.ext}` };
}

const names = (types: Record<string, readonly string[]>) => Object.fromEntries(Object.entries(types).map(([mime, [name]]) => [mime, name]));

/** Images every upload may be (sharp reads each of them); the rules are shared with the browser. */
export const imageTypes: Record<string, string> = names(uploadRules.photo.types);

/** What a licence or insurance document may be. */
export const documentTypes: Record<string, string> = names(uploadRules.document.types);
export const DOCUMENT_MAX_BYTES = uploadRules.document.maxBytes;
