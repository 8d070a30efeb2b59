// s3rver (the local S3-compatible server the tests and `npm run cluster` use) ships no types.
declare module 's3rver' {
	import type { AddressInfo } from 'node:net';
	interface S3rverOptions {
		address?: string;
		port?: number;
		directory?: string;
		silent?: boolean;
		vhostBuckets?: boolean;
		resetOnClose?: boolean;
		configureBuckets?: { name: string; configs?: unknown[] }[];
	}
	export default class S3rver {
		constructor(options: S3rverOptions);
		run(): Promise<AddressInfo>;
		close(): Promise<void>;
	}
}
