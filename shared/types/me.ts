import type { Role } from '../utils/roles'

export interface MePayload {
  user: { id: string, name: string, email: string }
  memberships: { shopId: string, shopName: string, role: Role }[]
  /** The user's personal space: where their rigs are kept and synced, with or without a shop. */
  personalSpaceId: string
  activeShop: { id: string, name: string, role: Role } | null
}
