import { describe, expect, it } from 'vitest';
import { parsePlanInput, planInputJsonSchema } from './schema';

const square = [
	[0, 0],
	[10, 0],
	[10, 10],
	[0, 10]
];
const base = { units: 'imperial', sections: [{ outline: square }] };

const errorsOf = (input: unknown) => {
	const r = parsePlanInput(input);
	if (r.ok) throw new Error('expected errors');
	return r.errors;
};

describe('defaults', () => {
	it('fills every optional field for an imperial plan', () => {
		const r = parsePlanInput(base);
		if (!r.ok) throw new Error(JSON.stringify(r.errors));
		const p = r.plan;
		expect(p.thickness).toBe(4); // common practice; IRC R506.1 minimum 3½ in
		expect(p.base.depth).toBe(4); // IRC R506.2.2
		expect(p.base.bulking).toBe(1.2); // common practice, 1.15–1.30
		expect(p.slope.fall).toEqual({ value: 2, unit: 'percent' }); // IRC R401.3
		expect(p.wastePercent).toBe(10); // common practice, 5–10 %
		expect(p.forms.stakeSpacing).toBe(3); // common practice, 3–4 ft
		expect(p.forms.stockLengths).toEqual([8, 10, 12, 16]); // usual stock lengths, ft
		expect(p.crew.handMixMinutes).toBe(8); // common practice, 5–8 min a bag
		expect(p.crew.workingMinutes).toBe(90); // common practice, 1½–2 h at 70 °F
		expect(p.bags.offered.map((b) => b.size)).toEqual([80, 60, 40]); // bag labels, common practice
		expect(p.milestones.vehiclePercent).toBe(70); // common practice
		expect(p.houseEdge).toEqual({ section: 0, edge: 0 });
	});

	it('uses metric defaults for a metric plan', () => {
		const r = parsePlanInput({ ...base, units: 'metric' });
		if (!r.ok) throw new Error(JSON.stringify(r.errors));
		expect(r.plan.thickness).toBe(100); // mm, common practice
		expect(r.plan.forms.stockLengths).toEqual([2.4, 3.0, 3.6, 4.8]); // usual metric stock, m
		expect(r.plan.base.depth).toBe(100); // mm, IRC R506.2.2 (4 in)
	});
});

describe('errors carry dotted paths', () => {
	it('names a bad unit system', () => {
		expect(errorsOf({ ...base, units: 'cubits' })[0].path).toBe('units');
	});

	it('names wrong types and unknown keys', () => {
		const errors = errorsOf({
			...base,
			thickness: 'four',
			colour: 'grey',
			sections: [
				{
					outline: [
						[0, 0],
						['1', 0],
						[1, 1]
					]
				}
			]
		});
		const paths = errors.map((e) => e.path);
		expect(paths).toContain('thickness');
		expect(paths).toContain('colour');
		expect(paths).toContain('sections.0.outline.1.0');
	});

	it('checks edge references against the outlines', () => {
		expect(errorsOf({ ...base, houseEdge: { section: 0, edge: 7 } })[0].path).toBe('houseEdge.edge');
		expect(errorsOf({ ...base, slope: { highEdge: { section: 2, edge: 0 } } })[0].path).toBe('slope.highEdge.section');
	});

	it('checks fields that depend on each other', () => {
		expect(errorsOf({ ...base, forms: { lumber: 'custom' } })[0].path).toBe('forms.customDepth');
		expect(errorsOf({ ...base, fill: { volume: 1, shareOfTrench: 0.1, largestPiece: 3 } })[0].path).toBe('fill');
		expect(errorsOf({ ...base, bags: { planSize: 50 } })[0].path).toBe('bags.planSize');
	});

	it('bounds slopes and coordinates', () => {
		expect(errorsOf({ ...base, slope: { fall: { value: 30, unit: 'percent' } } })[0].path).toBe('slope.fall.value');
		expect(
			errorsOf({
				...base,
				sections: [
					{
						outline: [
							[0, 0],
							[10, 0],
							[5000, 10]
						]
					}
				]
			})[0].path
		).toBe('sections.0.outline.2');
	});

	it('rejects invalid geometry at the outline', () => {
		const bow = [
			[0, 0],
			[10, 0],
			[2, 8],
			[8, 10]
		];
		expect(errorsOf({ ...base, sections: [{ outline: bow }] })[0].path).toBe('sections.0.outline');
		const overlap = errorsOf({
			...base,
			sections: [
				{ outline: square },
				{
					outline: [
						[5, 5],
						[15, 5],
						[15, 15],
						[5, 15]
					]
				}
			]
		});
		expect(overlap[0].path).toBe('sections.1.outline');
	});
});

// The outline has a parse of its own (parseOutline) in front of zod's: it takes only what zod
// would, and everything else goes to zod, so the messages are zod's and the error map's.
describe('outline parse', () => {
	it('hands back new corners equal to those sent', () => {
		const outline = square;
		const r = parsePlanInput({ units: 'metric', sections: [{ outline }] });
		if (!r.ok) throw new Error(JSON.stringify(r.errors));
		const got = r.plan.sections[0].outline;
		expect(got).toEqual(outline);
		expect(got).not.toBe(outline);
		got.forEach((p, i) => expect(p).not.toBe(outline[i]));
	});

	it('leaves every outline it does not take to zod, with the same messages', () => {
		const corners = (...extra: unknown[]) => [[0, 0], [10, 0], ...extra];
		const hole = corners([10, 10]);
		hole[4] = [0, 10];
		const corner = 'Enter each corner as two numbers [x, y] in ft.';
		const cases: [unknown, string, string][] = [
			[corners(), 'sections.0.outline', 'Give at least 3 corners in the outline.'],
			[corners([1]), 'sections.0.outline.2', corner],
			[corners([1, 1, 1]), 'sections.0.outline.2', corner],
			[corners([1, '1']), 'sections.0.outline.2.1', corner],
			[corners([NaN, 1]), 'sections.0.outline.2.0', corner],
			[corners([Infinity, 1]), 'sections.0.outline.2.0', corner],
			[corners(null), 'sections.0.outline.2', corner],
			[corners([1, new Number(1)]), 'sections.0.outline.2.1', corner],
			[hole, 'sections.0.outline.3', corner],
			[Array.from({ length: 101 }, (_, i) => [Math.cos(i), Math.sin(i)]), 'sections.0.outline', 'Give at most 100 corners in the outline.'],
			['square', 'sections.0.outline', 'Give the outline as a list.']
		];
		for (const [outline, path, message] of cases) expect(errorsOf({ ...base, sections: [{ outline }] })[0], JSON.stringify(outline)).toEqual({ path, message });
	});
});

describe('JSON Schema', () => {
	it('publishes both unit systems with their defaults', () => {
		const s = planInputJsonSchema() as { oneOf: { properties: Record<string, { default?: unknown }> }[] };
		expect(s.oneOf).toHaveLength(2);
		expect(s.oneOf[0].properties.thickness.default).toBe(4); // in, common practice
		expect(s.oneOf[1].properties.thickness.default).toBe(100); // mm, common practice
		expect(JSON.stringify(s)).toContain('"maximum":1000'); // coordinate bound, ft
	});
});

describe('scope limits', () => {
	const rect = (w: number, h: number) => [
		[0, 0],
		[w, 0],
		[w, h],
		[0, h]
	];
	const plan = (over: object) => ({ units: 'imperial', ...over });
	const messages = (input: unknown) => {
		const r = parsePlanInput(input);
		return r.ok ? [] : r.errors.map((e) => `${e.path}: ${e.message}`);
	};

	it('takes 3000 ft² of slab and refuses more, naming the limit', () => {
		expect(messages(plan({ sections: [{ outline: rect(50, 60) }] }))).toEqual([]); // 50 × 60 = 3000 ft²
		expect(messages(plan({ sections: [{ outline: rect(50, 60.1) }] }))).toEqual([
			'sections: The slab is 3,005 ft²; the limit is 3,000 ft². Plan a larger job as separate slabs.' // 50 × 60.1 = 3005
		]);
		expect(messages({ units: 'metric', sections: [{ outline: rect(14, 21) }] })[0]).toMatch(/is 294 m²; the limit is 280 m²/); // 14 × 21
	});

	it('takes 1000 ft of outline and refuses more', () => {
		expect(messages(plan({ sections: [{ outline: rect(499, 1) }], forms: { stakeSpacing: 2 } }))).toEqual([]); // 2 × 499 + 2 = 1000 ft
		expect(messages(plan({ sections: [{ outline: rect(499.5, 1) }], forms: { stakeSpacing: 2 } }))[0]).toMatch(
			/add up to 1,001 ft of edge; the limit is 1,000 ft/
		);
	});

	it('counts stakes as outline ÷ spacing: 600 taken, 601 refused at the spacing', () => {
		expect(messages(plan({ sections: [{ outline: rect(290, 10) }], forms: { stakeSpacing: 1 } }))).toEqual([]); // 600 ft at 1 ft
		expect(messages(plan({ sections: [{ outline: rect(290.5, 10) }], forms: { stakeSpacing: 1 } }))).toEqual([
			'forms.stakeSpacing: Stakes every 1 ft along 601 ft of outline make about 601 stakes; the limit is 600. Space the stakes wider.'
		]);
	});

	it('refuses a bag size that would take over 10,000 bags', () => {
		// 40 × 40 ft × 6 in = 800 ft³, + 10 % waste = 880 ft³; 10 lb → 0.075 ft³ (80 lb → 0.60 ft³, bag labels): 11,734 bags.
		const slab = plan({ sections: [{ outline: rect(40, 40) }], thickness: 6, bags: { offered: [{ size: 20 }, { size: 10 }] } });
		expect(messages(slab)).toEqual([
			'bags.offered.1.size: With 10 lb bags this slab takes about 11,734 bags; the limit is 10,000 of a size. Offer a larger bag, or plan ready-mix.'
		]); // 20 lb → 0.15 ft³: 5,867 bags, taken
	});

	it('counts corners per section and in all', () => {
		const star = (n: number, cx: number) =>
			Array.from({ length: n }, (_, i) => [cx + 5 * Math.cos((2 * Math.PI * i) / n), 5 * Math.sin((2 * Math.PI * i) / n)]);
		expect(messages(plan({ sections: [{ outline: star(101, 0) }] }))).toEqual(['sections.0.outline: Give at most 100 corners in the outline.']);
		const four = [0, 11, 22, 33].map((cx) => ({ outline: star(76, cx) })); // 4 × 76 = 304
		expect(messages(plan({ sections: four }))).toEqual(['sections: The outlines have 304 corners in all; the limit is 300. Use fewer corners.']);
	});
});

describe('messages in plain words', () => {
	const messageAt = (input: object, path: string) => {
		const r = parsePlanInput({ ...base, ...input });
		if (r.ok) throw new Error('expected errors');
		return r.errors.find((e) => e.path === path)?.message;
	};

	it('name the field, its unit and the range, in the plan’s units', () => {
		expect(messageAt({ thickness: 'four' }, 'thickness')).toBe('Enter the thickness, 2–12 in.');
		expect(messageAt({ forms: { stakeSpacing: 9 } }, 'forms.stakeSpacing')).toBe('Enter the stake spacing, 1–8 ft.');
		expect(messageAt({ units: 'metric', forms: { stakeSpacing: 9 } }, 'forms.stakeSpacing')).toBe('Enter the stake spacing, 0.3–2.5 m.');
		expect(messageAt({ conditions: { wind: -1 } }, 'conditions.wind')).toBe('Enter the wind speed, 0–100 mph.');
		expect(messageAt({ reference: { below: 50 } }, 'reference.below')).toBe('Enter how far the slab sits below the reference mark, −48 to 48 in.');
		expect(messageAt({ loads: { vehicles: 1 } }, 'loads.vehicles')).toBe('Choose yes or no (true or false) for whether vehicles drive on the slab.');
		expect(messageAt({ name: 'x'.repeat(101) }, 'name')).toBe('Shorten the plan name to 100 characters or fewer.');
		expect(messageAt({ slope: { fall: { value: 4, unit: 'inPerFt' } } }, 'slope.fall.value')).toBe('Enter the fall, 0–3 in per ft.');
		// A fall's range and unit follow the unit it is given in, whatever is wrong with the number.
		expect(messageAt({ slope: { fall: { value: null, unit: 'totalDrop' } } }, 'slope.fall.value')).toBe('Enter the fall, 0–48 in.');
		expect(messageAt({ slope: { fall: { value: 60, unit: 'totalDrop' } } }, 'slope.fall.value')).toBe('Enter the fall, 0–48 in.');
		expect(messageAt({ slope: { fall: { value: null, unit: 'percent' } } }, 'slope.fall.value')).toBe('Enter the fall, 0–25 %.');
		expect(messageAt({ units: 'metric', slope: { fall: { value: 300, unit: 'mmPerM' } } }, 'slope.fall.value')).toBe('Enter the fall, 0–250 mm per m.');
		expect(messageAt({ units: 'metric', slope: { crossFall: { value: null, unit: 'totalDrop' } } }, 'slope.crossFall.value')).toBe(
			'Enter the cross fall, −1,200 to 1,200 mm.'
		);
		expect(messageAt({ prices: { stake: -1 } }, 'prices.stake')).toBe('Enter the stake price, 0–1,000,000 USD.');
		expect(messageAt({ currency: 'CAD', prices: { stake: -1 } }, 'prices.stake')).toBe('Enter the stake price, 0–1,000,000 CAD.');
	});

	it('say what is wrong with a pour date: too far ahead, not a real day, or not written as a date', () => {
		const date = (pourDate: string) => messageAt({ conditions: { pourDate } }, 'conditions.pourDate');
		// A date box takes years up to 275760 and gives a five- or six-digit one as typed; the schema's ISO dates end in 9999.
		expect(date('192027-06-12')).toBe('The pour date is too far ahead: a plan takes days up to 31 December 9999.');
		expect(date('20277-06-12')).toBe('The pour date is too far ahead: a plan takes days up to 31 December 9999.');
		expect(parsePlanInput({ ...base, conditions: { pourDate: '9999-12-31' } }).ok).toBe(true);
		expect(date('2027-02-30')).toBe('Enter the pour date as a real calendar date.');
		// Only a value no date box gives (an API client's) is told how to write a date.
		expect(date('06/12/2027')).toBe('Enter the pour date as a real calendar date, written year-month-day (2027-06-12).');
	});

	it('bound a custom board depth and a thickened edge’s depth below the slab, in both units', () => {
		// common practice, no published source: boards 2–16 in (50–400 mm), trench 2–24 in (50–600 mm) below the slab.
		const board = (units: string, customDepth: number) => messageAt({ units, forms: { lumber: 'custom', customDepth } }, 'forms.customDepth');
		const trench = (units: string, extraDepth: number) => messageAt({ units, thickenedEdge: { edges: 'free', extraDepth } }, 'thickenedEdge.extraDepth');
		expect(board('imperial', 1)).toBe('Enter the board depth, 2–16 in.');
		expect(board('imperial', 17)).toBe('Enter the board depth, 2–16 in.');
		expect(board('metric', 1)).toBe('Enter the board depth, 50–400 mm.');
		expect(board('metric', 401)).toBe('Enter the board depth, 50–400 mm.');
		expect(trench('imperial', 1)).toBe('Enter the trench depth below the slab, 2–24 in.');
		expect(trench('imperial', 25)).toBe('Enter the trench depth below the slab, 2–24 in.');
		expect(trench('metric', 1)).toBe('Enter the trench depth below the slab, 50–600 mm.');
		expect(trench('metric', 601)).toBe('Enter the trench depth below the slab, 50–600 mm.');
		// The ends of each range are taken.
		for (const [units, d, t] of [
			['imperial', 2, 2],
			['imperial', 16, 24],
			['metric', 50, 50],
			['metric', 400, 600]
		] as const)
			expect(parsePlanInput({ ...base, units, forms: { lumber: 'custom', customDepth: d }, thickenedEdge: { edges: 'free', extraDepth: t } }).ok).toBe(true);
		// Custom lumber with no depth says the range too.
		expect(messageAt({ forms: { lumber: 'custom' } }, 'forms.customDepth')).toBe('Enter the board depth for custom lumber, 2–16 in.');
	});

	it('give every number field a message with its range, never the validator’s text', () => {
		const s = planInputJsonSchema() as { oneOf: { properties: Record<string, { type?: string; properties?: Record<string, { type?: string }> }> }[] };
		let checked = 0;
		for (const [key, field] of Object.entries(s.oneOf[0].properties)) {
			const nested = field.properties ? Object.entries(field.properties).filter(([, f]) => f.type === 'number' || f.type === 'integer') : [];
			const paths = field.type === 'number' ? [[key]] : nested.map(([k]) => [key, k]);
			for (const [a, b] of paths) {
				const r = parsePlanInput({ ...base, [a]: b ? { [b]: null } : null });
				if (r.ok) throw new Error(`${a}.${b} took null`);
				const m = r.errors[0].message;
				expect(m, `${a}.${b ?? ''}`).toMatch(/^Enter (the|how) .+, (a whole number )?−?[\d.,]+( to |–)[\d.,]+/);
				expect(m).not.toMatch(/expected|received|Invalid|Too (small|big)/);
				checked++;
			}
		}
		expect(checked).toBeGreaterThan(30);
	});

	// Every number a plan holds, at any depth (lists, items of lists, optional groups), with its unit
	// word; the few numbers without a unit are listed here, by path, so a new field must say which.
	const UNITLESS = [
		/\.(section|edge)$/, // edge references: indices
		/^crew\.people$/,
		/^base\.bulking$/, // a ratio
		/^fill\.shareOfTrench$/,
		/^bags\.waterRatio$/,
		/^reinforcing\.lapDiameters$/ // counted in bar diameters, which the label says
	];
	// Numbers where null is a value, not an emptied field: a day's low left to its mean.
	const NULLABLE = [/^conditions\.airLow\.\d+$/];
	const UNIT_WORD =
		/\d (ft|in|m|mm|°F|°C|lb|kg|yd³|ft³|m³|psi|MPa|mph|km\/h|%|min|days|in per ft|mm per m|short tons per yd³|t per m³|ft² per US gal|m² per L|oz|g|USD)[.,]/;
	type Node = { type?: string | string[]; properties?: Record<string, Node>; items?: Node; prefixItems?: Node[]; anyOf?: Node[]; oneOf?: Node[] };
	function numberPaths(n: Node, path: (string | number)[], out: (string | number)[][]) {
		const types = [n.type ?? []].flat();
		if (types.includes('number') || types.includes('integer')) out.push(path);
		for (const [k, c] of Object.entries(n.properties ?? {})) numberPaths(c, [...path, k], out);
		if (n.items) numberPaths(n.items, [...path, 0], out);
		n.prefixItems?.forEach((c, i) => numberPaths(c, [...path, i], out));
		for (const c of [...(n.anyOf ?? []), ...(n.oneOf ?? [])]) numberPaths(c, path, out);
		return out;
	}
	const unique = (paths: (string | number)[][]) => [...new Map(paths.map((p) => [p.join('.'), p])).values()];
	/** The plan with the value at `path` set, making the groups and lists on the way. */
	function withValue(plan: Record<string, unknown>, path: (string | number)[], value: unknown) {
		const copy = structuredClone(plan);
		let o: Record<string | number, unknown> = copy;
		path.slice(0, -1).forEach((k, i) => {
			if (o[k] === null || typeof o[k] !== 'object') o[k] = typeof path[i + 1] === 'number' ? [] : {};
			o = o[k] as Record<string | number, unknown>;
		});
		o[path[path.length - 1]] = value;
		return copy;
	}

	for (const units of ['imperial', 'metric'] as const) {
		it(`every number field’s message names its unit (${units})`, () => {
			const js = planInputJsonSchema() as Node & { oneOf: Node[] };
			const branch = js.oneOf.find((b) => (b.properties?.units as { const?: string }).const === units)!;
			const parsed = parsePlanInput({ units, sections: [{ outline: units === 'imperial' ? square : square.map((p) => p.map((v) => v / 3)) }] });
			if (!parsed.ok) throw new Error('the base plan is valid');
			const plan = structuredClone(parsed.plan) as Record<string, unknown>;
			const paths = unique(numberPaths(branch, [], [])).filter((p) => p[0] !== 'sections' || p.length < 4);
			let withUnit = 0;
			for (const path of paths) {
				const key = path.join('.');
				const nullable = NULLABLE.some((n) => n.test(key));
				if (nullable) expect(parsePlanInput(withValue(plan, path, null)).ok, `${key} takes null`).toBe(true);
				for (const bad of nullable ? [1e12] : [null, 1e12]) {
					const r = parsePlanInput(withValue(plan, path, bad));
					if (r.ok) throw new Error(`${key} took ${bad}`);
					const e = r.errors.find((x) => x.path === key) ?? r.errors.find((x) => key.startsWith(x.path));
					expect(e, `${key} = ${bad}: ${JSON.stringify(r.errors)}`).toBeDefined();
					const m = e!.message;
					expect(m, key).not.toMatch(/expected|received|Invalid|Too (small|big)/);
					if (UNITLESS.some((u) => u.test(key))) continue;
					expect(m, key).toMatch(/^Enter /);
					expect(m, `${key} = ${bad}`).toMatch(key.startsWith('sections.') ? / (ft|m)\./ : UNIT_WORD);
					withUnit++;
				}
			}
			expect(withUnit).toBeGreaterThan(120); // about 70 fields, two messages each
		});
	}
});
