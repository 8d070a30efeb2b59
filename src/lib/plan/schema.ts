// The one input schema, shared by the wizard's forms, the public API and the engine. Lengths are in
// the plan's units: site lengths in ft or m, small dimensions in in or mm, °F or °C, lb or kg.

import { z } from 'zod';
import { COMMON, DEFAULTS } from './defaults';
import { geometryIssues, type PlanIssue } from './geometry';
import { planErrorMap, plainNumber, RATE_MAX, RATE_UNITS, rateMessage } from './messages';
import { perimeter, signedArea } from './polygon';
import { KG_PER_LB, M2_PER_FT2, M3_PER_FT3, M_PER_FT, M_PER_IN, type Units } from './units';
import { LIMITS } from './limits';
import { mapList } from './util';

export { answerBytesBound, LIMITS } from './limits';

export const LUMBER_SIZES = ['2x4', '2x6', '2x8', '2x10', '2x12'] as const;
export { RATE_UNITS };
export const REINFORCEMENT = ['none', 'fiber', 'mesh', 'rebar'] as const;

const MAX_SECTIONS = LIMITS.sections;
const MAX_VERTICES = LIMITS.verticesPerSection;

/** NUL and other control characters, and UTF-16 halves without their other half. */
// eslint-disable-next-line no-control-regex -- finding control characters is this pattern's job
const BAD_TEXT = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]|[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/;

/** One line of text a person typed: trimmed, bounded, and free of characters that break storage. */
const text = (max: number) =>
	z
		.string()
		.trim()
		.max(max)
		.refine((v) => !BAD_TEXT.test(v), { error: 'Remove the control character or broken character (such as NUL) from this text.' });

/** ISO 4217 codes this runtime can format (Intl); prices are shown with Intl.NumberFormat. */
const CURRENCIES = new Set(Intl.supportedValuesOf('currency'));

function deepFreeze<T>(v: T): T {
	if (v && typeof v === 'object') {
		for (const x of Object.values(v)) deepFreeze(x);
		Object.freeze(v);
	}
	return v;
}

/**
 * An optional object whose absence means "all its own defaults". The default is worked out once
 * and frozen; zod hands it back without parsing, which keeps a parse cheap. It is given as a
 * function: zod shallow-copies a default given as a value on every parse that uses it (a dozen
 * objects a plan), while a function's answer is handed back as it is.
 */
function withDefaults<T extends z.ZodObject>(schema: T) {
	const frozen = deepFreeze(schema.parse({})) as z.util.NoUndefined<z.output<T>>;
	return schema.default(() => frozen);
}
/**
 * The outline's own parse, given to zod as its fast path (`z.withParser`): for a valid outline it
 * returns what zod's array of [x, y] tuples returns (a new list of new pairs of finite numbers)
 * without zod's per-corner and per-number bookkeeping, half the parse's allocation. Anything else
 * it hands to zod's parse (INVALID), so a bad outline gets the same issues and messages, and the
 * schema, hence its JSON Schema, is zod's. Plain code, no `new Function`: it runs under the page's
 * content security policy too.
 */
function parseOutline(input: unknown): [number, number][] | typeof z.INVALID {
	if (!Array.isArray(input) || input.length < 3 || input.length > MAX_VERTICES) return z.INVALID;
	const out: [number, number][] = [];
	for (let i = 0; i < input.length; i++) {
		const p: unknown = input[i];
		if (!Array.isArray(p) || p.length !== 2) return z.INVALID;
		const x: unknown = p[0];
		const y: unknown = p[1];
		// z.number() takes finite numbers only.
		if (!Number.isFinite(x) || !Number.isFinite(y)) return z.INVALID;
		out.push([x as number, y as number]);
	}
	return out;
}

function planSchemaFor<U extends Units>(units: U) {
	const d = DEFAULTS[units];
	const imp = units === 'imperial';
	const [L, S, T, M, V, PV] = imp ? ['ft', 'in', '°F', 'lb', 'yd³', 'ft³'] : ['m', 'mm', '°C', 'kg', 'm³', 'm³'];
	// Bounds are checked in crossChecks: per-number zod checks cost more than the whole engine.
	const coord = z.number().meta({ minimum: -d.maxCoordinate, maximum: d.maxCoordinate });
	const smallDim = z.number().min(0).max(d.maxSmall);
	const price = z.number().min(0).max(1e6);
	const temp = imp ? z.number().min(-40).max(130) : z.number().min(-40).max(55);

	const edgeRef = z.strictObject({
		section: z
			.int()
			.min(0)
			.max(MAX_SECTIONS - 1)
			.default(0)
			.describe('Index into sections.'),
		edge: z
			.int()
			.min(0)
			.max(MAX_VERTICES - 1)
			.describe('Edge i runs from vertex i to vertex i + 1; the last edge closes to vertex 0.')
	});

	const rate = (signed: boolean, label: string) =>
		z
			.strictObject({
				value: z
					.number()
					.min(signed ? -d.maxSmall : 0)
					.max(d.maxSmall),
				unit: z.enum(RATE_UNITS).describe(`percent, in per ft, mm per m, or a totalDrop in ${S} across the slab.`)
			})
			.superRefine(({ value, unit }, ctx) => {
				if (Math.abs(value) > RATE_MAX[unit]) ctx.addIssue({ code: 'custom', path: ['value'], message: rateMessage(label, unit, units, signed, d.maxSmall) });
			});

	const section = z.strictObject({
		name: text(60).optional(),
		outline: z.withParser(
			z
				.array(z.tuple([coord, coord]))
				.min(3)
				.max(MAX_VERTICES)
				.describe(`Vertices [x, y] in ${L}, in order around the section (either direction).`),
			parseOutline
		)
	});

	return z.strictObject({
		units: z.literal(units),
		name: text(100).optional(),
		currency: z
			.string()
			.trim()
			.toUpperCase()
			.refine((c) => CURRENCIES.has(c), { error: 'Enter a three-letter currency code such as USD, CAD or EUR (ISO 4217).' })
			.default('USD')
			.describe('ISO 4217 code of every price in the plan.'),
		sections: z.array(section).min(1).max(MAX_SECTIONS).describe('Pour sections in pour order; sections sharing an edge meet at a cold joint.'),
		houseEdge: edgeRef.nullable().default({ section: 0, edge: 0 }).describe('The edge along the house wall; null for a freestanding slab.'),
		otherHouseEdges: z.array(edgeRef).max(8).default([]).describe('More edges along the house, e.g. both sides of a notch around a house corner.'),
		gapToHouse: smallDim.default(d.gapToHouse).describe(`Space between slab and wall, ${S} (room for an isolation strip; common practice).`), // from memory
		houseEdgeFormed: z.boolean().default(false).describe('true: a form board along the house; false: poured against an isolation strip.'),
		reference: withDefaults(
			z.strictObject({
				label: text(80).default('reference mark'),
				below: z.number().min(-d.maxSmall).max(d.maxSmall).default(0).describe(`How far the slab's high point sits below the reference, ${S}.`)
			})
		),
		slope: withDefaults(
			z.strictObject({
				fall: rate(false, 'the fall')
					.default({ value: COMMON.slopePercent, unit: 'percent' })
					.describe('Fall away from the high edge (IRC R401.3: ≥ 2 % near the foundation).'),
				crossFall: rate(true, 'the cross fall')
					.default({ value: 0, unit: 'percent' })
					.describe('Fall along the high edge; positive falls toward its end vertex.'),
				highEdge: edgeRef.optional().describe('The edge at the high side; defaults to houseEdge, else section 0 edge 0.')
			})
		),
		thickness: z
			.number()
			.min(imp ? 2 : 50)
			.max(imp ? 12 : 300)
			.default(d.thickness)
			.describe(`Slab thickness, ${S} (common practice 4 in; IRC R506.1 minimum 3½ in).`),
		forms: withDefaults(
			z.strictObject({
				lumber: z.enum([...LUMBER_SIZES, 'custom']).default('2x4'),
				// common practice, no published source: a form board stands at least a thin slab's
				// 2 in (50 mm) deep and no deeper than two 2x8s stacked, 16 in (400 mm).
				customDepth: z
					.number()
					.min(imp ? 2 : 50)
					.max(imp ? 16 : 400)
					.optional()
					.describe(`Board depth, ${S}, when lumber is custom.`),
				stakeSpacing: z
					.number()
					.min(imp ? 1 : 0.3)
					.max(imp ? 8 : 2.5)
					.default(d.stakeSpacing)
					.describe(`${L}; common practice 3–4 ft, plus one at every corner and splice.`),
				stakeLength: smallDim.default(d.stakeLength).describe(`Stake length, ${S}; common practice, no published source.`), // from memory
				release: z.enum(['agent', 'oil', 'none']).default('agent').describe('What keeps concrete off the boards.'),
				stockLengths: z
					.array(
						z
							.number()
							.min(imp ? 4 : 1.2)
							.max(imp ? 24 : 7.2)
					)
					.min(1)
					.max(8)
					.default([...d.stockLengths])
					.describe(`Board lengths on sale, ${L}.`)
			})
		),
		thickenedEdge: withDefaults(
			z.strictObject({
				edges: z
					.union([z.enum(['none', 'free']), z.array(edgeRef).max(200)])
					.default('none')
					.describe("'free' thickens every edge not along the house or a cold joint."),
				width: smallDim.default(d.edgeWidth).describe(`Trench width, ${S}; common practice, no published source.`), // from memory
				// common practice, no published source: a thickened edge goes about the slab's own
				// thickness below it (twice the slab deep in all); 2–24 in (50–600 mm) holds any slab here.
				extraDepth: z
					.number()
					.min(imp ? 2 : 50)
					.max(imp ? 24 : 600)
					.optional()
					.describe(`Depth below the slab, ${S}; defaults to the thickness (common practice).`),
				profile: z
					.enum(['rectangular', 'tapered'])
					.default('rectangular')
					.describe('tapered: full depth at the form, sloping up to the slab underside at the trench width.')
			})
		),
		base: withDefaults(
			z.strictObject({
				depth: smallDim.default(d.baseDepth).describe(`Compacted gravel, ${S} (IRC R506.2.2).`),
				bulking: z.number().min(1).max(2).default(COMMON.baseBulking).describe('Loose ÷ compacted volume (common practice 1.15–1.30).'),
				overhang: smallDim.default(d.baseOverhang).describe(`Base past the forms, ${S}; common practice.`),
				stoneDensity: z
					.number()
					.min(0.5)
					.max(3)
					.default(d.stoneDensity)
					.describe(`Compacted stone, ${imp ? 'short tons per yd³' : 't per m³'}; common practice.`),
				soilDensity: z
					.number()
					.min(0.5)
					.max(3)
					.default(d.soilDensity)
					.describe(`Dug soil in the ground, ${imp ? 'short tons per yd³' : 't per m³'}; common practice, no published source.`) // from memory
			})
		),
		fill: z
			.strictObject({
				volume: z.number().min(0).max(1e4).optional().describe(`Chunk volume, ${PV}.`),
				shareOfTrench: z.number().min(0).max(0.9).optional().describe('Share of trench volume.'),
				largestPiece: smallDim.describe(`Largest chunk, ${S}.`)
			})
			.optional()
			.describe('Broken concrete chunks laid in the thickened-edge trench.'),
		reinforcement: z.enum(REINFORCEMENT).default('none'),
		loads: withDefaults(
			z.strictObject({
				vehicles: z.boolean().default(false),
				pointLoads: z.boolean().default(false).describe('Hot tub, shed posts, heavy planters.')
			})
		),
		mix: withDefaults(
			z.strictObject({
				cement: z.enum(['typeI', 'typeIII']).default('typeI').describe('typeIII: high early.'),
				designStrength: z
					.number()
					.min(imp ? 1500 : 10)
					.max(imp ? 8000 : 55)
					.default(d.designStrength)
					.describe(`28-day strength, ${imp ? 'psi' : 'MPa'}; IRC Table R402.2 asks 2500–3500 psi by weathering.`) // default from memory
			})
		),
		wastePercent: z.number().min(0).max(50).default(COMMON.wastePercent).describe('common practice 5–10 %.'),
		bags: withDefaults(
			z.strictObject({
				offered: z
					.array(
						z.strictObject({
							size: z
								.number()
								.min(imp ? 10 : 5)
								.max(imp ? 100 : 50)
								.describe(`Bag mass, ${M}.`),
							yield: z
								.number()
								.min(imp ? 0.05 : 0.001)
								.max(imp ? 2 : 0.06)
								.optional()
								.describe(`${PV} placed per bag; default from 80 lb ≈ 0.60 ft³ (bag labels).`),
							price: price.optional()
						})
					)
					.min(1)
					.max(6)
					.default(d.bagSizes.map((size) => ({ size }))),
				planSize: z
					.number()
					.min(imp ? 10 : 5)
					.max(imp ? 100 : 50)
					.optional()
					.describe('Bag size the mixing plan uses; default the largest.'),
				waterRatio: z.number().min(0).max(0.2).default(COMMON.waterPerKgDryMix).describe('Water per dry mix by mass; the bag label rules.') // default from memory
			})
		),
		readyMix: withDefaults(
			z.strictObject({
				price: price.optional().describe(`Per ${V}.`),
				increment: z.number().min(0.01).max(2).default(d.readyMixIncrement).describe(`Order step, ${V}; ask the plant.`), // from memory
				minimum: z.number().min(0).max(20).default(d.readyMixMinimum).describe(`Smallest order, ${V}; ask the plant.`), // from memory
				shortLoadFee: price.optional()
			})
		),
		prices: withDefaults(
			z.strictObject({
				gravel: price.optional().describe(`Per ${V}.`),
				lumber: price.optional().describe(`Per ${L} of board.`),
				stake: price.optional(),
				screw: price.optional(),
				mesh: price.optional().describe(`Per ${L}².`),
				releaseAgent: price.optional(),
				isolationStrip: price.optional().describe(`Per ${L}.`),
				curingCover: price.optional().describe(`Per ${L}².`),
				curingCompound: price.optional().describe(`Per ${imp ? 'US gal' : 'L'}.`),
				fiber: price.optional().describe(`Per ${imp ? 'lb' : 'kg'} of fiber.`),
				rebar: price.optional().describe(`Per ${L} of bar.`),
				chair: price.optional().describe('Per support chair.'),
				tools: price.optional().describe('Tools bought or hired, one sum; counted for bags and ready-mix alike.'),
				haulSoil: price.optional().describe('Per load of dug soil hauled away.')
			})
		),
		crew: withDefaults(
			z.strictObject({
				people: z.int().min(1).max(20).default(COMMON.people),
				method: z.enum(['hand', 'drum']).default('hand').describe('hand: tub or wheelbarrow.'),
				handMixMinutes: z.number().min(1).max(30).default(COMMON.handMixMinutesPer80lb).describe('Per 80 lb (36 kg) of dry mix; common practice 5–8 min.'),
				drumMinutesPerBatch: z.number().min(1).max(30).default(COMMON.drumMixMinutesPerBatch),
				drumBatchMass: z
					.number()
					.min(imp ? 20 : 10)
					.max(imp ? 500 : 225)
					.default(imp ? 160 : 72)
					.describe(`Dry mix per drum batch, ${M}; common practice two 80 lb bags.`),
				placeMinutesPerBag: z
					.number()
					.min(0)
					.max(30)
					.default(COMMON.placeMinutesPerBag)
					.describe('Per 80 lb (36 kg) of dry mix placed; smaller bags take their share; about 2 min (common practice).'), // from memory
				workingMinutes: z
					.number()
					.min(10)
					.max(300)
					.default(COMMON.workingMinutesAt70F)
					.describe('Workable time of the mix at 70 °F (21 °C); common practice 1½–2 h.'),
				finishMinutes: z.number().min(0).max(240).default(COMMON.finishMinutes),
				payload: z
					.number()
					.min(imp ? 100 : 45)
					.max(imp ? 20000 : 9000)
					.default(d.payload)
			})
		),
		conditions: withDefaults(
			z.strictObject({
				airTemp: z
					.union([temp, z.array(temp).min(1).max(60)])
					.default(d.airTemp)
					.describe(`Daily mean air temperature, ${T}: one value or one per day from the first pour.`),
				airLow: z
					.union([temp, z.array(temp.nullable()).min(1).max(60)])
					.optional()
					.describe(
						`Daily low air temperature, ${T}: one value or one per day (null for a day without its own low, which uses its mean); checked against ACI 306R's 40 °F.`
					),
				humidity: z.number().min(0).max(100).default(COMMON.humidity).describe('Relative humidity, %.'),
				wind: z
					.number()
					.min(0)
					.max(imp ? 100 : 160)
					.default(d.wind)
					.describe(imp ? 'mph' : 'km/h'),
				concreteTemp: temp.optional().describe(`As placed, ${T}; defaults to the air temperature.`),
				pourDate: z.iso.date().optional().describe('First pour day, YYYY-MM-DD.')
			})
		),
		milestones: withDefaults(
			z.strictObject({
				formsOffDays: z.number().min(0.5).max(14).default(COMMON.formsOffDays),
				walkDays: z.number().min(0.5).max(28).default(COMMON.walkDays),
				furnitureDays: z.number().min(0.5).max(28).default(COMMON.furnitureDays),
				vehiclePercent: z.number().min(10).max(100).default(COMMON.vehiclePercent)
			})
		).describe('Days are equivalent age at 20 °C (ASTM C1074), so cold weather pushes them out.'),
		joints: withDefaults(z.strictObject({ method: z.enum(['tool', 'saw']).default('tool') })),
		exposure: z
			.enum(['negligible', 'moderate', 'severe'])
			.default('moderate')
			.describe('Freeze–thaw weathering where the slab is (IRC Table R402.2): severe where winters freeze hard and de-icers are used.'),
		curing: withDefaults(
			z.strictObject({
				method: z
					.enum(['cover', 'wet', 'compound'])
					.default('cover')
					.describe('cover: plastic sheet or wet burlap; wet: sprinkle or pond; compound: ASTM C309 membrane.'),
				coverage: z
					.number()
					.min(imp ? 50 : 1)
					.max(imp ? 800 : 20)
					.default(d.compoundCoverage)
					.describe(`Compound coverage, ${imp ? 'ft² per US gal' : 'm² per L'}; the label rules.`)
			})
		),
		reinforcing: withDefaults(
			z.strictObject({
				meshForm: z.enum(['sheet', 'roll']).default('sheet'),
				meshWidth: z
					.number()
					.min(imp ? 2 : 0.6)
					.max(imp ? 12 : 3.6)
					.default(d.meshWidth)
					.describe(`${L}; sheet or roll width.`),
				meshLength: z
					.number()
					.min(imp ? 2 : 0.6)
					.max(imp ? 300 : 90)
					.default(d.meshLength)
					.describe(`${L}; sheet or roll length.`),
				wireSpacing: smallDim.default(d.wireSpacing).describe(`${S}; 6 in for 6×6 mesh.`),
				chairSpacing: z
					.number()
					.min(imp ? 1 : 0.3)
					.max(imp ? 6 : 1.8)
					.default(d.chairSpacing)
					.describe(`${L}; supports every 3 ft at most (WRI).`),
				barSpacing: smallDim.default(d.barSpacing).describe(`${S}; from the design, this is an example.`),
				barDiameter: smallDim.default(d.barDiameter).describe(`${S}; #3 bar is ⅜ in.`),
				barStock: z
					.number()
					.min(imp ? 4 : 1.2)
					.max(imp ? 40 : 12)
					.default(d.barStock)
					.describe(`${L}; bar length on sale.`),
				lapDiameters: z.number().min(0).max(100).default(40).describe('Lap splice in bar diameters; common practice 40.'),
				fiberPerBag: z
					.number()
					.min(0)
					.max(imp ? 16 : 500)
					.optional()
					.describe(`${imp ? 'oz' : 'g'} of fiber per bag of the plan's size, as the fiber label gives it.`)
			})
		)
	});
}

type EdgeRefOut = { section: number; edge: number };

type Parsed = z.output<ReturnType<typeof planSchemaFor>>;

/** Cross-field checks: edge references in range, custom board depth, fill, bag size, scope, geometry. */
function crossChecks(plan: Parsed): PlanIssue[] {
	const issues: PlanIssue[] = [];
	const outlines = mapList(plan.sections, (s) => s.outline);
	const checkEdge = (ref: EdgeRefOut | null | undefined, path: string) => {
		if (!ref) return;
		const o = outlines[ref.section];
		if (!o) issues.push({ path: `${path}.section`, message: `Choose a section from 0 to ${outlines.length - 1}; there is no section ${ref.section}.` });
		else if (ref.edge >= o.length)
			issues.push({ path: `${path}.edge`, message: `Choose an edge of section ${ref.section} from 0 to ${o.length - 1}; it has ${o.length} edges.` });
	};
	checkEdge(plan.houseEdge, 'houseEdge');
	plan.otherHouseEdges.forEach((r, i) => checkEdge(r, `otherHouseEdges.${i}`));
	if (!plan.houseEdge && plan.otherHouseEdges.length)
		issues.push({ path: 'otherHouseEdges', message: 'Choose the house edge first, or remove the other house edges.' });
	checkEdge(plan.slope.highEdge, 'slope.highEdge');
	const te = plan.thickenedEdge.edges;
	if (Array.isArray(te)) te.forEach((r, i) => checkEdge(r, `thickenedEdge.edges.${i}`));
	if (plan.forms.lumber === 'custom' && !plan.forms.customDepth)
		issues.push({
			path: 'forms.customDepth',
			message: `Enter the board depth for custom lumber, ${plan.units === 'imperial' ? '2–16 in' : '50–400 mm'}.`
		});
	if (plan.fill && (plan.fill.volume === undefined) === (plan.fill.shareOfTrench === undefined))
		issues.push({ path: 'fill', message: 'Give the fill as either a volume or a share of the trench, not both.' });
	if (plan.bags.planSize !== undefined && !plan.bags.offered.some((b) => b.size === plan.bags.planSize))
		issues.push({
			path: 'bags.planSize',
			message: `Choose the bag size for the mixing plan from the sizes on sale (${plan.bags.offered.map((b) => b.size).join(', ')}).`
		});
	const d = DEFAULTS[plan.units];
	// A plain loop: flatMap costs more than this whole check on every keystroke.
	const far: PlanIssue[] = [];
	outlines.forEach((o, s) => {
		const j = o.findIndex((p) => Math.abs(p[0]) > d.maxCoordinate || Math.abs(p[1]) > d.maxCoordinate);
		if (j >= 0)
			far.push({
				path: `sections.${s}.outline.${j}`,
				message: `Enter each corner within ±${plainNumber(d.maxCoordinate)} ${lengthUnit(plan.units)} of the origin.`
			});
	});
	if (far.length) return [...issues, ...far];
	const scope = scopeIssues(plan);
	// Out of scope: stop before the costlier geometry checks.
	if (scope.length) return [...issues, ...scope];
	issues.push(...geometryIssues(outlines));
	return issues;
}

const lengthUnit = (u: Units) => (u === 'imperial' ? 'ft' : 'm');

/** The plan against LIMITS: corners, outline length, area, stakes and bags. */
function scopeIssues(plan: Parsed): PlanIssue[] {
	const u = plan.units;
	const imp = u === 'imperial';
	const L = lengthUnit(u);
	const issues: PlanIssue[] = [];
	const outlines = mapList(plan.sections, (s) => s.outline);
	let vertices = 0;
	let edge = 0;
	let area = 0;
	for (const o of outlines) {
		vertices += o.length;
		edge += perimeter(o);
		area += Math.abs(signedArea(o));
	}
	if (vertices > LIMITS.vertices)
		issues.push({
			path: 'sections',
			message: `The outlines have ${vertices} corners in all; the limit is ${LIMITS.vertices}. Use fewer corners.`
		});
	if (edge > LIMITS.perimeter[u])
		issues.push({
			path: 'sections',
			message: `The outlines add up to ${plainNumber(Math.ceil(edge))} ${L} of edge; the limit is ${plainNumber(LIMITS.perimeter[u])} ${L}. Plan a larger job as separate slabs.`
		});
	if (area > LIMITS.area[u])
		issues.push({
			path: 'sections',
			message: `The slab is ${plainNumber(Math.ceil(area))} ${L}²; the limit is ${plainNumber(LIMITS.area[u])} ${L}². Plan a larger job as separate slabs.`
		});
	if (issues.length) return issues;
	const stakes = Math.ceil(edge / plan.forms.stakeSpacing);
	if (stakes > LIMITS.stakes)
		issues.push({
			path: 'forms.stakeSpacing',
			message: `Stakes every ${plainNumber(plan.forms.stakeSpacing)} ${L} along ${plainNumber(Math.round(edge))} ${L} of outline make about ${plainNumber(stakes)} stakes; the limit is ${LIMITS.stakes}. Space the stakes wider.`
		});
	// Concrete ordered, m³: slab plus the most a thickened edge can add, plus waste.
	const small = imp ? M_PER_IN : 0.001;
	const te = plan.thickenedEdge;
	const trenchLength = te.edges === 'none' ? 0 : te.edges === 'free' ? edge : te.edges.reduce((s, r) => s + edgeLength(outlines, r), 0);
	const orderM3 =
		(area * (imp ? M2_PER_FT2 : 1) * plan.thickness * small +
			trenchLength * (imp ? M_PER_FT : 1) * te.width * small * (te.extraDepth ?? plan.thickness) * small) *
		(1 + plan.wastePercent / 100);
	plan.bags.offered.forEach((b, i) => {
		const kg = imp ? b.size * KG_PER_LB : b.size;
		// Default yield from the bag-label ratio, 80 lb → 0.60 ft³ (as the engine's model).
		const yieldM3 = b.yield === undefined ? (kg / KG_PER_LB / COMMON.dryMixLbPerFt3) * M3_PER_FT3 : b.yield * (imp ? M3_PER_FT3 : 1);
		const count = Math.ceil(orderM3 / yieldM3);
		if (count > LIMITS.bags)
			issues.push({
				path: `bags.offered.${i}.size`,
				message: `With ${plainNumber(b.size)} ${imp ? 'lb' : 'kg'} bags this slab takes about ${plainNumber(count)} bags; the limit is ${plainNumber(LIMITS.bags)} of a size. Offer a larger bag, or plan ready-mix.`
			});
	});
	return issues;
}

function edgeLength(outlines: readonly (readonly (readonly [number, number])[])[], r: EdgeRefOut): number {
	const o = outlines[r.section];
	if (!o || r.edge >= o.length) return 0;
	const [a, b] = [o[r.edge], o[(r.edge + 1) % o.length]];
	return Math.hypot(b[0] - a[0], b[1] - a[1]);
}

export const planInputSchema = z.discriminatedUnion('units', [planSchemaFor('imperial'), planSchemaFor('metric')]).superRefine(
	(plan, ctx) => {
		for (const i of crossChecks(plan)) ctx.addIssue({ code: 'custom', path: i.path.split('.').map(pathPart), message: i.message });
	},
	// Only on input that passed every field check: an over-long outline never reaches the geometry.
	{ when: (payload) => payload.issues.length === 0 }
);

const pathPart = (p: string) => (/^\d+$/.test(p) ? Number(p) : p);

/** What a form or API client sends (optional fields may be left out). */
export type PlanInput = z.input<typeof planInputSchema>;
/** The input with every default filled in. */
export type ParsedPlan = z.output<typeof planInputSchema>;
export type EdgeRef = EdgeRefOut;

export type ParseResult = { ok: true; plan: ParsedPlan } | { ok: false; errors: PlanIssue[] };

/**
 * Validate anything against the schema; errors carry dotted paths like "sections.0.outline" and
 * plain-words messages (messages.ts), each (path, message) once.
 */
export function parsePlanInput(input: unknown): ParseResult {
	const r = planInputSchema.safeParse(input, { error: planErrorMap(input) });
	if (r.success) return { ok: true, plan: r.data };
	const seen = new Set<string>();
	const errors: PlanIssue[] = [];
	for (const i of r.error.issues.map(toPlanIssue)) {
		const k = `${i.path}\n${i.message}`;
		if (seen.has(k)) continue;
		errors.push(i);
		seen.add(k);
	}
	return { ok: false, errors };
}

function toPlanIssue(issue: z.core.$ZodIssue): PlanIssue {
	const path = issue.path.map(String);
	if (issue.code === 'unrecognized_keys' && issue.keys.length === 1) path.push(issue.keys[0]);
	return { path: path.join('.'), message: issue.message };
}

/** JSON Schema of what clients may send, defaults included. */
export function planInputJsonSchema() {
	return z.toJSONSchema(planInputSchema, { io: 'input', unrepresentable: 'any' });
}
