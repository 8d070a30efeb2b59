import { error } from '@sveltejs/kit';
import { findDocumentFor } from '$lib/server/contractors';
import { requireUser } from '$lib/server/guards';
import { storage } from '$lib/server/storage';
import type { RequestHandler } from './$types';

/** A licence or insurance file: only for the contractor who uploaded it and for admins. */
export const GET: RequestHandler = async (event) => {
	const user = requireUser(event);
	if (user.role !== 'admin' && user.role !== 'contractor') error(403, 'Documents are for their contractor and administrators.');
	// Another contractor's document answers as missing, so ids reveal nothing.
	const doc = await findDocumentFor(event.params.id, user);
	if (!doc) error(404, 'Not found');
	// Streamed from storage (disk or S3) rather than read whole into memory first.
	const file = await storage().stream(doc.storageKey);
	if (!file) error(404, 'Not found');
	return new Response(file.body, {
		headers: {
			'Content-Type': doc.contentType,
			'Content-Length': String(file.size),
			// Named by the server from the sniffed type the key was stored under, never the uploader's name.
			'Content-Disposition': `inline; filename="${doc.kind}.${doc.storageKey.split('.').pop()}"`,
			'Cache-Control': 'private, no-store',
			// The bytes were sniffed, but never let a document run script in our origin.
			'Content-Security-Policy': "default-src 'none'; style-src 'unsafe-inline'; sandbox"
		}
	});
};
