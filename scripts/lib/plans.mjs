// Plans the drills write: the fault drill (scripts/fault.mjs) and the cluster's kill drill.

/** A 12 × 10 ft slab: a valid plan the engine computes quickly. */
export const smallSlab = {
	units: 'imperial',
	sections: [
		{
			outline: [
				[0, 0],
				[12, 0],
				[12, 10],
				[0, 10]
			]
		}
	]
};
