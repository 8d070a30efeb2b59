// Editable defaults, per unit system. Each names where it comes from; "common practice" and
// "from memory" mean no published source was checked — they are starting points to edit.

export const DEFAULTS = {
	imperial: {
		thickness: 4, // in — common practice; IRC R506.1 minimum is 3½ in
		gapToHouse: 0.5, // in — room for an isolation-joint strip, from memory
		stakeSpacing: 3, // ft — common practice, stakes every 3–4 ft
		stakeLength: 18, // in — from memory
		stockLengths: [8, 10, 12, 16], // ft — usual stock lengths
		edgeWidth: 8, // in — thickened-edge trench width, from memory
		baseDepth: 4, // in — IRC R506.2.2
		designStrength: 3000, // psi — from memory (IRC Table R402.2 asks 2500–3500 by weathering)
		bagSizes: [80, 60, 40], // lb — bag-label sizes, common practice
		readyMixIncrement: 0.25, // yd³ — from memory; ask the plant
		readyMixMinimum: 1, // yd³ — from memory; ask the plant
		payload: 1000, // lb — from memory (a half-ton pickup); read the vehicle's label
		airTemp: 70, // °F — placeholder; enter the forecast
		wind: 5, // mph — placeholder; enter the forecast
		baseOverhang: 6, // in — base past the forms, common practice (6–12 in), no published source
		stoneDensity: 1.4, // short tons per compacted yd³ — common practice 1.4–1.5
		soilDensity: 1.35, // short tons per yd³ of soil in the ground (≈ 100 lb/ft³) — from memory
		compoundCoverage: 200, // ft² per US gal — the ASTM C156 test rate for C309 compounds (Iowa DOT 4105); the label rules
		meshWidth: 5, // ft — 5 × 10 ft sheets, common practice
		meshLength: 10, // ft
		wireSpacing: 6, // in — 6×6 mesh, common practice
		chairSpacing: 3, // ft — supports at most 3 ft apart (WRI, as in Florida Building Code 1909.3)
		barSpacing: 18, // in — example only; bar layout comes from a design (from memory)
		barDiameter: 0.375, // in — #3 bar (ASTM A615 size designation)
		barStock: 20, // ft — usual bar length on sale, common practice
		maxCoordinate: 1000, // ft — keeps requests to yard-sized work
		maxSmall: 48 // in
	},
	metric: {
		thickness: 100, // mm — common practice; IRC R506.1 minimum is 89 mm
		gapToHouse: 12, // mm — from memory
		stakeSpacing: 0.9, // m — common practice, 3–4 ft
		stakeLength: 450, // mm — from memory
		stockLengths: [2.4, 3.0, 3.6, 4.8], // m — usual stock lengths
		edgeWidth: 200, // mm — from memory
		baseDepth: 100, // mm — IRC R506.2.2 (4 in)
		designStrength: 21, // MPa — from memory; ≥ 3000 psi (20.7 MPa), IRC Table R402.2 moderate weathering
		bagSizes: [40, 30, 20], // kg — common practice; sizes vary by store
		readyMixIncrement: 0.2, // m³ — from memory; ask the plant
		readyMixMinimum: 1, // m³ — from memory; ask the plant
		payload: 450, // kg — from memory; read the vehicle's label
		airTemp: 21, // °C — placeholder; enter the forecast
		wind: 8, // km/h — placeholder; enter the forecast
		baseOverhang: 150, // mm — common practice, no published source
		stoneDensity: 1.66, // t per compacted m³ (1.4 short tons/yd³) — common practice
		soilDensity: 1.6, // t per m³ in the ground — from memory
		compoundCoverage: 5, // m² per L (≈ 200 ft²/gal, the ASTM C156 test rate) — the label rules
		meshWidth: 1.5, // m — common practice
		meshLength: 3, // m
		wireSpacing: 150, // mm — common practice
		chairSpacing: 0.9, // m — at most 3 ft (WRI)
		barSpacing: 450, // mm — example only; from memory
		barDiameter: 10, // mm — 10M bar
		barStock: 6, // m — common practice
		maxCoordinate: 300, // m
		maxSmall: 1200 // mm
	}
} as const;

/** Defaults that do not depend on the unit system. */
export const COMMON = {
	slopePercent: 2, // IRC R401.3 (≥ 2 % away within 10 ft of the foundation)
	baseBulking: 1.2, // common practice, loose stone 1.15–1.30 × compacted
	wastePercent: 10, // common practice, 5–10 %
	/** Dry bagged mix per volume placed: 80 lb → 0.60 ft³ (≈ 133 lb/ft³); bag labels, common practice. */
	dryMixLbPerFt3: 80 / 0.6,
	waterPerKgDryMix: 0.08, // kg water per kg dry mix ≈ 3 qt per 80 lb; from memory — follow the bag label
	people: 2,
	handMixMinutesPer80lb: 8, // common practice, 5–8 min a bag by hand
	drumMixMinutesPerBatch: 6, // from memory
	drumBatch80lbBags: 2, // common practice, a small drum takes two 80 lb bags
	placeMinutesPerBag: 2, // wheel, dump and spread one 80 lb bag's worth; from memory
	workingMinutesAt70F: 90, // common practice, 1½–2 h at 70 °F, about half at 90 °F
	finishMinutes: 30, // screed, float, edge and tool joints after the last batch; from memory
	humidity: 50, // % — placeholder; enter the forecast
	formsOffDays: 1, // common practice, ~24 h
	walkDays: 2, // common practice, foot traffic after 24–48 h
	furnitureDays: 3, // from memory
	vehiclePercent: 70 // common practice, ~70 % of design strength
} as const;

/**
 * Example prices to show beside empty price fields (never applied to a plan): round numbers of the
 * right size for a US or metric market, from memory. Same keys and units as the prices input.
 */
export const EXAMPLE_PRICES = {
	imperial: {
		gravel: 45,
		lumber: 0.9,
		stake: 1.25,
		screw: 0.1,
		mesh: 0.3,
		releaseAgent: 15,
		isolationStrip: 1,
		curingCover: 0.1,
		curingCompound: 25,
		fiber: 8,
		rebar: 0.6,
		chair: 0.4,
		tools: 150,
		haulSoil: 60
	},
	metric: {
		gravel: 60,
		lumber: 3,
		stake: 1.25,
		screw: 0.1,
		mesh: 3.2,
		releaseAgent: 15,
		isolationStrip: 3.3,
		curingCover: 1.1,
		curingCompound: 6.6,
		fiber: 18,
		rebar: 2,
		chair: 0.4,
		tools: 150,
		haulSoil: 60
	}
} as const;
