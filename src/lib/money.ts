// Money as people read it: one formatter for bids and prices (stored in cents) and plan costs (the
// engine's amounts, turned into cents first), always with the currency.

const formats = new Map<string, Intl.NumberFormat>();

export interface MoneyOptions {
	/** Leave off the minor digits when they are all zero ("$39" rather than "$39.00"), for prices
	 * quoted in a sentence; amounts with cents still show them ("$6.50"). */
	wholeWhenEven?: boolean;
}

/**
 * An amount given in cents (hundredths of the currency's main unit, also for a currency without a
 * minor unit) in that currency (ISO 4217): "$1,683.20", "CA$12.00", "€5.10", "¥1,500". One fixed
 * locale, so the server-rendered page, the browser, the PDF and e-mails print the same text.
 */
export function formatMoney(cents: number, currency = 'USD', { wholeWhenEven = false }: MoneyOptions = {}): string {
	const whole = wholeWhenEven && cents % 100 === 0;
	const key = `${currency}${whole ? ':whole' : ''}`;
	let f = formats.get(key);
	if (!f) {
		const digits = whole ? { minimumFractionDigits: 0, maximumFractionDigits: 0 } : {};
		formats.set(key, (f = new Intl.NumberFormat('en-US', { style: 'currency', currency, ...digits })));
	}
	return f.format(cents / 100);
}

/** An amount in the currency's main unit (the engine's costs) to whole cents. */
export const toCents = (amount: number) => Math.round(amount * 100);
