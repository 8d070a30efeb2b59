import { describe, expect, it } from 'vitest';
import { waitNote } from './wait-note';

describe('waitNote', () => {
	it('says "it" for one thing waiting and "they" or "them" for several', () => {
		expect(waitNote('offline', 1, 'Saved')).toBe('Saved on this device; it will be sent when there is a connection.');
		expect(waitNote('offline', 3, 'Kept')).toBe('Kept on this device; they will be sent when there is a connection.');
		expect(waitNote('signed-out', 1, 'Kept')).toBe('Kept on this device. Sign in again to send it.');
		expect(waitNote('signed-out', 2, 'Saved')).toBe('Saved on this device. Sign in again to send them.');
	});

	it('says nothing while nothing keeps them back', () => {
		expect(waitNote('', 4, 'Saved')).toBe('');
	});
});
