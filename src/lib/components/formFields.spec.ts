import { describe, expect, it } from 'vitest';
import { formFields } from './formFields';

describe('a form field named once', () => {
	it('takes its value and its error under its own name', () => {
		const field = formFields({ phone: '555 0100', total: '1200' }, { total: 'Enter a price from $1.' });
		expect(field('phone')).toEqual({ name: 'phone', value: '555 0100', error: undefined });
		expect(field('total')).toEqual({ name: 'total', value: '1200', error: 'Enter a price from $1.' });
		expect(field('notes')).toEqual({ name: 'notes', value: undefined, error: undefined });
	});
});
