import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';

/** All text drawn on a PDF's pages, read with pdf.js (fonts' ToUnicode maps included). */
export async function pdfText(bytes: Uint8Array): Promise<string> {
	const doc = await getDocument({ data: new Uint8Array(bytes), useSystemFonts: false, isEvalSupported: false }).promise;
	const pages: string[] = [];
	for (let i = 1; i <= doc.numPages; i++) {
		const content = await (await doc.getPage(i)).getTextContent();
		pages.push(content.items.map((it) => ('str' in it ? it.str + (it.hasEOL ? '\n' : ' ') : '')).join(''));
	}
	await doc.destroy();
	return pages.join('\n');
}
