/** The three kinds of account, shared by server and browser. */
export const roles = ['homeowner', 'contractor', 'admin'] as const;
export type Role = (typeof roles)[number];

/** Where each role lands after signing in, and what the navigation calls it. */
export const roleHome: Record<Role, { href: string; label: string }> = {
	homeowner: { href: '/plans', label: 'My plans' },
	contractor: { href: '/pro', label: 'Pro desk' },
	admin: { href: '/admin', label: 'Admin' }
};
