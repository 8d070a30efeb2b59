// Cautions: where the job can hurt someone or fail, each with the reason it applies to this plan,
// what to do, and the source. The deferral to local codes and licensed practice always comes first.

import type { ElevationResult } from './elevations';
import { MAX_COMFORTABLE_FALL, MIN_FALL } from './elevations';
import type { JointsResult } from './joints';
import type { MixingResult } from './mixing';
import { NIOSH_LOAD_CONSTANT_KG } from './mixing';
import type { Model } from './model';
import { CROSS_FALL_MIN_SINE, edgeSine } from './polygon';
import { MPA_PER_PSI, M_PER_IN } from './units';
import { filterList, mapList } from './util';
import type { VolumeResult } from './volume';
import { addDays as addDaysIso, type ScheduleResult } from './schedule';
import { toLbPerFt2h, type WeatherResult } from './weather';

export type Severity = 'info' | 'warning' | 'danger';

export interface Caution {
	id: string;
	title: string;
	reason: string;
	action: string;
	source: string;
	severity: Severity;
}

export interface CautionContext {
	m: Model;
	volume: VolumeResult;
	elevations: ElevationResult;
	mixing: MixingResult;
	joints: JointsResult;
	weather: WeatherResult;
	schedule?: ScheduleResult;
}

/**
 * IRC Table R402.2, porches, carport slabs and steps exposed to the weather (the row nearest a
 * patio or walk): least 28-day strength by weathering potential, psi, and air entrainment 5–7 %
 * where moderate or severe. Values as in reproductions of the 2018 IRC, not re-checked here.
 */
export const IRC_R402_2 = {
	psi: { negligible: 2500, moderate: 3000, severe: 3500 },
	air: { negligible: null, moderate: [5, 7], severe: [5, 7] }
} as const;

/** IRC R506.1 / ACI 332: slabs on ground at least 3½ in (89 mm). */
export const MIN_THICKNESS_M = 3.5 * M_PER_IN;

/** An edge by the corner letters the wizard and the layout sheet use: "edge D–E", or "edge 2A–2B" with several pours. */
export function edgeLabel(m: Pick<Model, 'sections'>, s: number, e: number): string {
	const many = m.sections.length > 1;
	const n = m.sections[s].outline.length;
	const at = (v: number) => `${many ? s + 1 : ''}${String.fromCharCode(65 + (v % 26)) + (v >= 26 ? Math.floor(v / 26) : '')}`;
	return `edge ${at(e)}–${at((e + 1) % n)}`;
}

const one = (x: number, d = 1) => String(Math.round(x * 10 ** d) / 10 ** d);

/** Modulus of rupture, ACI 318-19 §19.2.3: 7.5 √f'c psi, or 0.62 √f'c MPa. */
export const modulusOfRupture = { psi: (fc: number) => 7.5 * Math.sqrt(fc), mpa: (fc: number) => 0.62 * Math.sqrt(fc) };

type Rule = (c: CautionContext) => Caution | null;

const localCodes: Rule = () => ({
	id: 'local-codes',
	title: 'Local codes, permits and licensed practice come first',
	reason: 'Every number here is a planning estimate from published general rules; your town may require a permit, an inspection or different details.',
	action: 'Check with the local building department before you dig, and hire a licensed professional where the work, the loads or the site call for one.',
	// IRC R105 section number from memory
	source: 'Local building code as adopted (e.g. IRC R105 permits)',
	severity: 'info'
});

const utilities: Rule = () => ({
	id: 'utility-locate',
	title: 'Have buried utilities marked before digging',
	reason: 'The plan digs for the slab and its base; gas, power and water lines can run shallow.',
	action:
		'Call 811 in the US (or your one-call number) at least 3 working days before digging — the day plan schedules it — wait for every utility to mark, and dig by hand near the marks.',
	source: 'FCC 05-59 (2005), 811 as the one-call number; notice set by state one-call law (2–3 working days in most states)',
	severity: 'warning'
});

const wetCement: Rule = () => ({
	id: 'wet-cement',
	title: 'Wet cement burns skin and eyes',
	reason: 'Mixing and placing the bags keeps you in contact with wet concrete for hours.',
	action: 'Wear alkali-resistant gloves, rubber boots and eye protection; wash skin with pH-neutral soap and water; kneel on boards, not in the mix.',
	source: 'OSHA 3351-07',
	severity: 'warning'
});

const bagWeight: Rule = ({ mixing }) => {
	const kg = mixing.heaviestLift.mass.kilograms;
	const over = kg > NIOSH_LOAD_CONSTANT_KG;
	return {
		id: 'bag-weight',
		title: over ? 'Each bag weighs more than the NIOSH load constant' : 'Lifting bags from the ground',
		reason: `The ${one(mixing.bag.size)} ${mixing.bag.unit} bags${mixing.bag.unit === 'kg' ? '' : ` (${one(kg)} kg)`} are ${over ? 'over' : 'near'} the NIOSH load constant of ${mixing.bag.unit === 'kg' ? '23 kg (51 lb)' : '51 lb (23 kg)'}, and lifting from the ground lowers the recommended limit well below it; the crew handles about ${mixing.bagsPerPerson} bags each.`,
		action: 'Lift with two people or slide bags at waist height from the vehicle; choose a smaller bag size; take turns.',
		source: 'NIOSH Revised Lifting Equation, Pub. 94-110',
		severity: over ? 'warning' : 'info'
	};
};

const silica: Rule = ({ joints }) => {
	if (joints.totalLength.meters <= 0) return null;
	const saw = joints.method === 'saw';
	return {
		id: 'silica-saw',
		title: 'Silica dust from saw-cutting joints',
		reason: saw
			? `The plan saw-cuts ${one(joints.totalLength.feet)} ft (${one(joints.totalLength.meters)} m) of control joints; dry cutting raises respirable crystalline silica.`
			: 'The plan tools its joints; this applies if you saw-cut instead.',
		action: 'Use a saw with a water feed; outdoors, wear a respirator (APF 10) if you cut more than 4 hours in a shift; keep others upwind.',
		source: 'OSHA 29 CFR 1926.1153, Table 1 (PEL 50 µg/m³, 8-h TWA)',
		severity: saw ? 'warning' : 'info'
	};
};

/**
 * Vehicle and point loads need a designed slab whatever the reinforcement: mesh and rebar hold
 * cracks tight once the concrete has cracked, they do not raise the cracking load of a thin slab
 * (ACI 318-19 §19.2.3 modulus of rupture; ACI 302.1R on reinforcement for crack width).
 */
const loads: Rule = ({ m }) => {
	const steel = m.reinforcement === 'mesh' || m.reinforcement === 'rebar';
	const loaded = m.loads.vehicles || m.loads.pointLoads;
	if (steel && !loaded) return null;
	const psi = m.designStrengthMpa / MPA_PER_PSI;
	const fr = m.units === 'imperial' ? `${Math.round(modulusOfRupture.psi(psi))} psi` : `${one(modulusOfRupture.mpa(m.designStrengthMpa), 2)} MPa`;
	const what = steel
		? `reinforced with ${m.reinforcement === 'mesh' ? 'welded wire mesh' : 'rebar'}`
		: m.reinforcement === 'fiber'
			? 'fiber-reinforced only'
			: 'unreinforced';
	return {
		id: steel ? 'loads-need-design' : 'unreinforced-loads',
		title: steel ? 'Reinforcement does not make a slab carry vehicles' : 'Unreinforced concrete cracks under point and vehicle loads',
		reason: `The slab is ${what}; it cracks once bending exceeds its modulus of rupture, about ${fr} here${steel ? ', and mesh or bars only hold the cracks closed afterwards' : ''}${loaded ? '; the plan expects vehicles or heavy point loads' : ''}.`,
		action: loaded
			? 'Have the slab designed for the loads (thickness, reinforcement, base) by a licensed professional; do not drive or set heavy loads on a patio slab.'
			: 'Keep vehicles, hot tubs and post loads off it unless it is designed for them.',
		source: 'ACI 318-19 §19.2.3',
		severity: loaded ? 'danger' : 'info'
	};
};

const freezeThaw: Rule[] = [
	({ m }) => {
		const need = IRC_R402_2.psi[m.exposure];
		const psi = m.designStrengthMpa / MPA_PER_PSI;
		const low = psi < need - 0.5;
		const air = IRC_R402_2.air[m.exposure];
		if (!air && !low) return null;
		const strength = m.units === 'imperial' ? `${need} psi` : `${one(need * MPA_PER_PSI)} MPa`;
		return {
			id: 'freeze-thaw',
			title: 'Winters that freeze: air-entrained concrete and enough strength',
			reason: `For ${m.exposure} weathering an exterior slab needs at least ${strength}${air ? ` and ${air[0]}–${air[1]} % entrained air, which lets water in the pores freeze without spalling the surface` : ''}; the plan uses ${m.units === 'imperial' ? `${Math.round(psi)} psi` : `${one(m.designStrengthMpa)} MPa`}.`,
			action: `${low ? `Raise the design strength to ${strength}. ` : ''}${air ? 'Order air-entrained ready-mix, or buy a bagged mix labelled air-entrained or for exterior freeze–thaw use; plain bagged mix usually is not.' : ''}`,
			source: 'IRC Table R402.2 (as reproduced from the 2018 IRC)',
			severity: low || air ? 'warning' : 'info'
		};
	},
	({ m }) =>
		m.exposure === 'negligible'
			? null
			: {
					id: 'first-winter-deicer',
					title: 'No de-icing salt the first winter',
					reason: 'Young concrete has not dried out enough to resist de-icers; salts scale the surface where water freezes in it.',
					action: 'Use sand for grip in the first winter; never use ammonium sulfate or ammonium nitrate de-icers at all.',
					// concrete industry guidance, from memory
					source: 'common practice, no published source (concrete industry guidance)',
					severity: 'info'
				}
];

const fillNearSurface: Rule = ({ m }) => {
	if (!m.fill || m.fill.largestPiece <= m.thickened.extraDepth) return null;
	const cover = m.thickness + m.thickened.extraDepth - m.fill.largestPiece;
	return {
		id: 'fill-near-surface',
		title: 'Chunk fill too close to the surface',
		reason: `The largest chunk is taller than the trench below the slab, leaving about ${one(cover / M_PER_IN)} in (${Math.round(cover * 1000)} mm) of concrete over it instead of the full slab thickness.`,
		action: 'Break the chunks smaller than the trench depth, keep them off the forms, and surround each with concrete.',
		source: 'common practice, no published source',
		severity: 'warning'
	};
};

const oilRelease: Rule = ({ m }) =>
	m.forms.release !== 'oil'
		? null
		: {
				id: 'form-release-oil',
				title: 'Use a form release agent, never waste motor oil',
				reason: 'The plan lists oil as the form release; used motor oil soaks into the soil and stains the concrete edge.',
				action: 'Use a commercial release agent made for concrete forms, applied thinly before the pour.',
				// 40 CFR 279 citation from memory
				source: 'common practice; used-oil rules under 40 CFR 279',
				severity: 'warning'
			};

/** A slab top above the door sill or the slab it meets sends water in under the door. */
const aboveReference: Rule = ({ m }) =>
	m.reference.below >= 0
		? null
		: {
				id: 'above-reference',
				title: `The slab would finish above the ${m.reference.label}`,
				reason: `The Site step puts the high point of the slab ${m.units === 'metric' ? `${Math.round(-m.reference.below * 1000)} mm` : `${one(-m.reference.below / M_PER_IN, 2)} in`} above the ${m.reference.label}, so water running off it can reach the ${m.reference.label} and get in under a door or against the wall.`,
				action: 'In the Site step, enter a positive "High point of the slab below it by": most slabs finish a little below a door sill or the slab they meet.',
				// IRC R311.3 (landing at most 1½ in below the threshold) and R401.3: section numbers from memory
				source: 'IRC R311.3 and R401.3',
				severity: 'warning'
			};

const drainage: Rule[] = [
	({ m, elevations: e }) => {
		const bad = filterList(e.houseEdges, (h) => h.fallAway.percent <= 0);
		if (!bad.length) return null;
		const walls = mapList(bad, (h) => `${edgeLabel(m, h.section, h.edge)}${m.sections.length > 1 ? ` of ${m.sections[h.section].name}` : ''}`);
		const worst = -Math.min(...bad.map((h) => h.fallAway.percent));
		const high = m.highEdge;
		const highIsBad = bad.some((h) => h.section === high.section && h.edge === high.edge);
		const outline = (s: number) => m.sections[s].outline;
		// Beside a wall parallel to the high side the fall runs straight at it; a cross fall runs along it.
		const crossHelps = bad.every((h) => edgeSine(outline(h.section), h.edge, outline(high.section), high.edge) >= CROSS_FALL_MIN_SINE);
		return {
			id: 'water-toward-foundation',
			title: 'Water would run toward the foundation',
			reason: `Along the house wall ${walls.join(' and ')} the surface ${worst > 0.005 ? `falls ${one(worst, 2)} % toward the house` : 'is level, so water stands against the house'}.`,
			action: highIsBad
				? `In the Pitch step, raise Fall so the surface falls at least 2 % away from the house wall ${walls[0]}.`
				: crossHelps
					? `In the Pitch step, choose the house wall ${walls[0]} as High side, or enter a Cross fall (under "Fall along the high side") so every house wall falls away from the house.`
					: `In the Pitch step, choose the house wall ${walls[0]} as High side: the fall now runs from the high side straight toward it, and a cross fall, which runs along the high side, cannot turn it.`,
			source: 'IRC R401.3',
			severity: 'danger'
		};
	},
	({ elevations: e }) => {
		const low = filterList(e.houseEdges, (h) => !h.meetsIrc && h.fallAway.percent > 0);
		if (!low.length) return null;
		return {
			id: 'drainage-2-percent',
			title: 'Less than 2 % fall away from the house',
			reason: `Within 10 ft of the foundation the slab falls only ${one(Math.min(...low.map((h) => h.fallAway.percent)), 2)} % away from it.`,
			action: 'Raise the fall to at least 2 % (¼ in/ft) away from the house, or provide drains as the building official allows.',
			source: 'IRC R401.3',
			severity: 'warning'
		};
	},
	({ elevations: e }) =>
		e.steepest.percent / 100 > MAX_COMFORTABLE_FALL + 1e-12
			? {
					id: 'slope-steep',
					title: 'Steep surface',
					reason: `The surface falls ${one(e.steepest.percent)} % at its steepest; past about 5 % (1:20) it reads as a ramp and furniture tips.`,
					action: 'Lower the fall, step the slab, or treat it as a walk ramp with a rough finish.',
					// from memory: the ADA running-slope limit applied to a patio
					source: 'common practice, after ADA 2010 Standards §403.3 (1:20 running slope)',
					severity: 'warning'
				}
			: null,
	({ elevations: e }) =>
		e.steepest.percent / 100 < MIN_FALL - 1e-12
			? {
					id: 'slope-flat',
					title: 'Too flat to shed water',
					reason: `The surface falls only ${one(e.steepest.inchesPerFoot, 3)} in/ft; water will pond.`,
					action: 'Give it at least ⅛ in/ft; ¼ in/ft (2 %) drains surely.',
					source: 'ACI 302.1R (¼ in/ft); ⅛ in/ft common practice',
					severity: 'warning'
				}
			: null
];

const weatherRules: Rule[] = [
	({ weather: w }) => {
		if (!w.cold) return null;
		const safe = w.pours.map((p) => p.freezeSafeHours).filter((h): h is number => h !== null);
		const last = w.pours.reduce((a, p) => ((p.freezeSafeHours ?? Infinity) > (a.freezeSafeHours ?? Infinity) ? p : a));
		const when = !safe.length
			? 'does not reach 500 psi (3.5 MPa) within 60 days at these temperatures'
			: `reaches 500 psi (3.5 MPa), enough to survive a single freeze, about ${Math.ceil(Math.max(...safe))} h after placing${last.date && last.freezeSafeDay !== null ? ` (by ${addDaysIso(last.date, last.freezeSafeDay)})` : ''}`;
		return {
			id: 'cold-weather',
			title: 'Cold weather',
			reason: `The air falls to ${one(Math.min(...w.pours.map((p) => p.coldestAir.fahrenheit)))} °F (${one(Math.min(...w.pours.map((p) => p.coldestAir.celsius)))} °C) in the days after a pour — at or below 40 °F (4.4 °C) — or the mix goes in below 55 °F (13 °C). The concrete ${when}.`,
			action:
				'Keep the slab at or above 55 °F (13 °C) as placed, cover it with insulated blankets until it has reached 500 psi and through any frost, never pour on frozen ground; or wait for warmer days.',
			source: 'ACI 306R (cold weather: air falling to 40 °F; Table 3.1; 500 psi after Powers); strength from ACI 209R-92 on ASTM C1074 equivalent age',
			severity: 'warning'
		};
	},
	({ m, weather: w }) =>
		!w.coolCuring
			? null
			: {
					id: 'cool-curing',
					title: 'Too cool to cure without cover',
					reason: `A daily mean of ${one(Math.min(...w.pours.map((p) => p.coldestCuringMean.fahrenheit)))} °F (${one(Math.min(...w.pours.map((p) => p.coldestCuringMean.celsius)))} °C) falls in the first ${m.cement === 'typeIII' ? 3 : 7} days after a pour; concrete should stay above 50 °F (10 °C) and moist that long.`,
					action:
						'Cover the slab with insulated curing blankets over the moist cure, or pour in a warmer week; strength gain slows and the milestones move out.',
					// ACI 318-19 section number from memory
					source: 'ACI 318-19 §26.5.3.1',
					severity: 'warning'
				},
	({ weather: w }) =>
		!w.hot
			? null
			: {
					id: 'hot-weather',
					title: 'Hot weather',
					reason: `The concrete would be placed above about 95 °F (35 °C).`,
					action: 'Pour early in the morning, use cool water, shade the materials, and have extra hands so it is finished before it stiffens.',
					// the 95 °F figure from memory
					source: 'ACI 305R (hot weather concreting)',
					severity: 'warning'
				},
	({ weather: w }) => {
		if (!w.highEvaporation) return null;
		const e = Math.max(...w.pours.map((p) => p.evaporation.kgPerSquareMeterHour));
		return {
			id: 'evaporation',
			title: 'Fast drying: plastic shrinkage cracks',
			reason: `Expected evaporation ${one(e, 2)} kg/m²/h (${one(toLbPerFt2h(e), 3)} lb/ft²/h) reaches the 0.2 lb/ft²/h (1.0 kg/m²/h) level where precautions are needed.`,
			action: 'Put up wind breaks and shade, dampen the base, fog the air above the slab, and start curing right after finishing.',
			source: 'ACI 305R; evaporation by Uno, ACI Materials Journal 95-M34 (1998)',
			severity: 'warning'
		};
	}
];

const crew: Rule[] = [
	({ m }) =>
		m.crew.people > 1
			? null
			: {
					id: 'working-alone',
					title: 'Working alone',
					reason: 'The plan has one person mixing, lifting and finishing.',
					action: 'Have a second person on site: for lifting, for help if you are hurt, and to finish before the mix stiffens.',
					source: 'common practice, no published source',
					severity: 'warning'
				},
	({ m, mixing }) => {
		const late = filterList(mixing.sections, (s) => !s.fits);
		if (!late.length) return null;
		if (late.every((s) => s.split && s.split.coldJoints.length))
			return {
				id: 'mixing-time',
				title: 'Split into pours on separate days',
				reason: `${late.map((s) => `${m.sections[s.index].name} (${s.split!.parts} pours of ${s.split!.bagsPerPart.join(', ')} bags)`).join('; ')}: the crew cannot place it in one go before the first batch stiffens.`,
				action:
					'Set a bulkhead board on stakes at each cold joint, on a control-joint line, and pour one part a day as the day plan lists; or add hands, a drum mixer, or order ready-mix.',
				source: 'common practice (1½–2 h working time at 70 °F), no published source; joints ACI 302.1R',
				severity: 'info'
			};
		return {
			id: 'mixing-time',
			title: 'The crew cannot place a section before it stiffens',
			reason: `${andList(mapList(late, (s) => m.sections[s.index].name))} ${late.length > 1 ? 'need up to' : 'needs'} ${Math.round(Math.max(...late.map((s) => s.totalMinutes)))} min of mixing and placing against ${Math.round(Math.min(...late.map((s) => s.workingMinutes)))} min of working time, with ${late[0].finishMinutes} min kept for finishing.`,
			action: 'Split the section as suggested in the mixing plan, add people or a drum mixer, or order ready-mix.',
			source: 'common practice (1½–2 h working time at 70 °F), no published source',
			severity: 'warning'
		};
	}
];

/** "A", "A and B", "A, B and C". */
const andList = (names: string[]) => (names.length > 1 ? `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}` : (names[0] ?? ''));

const build: Rule[] = [
	({ m }) =>
		m.thickness >= MIN_THICKNESS_M - 1e-6
			? null
			: {
					id: 'thin-slab',
					title: 'Thinner than 3½ in',
					reason: `The slab is ${one(m.thickness / M_PER_IN, 2)} in (${Math.round(m.thickness * 1000)} mm) thick.`,
					action: 'Make it at least 3½ in (89 mm); 4 in is usual for patios and walks.',
					source: 'IRC R506.1; ACI 332',
					severity: 'warning'
				},
	({ m }) =>
		m.base.depth > 0
			? null
			: {
					id: 'no-base',
					title: 'No base course',
					reason: 'The plan puts the slab straight on the soil.',
					action: 'Where soil drains poorly, lay 4 in (100 mm) of compacted clean gravel or crushed stone first.',
					source: 'IRC R506.2.2; drainage benefit: common practice',
					severity: 'info'
				}
];

/**
 * A thickened-edge trench that stops above the bottom of the base dig: the plan puts no base under
 * the edge (volume.ts), so its bottom would sit on a ledge of soil left above the dug grade, and the
 * build card's two dig depths contradict each other (10 in overall, 9 in at the edges).
 */
const trenchAboveBase: Rule = ({ m }) => {
	const e = m.thickened.edges;
	if (e === 'none' || (Array.isArray(e) && !e.length) || m.thickened.extraDepth >= m.base.depth - 1e-6) return null;
	const [trench, base] = [m.thickened.extraDepth, m.base.depth];
	return {
		id: 'trench-above-base',
		title: 'Thickened edge shallower than the base',
		reason: `The trench goes ${one(trench / M_PER_IN, 2)} in (${Math.round(trench * 1000)} mm) below the slab, but the base under the rest of the slab is ${one(base / M_PER_IN, 2)} in (${Math.round(base * 1000)} mm) deep, so the edge would stand on a ledge of soil above the dug grade.`,
		action: `Dig the trench at least ${one(base / M_PER_IN, 2)} in (${Math.round(base * 1000)} mm) below the slab, so the thickened edge bears on firm undisturbed soil at or below the bottom of the base.`,
		// common practice, no published source
		source: 'common practice, no published source',
		severity: 'warning'
	};
};

const RULES: Rule[] = [
	localCodes,
	utilities,
	wetCement,
	bagWeight,
	silica,
	loads,
	...freezeThaw,
	fillNearSurface,
	oilRelease,
	aboveReference,
	...drainage,
	...weatherRules,
	...crew,
	...build,
	trenchAboveBase
];

export function computeCautions(c: CautionContext): Caution[] {
	return filterList(
		mapList(RULES, (r) => r(c)),
		(x): x is Caution => x !== null
	);
}
