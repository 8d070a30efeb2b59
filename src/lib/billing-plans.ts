/**
 * Stakeline's own contractor plans and prices, in one place. Homeowners never pay Stakeline;
 * approved contractors pay for the leads they open. Amounts are in cents (US dollars).
 * Shared by the server (checkout, entitlement) and the pages that show prices.
 */
export const currency = 'usd';

/** The monthly plan: a number of leads included each billing period. */
export const monthlyPlan = {
	key: 'slab_desk_monthly',
	name: 'Slab Desk monthly',
	monthlyCents: 3900,
	leadsIncluded: 8
} as const;

/**
 * A lead opened beyond the plan's included leads, with no credit left: charged at this price on the
 * plan's next invoice (an invoice item at the provider), after the contractor agrees to it.
 */
export const extraLead = {
	name: 'Extra lead',
	cents: 600
} as const;

/** Extra leads bought ahead as a pack of credits at the same price (one credit opens one lead). */
export const leadPack = {
	key: 'lead_pack_5',
	name: 'Five extra leads',
	leads: 5,
	perLeadCents: extraLead.cents
} as const;

export const leadPackCents = leadPack.leads * leadPack.perLeadCents;

export const money = (cents: number) => `$${(cents / 100).toFixed(cents % 100 ? 2 : 0)}`;

/** One sentence with the prices, for the sign-up page and the billing page. */
export const priceLine = `${monthlyPlan.name}: ${money(monthlyPlan.monthlyCents)} a month with ${monthlyPlan.leadsIncluded} leads included; beyond that, ${money(extraLead.cents)} a lead on your next invoice, or prepaid in packs of ${leadPack.leads}.`;
