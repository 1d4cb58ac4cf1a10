import type { SvelteKitAuthConfig } from '@auth/sveltekit';
import { base64url, calculateJwkThumbprint, EncryptJWT, jwtDecrypt } from 'jose';
import { hkdfSync, randomUUID } from 'node:crypto';

type TokenCodec = NonNullable<SvelteKitAuthConfig['jwt']>;
type EncodeParams = Parameters<NonNullable<TokenCodec['encode']>>[0];
type DecodeParams = Parameters<NonNullable<TokenCodec['decode']>>[0];
export type SessionPayload = NonNullable<Awaited<ReturnType<NonNullable<TokenCodec['decode']>>>>;

const ENCRYPTION = 'A256CBC-HS512';
const KEY_BYTES = 64;

type DerivedKey = { key: Uint8Array; keyId: string };
const derivedKeys = new Map<string, Promise<DerivedKey>>();

/**
 * The token is a JWE (RFC 7516) encrypted directly under a key derived by HKDF (RFC 5869) from
 * the secret, salted with the cookie's name: the format Auth.js writes by default, so tokens
 * issued before this codec stay readable. The key depends on the secret and the name alone, and
 * deriving it (with the key's thumbprint) cost more than the decryption itself, so it is derived
 * once per pair.
 */
function derivedKey(secret: string, salt: string): Promise<DerivedKey> {
	const id = `${salt}\n${secret}`;
	let found = derivedKeys.get(id);
	if (!found) {
		const info = `Auth.js Generated Encryption Key (${salt})`;
		const key = new Uint8Array(hkdfSync('sha256', secret, salt, info, KEY_BYTES));
		found = calculateJwkThumbprint({ kty: 'oct', k: base64url.encode(key) }, 'sha512').then(
			(keyId) => ({ key, keyId })
		);
		derivedKeys.set(id, found);
	}
	return found;
}

const secretsOf = (secret: string | string[]) => (Array.isArray(secret) ? secret : [secret]);

/** Auth.js's `jwt.encode`, and the hooks' re-issue: a token that expires `maxAge` seconds after `now`. */
export async function encodeSessionToken(
	{ token = {}, secret, salt, maxAge }: EncodeParams,
	now = new Date()
): Promise<string> {
	if (maxAge === undefined) throw new Error('A session token needs its lifetime.');
	const { key, keyId } = await derivedKey(secretsOf(secret)[0]!, salt);
	const now_s = Math.floor(now.getTime() / 1000);
	return new EncryptJWT(token)
		.setProtectedHeader({ alg: 'dir', enc: ENCRYPTION, kid: keyId })
		.setIssuedAt(now_s)
		.setExpirationTime(now_s + maxAge)
		.setJti(randomUUID())
		.encrypt(key);
}

/**
 * Auth.js's `jwt.decode`, and the hooks' own reading of the cookie: the payload of a token this
 * app encrypted and that has not expired at `now`; throws on anything else.
 */
export async function decodeSessionToken(
	{ token, secret, salt }: DecodeParams,
	now = new Date()
): Promise<SessionPayload | null> {
	if (!token) return null;
	const keys = await Promise.all(secretsOf(secret).map((s) => derivedKey(s, salt)));
	const { payload } = await jwtDecrypt(
		token,
		({ kid }) => {
			const match = keys.find((k) => kid === undefined || k.keyId === kid);
			if (!match) throw new Error('The token was not issued under this secret.');
			return match.key;
		},
		{
			currentDate: now,
			keyManagementAlgorithms: ['dir'],
			contentEncryptionAlgorithms: [ENCRYPTION]
		}
	);
	return payload as SessionPayload;
}
