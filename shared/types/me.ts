import type { Role } from '../utils/roles'

export interface MePayload {
  user: { id: string, name: string, email: string }
  memberships: { shopId: string, shopName: string, role: Role }[]
  activeShop: { id: string, name: string, role: Role } | null
}
