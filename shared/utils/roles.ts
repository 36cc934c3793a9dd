export const ROLES = ['owner', 'tech', 'desk', 'player'] as const
export type Role = (typeof ROLES)[number]

export const ROLE_LABELS: Record<Role, string> = {
  owner: 'Owner',
  tech: 'Bench tech',
  desk: 'Front desk',
  player: 'Player',
}

/** Roles that work inside the shop (everyone but customers). */
export const STAFF_ROLES: readonly Role[] = ['owner', 'tech', 'desk']
