import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { DOCUMENT_MAX_BYTES, documentTypes, isEmptyUpload, MB, sniffUpload } from './uploads';

const pdfBytes = new TextEncoder().encode('%PDF-1.4\n1 0 obj\n<< /Type /Catalog >>\nendobj\ntrailer\n<< /Root 1 0 R >>\n%%EOF\n');
const opts = { maxBytes: DOCUMENT_MAX_BYTES, accept: documentTypes, what: 'licence document' };

describe('sniffUpload', () => {
	it('accepts a PDF and an image by their bytes, whatever the name says', async () => {
		const pdf = await sniffUpload(new File([pdfBytes], 'licence.bin'), opts);
		expect(pdf).toMatchObject({ ok: true, mime: 'application/pdf', ext: 'pdf', name: 'licence.bin' });
		const png = await sharp({ create: { width: 4, height: 4, channels: 3, background: '#3f8a62' } })
			.png()
			.toBuffer();
		const img = await sniffUpload(new File([new Uint8Array(png)], 'insurance.pdf', { type: 'application/pdf' }), opts);
		expect(img).toMatchObject({ ok: true, mime: 'image/png', ext: 'png' });
	});

	it('refuses text named .pdf and sent as application/pdf', async () => {
		const fake = new File(['This is not a PDF, only words.\n'], 'licence.pdf', { type: 'application/pdf' });
		const r = await sniffUpload(fake, opts);
		expect(r.ok).toBe(false);
		expect(!r.ok && r.message).toBe('The licence document must be a PDF, a JPEG, a PNG, or a WebP image; this file is not one of them.');
	});

	it('refuses a known type that is not accepted and names it', async () => {
		const gif = new TextEncoder().encode('GIF89a\x01\x00\x01\x00\x00\x00\x00;');
		const r = await sniffUpload(new File([gif], 'x.png'), opts);
		expect(!r.ok && r.message).toMatch(/this file is GIF\.$/);
	});

	it('refuses a file over the limit with both sizes, and an empty one', async () => {
		const big = new File([new Uint8Array(DOCUMENT_MAX_BYTES + 1)], 'big.pdf');
		const r = await sniffUpload(big, opts);
		expect(!r.ok && r.message).toBe('The licence document is 5.0 MB; the limit is 5.0 MB. Please send a smaller file.');
		const huge = await sniffUpload(new File([new Uint8Array(12 * MB)], 'huge.pdf'), opts);
		expect(!huge.ok && huge.message).toContain('is 12 MB');
		const exact = await sniffUpload(new File([pdfBytes, new Uint8Array(DOCUMENT_MAX_BYTES - pdfBytes.length)], 'exact.pdf'), opts);
		expect(exact.ok).toBe(true);
		const empty = await sniffUpload(new File([], 'e.pdf'), opts);
		expect(!empty.ok && empty.message).toBe('The licence document file is empty.');
	});

	it('tells an untouched file input from a chosen file', () => {
		expect(isEmptyUpload(new File([], ''))).toBe(true);
		expect(isEmptyUpload(null)).toBe(true);
		expect(isEmptyUpload('text')).toBe(true);
		expect(isEmptyUpload(new File(['x'], 'a.pdf'))).toBe(false);
	});
});
