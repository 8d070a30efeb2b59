import type { Role } from './roles';

/**
 * The e-mails a person may turn off, one line each: the key a template tags its message with, the
 * label on the account page, and who sees the switch. Messages without a kind (sign-in links,
 * password resets, e-mail changes, account decisions, and billing changes that limit what an
 * account can do: a failed payment, a plan ended, leads resumed after an overdue payment) always go. A new kind starts on for everyone.
 */
export const mailKinds = {
	new_lead: { label: 'New leads and newer plan revisions', roles: ['contractor'] },
	billing: { label: 'Billing receipts (plan started, monthly payment received, lead credits added)', roles: ['contractor'] },
	bid_result: { label: 'Decisions on my bids (accepted, not selected, reopened)', roles: ['contractor'] },
	bid_update: { label: 'Bids on my plans (new, changed, withdrawn)', roles: ['homeowner'] },
	message: { label: 'New messages', roles: ['homeowner', 'contractor'] },
	curing: { label: 'Curing reminders for plans I turned them on for', roles: ['homeowner'] },
	review_queue: { label: 'Contractor profiles waiting for review', roles: ['admin'] }
} as const satisfies Record<string, { label: string; roles: readonly Role[] }>;

export type MailKind = keyof typeof mailKinds;
export const mailKindKeys = Object.keys(mailKinds) as MailKind[];

/** The switches shown to a role, in the order above. */
export const mailKindsFor = (role: Role) => mailKindKeys.filter((k) => (mailKinds[k].roles as readonly Role[]).includes(role));

export const isMailKind = (k: string): k is MailKind => Object.hasOwn(mailKinds, k);
