// Types for profiles.js (plain JavaScript: it runs before anything is installed).
export const ROOT: string;
export const STACK_KEYS: string[];
export function stackEnv(
	name: string,
	outer?: Record<string, string | undefined>
): Record<string, string>;
export function ownerEnv(e: Record<string, string>): Record<string, string>;
