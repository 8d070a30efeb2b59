import { and, desc, eq, isNull } from 'drizzle-orm';
import { decisionMeta, decisionTarget, statusLabels, type ContractorStatus, type VettingDecision } from '$lib/contractor-status';
import { db } from '$lib/server/db';
import { auditLog, contractor, contractorDocument, user } from '$lib/server/db/schema';
import { reviewedFields } from './contractors';
import { tellHomeownersOfContractorChange } from './leads';
import { queueMail } from './mail';
import { vettingDecisionMail } from './mail/pro-notices';

/** A decision that does not fit the account's current state; the message says why. */
export class VettingRefused extends Error {}

type Admin = { id: string; name: string };
type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/**
 * Applies an admin's decision to a contractor, as the table in contractor-status says: the status
 * change, its audit row, the notices to the contractor and to homeowners with bids from them, all
 * in one transaction (the row is locked, so two admins deciding at once cannot both win). Returns
 * false when there is no such contractor.
 */
export async function decide(admin: Admin, contractorId: string, decision: VettingDecision, reason: string | null, origin: string) {
	const meta = decisionMeta[decision];
	if (meta.reason && !reason) throw new VettingRefused('A reason is required.');
	const found = await db.transaction(async (tx) => {
		const [c] = await tx
			.select({ row: contractor, name: user.name, email: user.email })
			.from(contractor)
			.innerJoin(user, eq(user.id, contractor.userId))
			.where(eq(contractor.userId, contractorId))
			.for('update', { of: contractor });
		if (!c) return false;
		const from = c.row.status;
		const to = decisionTarget(from, decision, { before: c.row.suspendedFrom, credentialsChanged: c.row.credentialsChangedWhileSuspended });
		if (!to) throw new VettingRefused(`This account is ${statusLabels[from].toLowerCase()}; it cannot get “${meta.label}” now.`);
		const docs = await tx
			.select({ id: contractorDocument.id, kind: contractorDocument.kind })
			.from(contractorDocument)
			.where(and(eq(contractorDocument.contractorId, contractorId), isNull(contractorDocument.supersededAt)));
		if (to === 'approved' && decision === 'approve' && docs.length < 2)
			throw new VettingRefused('The profile is not complete: it needs both documents before it can be approved.');
		const today = new Date().toISOString().slice(0, 10);
		if (to === 'approved' && [c.row.licenceExpiresOn, c.row.insuranceExpiresOn].some((d) => d !== null && d < today))
			throw new VettingRefused('The licence or insurance on this profile has expired: the contractor needs to renew it first.');
		const now = new Date();
		const reviewed = decision === 'approve' || decision === 'send_back';
		await tx
			.update(contractor)
			.set({
				status: to,
				statusReason: meta.reason ? reason : to === 'sent_back' ? await lastSendBackReason(tx, contractorId) : null,
				suspendedFrom: to === 'suspended' ? from : null,
				credentialsChangedWhileSuspended: false,
				...(reviewed ? { reviewedSnapshot: { fields: reviewedFields(c.row), documentIds: docs.map((d) => d.id) } } : {}),
				...(to === 'awaiting_review' ? { reviewRequestedAt: now } : {}),
				updatedAt: now
			})
			.where(eq(contractor.userId, contractorId));
		await tx.insert(auditLog).values({
			actorId: admin.id,
			actorName: admin.name,
			action: decision,
			subjectId: contractorId,
			subjectName: c.row.businessName ? `${c.row.businessName} (${c.name})` : c.name,
			reason,
			createdAt: now
		});
		await queueMail(c.email, vettingDecisionMail(c.name, decision, to, reason, origin), tx);
		const change = bidsChange(from, to);
		if (change) await tellHomeownersOfContractorChange(tx, contractorId, c.row.businessName ?? c.name, change, origin);
		return true;
	});
	return found;
}

/** What a status change means for the contractor's bids: they stop or start being acceptable. */
function bidsChange(from: ContractorStatus, to: ContractorStatus): 'suspended' | 'review' | 'active' | null {
	if (to === 'suspended') return 'suspended';
	if (from === 'approved' && to !== 'approved') return 'review';
	if (from !== 'approved' && to === 'approved') return 'active';
	return null;
}

/** Reinstating a sent-back account shows the send-back reason again, not the suspension's. */
async function lastSendBackReason(tx: Tx, contractorId: string) {
	const [row] = await tx
		.select({ reason: auditLog.reason })
		.from(auditLog)
		.where(and(eq(auditLog.subjectId, contractorId), eq(auditLog.action, 'send_back')))
		.orderBy(desc(auditLog.createdAt))
		.limit(1);
	return row?.reason ?? null;
}
