import { describe, expect, it } from 'vitest';
import { modulusOfRupture } from './cautions';
import { computePlan } from './index';
import type { PlanInput } from './schema';
import { rect } from './test-plans';

const base: PlanInput = { units: 'imperial', sections: [{ outline: rect(0, 0, 10, 8) }] };
const ids = (input: Partial<PlanInput>) => computePlan({ ...base, ...input } as PlanInput).cautions.map((c) => c.id);

describe('every plan', () => {
	it('starts with the deferral to local codes and covers the job hazards', () => {
		const c = computePlan(base).cautions;
		expect(c[0].id).toBe('local-codes');
		expect(c.map((x) => x.id)).toEqual(expect.arrayContaining(['utility-locate', 'wet-cement', 'bag-weight', 'unreinforced-loads']));
		for (const x of c) {
			expect(x.title && x.reason && x.action && x.source).toBeTruthy();
		}
		expect(c.find((x) => x.id === 'utility-locate')!.source).toMatch(/FCC 05-59/);
		expect(c.find((x) => x.id === 'wet-cement')!.source).toMatch(/OSHA 3351-07/);
	});

	it('compares the bag with the NIOSH load constant', () => {
		const sev = (size: number) => computePlan({ ...base, bags: { offered: [{ size }] } }).cautions.find((x) => x.id === 'bag-weight')!.severity;
		expect(sev(80)).toBe('warning'); // 80 lb = 36.3 kg > 23 kg, NIOSH Pub. 94-110
		expect(sev(51)).toBe('warning'); // 51 lb = 23.13 kg, just over the 23 kg (51 lb) load constant
		expect(sev(50)).toBe('info'); // 50 lb = 22.68 kg < 23 kg, NIOSH Pub. 94-110
	});

	it("names a metric bag once, in kg, and the load constant in the plan's unit first", () => {
		const reason = (input: PlanInput) => computePlan(input).cautions.find((x) => x.id === 'bag-weight')!.reason;
		const met = reason({ units: 'metric', sections: [{ outline: rect(0, 0, 3, 2) }], bags: { offered: [{ size: 40 }] } });
		expect(met).toMatch(/^The 40 kg bags are over the NIOSH load constant of 23 kg \(51 lb\)/);
		expect(reason({ ...base, bags: { offered: [{ size: 80 }] } })).toMatch(/^The 80 lb bags \(36\.3 kg\) are over the NIOSH load constant of 51 lb \(23 kg\)/);
	});

	it('calls the utility locate 3 working days ahead', () => {
		expect(computePlan(base).cautions.find((x) => x.id === 'utility-locate')!.action).toMatch(/3 working days/); // state one-call laws, 2–3 days
	});
});

describe('plan-specific cautions', () => {
	it('flags a slab under 3½ in', () => {
		expect(ids({ thickness: 3.4 })).toContain('thin-slab'); // IRC R506.1, 3½ in
		expect(ids({ units: 'metric', sections: [{ outline: rect(0, 0, 3, 2) }], thickness: 88 })).toContain('thin-slab'); // 88 < 88.9 mm
		expect(ids({ units: 'metric', sections: [{ outline: rect(0, 0, 3, 2) }], thickness: 89 })).not.toContain('thin-slab'); // IRC R506.1
		expect(ids({ thickness: 3.5 })).not.toContain('thin-slab'); // IRC R506.1
	});

	it('flags a thickened-edge trench that stops above the bottom of the base dig', () => {
		// common practice, no published source: the edge has no base under it, so its trench must reach the base's bottom.
		const edge = (extraDepth: number, edges: 'none' | 'free' = 'free') => ({ thickness: 5, base: { depth: 5 }, thickenedEdge: { edges, extraDepth } });
		expect(ids(edge(4))).toContain('trench-above-base'); // 5 in slab + 4 in trench = 9 in, above the 10 in dug grade
		expect(ids(edge(5))).not.toContain('trench-above-base'); // 10 in at the edge = the dug grade
		expect(ids(edge(6))).not.toContain('trench-above-base');
		expect(ids(edge(4, 'none'))).not.toContain('trench-above-base'); // no thickened edge at all
		const c = computePlan({ ...base, ...edge(4) } as PlanInput).cautions.find((x) => x.id === 'trench-above-base')!;
		expect(c.reason).toContain('4 in (102 mm) below the slab');
		expect(c.action).toContain('at least 5 in (127 mm) below the slab');
	});

	it('explains the modulus of rupture for unreinforced slabs', () => {
		expect(modulusOfRupture.psi(3000)).toBeCloseTo(410.79, 2); // 7.5 √3000, ACI 318-19 §19.2.3
		expect(modulusOfRupture.mpa(20)).toBeCloseTo(2.7727, 4); // 0.62 √20, ACI 318-19 §19.2.3
		const c = computePlan({ ...base, loads: { vehicles: true } }).cautions.find((x) => x.id === 'unreinforced-loads')!;
		expect(c.severity).toBe('danger');
		expect(c.reason).toMatch(/411 psi/);
		expect(ids({ reinforcement: 'mesh' })).not.toContain('unreinforced-loads');
	});

	it('keeps the loads caution when mesh or rebar is chosen', () => {
		// Mesh holds cracks closed; the cracking load is still the modulus of rupture (ACI 318-19 §19.2.3).
		for (const reinforcement of ['mesh', 'rebar'] as const) {
			const c = computePlan({ ...base, reinforcement, loads: { vehicles: true } }).cautions.find((x) => x.id === 'loads-need-design')!;
			expect(c.severity).toBe('danger');
			expect(c.reason).toMatch(/411 psi/); // 7.5 √3000
			expect(c.reason).toMatch(/hold the cracks closed/);
		}
		expect(ids({ reinforcement: 'mesh' })).not.toContain('loads-need-design'); // no loads: nothing to design for
	});

	it('asks for air entrainment and strength where winters freeze', () => {
		// IRC Table R402.2 (porches, carport slabs, steps exposed to weather): severe → 3500 psi and 5–7 % air.
		const severe = computePlan({ ...base, exposure: 'severe' }).cautions.find((x) => x.id === 'freeze-thaw')!;
		expect(severe.reason).toMatch(/3500 psi and 5–7 % entrained air/);
		expect(severe.action).toMatch(/Raise the design strength to 3500 psi/);
		const moderate = computePlan({ ...base, exposure: 'moderate' }).cautions.find((x) => x.id === 'freeze-thaw')!;
		expect(moderate.action).not.toMatch(/Raise/); // 3000 psi meets moderate
		expect(ids({ exposure: 'negligible' })).not.toContain('freeze-thaw'); // 2500 psi, no air asked
		expect(ids({ exposure: 'moderate' })).toContain('first-winter-deicer');
		expect(ids({ exposure: 'negligible' })).not.toContain('first-winter-deicer');
	});

	it('flags silica when saw-cutting', () => {
		const sawn = { ...base, sections: [{ outline: rect(0, 0, 20, 12) }], joints: { method: 'saw' as const } };
		const c = computePlan(sawn).cautions.find((x) => x.id === 'silica-saw')!;
		expect(c.severity).toBe('warning');
		expect(c.source).toMatch(/1926\.1153/); // OSHA 29 CFR 1926.1153 Table 1
		expect(ids({})).not.toContain('silica-saw'); // 10 × 8 ft needs no joint at 12 ft spacing (ACI 302.1R)
	});

	it('flags oil as form release, working alone and chunk fill too near the top', () => {
		expect(ids({ forms: { release: 'oil' } })).toContain('form-release-oil');
		expect(ids({ crew: { people: 1 } })).toContain('working-alone');
		const fill = { houseEdge: null, thickenedEdge: { edges: 'free' as const, extraDepth: 4 }, fill: { shareOfTrench: 0.2, largestPiece: 6 } };
		expect(ids(fill)).toContain('fill-near-surface');
		expect(ids({ ...fill, fill: { shareOfTrench: 0.2, largestPiece: 3 } })).not.toContain('fill-near-surface');
	});

	it('flags water toward the foundation and falls under 2 %', () => {
		expect(ids({ slope: { highEdge: { section: 0, edge: 2 } } })).toContain('water-toward-foundation'); // IRC R401.3
		expect(ids({ slope: { fall: { value: 1.5, unit: 'percent' } } })).toContain('drainage-2-percent'); // IRC R401.3
		expect(ids({ slope: { fall: { value: 2, unit: 'percent' } } })).not.toContain('drainage-2-percent'); // IRC R401.3
		expect(ids({ slope: { fall: { value: 8, unit: 'percent' } } })).toContain('slope-steep');
		expect(ids({ houseEdge: null, slope: { fall: { value: 0.5, unit: 'percent' } } })).toContain('slope-flat'); // ⅛ in/ft, common practice
	});

	it('names the house wall by its corner letters and the fix by the wizard step and field', () => {
		const c = (input: Partial<PlanInput>) => computePlan({ ...base, ...input } as PlanInput).cautions.find((x) => x.id === 'water-toward-foundation')!;
		const high = c({ houseEdge: { section: 0, edge: 0 }, slope: { highEdge: { section: 0, edge: 2 } } });
		expect(high.reason).toMatch(/house wall edge A–B /);
		expect(high.reason).toMatch(/falls \d[\d.]* % toward the house/);
		// The wall faces the high side, so the fall runs straight at it and a cross fall (along the high side) cannot turn it.
		expect(high.action).toMatch(/Pitch step, choose the house wall edge A–B as High side: .*cross fall.*cannot turn it/);
		expect(high.action).not.toMatch(/enter a Cross fall/);
		// A wall square to the high side: a cross fall along the high side does run water off it.
		const side = c({ houseEdge: { section: 0, edge: 1 }, slope: { highEdge: { section: 0, edge: 2 } } });
		expect(side.reason).toMatch(/edge B–C the surface is level/);
		expect(side.action).toMatch(/Pitch step, choose the house wall edge B–C as High side, or enter a Cross fall/);
		const level = c({ houseEdge: { section: 0, edge: 0 }, slope: { fall: { value: 0, unit: 'percent' } } });
		expect(level.reason).toMatch(/edge A–B the surface is level/);
		expect(level.action).toMatch(/Pitch step, raise Fall/);
		const two = c({
			sections: [{ outline: rect(0, 0, 10, 8) }, { name: 'Walk', outline: rect(10, 0, 14, 8) }],
			houseEdge: { section: 1, edge: 1 },
			slope: { highEdge: { section: 0, edge: 3 } }
		});
		expect(two.reason).toMatch(/edge 2B–2C of Walk/);
		for (const x of [high, side, level, two]) expect(`${x.reason} ${x.action}`).not.toMatch(/slope\.|highEdge|edge \d+[ ,.]/);
	});

	it('warns when the slab would finish above the door sill, and names an unnamed reference', () => {
		expect(ids({ reference: { label: 'door sill', below: 1 } })).not.toContain('above-reference');
		const c = computePlan({ ...base, reference: { label: 'door sill', below: -0.5 } }).cautions.find((x) => x.id === 'above-reference')!;
		expect(c.severity).toBe('warning');
		expect(c.reason).toMatch(/0\.5 in above the door sill/);
		const unnamed = computePlan({ ...base, reference: { label: '  ', below: -1 } });
		expect(unnamed.cautions.find((x) => x.id === 'above-reference')!.title).toBe('The slab would finish above the reference mark');
		expect(unnamed.elevations.reference.label).toBe('reference mark');
		expect(JSON.stringify(unnamed)).not.toMatch(/the \./);
	});

	it('the day plan coats the boards as the Build-up step chose, so it never contradicts the oil caution', () => {
		const forms = (release: 'agent' | 'oil' | 'none') => {
			const r = computePlan({ ...base, forms: { release } });
			return { text: r.schedule.days.flatMap((d) => d.tasks).find((t) => t.id === 'forms')!.text, ids: r.cautions.map((c) => c.id) };
		};
		expect(forms('agent').text).toMatch(/release agent/);
		const oil = forms('oil');
		expect(oil.ids).toContain('form-release-oil');
		expect(oil.text).not.toMatch(/release agent/);
		expect(oil.text).toMatch(/never used motor oil/);
		expect(forms('none').text).toMatch(/no release coat/);
	});

	it('flags cold, hot and fast-drying weather', () => {
		expect(ids({ conditions: { airTemp: 38 } })).toContain('cold-weather'); // 38 °F ≤ 40 °F, ACI 306R
		expect(ids({ conditions: { airTemp: 55, airLow: 34 } })).toContain('cold-weather'); // a 34 °F night, ACI 306R
		expect(ids({ conditions: { airTemp: 55, airLow: 45 } })).not.toContain('cold-weather');
		// Day by day, a day without its own low (null) uses its own mean: 38 °F ≤ 40 °F on day 2, ACI 306R.
		expect(ids({ conditions: { airTemp: [55, 38, 55], airLow: [45, null, 45] } })).toContain('cold-weather');
		expect(ids({ conditions: { airTemp: [55, 45, 55], airLow: [45, null, 45] } })).not.toContain('cold-weather');
		expect(ids({ conditions: { airTemp: 48 } })).toContain('cool-curing'); // ≤ 50 °F, ACI 318-19 §26.5.3.1
		expect(ids({ conditions: { airTemp: 98 } })).toContain('hot-weather'); // 98 °F > 95 °F, ACI 305R
		expect(ids({ conditions: { airTemp: 90, humidity: 20, wind: 15 } })).toContain('evaporation'); // Uno 1998 vs ACI 305R
		expect(ids({ conditions: { airTemp: 70 } })).not.toContain('cold-weather');
	});

	it('flags a section the crew cannot place in time, and no base', () => {
		expect(ids({ sections: [{ outline: rect(0, 0, 20, 16) }] })).toContain('mixing-time');
		expect(ids({ base: { depth: 0 } })).toContain('no-base'); // IRC R506.2.2
	});

	it('names every late section in one sentence: "A needs", "A and B need up to"', () => {
		const reason = (sections: PlanInput['sections']) =>
			computePlan({ ...base, houseEdge: null, sections } as PlanInput).cautions.find((c) => c.id === 'mixing-time')?.reason ?? '';
		expect(reason([{ outline: rect(0, 0, 20, 16) }])).toMatch(/^Section 1 needs \d+ min of mixing/);
		expect(reason([{ outline: rect(0, 0, 20, 16) }, { outline: rect(20, 0, 20, 16) }])).toMatch(/^Section 1 and Section 2 need up to \d+ min of mixing/);
	});
});
