// The wizard's price fields, read from the schema's prices object: a price the engine learns to
// use shows up in the wizard without more work here.
import { planInputSchema, type Units } from '$lib/plan';

type Shape = Record<string, { description?: string }>;
const [imperial, metric] = planInputSchema.options;
const shapes: Record<Units, Shape> = {
	imperial: imperial.shape.prices.unwrap().shape as Shape,
	metric: metric.shape.prices.unwrap().shape as Shape
};

/** What each price is, in words; a key missing here is spelled out from its name. */
const LABELS: Record<string, string> = {
	gravel: 'Gravel',
	lumber: 'Form board',
	stake: 'Stake, each',
	screw: 'Screw, each',
	mesh: 'Welded wire mesh',
	rebar: 'Reinforcing bar',
	fiber: 'Fibres',
	releaseAgent: 'Form release agent',
	isolationStrip: 'Isolation strip',
	curingCover: 'Curing cover'
};

const spell = (key: string) => key.replace(/([A-Z])/g, ' $1').replace(/^./, (c) => c.toUpperCase()).trim();

export function priceFields(units: Units): { key: string; label: string }[] {
	return Object.entries(shapes[units]).map(([key, s]) => {
		const per = s.description?.match(/^Per ([^.;]+)/)?.[1];
		const label = LABELS[key] ?? spell(key);
		return { key, label: per ? `${label} per ${per}` : label };
	});
}
