// An invented patio for the home page's 3D preview: 22 × 14 ft against the back wall, poured in two
// halves so the preview shows a cold joint, control joints and thickened open edges. Loaded only when
// the preview opens, so the home page's first bundle carries neither the engine nor its schema.
import { computePlan } from '$lib/plan';

export const demoPatio = () =>
	computePlan({
		units: 'imperial',
		name: 'Demo patio',
		sections: [
			{
				name: 'First pour',
				outline: [
					[0, 0],
					[12, 0],
					[12, 14],
					[0, 14]
				]
			},
			{
				name: 'Second pour',
				outline: [
					[12, 0],
					[22, 0],
					[22, 14],
					[12, 14]
				]
			}
		],
		houseEdge: { section: 0, edge: 0 },
		otherHouseEdges: [{ section: 1, edge: 0 }],
		slope: { fall: { value: 2, unit: 'percent' } },
		thickness: 4,
		forms: { lumber: '2x4', stakeSpacing: 4 },
		thickenedEdge: { edges: 'free', width: 8 }
	});
