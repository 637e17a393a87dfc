import { hash, verify } from '@node-rs/argon2';

// argon2id with the library's defaults (19 MiB, t=2), the OWASP-recommended baseline.
export function hashPassword(plain: string): Promise<string> {
	return hash(plain);
}

export async function checkPassword(stored: string | null, plain: string): Promise<boolean> {
	if (!stored) return false;
	try {
		return await verify(stored, plain);
	} catch {
		return false;
	}
}
