import fs from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import S3rver from 's3rver';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { diskStorage, s3BucketReachable, s3SettingsFrom, s3Storage, type S3Settings, type Storage } from './storage';

async function readAll(body: ReadableStream<Uint8Array>) {
	const chunks: Uint8Array[] = [];
	for await (const chunk of body as unknown as AsyncIterable<Uint8Array>) chunks.push(chunk);
	return { bytes: Buffer.concat(chunks), chunks: chunks.length };
}

function randomBytes(n: number) {
	const b = new Uint8Array(n);
	for (let i = 0; i < n; i++) b[i] = (i * 7919 + (i >> 8)) & 0xff;
	return b;
}

/**
 * What every backend must do. `make` returns a fresh handle on the same store each call, as two app
 * servers would each have their own.
 */
function contract(name: string, make: () => Storage) {
	describe(`${name} storage`, () => {
		it('stores, reads back and deletes bytes by key', async () => {
			const s = make();
			await s.put('plans/abc/photo.jpg', new Uint8Array([1, 2, 3]), 'image/jpeg');
			expect([...(await s.get('plans/abc/photo.jpg'))!]).toEqual([1, 2, 3]);
			await s.delete('plans/abc/photo.jpg');
			expect(await s.get('plans/abc/photo.jpg')).toBeNull();
			expect(await s.stream('plans/abc/photo.jpg')).toBeNull();
		});

		it('answers null for a key never written, and deleting it is not an error', async () => {
			const s = make();
			expect(await s.get('plans/never/written.jpg')).toBeNull();
			expect(await s.stream('plans/never/written.jpg')).toBeNull();
			await expect(s.delete('plans/never/written.jpg')).resolves.toBeUndefined();
		});

		it('a second handle (another app server) reads what the first wrote, and a rewrite replaces it whole', async () => {
			const a = make();
			const b = make();
			await a.put('docs/x/licence.pdf', new Uint8Array([9, 9, 9, 9]), 'application/pdf');
			expect([...(await b.get('docs/x/licence.pdf'))!]).toEqual([9, 9, 9, 9]);
			await b.put('docs/x/licence.pdf', new Uint8Array([4, 5]), 'application/pdf');
			expect([...(await a.get('docs/x/licence.pdf'))!]).toEqual([4, 5]);
			await a.delete('docs/x/licence.pdf');
			expect(await b.get('docs/x/licence.pdf')).toBeNull();
		});

		it('streams a large file piece by piece with its size known up front', async () => {
			const s = make();
			const big = randomBytes(3 * 1024 * 1024 + 17);
			await s.put('plans/big/photo.jpg', big, 'image/jpeg');
			const opened = await s.stream('plans/big/photo.jpg');
			expect(opened).not.toBeNull();
			expect(opened!.size).toBe(big.byteLength);
			const { bytes, chunks } = await readAll(opened!.body);
			expect(bytes.equals(Buffer.from(big))).toBe(true);
			// More than one piece: the file was never handed over as one buffer.
			expect(chunks).toBeGreaterThan(1);
			await s.delete('plans/big/photo.jpg');
		});

		it('refuses keys that would leave its folder or bucket prefix', async () => {
			const s = make();
			await expect(s.get('../etc/passwd')).rejects.toThrow(/Unsafe/);
			await expect(s.stream('a/../../b')).rejects.toThrow(/Unsafe/);
			await expect(s.put('/abs/path', new Uint8Array(), 'x')).rejects.toThrow(/Unsafe/);
			await expect(s.delete('')).rejects.toThrow(/Unsafe/);
		});
	});
}

let diskRoot = '';
let s3Dir = '';
let s3: S3rver | undefined;
let s3Settings: S3Settings;

beforeAll(async () => {
	diskRoot = await fs.mkdtemp(path.join(os.tmpdir(), 'stakeline-storage-'));
	s3Dir = await fs.mkdtemp(path.join(os.tmpdir(), 'stakeline-s3-'));
	// A real S3-compatible server on loopback (any free port), in a folder of its own.
	s3 = new S3rver({ address: '127.0.0.1', port: 0, directory: s3Dir, silent: true, vhostBuckets: false, configureBuckets: [{ name: 'stakeline-test' }] });
	const addr = await s3.run();
	s3Settings = s3SettingsFrom({
		S3_ENDPOINT: `http://127.0.0.1:${addr.port}`,
		S3_BUCKET: 'stakeline-test',
		S3_ACCESS_KEY_ID: 'S3RVER',
		S3_SECRET_ACCESS_KEY: 'S3RVER'
	})!;
});

afterAll(async () => {
	await s3?.close();
	await fs.rm(diskRoot, { recursive: true, force: true });
	await fs.rm(s3Dir, { recursive: true, force: true });
});

contract('disk', () => diskStorage(diskRoot));
contract('S3', () => s3Storage(s3Settings));

describe('disk storage', () => {
	it('leaves no partial files behind after a write', async () => {
		const s = diskStorage(diskRoot);
		await s.put('plans/tidy/photo.jpg', new Uint8Array([1, 2, 3]), 'image/jpeg');
		expect(await fs.readdir(path.join(diskRoot, 'plans/tidy'))).toEqual(['photo.jpg']);
	});
});

describe('S3 settings', () => {
	it('stay off without a bucket, so one server keeps files on disk', () => {
		expect(s3SettingsFrom({ S3_ENDPOINT: 'http://127.0.0.1:9000' })).toBeNull();
	});

	it('use path-style addressing for a named endpoint and host-style for AWS itself, unless told', () => {
		expect(s3SettingsFrom({ S3_BUCKET: 'b', S3_ENDPOINT: 'http://127.0.0.1:9000' })!.forcePathStyle).toBe(true);
		expect(s3SettingsFrom({ S3_BUCKET: 'b' })!.forcePathStyle).toBe(false);
		expect(s3SettingsFrom({ S3_BUCKET: 'b', S3_FORCE_PATH_STYLE: '1' })!.forcePathStyle).toBe(true);
		expect(s3SettingsFrom({ S3_BUCKET: 'b', S3_ENDPOINT: 'http://x', S3_FORCE_PATH_STYLE: 'false' })!.forcePathStyle).toBe(false);
		expect(s3SettingsFrom({ S3_BUCKET: 'b' })!.region).toBe('us-east-1');
	});

	it('report whether the bucket answers', async () => {
		expect(await s3BucketReachable(s3Settings)).toBe(true);
		expect(await s3BucketReachable({ ...s3Settings, bucket: 'no-such-bucket' })).toBe(false);
	});
});
