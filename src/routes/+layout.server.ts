import type { LayoutServerLoad } from './$types';

export const load = (({ locals }) => {
	const u = locals.user;
	return {
		user: u ? { name: u.name, email: u.email, role: u.role, emailVerified: u.emailVerifiedAt !== null } : null
	};
}) satisfies LayoutServerLoad;
