// The plan PDF's fonts: Nunito's static weights from @fontsource, unwrapped from WOFF once per
// process, and text mapped onto what the latin subset can print.

import { readFile } from 'node:fs/promises';
import { inflateSync } from 'node:zlib';
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);

// WOFF, not WOFF2: fontkit (pdfkit's font reader) throws while subsetting these WOFF2 files, and
// the WOFF2 ones hold the variable font rather than the static weights.
const FONT_FILES = { regular: 'nunito-latin-400-normal.woff', bold: 'nunito-latin-800-normal.woff' } as const;

export interface Fonts {
	regular: Buffer;
	bold: Buffer;
	/** Code points the latin subset covers, from fontsource's own range list. */
	covers: (cp: number) => boolean;
}

/**
 * WOFF 1.0 to the plain TrueType it wraps. fontkit reads WOFF but inflates a table again on every
 * glyph lookup, which made each PDF take about half a second; unwrapped once, it reads in place.
 */
export function woffToSfnt(woff: Buffer): Buffer {
	if (woff.toString('latin1', 0, 4) !== 'wOFF') throw new Error('Not a WOFF 1.0 font');
	const count = woff.readUInt16BE(12);
	const tables = Array.from({ length: count }, (_, i) => {
		const at = 44 + i * 20;
		const [offset, compLength, origLength] = [4, 8, 12].map((k) => woff.readUInt32BE(at + k));
		const raw = woff.subarray(offset, offset + compLength);
		return { tag: woff.readUInt32BE(at), checksum: woff.readUInt32BE(at + 16), data: compLength < origLength ? inflateSync(raw) : raw };
	});
	const pad = (n: number) => (n + 3) & ~3;
	const dirLength = 12 + 16 * count;
	const out = Buffer.alloc(dirLength + tables.reduce((a, x) => a + pad(x.data.length), 0));
	const power = 2 ** Math.floor(Math.log2(count));
	out.writeUInt32BE(woff.readUInt32BE(4), 0); // flavor: the sfnt version
	out.writeUInt16BE(count, 4);
	out.writeUInt16BE(power * 16, 6);
	out.writeUInt16BE(Math.log2(power), 8);
	out.writeUInt16BE(count * 16 - power * 16, 10);
	let offset = dirLength;
	tables.forEach((x, i) => {
		const at = 12 + i * 16;
		out.writeUInt32BE(x.tag, at);
		out.writeUInt32BE(x.checksum, at + 4);
		out.writeUInt32BE(offset, at + 8);
		out.writeUInt32BE(x.data.length, at + 12);
		x.data.copy(out, offset);
		offset += pad(x.data.length);
	});
	return out;
}

let fonts: Promise<Fonts> | undefined;

export function loadFonts(): Promise<Fonts> {
	fonts ??= (async () => {
		const file = (name: string) => readFile(require.resolve(`@fontsource/nunito/files/${name}`));
		const [regular, bold, unicode] = await Promise.all([
			file(FONT_FILES.regular),
			file(FONT_FILES.bold),
			readFile(require.resolve('@fontsource/nunito/unicode.json'), 'utf8')
		]);
		const ranges: Record<string, string> = JSON.parse(unicode);
		const spans = ranges.latin.split(',').map((r) =>
			r
				.replace('U+', '')
				.split('-')
				.map((h) => parseInt(h, 16))
		);
		const covers = (cp: number) => spans.some(([lo, hi = lo]) => cp >= lo && cp <= hi);
		return { regular: woffToSfnt(regular), bold: woffToSfnt(bold), covers };
	})().catch((e) => {
		fonts = undefined;
		throw e;
	});
	return fonts;
}

// The latin subset has ¼ ½ ¾ but not eighths or math signs; spell those out rather than print boxes.
const SPELLED: Record<string, string> = { '⅛': '1/8', '⅜': '3/8', '⅝': '5/8', '⅞': '7/8', '≥': '>=', '≤': '<=', '→': '->' };

export function pdfText(s: string, covers: (cp: number) => boolean): string {
	return [...s.replace(/(\d)([⅛⅜⅝⅞])/g, '$1 $2')].map((c) => (covers(c.codePointAt(0)!) ? c : (SPELLED[c] ?? '?'))).join('');
}
