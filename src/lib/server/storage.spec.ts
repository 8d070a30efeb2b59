import fs from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { diskStorage } from './storage';

describe('disk storage', () => {
	it('stores, reads back and deletes bytes by key', async () => {
		const root = await fs.mkdtemp(path.join(os.tmpdir(), 'stakeline-storage-'));
		const s = diskStorage(root);
		await s.put('plans/abc/photo.jpg', new Uint8Array([1, 2, 3]), 'image/jpeg');
		expect([...(await s.get('plans/abc/photo.jpg'))!]).toEqual([1, 2, 3]);
		expect(await fs.readdir(path.join(root, 'plans/abc'))).toEqual(['photo.jpg']); // no partial files left
		await s.delete('plans/abc/photo.jpg');
		expect(await s.get('plans/abc/photo.jpg')).toBeNull();
		await fs.rm(root, { recursive: true });
	});

	it('refuses keys that would leave its folder', async () => {
		const s = diskStorage(os.tmpdir());
		await expect(s.get('../etc/passwd')).rejects.toThrow(/Unsafe/);
		await expect(s.put('/abs/path', new Uint8Array(), 'x')).rejects.toThrow(/Unsafe/);
	});
});
