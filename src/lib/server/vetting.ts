import { eq } from 'drizzle-orm';
import { statusLabels, vettingMoves, type VettingDecision } from '$lib/contractor-status';
import { db } from '$lib/server/db';
import { auditLog, contractor, contractorDocument, user } from '$lib/server/db/schema';
import { withdrawOpenBidsOf } from './leads';
import { queueMail } from './mail';
import { vettingDecisionMail } from './mail/pro-notices';

/** A decision that does not fit the account's current state; the message says why. */
export class VettingRefused extends Error {}

type Admin = { id: string; name: string };

/**
 * Applies an admin's decision to a contractor: the status change, its audit row and the side
 * effects in one transaction (the row is locked, so two admins deciding at once cannot both win),
 * then the e-mail. Returns false when there is no such contractor.
 */
export async function decide(admin: Admin, contractorId: string, decision: VettingDecision, reason: string | null, origin: string) {
	const move = vettingMoves[decision];
	if (move.reason && !reason) throw new VettingRefused('A reason is required.');
	const target = await db.transaction(async (tx) => {
		const [c] = await tx
			.select({ status: contractor.status, submittedAt: contractor.submittedAt, businessName: contractor.businessName, name: user.name, email: user.email })
			.from(contractor)
			.innerJoin(user, eq(user.id, contractor.userId))
			.where(eq(contractor.userId, contractorId))
			.for('update', { of: contractor });
		if (!c) return null;
		if (!move.from.includes(c.status)) throw new VettingRefused(`This account is ${statusLabels[c.status].toLowerCase()}; it cannot get “${move.label}” now.`);
		if (decision === 'approve') {
			const docs = await tx.select({ kind: contractorDocument.kind }).from(contractorDocument).where(eq(contractorDocument.contractorId, contractorId));
			if (!c.submittedAt || docs.length < 2) throw new VettingRefused('The profile is not complete: it needs both documents before it can be approved.');
		}
		const now = new Date();
		await tx
			.update(contractor)
			.set({ status: move.to, statusReason: move.reason ? reason : null, updatedAt: now })
			.where(eq(contractor.userId, contractorId));
		if (move.to === 'suspended') await withdrawOpenBidsOf(tx, contractorId);
		await tx.insert(auditLog).values({
			actorId: admin.id,
			actorName: admin.name,
			action: decision,
			subjectId: contractorId,
			subjectName: c.businessName ? `${c.businessName} (${c.name})` : c.name,
			reason,
			createdAt: now
		});
		return c;
	});
	if (!target) return false;
	await queueMail(target.email, vettingDecisionMail(target.name, decision, reason, origin));
	return true;
}
