import { describe, expect, it } from 'vitest';
import { MAX_ATTEMPTS, retryDelaySeconds } from './index';
import { resetPasswordMail, verifyEmailMail } from './templates';

describe('mail', () => {
	it('waits e^n seconds after the n-th failure, at most e^10 (about 6 h), as the job queue does', () => {
		expect([1, 2, 5, 10, 11, 20].map((n) => Math.round(retryDelaySeconds(n)))).toEqual([3, 7, 148, 22026, 22026, 22026]);
		// The waits between the tries add up to more than half a day of SMTP outage before a message fails.
		const total = Array.from({ length: MAX_ATTEMPTS - 1 }, (_, i) => retryDelaySeconds(i + 1)).reduce((a, b) => a + b, 0);
		expect(total / 3600).toBeGreaterThan(12);
	});

	it('puts the link in both the text and the HTML body, escaped in HTML', () => {
		const m = verifyEmailMail('Bo <Tables>', 'http://127.0.0.1:3000/verify-email?token=a&b');
		expect(m.text).toContain('http://127.0.0.1:3000/verify-email?token=a&b');
		expect(m.html).toContain('href="http://127.0.0.1:3000/verify-email?token=a&amp;b"');
		expect(m.html).toContain('Bo &lt;Tables&gt;');
		expect(resetPasswordMail('Bo', 'http://x/r').subject).toMatch(/password/);
	});
});
