// Plain-language help for the trade words a homeowner meets in a plan. Shown on the plan page and
// in the PDF. Where a word carries a number, the source stands beside it, as with the cautions.

export interface GlossaryEntry {
	id: string;
	term: string;
	plain: string;
	source?: string;
}

export const GLOSSARY: GlossaryEntry[] = [
	{
		id: 'stake-mark',
		term: 'Stake mark',
		plain:
			'A pencil line on a form stake at the height the top of the finished slab must reach there. Boards are screwed to the stakes with their tops on the marks.'
	},
	{
		id: 'level-line',
		term: 'Level line',
		plain:
			'A string pulled tight from the high stake and levelled with a line level. Measuring down from it to each stake mark sets the slope without any arithmetic on site.'
	},
	{
		id: 'fall',
		term: 'Fall',
		plain: 'How much the surface drops as you walk away from the high edge, so rain runs off. Near a house it runs away from the wall.',
		source: 'IRC R401.3: at least 2 % within 10 ft of the foundation; ACI 302.1R: ¼ in per ft'
	},
	{
		id: 'cross-fall',
		term: 'Cross fall',
		plain: 'A second, sideways drop along the high edge, so water also runs toward one end — for example toward a lawn instead of a path.'
	},
	{
		id: 'control-joint',
		term: 'Control joint',
		plain:
			'A groove tooled or sawn into the slab so that when concrete shrinks and cracks, it cracks neatly along the groove instead of across the middle of a panel.',
		source: 'ACI 302.1R: at most 24–36 times the thickness apart, at least ¼ of the thickness deep'
	},
	{
		id: 'cold-joint',
		term: 'Cold joint',
		plain:
			'Where one pour meets concrete poured earlier that has already set, for example between two sections poured on different days. It is formed by a board (a bulkhead) that is pulled before the next pour.'
	},
	{
		id: 'isolation-joint',
		term: 'Isolation joint',
		plain: 'A soft strip (often foam or fibre board) between the slab and a house wall, step or post, so the slab can move without pushing on them or cracking.'
	},
	{
		id: 'thickened-edge',
		term: 'Thickened edge',
		plain:
			'A trench dug along an edge so the concrete there is deeper than the rest of the slab, making the edge stiffer where wheels, posts or frost work on it.'
	},
	{
		id: 'working-time',
		term: 'Working time',
		plain:
			'How long mixed concrete stays soft enough to place, level and finish. Heat shortens it a lot; when it runs out the surface can no longer be finished well.'
	},
	{
		id: 'equivalent-age',
		term: 'Equivalent age',
		plain:
			'Concrete gains strength faster when warm and slower when cold. Equivalent age counts days as if the concrete had cured at a steady 20 °C (68 °F), so cold weather pushes the dates out.',
		source: 'ASTM C1074 (maturity method)'
	},
	{
		id: 'lifting-limit',
		term: 'Lifting limit',
		plain:
			'The heaviest load that nearly everyone can lift in ideal conditions: held close, at waist height, rarely. Lifting a bag from the ground, reaching or twisting lowers it far below that.',
		source: 'NIOSH Revised Lifting Equation, Pub. 94-110: load constant 23 kg (51 lb)'
	},
	{
		id: 'modulus-of-rupture',
		term: 'Modulus of rupture',
		plain:
			'How hard concrete can be bent before it cracks — much less than how hard it can be squeezed. It is why an unreinforced slab cracks under a heavy point load such as a post or a car jack.',
		source: "ACI 318-19 §19.2.3: fr = 7.5 √f'c (psi)"
	}
];
