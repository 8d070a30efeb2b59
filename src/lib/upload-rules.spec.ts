import { describe, expect, it } from 'vitest';
import { MB, refuseFile, uploadRules } from './upload-rules';

describe('refuseFile', () => {
	const doc = uploadRules.document;
	it('lets a PDF under the limit through', () => {
		expect(refuseFile({ name: 'licence.pdf', size: MB, type: 'application/pdf' }, doc)).toBeNull();
	});
	it('says the size and the limit of an oversized file', () => {
		expect(refuseFile({ name: 'scan.pdf', size: 7 * MB, type: 'application/pdf' }, doc, 'licence document')).toBe(
			'The licence document “scan.pdf” is 7.0 MB; the limit is 5.0 MB. Please choose a smaller file.'
		);
	});
	it('names the accepted types for a wrong one', () => {
		expect(refuseFile({ name: 'notes.docx', size: 1000, type: 'application/vnd.openxmlformats-officedocument.wordprocessingml.document' }, doc)).toMatch(
			/must be a PDF, a JPEG, a PNG, or a WebP image/
		);
		expect(refuseFile({ name: 'plan.pdf', size: 1000, type: 'application/pdf' }, uploadRules.photo)).toMatch(/photo must be a JPEG/);
	});
	it('falls back to the extension when the browser gives no type', () => {
		expect(refuseFile({ name: 'yard.JPG', size: 1000, type: '' }, uploadRules.photo)).toBeNull();
		expect(refuseFile({ name: 'yard.heic', size: 1000, type: '' }, uploadRules.photo)).not.toBeNull();
	});
	it('refuses an empty file', () => {
		expect(refuseFile({ name: 'x.png', size: 0, type: 'image/png' }, uploadRules.photo)).toMatch(/empty/);
	});
});
