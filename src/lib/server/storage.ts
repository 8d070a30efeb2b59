import fs from 'node:fs/promises';
import path from 'node:path';
import { env } from '$env/dynamic/private';

/**
 * Where uploaded bytes live. Everything goes through this interface so the disk backend can be
 * swapped for object storage when several app servers share the work.
 */
export interface Storage {
	put(key: string, bytes: Uint8Array, contentType: string): Promise<void>;
	get(key: string): Promise<Uint8Array | null>;
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
				if ((err as NodeJS.ErrnoException).code === 'ENOENT') return null;
				throw err;
			}
		},
		async delete(key) {
			await fs.rm(file(key), { force: true });
		}
	};
}

let instance: Storage | undefined;

/** The configured storage: UPLOAD_DIR on local disk (default .data/uploads). */
export function storage(): Storage {
	instance ??= diskStorage(path.resolve(env.UPLOAD_DIR || '.data/uploads'));
	return instance;
}
