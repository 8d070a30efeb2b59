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

/** Text of one page (1-based). */
export async function pdfPageText(bytes: Uint8Array, page: number): Promise<string> {
	const doc = await getDocument({ data: new Uint8Array(bytes), useSystemFonts: false, isEvalSupported: false }).promise;
	const content = await (await doc.getPage(page)).getTextContent();
	await doc.destroy();
	return content.items.map((it) => ('str' in it ? it.str + (it.hasEOL ? '\n' : ' ') : '')).join('');
}

/** One page rendered by pdf.js onto a canvas (Node: @napi-rs/canvas, pdf.js's own choice), as RGBA. */
export async function pdfPagePixels(bytes: Uint8Array, page: number, scale = 1): Promise<{ width: number; height: number; data: Uint8ClampedArray }> {
	const doc = await getDocument({ data: new Uint8Array(bytes), useSystemFonts: false, isEvalSupported: false }).promise;
	const p = await doc.getPage(page);
	const viewport = p.getViewport({ scale });
	const factory = doc.canvasFactory as unknown as {
		create: (
			w: number,
			h: number
		) => { canvas: unknown; context: { getImageData: (x: number, y: number, w: number, h: number) => { data: Uint8ClampedArray } } };
	};
	const { canvas, context } = factory.create(Math.ceil(viewport.width), Math.ceil(viewport.height));
	await p.render({ canvas: canvas as HTMLCanvasElement, canvasContext: context as unknown as CanvasRenderingContext2D, viewport }).promise;
	const width = Math.ceil(viewport.width);
	const height = Math.ceil(viewport.height);
	const { data } = context.getImageData(0, 0, width, height);
	await doc.destroy();
	return { width, height, data };
}

/** Number of pages of a PDF. */
export async function pdfPageCount(bytes: Uint8Array): Promise<number> {
	const doc = await getDocument({ data: new Uint8Array(bytes), useSystemFonts: false, isEvalSupported: false }).promise;
	const n = doc.numPages;
	await doc.destroy();
	return n;
}

/** One page rendered by pdf.js as PNG bytes, to look at (saved under test-results/screens/). */
export async function pdfPagePng(bytes: Uint8Array, page: number, scale = 1.5): Promise<Buffer> {
	const doc = await getDocument({ data: new Uint8Array(bytes), useSystemFonts: false, isEvalSupported: false }).promise;
	const p = await doc.getPage(page);
	const viewport = p.getViewport({ scale });
	const factory = doc.canvasFactory as unknown as {
		create: (w: number, h: number) => { canvas: { toBuffer: (mime: 'image/png') => Buffer }; context: unknown };
	};
	const { canvas, context } = factory.create(Math.ceil(viewport.width), Math.ceil(viewport.height));
	await p.render({ canvas: canvas as unknown as HTMLCanvasElement, canvasContext: context as CanvasRenderingContext2D, viewport }).promise;
	const png = canvas.toBuffer('image/png');
	await doc.destroy();
	return png;
}
