import fs from 'node:fs/promises';
import path from 'node:path';
import { Readable } from 'node:stream';
import { DeleteObjectCommand, GetObjectCommand, HeadBucketCommand, PutObjectCommand, S3Client, type S3ClientConfig } from '@aws-sdk/client-s3';
import { env } from '$env/dynamic/private';

/** Bytes read piece by piece, with their length known before the first piece. */
export interface StoredStream {
	body: ReadableStream<Uint8Array>;
	size: number;
}

/**
 * Where uploaded bytes live. Everything goes through this interface: one server keeps them on disk,
 * several app servers share an S3-compatible object store (chosen by settings, see `storage()`).
 */
export interface Storage {
	put(key: string, bytes: Uint8Array, contentType: string): Promise<void>;
	/** The whole object in memory; for small files the server itself must read (e.g. to re-encode). */
	get(key: string): Promise<Uint8Array | null>;
	/** The object as a stream, for sending to a browser without holding the whole file. */
	stream(key: string): Promise<StoredStream | null>;
	/** Removing a key that is not there is not an error. */
	delete(key: string): Promise<void>;
}

const SAFE_KEY = /^[a-z0-9][a-z0-9/_.-]*$/i;

function checkKey(key: string) {
	if (!SAFE_KEY.test(key) || key.includes('..')) throw new Error(`Unsafe storage key: ${key}`);
}

/** Files under one folder; a key is a relative path. */
export function diskStorage(root: string): Storage {
	const file = (key: string) => {
		checkKey(key);
		return path.join(root, key);
	};
	const missing = (err: unknown) => (err as NodeJS.ErrnoException).code === 'ENOENT';
	return {
		async put(key, bytes) {
			const p = file(key);
			await fs.mkdir(path.dirname(p), { recursive: true });
			// Write then rename, so a reader never sees half a file.
			const tmp = `${p}.${process.pid}.${Date.now()}.part`;
			await fs.writeFile(tmp, bytes);
			await fs.rename(tmp, p);
		},
		async get(key) {
			try {
				return new Uint8Array(await fs.readFile(file(key)));
			} catch (err) {
				if (missing(err)) return null;
				throw err;
			}
		},
		async stream(key) {
			let handle: fs.FileHandle;
			try {
				handle = await fs.open(file(key), 'r');
			} catch (err) {
				if (missing(err)) return null;
				throw err;
			}
			try {
				// Size and bytes come from the same open file, even if a new version is renamed in meanwhile.
				const { size } = await handle.stat();
				const body = Readable.toWeb(handle.createReadStream({ autoClose: true })) as ReadableStream<Uint8Array>;
				return { body, size };
			} catch (err) {
				await handle.close();
				throw err;
			}
		},
		async delete(key) {
			await fs.rm(file(key), { force: true });
		}
	};
}

export interface S3Settings {
	endpoint?: string;
	bucket: string;
	region: string;
	accessKeyId?: string;
	secretAccessKey?: string;
	/** `bucket` in the path instead of the host name; what most S3-compatible servers want. */
	forcePathStyle: boolean;
}

/** Objects in one bucket of an S3-compatible store; a key is the object's name. */
export function s3Storage(s: S3Settings): Storage {
	const config: S3ClientConfig = {
		region: s.region,
		forcePathStyle: s.forcePathStyle,
		// Checksums on every request are an AWS extension some S3-compatible servers refuse.
		requestChecksumCalculation: 'WHEN_REQUIRED',
		responseChecksumValidation: 'WHEN_REQUIRED'
	};
	if (s.endpoint) config.endpoint = s.endpoint;
	if (s.accessKeyId && s.secretAccessKey) config.credentials = { accessKeyId: s.accessKeyId, secretAccessKey: s.secretAccessKey };
	const client = new S3Client(config);
	const Bucket = s.bucket;
	const missing = (err: unknown) => {
		const e = err as { name?: string; $metadata?: { httpStatusCode?: number } };
		return e.name === 'NoSuchKey' || e.name === 'NotFound' || e.$metadata?.httpStatusCode === 404;
	};
	const open = async (key: string) => {
		checkKey(key);
		try {
			return await client.send(new GetObjectCommand({ Bucket, Key: key }));
		} catch (err) {
			if (missing(err)) return null;
			throw err;
		}
	};
	return {
		async put(key, bytes, contentType) {
			checkKey(key);
			// One PUT replaces the object whole: a reader sees the old bytes or the new, never half.
			await client.send(new PutObjectCommand({ Bucket, Key: key, Body: bytes, ContentType: contentType, ContentLength: bytes.byteLength }));
		},
		async get(key) {
			const res = await open(key);
			if (!res?.Body) return null;
			return await res.Body.transformToByteArray();
		},
		async stream(key) {
			const res = await open(key);
			if (!res?.Body) return null;
			return { body: res.Body.transformToWebStream() as ReadableStream<Uint8Array>, size: Number(res.ContentLength ?? 0) };
		},
		async delete(key) {
			checkKey(key);
			await client.send(new DeleteObjectCommand({ Bucket, Key: key }));
		}
	};
}

/** Whether the bucket answers; for start-up checks and tests. */
export async function s3BucketReachable(s: S3Settings): Promise<boolean> {
	const client = new S3Client({
		region: s.region,
		forcePathStyle: s.forcePathStyle,
		...(s.endpoint ? { endpoint: s.endpoint } : {}),
		...(s.accessKeyId && s.secretAccessKey ? { credentials: { accessKeyId: s.accessKeyId, secretAccessKey: s.secretAccessKey } } : {})
	});
	try {
		await client.send(new HeadBucketCommand({ Bucket: s.bucket }));
		return true;
	} catch {
		return false;
	} finally {
		client.destroy();
	}
}

/** The S3 settings from the environment, or null when S3_BUCKET is unset (then files stay on disk). */
export function s3SettingsFrom(e: Record<string, string | undefined>): S3Settings | null {
	if (!e.S3_BUCKET) return null;
	return {
		endpoint: e.S3_ENDPOINT || undefined,
		bucket: e.S3_BUCKET,
		region: e.S3_REGION || 'us-east-1',
		accessKeyId: e.S3_ACCESS_KEY_ID || undefined,
		secretAccessKey: e.S3_SECRET_ACCESS_KEY || undefined,
		// Path style by default when an endpoint is named (a self-hosted or local store); AWS itself
		// wants host-style addressing.
		forcePathStyle: e.S3_FORCE_PATH_STYLE ? e.S3_FORCE_PATH_STYLE === '1' || e.S3_FORCE_PATH_STYLE === 'true' : Boolean(e.S3_ENDPOINT)
	};
}

let instance: Storage | undefined;

/**
 * The configured storage: the S3 bucket named by S3_BUCKET when set, otherwise UPLOAD_DIR on local
 * disk (default .data/uploads). Several app servers must share S3: each one's disk is its own.
 */
export function storage(): Storage {
	if (!instance) {
		const s3 = s3SettingsFrom(env);
		instance = s3 ? s3Storage(s3) : diskStorage(path.resolve(env.UPLOAD_DIR || '.data/uploads'));
	}
	return instance;
}
