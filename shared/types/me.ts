import type { Role } from '../utils/roles'

export interface MePayload {
  user: { id: string, name: string, email: string }
  memberships: { shopId: string, shopName: string, role: Role }[]
  /**
   * The user's personal space: where their rigs are kept and synced, with or without a shop.
   * The server always sends it; a device's cached copy from before rigs may lack it.
   */
  personalSpaceId?: string
  activeShop: { id: string, name: string, role: Role } | null
}
