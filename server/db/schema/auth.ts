import { relations, sql } from 'drizzle-orm'
import { index, int, mysqlEnum, mysqlTable, primaryKey, uniqueIndex, varchar, json } from 'drizzle-orm/mysql-core'
import { ROLES } from '../../../shared/utils/roles'
import { stamp, timestamps, uuid } from './columns'

export const users = mysqlTable('users', {
  id: uuid('id').primaryKey(),
  email: varchar('email', { length: 254 }).notNull(),
  name: varchar('name', { length: 120 }).notNull(),
  passwordHash: varchar('password_hash', { length: 255 }).notNull(),
  failedLogins: int('failed_logins').notNull().default(0),
  firstFailedAt: stamp('first_failed_at'),
  lockedUntil: stamp('locked_until'),
  ...timestamps(),
  deletedAt: stamp('deleted_at'),
}, t => [uniqueIndex('users_email_uq').on(t.email)])

export const SHOP_KINDS = ['shop', 'personal'] as const

export const shops = mysqlTable('shops', {
  id: uuid('id').primaryKey(),
  name: varchar('name', { length: 120 }).notNull(),
  // 'personal': one user's own space (their rigs), never shown or acted on as a shop.
  kind: mysqlEnum('kind', SHOP_KINDS).notNull().default('shop'),
  personalOf: uuid('personal_of'),
  ...timestamps(),
  deletedAt: stamp('deleted_at'),
}, t => [uniqueIndex('shops_personal_of_uq').on(t.personalOf)])

export const memberships = mysqlTable('memberships', {
  shopId: uuid('shop_id').notNull().references(() => shops.id),
  userId: uuid('user_id').notNull().references(() => users.id),
  role: mysqlEnum('role', ROLES).notNull(),
  ...timestamps(),
}, t => [
  primaryKey({ columns: [t.shopId, t.userId] }),
  index('memberships_user_idx').on(t.userId),
])

export const invitations = mysqlTable('invitations', {
  id: uuid('id').primaryKey(),
  shopId: uuid('shop_id').notNull().references(() => shops.id),
  email: varchar('email', { length: 254 }).notNull(),
  role: mysqlEnum('role', ROLES).notNull(),
  tokenHash: varchar('token_hash', { length: 64 }).notNull(),
  invitedBy: uuid('invited_by').notNull().references(() => users.id),
  expiresAt: stamp('expires_at').notNull(),
  acceptedAt: stamp('accepted_at'),
  acceptedBy: uuid('accepted_by'),
  ...timestamps(),
  deletedAt: stamp('deleted_at'),
}, t => [
  uniqueIndex('invitations_token_uq').on(t.tokenHash),
  index('invitations_shop_idx').on(t.shopId),
])

export const auditLog = mysqlTable('audit_log', {
  id: uuid('id').primaryKey(),
  shopId: uuid('shop_id'),
  userId: uuid('user_id'),
  action: varchar('action', { length: 64 }).notNull(),
  detail: json('detail').$type<Record<string, unknown>>(),
  createdAt: stamp('created_at').notNull().default(sql`CURRENT_TIMESTAMP(3)`),
}, t => [
  index('audit_shop_idx').on(t.shopId, t.createdAt),
  index('audit_user_idx').on(t.userId, t.createdAt),
])

export const usersRelations = relations(users, ({ many }) => ({ memberships: many(memberships) }))
export const shopsRelations = relations(shops, ({ many }) => ({ memberships: many(memberships), invitations: many(invitations) }))
export const membershipsRelations = relations(memberships, ({ one }) => ({
  shop: one(shops, { fields: [memberships.shopId], references: [shops.id] }),
  user: one(users, { fields: [memberships.userId], references: [users.id] }),
}))
export const invitationsRelations = relations(invitations, ({ one }) => ({
  shop: one(shops, { fields: [invitations.shopId], references: [shops.id] }),
}))

/**
 * A signed-in device. The cookie carries a random id; this row (keyed by its sha256) is what
 * makes the cookie valid, so signing out or changing the password ends it on the server too.
 */
export const sessions = mysqlTable('sessions', {
  id: varchar('id', { length: 64 }).primaryKey(),
  userId: uuid('user_id').notNull().references(() => users.id),
  createdAt: stamp('created_at').notNull().default(sql`CURRENT_TIMESTAMP(3)`),
  expiresAt: stamp('expires_at').notNull(),
}, t => [index('sessions_user_idx').on(t.userId)])
