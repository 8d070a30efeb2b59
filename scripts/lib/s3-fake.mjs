// A local S3-compatible object store (s3rver) for the cluster and its tests: loopback only, files
// in a folder of our choosing, one bucket created at start. Never for production.
import fs from 'node:fs';
import S3rver from 's3rver';

/** The fixed key pair s3rver accepts; it signs like AWS, so the real client code path is used. */
export const S3_FAKE_KEYS = { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' };

/**
 * Starts s3rver on host:port (port 0 picks a free one) with `bucket` created.
 * @param {{ host?: string, port?: number, directory: string, bucket: string }} o
 * @returns {Promise<{ endpoint: string, port: number, env: Record<string, string>, close: () => Promise<void> }>}
 */
export async function startS3Fake({ host = '127.0.0.1', port = 0, directory, bucket }) {
	fs.mkdirSync(directory, { recursive: true });
	const server = new S3rver({ address: host, port, directory, silent: true, vhostBuckets: false, configureBuckets: [{ name: bucket }] });
	const addr = await server.run();
	const endpoint = `http://${host}:${addr.port}`;
	return {
		endpoint,
		port: addr.port,
		env: {
			S3_ENDPOINT: endpoint,
			S3_BUCKET: bucket,
			S3_REGION: 'us-east-1',
			S3_ACCESS_KEY_ID: S3_FAKE_KEYS.accessKeyId,
			S3_SECRET_ACCESS_KEY: S3_FAKE_KEYS.secretAccessKey,
			S3_FORCE_PATH_STYLE: '1'
		},
		close: () => server.close()
	};
}
