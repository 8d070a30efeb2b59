import { error } from '@sveltejs/kit';
import { and, asc, desc, eq, getTableColumns, isNotNull, isNull } from 'drizzle-orm';
import { statusAfterEdit, type ContractorStatus } from '$lib/contractor-status';
import type { ContractorProfileInput, DistanceUnit, DocumentKind } from '$lib/schemas/contractor';
import { db } from '$lib/server/db';
import { contractor, contractorDocument, user, type Contractor } from '$lib/server/db/schema';
import { requireRole } from './guards';
import { queueMail } from './mail';
import { profileSubmittedMail } from './mail/pro-notices';
import { storage } from './storage';
import type { SniffedUpload } from './uploads';

/** What a document list shows; never the storage key. */
const { storageKey: _key, ...documentFields } = getTableColumns(contractorDocument);

/** The profile with its current documents and, newest first, the files they replaced. */
export async function findContractor(userId: string) {
	const [row] = await db.select().from(contractor).where(eq(contractor.userId, userId));
	if (!row) return null;
	const mine = eq(contractorDocument.contractorId, userId);
	const documents = await db
		.select(documentFields)
		.from(contractorDocument)
		.where(and(mine, isNull(contractorDocument.supersededAt)))
		.orderBy(asc(contractorDocument.kind));
	const earlierDocuments = await db
		.select(documentFields)
		.from(contractorDocument)
		.where(and(mine, isNotNull(contractorDocument.supersededAt)))
		.orderBy(desc(contractorDocument.supersededAt));
	return { ...row, documents, earlierDocuments };
}

/** The profile fields a reviewer judges, with the labels the admin page shows for a change. */
export const reviewedFieldLabels = {
	businessName: 'Business name',
	contactName: 'Contact',
	phone: 'Phone',
	description: 'Description',
	yearsInTrade: 'Years in the trade',
	services: 'Services',
	licenceNumber: 'Licence number',
	licenceAuthority: 'Licence issued by',
	licenceExpiresOn: 'Licence expires',
	insuranceExpiresOn: 'Insurance expires',
	servicePostcode: 'Service ZIP code',
	serviceRadius: 'Service radius',
	serviceRadiusUnit: 'Radius unit'
} as const;
type ReviewedField = keyof typeof reviewedFieldLabels;

export const reviewedFields = (c: Contractor) =>
	Object.fromEntries((Object.keys(reviewedFieldLabels) as ReviewedField[]).map((k) => [k, c[k]])) as Record<ReviewedField, unknown>;

/**
 * What changed since the admin's last decision: the fields (labels) and the document kinds with a
 * new file. Null before any decision, when everything is new.
 */
export function changesSinceReview(c: Contractor & { documents: { id: string; kind: DocumentKind }[] }) {
	if (!c.reviewedSnapshot) return null;
	const before = c.reviewedSnapshot.fields;
	const now = reviewedFields(c);
	const fields = (Object.keys(reviewedFieldLabels) as ReviewedField[])
		.filter((k) => JSON.stringify(before[k] ?? null) !== JSON.stringify(now[k] ?? null))
		.map((k) => reviewedFieldLabels[k]);
	const documents = c.documents.filter((d) => !c.reviewedSnapshot!.documentIds.includes(d.id)).map((d) => d.kind);
	return { fields, documents };
}
export type ContractorWithDocuments = NonNullable<Awaited<ReturnType<typeof findContractor>>>;

/** The document `id` when `viewer` may see it: its contractor, or any admin. */
export async function findDocumentFor(id: string, viewer: { id: string; role: string }) {
	const [doc] = await db
		.select()
		.from(contractorDocument)
		.where(viewer.role === 'admin' ? eq(contractorDocument.id, id) : and(eq(contractorDocument.id, id), eq(contractorDocument.contractorId, viewer.id)));
	return doc ?? null;
}

export type Centroid = { lat: number; lon: number };

/**
 * Saves the profile and any new documents, and works out the new status from the edit table in
 * contractor-status. Bytes are stored before the transaction under fresh keys, so a failed save
 * leaves nothing behind; a replaced file is kept as history (superseded), not deleted. Entering
 * the queue tells every admin, in the same transaction.
 */
export async function saveContractorProfile(
	userId: string,
	input: ContractorProfileInput,
	centroid: Centroid,
	uploads: Partial<Record<DocumentKind, SniffedUpload>>,
	origin = ''
): Promise<ContractorStatus> {
	const written: { kind: DocumentKind; key: string; file: SniffedUpload }[] = [];
	for (const [kind, file] of Object.entries(uploads) as [DocumentKind, SniffedUpload][]) {
		const key = `contractors/${userId}/${kind}-${crypto.randomUUID()}.${file.ext}`;
		await storage().put(key, file.bytes, file.mime);
		written.push({ kind, key, file });
	}
	try {
		const status = await db.transaction(async (tx) => {
			const [current] = await tx.select().from(contractor).where(eq(contractor.userId, userId)).for('update');
			if (!current) throw new Error(`No contractor record for ${userId}`);
			// The first submission counts as new credentials: nobody has looked at any of them yet.
			const credentialsChanged =
				current.status === 'draft' ||
				written.length > 0 ||
				current.licenceNumber !== input.licenceNumber ||
				current.licenceAuthority !== input.licenceAuthority ||
				input.licenceExpiresOn !== current.licenceExpiresOn ||
				input.insuranceExpiresOn !== current.insuranceExpiresOn;
			const status = statusAfterEdit(current.status, credentialsChanged);
			const entersQueue = status === 'awaiting_review' && current.status !== 'awaiting_review';
			const now = new Date();
			await tx
				.update(contractor)
				.set({
					...input,
					serviceLat: centroid.lat,
					serviceLon: centroid.lon,
					status,
					statusReason: status === current.status ? current.statusReason : null,
					submittedAt: current.submittedAt ?? now,
					...(current.status === 'suspended' && credentialsChanged ? { credentialsChangedWhileSuspended: true } : {}),
					...(entersQueue ? { reviewRequestedAt: now } : {}),
					updatedAt: now
				})
				.where(eq(contractor.userId, userId));
			for (const { kind, key, file } of written) {
				await tx
					.update(contractorDocument)
					.set({ supersededAt: now })
					.where(and(eq(contractorDocument.contractorId, userId), eq(contractorDocument.kind, kind), isNull(contractorDocument.supersededAt)));
				await tx.insert(contractorDocument).values({
					contractorId: userId,
					kind,
					storageKey: key,
					contentType: file.mime,
					bytes: file.bytes.byteLength,
					originalName: file.name,
					createdAt: now
				});
			}
			if (entersQueue) {
				const admins = await tx.select({ name: user.name, email: user.email }).from(user).where(eq(user.role, 'admin'));
				for (const a of admins) await queueMail(a.email, profileSubmittedMail(a.name, input.businessName, `${origin}/admin/contractors/${userId}`), tx);
			}
			return status;
		});
		return status;
	} catch (err) {
		await Promise.all(written.map((w) => storage().delete(w.key)));
		throw err;
	}
}

/** For actions, which run without the layout's check: the signed-in contractor, approved, or a 403. */
export async function requireApprovedContractor(event: Parameters<typeof requireRole>[0]) {
	const user = requireRole(event, 'contractor');
	const [c] = await db.select({ status: contractor.status }).from(contractor).where(eq(contractor.userId, user.id));
	if (c?.status !== 'approved') error(403, 'Leads are open to approved contractors only.');
	return user;
}

/** The unit the contractor chose for distances in their leads; null: follow their language. */
export async function contractorDistanceUnit(userId: string): Promise<DistanceUnit | null> {
	const [row] = await db.select({ unit: contractor.distanceUnit }).from(contractor).where(eq(contractor.userId, userId));
	return row?.unit ?? null;
}

export async function setContractorDistanceUnit(userId: string, unit: DistanceUnit | null) {
	await db.update(contractor).set({ distanceUnit: unit }).where(eq(contractor.userId, userId));
}
