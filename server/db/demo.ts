// The invented demo shop. Fixed ids keep the seed idempotent.
import type { Role } from '../../shared/utils/roles'

export const DEMO_SHOP = { id: '6f1c2a10-0000-4000-8000-000000000001', name: 'Larkspur Amp Works' }

export const DEMO_USERS: { id: string, email: string, name: string, role: Role }[] = [
  { id: '6f1c2a10-0000-4000-8000-000000000101', email: 'owner@larkspur.example', name: 'Mira Castell', role: 'owner' },
  { id: '6f1c2a10-0000-4000-8000-000000000102', email: 'tech@larkspur.example', name: 'Owen Pryde', role: 'tech' },
  { id: '6f1c2a10-0000-4000-8000-000000000103', email: 'desk@larkspur.example', name: 'Jo Ames', role: 'desk' },
  { id: '6f1c2a10-0000-4000-8000-000000000201', email: 'dana@players.example', name: 'Dana Whitlow', role: 'player' },
  { id: '6f1c2a10-0000-4000-8000-000000000202', email: 'sam@players.example', name: 'Sam Okafor', role: 'player' },
]
