// Plain-words messages for the plan schema, written once: the API, the forms and the wizard all read
// them. zod calls planErrorMap for every issue that has no message of its own; it names the field,
// its unit and what to enter, never the validator's own wording.

import type { z } from 'zod';
import { list } from './format';
import type { Units } from './units';

/** How a fall or cross fall is given, the largest of each a plan may take (a 25 % slope), and its words. */
export const RATE_UNITS = ['percent', 'inPerFt', 'mmPerM', 'totalDrop'] as const;
export type RateUnit = (typeof RATE_UNITS)[number];
export const RATE_MAX: Record<RateUnit, number> = { percent: 25, inPerFt: 3, mmPerM: 250, totalDrop: Infinity };
const RATE_WORDS: Record<Units, Record<RateUnit, string>> = {
	imperial: { percent: '%', inPerFt: 'in per ft', mmPerM: 'mm per m', totalDrop: 'in' },
	metric: { percent: '%', inPerFt: 'in per ft', mmPerM: 'mm per m', totalDrop: 'mm' }
};

/**
 * "Enter the fall, 0–3 in per ft." A fall's range and unit follow the unit it is given in; a total
 * drop is bounded by the largest small dimension (`maxDrop`, 48 in or 1,200 mm).
 */
export function rateMessage(label: string, rate: RateUnit | undefined, units: Units, signed: boolean, maxDrop: number): string {
	if (!rate || !(rate in RATE_MAX)) return `Enter ${label} as a number with its unit: %, in per ft, mm per m, or a total drop in ${UNIT[units].S}.`;
	const max = rate === 'totalDrop' ? maxDrop : RATE_MAX[rate];
	return `Enter ${label}${range(signed ? -max : 0, max, RATE_WORDS[units][rate])}.`;
}

type UnitKind = 'L' | 'S' | 'T' | 'M' | 'V' | 'PV' | 'psi' | 'wind' | '%' | 'min' | 'days' | 'money' | 'x' | 'dens' | 'cover' | 'dose';

const UNIT: Record<Units, Record<UnitKind, string>> = {
	imperial: {
		L: 'ft',
		S: 'in',
		T: '°F',
		M: 'lb',
		V: 'yd³',
		PV: 'ft³',
		psi: 'psi',
		wind: 'mph',
		'%': '%',
		min: 'min',
		days: 'days',
		money: 'USD',
		x: '',
		dens: 'short tons per yd³',
		cover: 'ft² per US gal',
		dose: 'oz'
	},
	metric: {
		L: 'm',
		S: 'mm',
		T: '°C',
		M: 'kg',
		V: 'm³',
		PV: 'm³',
		psi: 'MPa',
		wind: 'km/h',
		'%': '%',
		min: 'min',
		days: 'days',
		money: 'USD',
		x: '',
		dens: 't per m³',
		cover: 'm² per L',
		dose: 'g'
	}
};

/**
 * Each field's name in a sentence and its unit, by its path without list indices. Fields missing
 * here still get a plain message, named from their key.
 */
const FIELDS: Record<string, [string, UnitKind?]> = {
	units: ['the units'],
	name: ['the plan name'],
	currency: ['the currency code (ISO 4217, such as USD)'],
	sections: ['the pour sections'],
	'sections.name': ['the section name'],
	'sections.outline': ['the outline', 'L'],
	houseEdge: ['the house edge'],
	'houseEdge.section': ['the house edge’s section number'],
	'houseEdge.edge': ['the house edge’s edge number'],
	otherHouseEdges: ['the other house edges'],
	'otherHouseEdges.section': ['the house edge’s section number'],
	'otherHouseEdges.edge': ['the house edge’s edge number'],
	gapToHouse: ['the gap to the house', 'S'],
	houseEdgeFormed: ['whether a form board runs along the house'],
	reference: ['the reference mark'],
	'reference.label': ['the reference mark’s name'],
	'reference.below': ['how far the slab sits below the reference mark', 'S'],
	slope: ['the slope'],
	'slope.fall': ['the fall'],
	'slope.fall.value': ['the fall'],
	'slope.fall.unit': ['the fall’s unit'],
	'slope.crossFall': ['the cross fall'],
	'slope.crossFall.value': ['the cross fall'],
	'slope.crossFall.unit': ['the cross fall’s unit'],
	'slope.highEdge': ['the high edge'],
	'slope.highEdge.section': ['the high edge’s section number'],
	'slope.highEdge.edge': ['the high edge’s edge number'],
	thickness: ['the thickness', 'S'],
	forms: ['the forms'],
	'forms.lumber': ['the form board size'],
	'forms.customDepth': ['the board depth', 'S'],
	'forms.stakeSpacing': ['the stake spacing', 'L'],
	'forms.stakeLength': ['the stake length', 'S'],
	'forms.release': ['what keeps concrete off the boards'],
	'forms.stockLengths': ['the board lengths on sale', 'L'],
	thickenedEdge: ['the thickened edge'],
	'thickenedEdge.edges': ['the thickened edges'],
	'thickenedEdge.edges.section': ['the thickened edge’s section number'],
	'thickenedEdge.edges.edge': ['the thickened edge’s edge number'],
	'thickenedEdge.width': ['the trench width', 'S'],
	'thickenedEdge.extraDepth': ['the trench depth below the slab', 'S'],
	'thickenedEdge.profile': ['the trench profile'],
	base: ['the base'],
	'base.depth': ['the base depth', 'S'],
	'base.bulking': ['the loose-to-compacted ratio of the base stone', 'x'],
	'base.overhang': ['how far the base reaches past the forms', 'S'],
	'base.stoneDensity': ['the weight of the compacted base stone', 'dens'],
	'base.soilDensity': ['the weight of the dug soil', 'dens'],
	fill: ['the fill'],
	'fill.volume': ['the fill volume', 'PV'],
	'fill.shareOfTrench': ['the fill’s share of the trench (0.2 for a fifth)', 'x'],
	'fill.largestPiece': ['the largest fill piece', 'S'],
	reinforcement: ['the reinforcement'],
	loads: ['the loads'],
	'loads.vehicles': ['whether vehicles drive on the slab'],
	'loads.pointLoads': ['whether the slab carries point loads'],
	mix: ['the mix'],
	'mix.cement': ['the cement type'],
	'mix.designStrength': ['the design strength', 'psi'],
	wastePercent: ['the waste allowance', '%'],
	bags: ['the bags'],
	'bags.offered': ['the bag sizes on sale'],
	'bags.offered.size': ['the bag size', 'M'],
	'bags.offered.yield': ['the bag yield', 'PV'],
	'bags.offered.price': ['the bag price', 'money'],
	'bags.planSize': ['the bag size for the mixing plan', 'M'],
	'bags.waterRatio': ['the water per dry mix by mass (0.08 for 8 %)', 'x'],
	readyMix: ['the ready-mix details'],
	'readyMix.price': ['the ready-mix price', 'money'],
	'readyMix.increment': ['the ready-mix order step', 'V'],
	'readyMix.minimum': ['the ready-mix minimum order', 'V'],
	'readyMix.shortLoadFee': ['the short-load fee', 'money'],
	prices: ['the prices'],
	'prices.gravel': ['the gravel price', 'money'],
	'prices.lumber': ['the board price', 'money'],
	'prices.stake': ['the stake price', 'money'],
	'prices.screw': ['the screw price', 'money'],
	'prices.mesh': ['the mesh price', 'money'],
	'prices.releaseAgent': ['the release agent price', 'money'],
	'prices.isolationStrip': ['the isolation strip price', 'money'],
	'prices.curingCover': ['the curing cover price', 'money'],
	'prices.curingCompound': ['the curing compound price', 'money'],
	'prices.fiber': ['the fibre price', 'money'],
	'prices.rebar': ['the reinforcing bar price', 'money'],
	'prices.chair': ['the support chair price', 'money'],
	'prices.tools': ['the tools price', 'money'],
	'prices.haulSoil': ['the price of hauling a load of soil', 'money'],
	crew: ['the crew'],
	'crew.people': ['the number of people'],
	'crew.method': ['the mixing method'],
	'crew.handMixMinutes': ['the hand-mixing time per 80 lb (36 kg) of mix', 'min'],
	'crew.drumMinutesPerBatch': ['the drum time per batch', 'min'],
	'crew.drumBatchMass': ['the dry mix per drum batch', 'M'],
	'crew.placeMinutesPerBag': ['the placing time per 80 lb (36 kg) bag', 'min'],
	'crew.workingMinutes': ['the working time of the mix', 'min'],
	'crew.finishMinutes': ['the finishing time', 'min'],
	'crew.payload': ['the vehicle payload', 'M'],
	conditions: ['the weather'],
	'conditions.airTemp': ['the air temperature', 'T'],
	'conditions.airLow': ['the low air temperature', 'T'],
	'conditions.humidity': ['the humidity', '%'],
	'conditions.wind': ['the wind speed', 'wind'],
	'conditions.concreteTemp': ['the concrete temperature', 'T'],
	'conditions.pourDate': ['the pour date'],
	milestones: ['the milestones'],
	'milestones.formsOffDays': ['the days before the forms come off', 'days'],
	'milestones.walkDays': ['the days before walking on it', 'days'],
	'milestones.furnitureDays': ['the days before furniture', 'days'],
	'milestones.vehiclePercent': ['the strength share before vehicles', '%'],
	joints: ['the joints'],
	'joints.method': ['the jointing method'],
	exposure: ['the freeze–thaw exposure'],
	curing: ['the curing'],
	'curing.method': ['the curing method'],
	'curing.coverage': ['the curing compound coverage', 'cover'],
	reinforcing: ['the reinforcement details'],
	'reinforcing.meshForm': ['whether the mesh comes in sheets or a roll'],
	'reinforcing.meshWidth': ['the mesh sheet or roll width', 'L'],
	'reinforcing.meshLength': ['the mesh sheet or roll length', 'L'],
	'reinforcing.wireSpacing': ['the wire spacing of the mesh', 'S'],
	'reinforcing.chairSpacing': ['the support chair spacing', 'L'],
	'reinforcing.barSpacing': ['the bar spacing', 'S'],
	'reinforcing.barDiameter': ['the bar diameter', 'S'],
	'reinforcing.barStock': ['the bar length on sale', 'L'],
	'reinforcing.lapDiameters': ['the lap splice, in bar diameters', 'x'],
	'reinforcing.fiberPerBag': ['the fibre per bag', 'dose']
};

/**
 * A field's name in plain words from an engine path: "sections.0.outline" → "the outline of pour 1",
 * "bags.offered.2.price" → "the bag price (bag size 3)". Never shows the path itself.
 */
export function fieldLabel(path: string): string {
	const parts = path.split('.').filter(Boolean);
	const keys = parts.filter((p) => !/^\d+$/.test(p));
	let label = '';
	for (let n = keys.length; n > 0 && !label; n--) label = FIELDS[keys.slice(0, n).join('.')]?.[0] ?? '';
	if (!label) label = keys.length ? fromKey(keys[keys.length - 1]) : 'the plan';
	// The 1-based place of the item of `list` the path goes through, if it does.
	const at = (list: string) => {
		const i = parts.indexOf(list);
		return i >= 0 && /^\d+$/.test(parts[i + 1] ?? '') ? Number(parts[i + 1]) + 1 : null;
	};
	const pour = at('sections');
	if (pour !== null && keys[0] === 'sections') label += ` of pour ${pour}`;
	const bag = parts[0] === 'bags' ? at('offered') : null;
	if (bag !== null) label += ` (bag size ${bag})`;
	const day = parts[0] === 'conditions' ? at(keys[keys.length - 1]) : null;
	if (day !== null) label += ` (day ${day})`;
	return label;
}

/** What to call a list's items when saying how many it may hold. */
const ITEMS: Record<string, string> = {
	sections: 'sections',
	'sections.outline': 'corners',
	otherHouseEdges: 'other house edges',
	'thickenedEdge.edges': 'edges',
	'forms.stockLengths': 'board lengths',
	'bags.offered': 'bag sizes',
	'conditions.airTemp': 'daily temperatures',
	'conditions.airLow': 'daily temperatures'
};

/** "drumBatchMass" → "the drum batch mass": a readable name for a field missing from FIELDS. */
const fromKey = (key: string) => `the ${key.replace(/([a-z])([A-Z])/g, '$1 $2').toLowerCase()}`;

/** A number as a person writes it: 10000 → "10,000", −48 → "−48". */
const plainFormat = new Intl.NumberFormat('en-US', { maximumFractionDigits: 3 });
export const plainNumber = (x: number) => plainFormat.format(x).replace('-', '−');

/** ", 2–12 in", ", a whole number 1–20", ", at least 4 ft" or " in ft". */
function range(min: number | null | undefined, max: number | null | undefined, unit: string, whole = false): string {
	const u = unit ? ` ${unit}` : '';
	const w = whole ? 'a whole number ' : '';
	const lo = min != null && Number.isFinite(min) ? min : null;
	const hi = max != null && Number.isFinite(max) ? max : null;
	if (lo !== null && hi !== null) return `, ${w}${plainNumber(lo)}${lo < 0 ? ' to ' : '–'}${plainNumber(hi)}${u}`;
	if (lo !== null) return `, ${w}at least ${plainNumber(lo)}${u}`;
	if (hi !== null) return `, ${w}at most ${plainNumber(hi)}${u}`;
	return whole ? ', a whole number' : unit ? ` in ${unit}` : '';
}

type Issue = z.core.$ZodRawIssue;
/** What zod's number schemas tell about their bounds. */
interface NumberInfo {
	minValue?: number | null;
	maxValue?: number | null;
	isInt?: boolean;
}

type Tree = Record<PropertyKey, unknown>;
/** The value at a path of the input, if the input has it. */
function at(input: unknown, path: readonly PropertyKey[]): unknown {
	let v = input;
	for (const k of path) v = v !== null && typeof v === 'object' ? (v as Tree)[k] : undefined;
	return v;
}

/** The currency the plan's prices are in, as its code ("USD"); the default when it is not one. */
function currencyOf(input: unknown): string {
	const c = at(input, ['currency']);
	return typeof c === 'string' && /^[A-Za-z]{3}$/.test(c.trim()) ? c.trim().toUpperCase() : 'USD';
}

/**
 * The message for one issue of a plan in the given units. `input` is the plan being checked: a
 * fall's unit and the prices' currency are read from it, so every range names its unit.
 */
export function planMessage(iss: Issue, units: Units, input?: unknown): string {
	const path = (iss.path ?? []) as PropertyKey[];
	const keys = path.filter((p): p is string => typeof p === 'string');
	const key = keys.join('.');
	const [label, kind] = FIELDS[key] ?? [keys.length ? fromKey(keys[keys.length - 1]) : 'the plan'];
	const unit = kind === 'money' ? currencyOf(input) : kind ? UNIT[units][kind] : '';
	// A fall's number: its range and unit follow the unit it is given in (%, in per ft, a drop in in).
	if ((key === 'slope.fall.value' || key === 'slope.crossFall.value') && (iss.code === 'invalid_type' || iss.code === 'too_small' || iss.code === 'too_big')) {
		const rate = at(input, [...path.slice(0, -1), 'unit']) as RateUnit | undefined;
		return rateMessage(label, rate, units, key === 'slope.crossFall.value', units === 'imperial' ? 48 : 1200);
	}
	const Label = label[0].toUpperCase() + label.slice(1);
	// A corner of an outline: [x, y] in the plan's length unit.
	if (key === 'sections.outline' && typeof path[path.length - 1] === 'number') return `Enter each corner as two numbers [x, y] in ${unit}.`;
	// The schema that owns the issue (for a min/max check, the number it belongs to).
	const owner = ((iss as { schema?: unknown }).schema ?? iss.inst ?? {}) as NumberInfo;
	const [min, max] = [owner.minValue, owner.maxValue];
	const whole = owner.isInt === true;
	switch (iss.code) {
		case 'invalid_type':
			switch (iss.expected) {
				case 'number':
				case 'int':
					return `Enter ${label}${range(min, max, unit, whole)}.`;
				case 'boolean':
					return `Choose yes or no (true or false) for ${label}.`;
				case 'string':
					return `Enter ${label} as text.`;
				case 'array':
				case 'tuple':
					return `Give ${label} as a list.`;
				case 'object':
					return keys.length ? `Give ${label} as an object with its fields.` : 'Send the plan as a JSON object with its units and sections.';
				case 'null':
					return `Leave ${label} empty (null) or choose one.`;
				default:
					return `Check ${label}.`;
			}
		case 'too_small':
		case 'too_big': {
			if (iss.origin === 'number' || iss.origin === 'int' || iss.origin === 'bigint')
				return `Enter ${label}${range(min ?? (iss.code === 'too_small' ? Number(iss.minimum) : null), max ?? (iss.code === 'too_big' ? Number(iss.maximum) : null), unit, whole)}.`;
			if (iss.origin === 'string') return iss.code === 'too_big' ? `Shorten ${label} to ${iss.maximum} characters or fewer.` : `Enter ${label}.`;
			if (iss.origin === 'array' || iss.origin === 'set') {
				const items = ITEMS[key] ?? 'entries';
				if (key === 'sections' && iss.code === 'too_small') return 'Draw at least one section (an outline of 3 or more corners).';
				if (key === 'sections') return `Give at most ${iss.maximum} sections (pours); plan a larger job as separate slabs.`;
				return iss.code === 'too_big'
					? `Give at most ${plainNumber(Number(iss.maximum))} ${items} in ${label}.`
					: `Give at least ${plainNumber(Number(iss.minimum))} ${items === 'sections' && Number(iss.minimum) === 1 ? 'section' : items} in ${label}.`;
			}
			return `Check ${label}.`;
		}
		case 'not_multiple_of':
			return `Enter ${label}${range(min, max, unit, true)}.`;
		case 'invalid_value':
			return `Choose ${label}: ${list(iss.values)}.`;
		case 'invalid_format':
			return iss.format === 'date' ? dateMessage(label, at(input, path)) : `Check the form of ${label}.`;
		case 'unrecognized_keys':
			return `${
				iss.keys.length > 1
					? `The fields ${list(
							iss.keys.map((k) => `"${k}"`),
							'and'
						)} are`
					: `The field "${iss.keys[0]}" is`
			} not part of ${keys.length ? label : 'a plan'}; check the spelling or remove ${iss.keys.length > 1 ? 'them' : 'it'}.`;
		case 'invalid_union':
			if (key === 'units') return 'Choose the units: imperial or metric.';
			if (key === 'conditions.airTemp' || key === 'conditions.airLow')
				return `Enter ${label}${range(units === 'imperial' ? -40 : -40, units === 'imperial' ? 130 : 55, unit)}, as one value or a list of one per day.`;
			if (key === 'thickenedEdge.edges') return `Choose ${label}: none, free, or a list of edges ({ section, edge }).`;
			return `Check ${label}.`;
		default:
			return `${Label} is not valid; check it.`;
	}
}

/**
 * A date the schema refused. It takes ISO dates, whose years have four digits, so the last day a plan
 * can hold is 31 December 9999; a browser's date box takes years up to 275760 and hands a longer one
 * on as it is (192027-06-12). Only a value not written year-month-day at all, which no date box
 * gives, is told how to write one.
 */
export function dateMessage(label: string, value: unknown): string {
	const s = typeof value === 'string' ? value.trim() : '';
	if (/^\+?\d{5,}-\d{2}-\d{2}$/.test(s)) return `${label[0].toUpperCase()}${label.slice(1)} is too far ahead: a plan takes days up to 31 December 9999.`;
	if (/^\d{4}-\d{2}-\d{2}$/.test(s)) return `Enter ${label} as a real calendar date.`;
	return `Enter ${label} as a real calendar date, written year-month-day (2027-06-12).`;
}

/** The zod error map for checking one plan (zod's per-parse error customisation). */
export function planErrorMap(input: unknown): z.core.$ZodErrorMap {
	const units: Units = at(input, ['units']) === 'metric' ? 'metric' : 'imperial';
	return (iss) => planMessage(iss, units, input);
}
