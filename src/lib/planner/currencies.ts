// The currencies the wizard offers: ISO 4217 codes in current use, each shown with its name. The
// schema accepts any code the runtime can format; these are the ones a homeowner is likely to use.
export const CURRENCY_CODES = [
	'AED',
	'ARS',
	'AUD',
	'BGN',
	'BRL',
	'CAD',
	'CHF',
	'CLP',
	'CNY',
	'COP',
	'CZK',
	'DKK',
	'EGP',
	'EUR',
	'GBP',
	'HKD',
	'HUF',
	'IDR',
	'ILS',
	'INR',
	'ISK',
	'JPY',
	'KES',
	'KRW',
	'MAD',
	'MXN',
	'MYR',
	'NGN',
	'NOK',
	'NZD',
	'PEN',
	'PHP',
	'PKR',
	'PLN',
	'QAR',
	'RON',
	'RSD',
	'SAR',
	'SEK',
	'SGD',
	'THB',
	'TRY',
	'TWD',
	'UAH',
	'USD',
	'UYU',
	'VND',
	'ZAR'
] as const;

const names = new Intl.DisplayNames(['en'], { type: 'currency' });

/** The select's options; a code already in the plan but not listed is kept as an option. */
export function currencyOptions(current: string): { code: string; label: string }[] {
	const codes: string[] = [...CURRENCY_CODES];
	if (current && !codes.includes(current)) codes.push(current);
	return codes.map((code) => ({ code, label: `${code} — ${names.of(code) ?? code}` }));
}
