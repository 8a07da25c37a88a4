/** Roles, lowest to highest; each includes what the ones before it may do. */
export const ROLES = ['engineer', 'moderator', 'admin'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  engineer: 'Engineer',
  moderator: 'Moderator',
  admin: 'Admin',
};

export interface Actor {
  id: number;
  role: Role;
}

export function hasRole(actor: Pick<Actor, 'role'> | null | undefined, needed: Role): boolean {
  if (!actor) return false;
  return ROLES.indexOf(actor.role) >= ROLES.indexOf(needed);
}

export const canModerate = (actor: Pick<Actor, 'role'> | null | undefined) => hasRole(actor, 'moderator');
export const canManagePeople = (actor: Pick<Actor, 'role'> | null | undefined) => hasRole(actor, 'admin');
export const canReadOutbox = canManagePeople;
