// The wizard's price fields, read from the schema's prices object. Each has a label saying what it
// is, per what unit it is priced, and in which currency; a spec checks that every price key the
// schema has is labelled here.
import { planInputSchema, type ParsedPlan, type Units } from '$lib/plan';

const [imperial] = planInputSchema.options;
/** The price keys of the schema's prices object, in its order. */
export const PRICE_KEYS = Object.keys(imperial.shape.prices.unwrap().shape) as PriceKey[];
export type PriceKey = keyof ParsedPlan['prices'];

type Label = { what: string; per: Record<Units, string> };
const both = (per: string): Record<Units, string> => ({ imperial: per, metric: per });

/** What each price is and the unit it is priced by (as the engine multiplies it). */
export const PRICE_LABELS: Record<string, Label> = {
	gravel: { what: 'Gravel for the base', per: { imperial: 'per yd³', metric: 'per m³' } },
	lumber: { what: 'Form board', per: { imperial: 'per ft of board', metric: 'per m of board' } },
	stake: { what: 'Form stake', per: both('each') },
	screw: { what: 'Exterior screw', per: both('each') },
	mesh: { what: 'Welded wire mesh', per: { imperial: 'per ft²', metric: 'per m²' } },
	releaseAgent: { what: 'Form release agent', per: { imperial: 'per 1 gal container', metric: 'per 4 L container' } },
	isolationStrip: { what: 'Isolation-joint strip', per: { imperial: 'per ft', metric: 'per m' } },
	curingCover: { what: 'Curing sheet or burlap', per: { imperial: 'per ft²', metric: 'per m²' } },
	curingCompound: { what: 'Curing compound', per: { imperial: 'per US gal', metric: 'per L' } },
	fiber: { what: 'Fibres for the mix', per: { imperial: 'per lb', metric: 'per kg' } },
	rebar: { what: 'Reinforcing bar', per: { imperial: 'per ft of bar', metric: 'per m of bar' } },
	chair: { what: 'Bar or mesh support chair', per: both('each') },
	tools: { what: 'Tools bought or hired', per: both('in all') },
	haulSoil: { what: 'Hauling dug soil away', per: both('per load') }
};

/** "Gravel for the base, USD per yd³": what, in which currency, per what. */
export const priceLabel = (what: string, per: string, currency: string) => `${what}, ${currency} ${per}`;

export function priceFields(units: Units, currency = 'USD'): { key: PriceKey; label: string }[] {
	return PRICE_KEYS.map((key) => {
		const l = PRICE_LABELS[key] ?? { what: key, per: both('each') };
		return { key, label: priceLabel(l.what, l.per[units], currency) };
	});
}
