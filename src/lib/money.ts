// Money as people read it: one formatter for bids (stored in cents) and plan costs (the engine's
// amounts, turned into cents first), always with the currency.

const formats = new Map<string, Intl.NumberFormat>();

/**
 * An amount given in cents (hundredths of the currency's main unit, also for a currency without a
 * minor unit) in that currency (ISO 4217): "$1,683.20", "CA$12.00", "€5.10", "¥1,500". One fixed
 * locale, so the server-rendered page, the browser, the PDF and e-mails print the same text.
 */
export function formatMoney(cents: number, currency = 'USD'): string {
	let f = formats.get(currency);
	if (!f) formats.set(currency, (f = new Intl.NumberFormat('en-US', { style: 'currency', currency })));
	return f.format(cents / 100);
}

/** An amount in the currency's main unit (the engine's costs) to whole cents. */
export const toCents = (amount: number) => Math.round(amount * 100);
