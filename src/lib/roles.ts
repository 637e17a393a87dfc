export const ROLES = ['member', 'moderator', 'shop', 'admin'] as const;
export type Role = (typeof ROLES)[number];

/** What each role may act as. An admin can do what a moderator can; a shop is a member with a shop page. */
const GRANTS: Record<Role, readonly Role[]> = {
	member: ['member'],
	moderator: ['member', 'moderator'],
	shop: ['member', 'shop'],
	admin: ['member', 'moderator', 'admin']
};

export function roleAllows(role: Role, needed: Role): boolean {
	return GRANTS[role].includes(needed);
}
