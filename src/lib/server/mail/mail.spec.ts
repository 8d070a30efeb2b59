import { describe, expect, it } from 'vitest';
import { retryDelayMinutes } from './index';
import { resetPasswordMail, verifyEmailMail } from './templates';

describe('mail', () => {
	it('backs off 1, 2, 4 … minutes, at most an hour', () => {
		expect([1, 2, 3, 4, 7, 8, 20].map(retryDelayMinutes)).toEqual([1, 2, 4, 8, 60, 60, 60]);
	});

	it('puts the link in both the text and the HTML body, escaped in HTML', () => {
		const m = verifyEmailMail('Bo <Tables>', 'http://127.0.0.1:3000/verify-email?token=a&b');
		expect(m.text).toContain('http://127.0.0.1:3000/verify-email?token=a&b');
		expect(m.html).toContain('href="http://127.0.0.1:3000/verify-email?token=a&amp;b"');
		expect(m.html).toContain('Bo &lt;Tables&gt;');
		expect(resetPasswordMail('Bo', 'http://x/r').subject).toMatch(/password/);
	});
});
