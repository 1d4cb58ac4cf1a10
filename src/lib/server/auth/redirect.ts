/**
 * A redirect target the app may send a user to after sign-in: a path on its own origin, or
 * null. The candidate is parsed the way a browser would, against the origin, so `//elsewhere`,
 * `/\elsewhere`, a tab inside `/\t/elsewhere` and absolute URLs to other hosts all fall out.
 */
export function sameOriginPath(
	candidate: string | null | undefined,
	origin: string
): string | null {
	if (!candidate) return null;
	let target: URL;
	try {
		target = new URL(candidate, origin);
	} catch {
		return null;
	}
	if (target.origin !== new URL(origin).origin) return null;
	return `${target.pathname}${target.search}${target.hash}`;
}
