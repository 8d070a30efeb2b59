import { eq } from 'drizzle-orm';
import { db } from '$lib/server/db';
import { auditLog, contractor, session, user } from '$lib/server/db/schema';
import { tellHomeownersOfContractorChange } from './leads';
import { queueMail } from './mail';
import { accountAccessMail } from './mail/templates';

/** A disable or enable that does not fit the account now; the message says why. */
export class AccessRefused extends Error {}

type Admin = { id: string; name: string };

/**
 * Disables or enables an account: the flag, its sessions ended (disabling), the audit row and the
 * owner's notice, in one transaction. Returns false when there is no such account.
 */
export async function setAccountDisabled(admin: Admin, userId: string, disable: boolean, reason: string, origin: string) {
	if (disable && admin.id === userId) throw new AccessRefused('You cannot disable your own account.');
	const found = await db.transaction(async (tx) => {
		const [u] = await tx.select().from(user).where(eq(user.id, userId)).for('update');
		if (!u) return false;
		if (disable === !!u.disabledAt) throw new AccessRefused(disable ? 'This account is disabled already.' : 'This account is not disabled.');
		const now = new Date();
		await tx
			.update(user)
			.set(disable ? { disabledAt: now, disabledReason: reason } : { disabledAt: null, disabledReason: null })
			.where(eq(user.id, userId));
		if (disable) await tx.delete(session).where(eq(session.userId, userId));
		await tx.insert(auditLog).values({
			actorId: admin.id,
			actorName: admin.name,
			action: disable ? 'disable_account' : 'enable_account',
			subjectId: userId,
			subjectName: `${u.name} (${u.email})`,
			reason,
			createdAt: now
		});
		await queueMail(u.email, accountAccessMail(u.emailVerifiedAt ? u.name : '', disable, reason, origin), tx);
		// Homeowners waiting on an approved firm are told, as for a suspension: its bids cannot be accepted meanwhile.
		if (u.role === 'contractor') {
			const [c] = await tx.select({ status: contractor.status, business: contractor.businessName }).from(contractor).where(eq(contractor.userId, userId));
			if (c?.status === 'approved') await tellHomeownersOfContractorChange(tx, userId, c.business ?? u.name, disable ? 'suspended' : 'active', origin);
		}
		return true;
	});
	return found;
}
