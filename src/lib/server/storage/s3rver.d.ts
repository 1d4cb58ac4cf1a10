// s3rver ships no types; this names only what the local fake store uses.
declare module 's3rver' {
	import type { AddressInfo } from 'node:net';
	import type { Server } from 'node:http';

	type S3rverOptions = {
		address?: string;
		port?: number;
		directory?: string;
		silent?: boolean;
		configureBuckets?: { name: string }[];
	};

	export default class S3rver {
		constructor(options: S3rverOptions);
		httpServer: Server;
		run(): Promise<AddressInfo>;
		close(): Promise<void>;
	}
}
