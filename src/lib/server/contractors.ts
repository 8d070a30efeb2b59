import { error } from '@sveltejs/kit';
import { and, eq, getTableColumns } from 'drizzle-orm';
import { statusAfterEdit, type ContractorStatus } from '$lib/contractor-status';
import type { ContractorProfileInput, DocumentKind } from '$lib/schemas/contractor';
import { db } from '$lib/server/db';
import { contractor, contractorDocument } from '$lib/server/db/schema';
import { requireRole } from './guards';
import { storage } from './storage';
import type { SniffedUpload } from './uploads';

/** What a document list shows; never the storage key. */
const { storageKey: _key, ...documentFields } = getTableColumns(contractorDocument);

export async function findContractor(userId: string) {
	const [row] = await db.select().from(contractor).where(eq(contractor.userId, userId));
	if (!row) return null;
	const documents = await db.select(documentFields).from(contractorDocument).where(eq(contractorDocument.contractorId, userId));
	return { ...row, documents };
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
 * Saves the profile and any new documents, and works out the new status: see statusAfterEdit.
 * Bytes are stored before the transaction under fresh keys, so a failed save leaves the old files
 * in place; replaced files are deleted only after the commit.
 */
export async function saveContractorProfile(
	userId: string,
	input: ContractorProfileInput,
	centroid: Centroid,
	uploads: Partial<Record<DocumentKind, SniffedUpload>>
): Promise<ContractorStatus> {
	const written: { kind: DocumentKind; key: string; file: SniffedUpload }[] = [];
	for (const [kind, file] of Object.entries(uploads) as [DocumentKind, SniffedUpload][]) {
		const key = `contractors/${userId}/${kind}-${crypto.randomUUID()}.${file.ext}`;
		await storage().put(key, file.bytes, file.mime);
		written.push({ kind, key, file });
	}
	try {
		const { status, replaced } = await db.transaction(async (tx) => {
			const [current] = await tx.select().from(contractor).where(eq(contractor.userId, userId)).for('update');
			if (!current) throw new Error(`No contractor record for ${userId}`);
			const old = await tx.select().from(contractorDocument).where(eq(contractorDocument.contractorId, userId));
			const credentialsChanged =
				written.length > 0 || current.licenceNumber !== input.licenceNumber || current.licenceAuthority !== input.licenceAuthority;
			const status = current.submittedAt ? statusAfterEdit(current.status, credentialsChanged) : current.status;
			const backInQueue = status === 'awaiting_review' && (current.status !== 'awaiting_review' || !current.submittedAt);
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
					...(backInQueue ? { reviewRequestedAt: now } : {}),
					updatedAt: now
				})
				.where(eq(contractor.userId, userId));
			for (const { kind, key, file } of written) {
				const row = { storageKey: key, contentType: file.mime, bytes: file.bytes.byteLength, originalName: file.name, createdAt: now };
				await tx
					.insert(contractorDocument)
					.values({ contractorId: userId, kind, ...row })
					.onConflictDoUpdate({ target: [contractorDocument.contractorId, contractorDocument.kind], set: row });
			}
			return { status, replaced: old.filter((d) => written.some((w) => w.kind === d.kind)).map((d) => d.storageKey) };
		});
		await Promise.all(replaced.map((key) => storage().delete(key)));
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
