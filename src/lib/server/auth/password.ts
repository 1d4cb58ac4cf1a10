import { hash, verify } from '@node-rs/argon2';

// argon2id with the OWASP password-storage minimum (19 MiB, 2 passes, 1 lane).
const ARGON2ID = { algorithm: 2, memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
	return hash(password, ARGON2ID);
}

// A hash of a password nobody has: verifying against it when the account is unknown makes a
// failed sign-in take the same time whether or not the e-mail exists.
let decoyHash: Promise<string> | undefined;

export async function verifyPassword(storedHash: string | null | undefined, password: string) {
	decoyHash ??= hashPassword(crypto.randomUUID());
	const target = storedHash ?? (await decoyHash);
	const matches = await verify(target, password).catch(() => false);
	return matches && storedHash != null;
}
