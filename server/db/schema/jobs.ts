import { bigint, boolean, double, index, int, json, mysqlEnum, mysqlTable, primaryKey, text, uniqueIndex, varchar } from 'drizzle-orm/mysql-core'
import { sql } from 'drizzle-orm'
import { JOB_PRIORITIES, JOB_STATES } from '../../../shared/utils/jobs/states'
import { stamp, synced, timestamps, uuid } from './columns'

export const customers = mysqlTable('customers', {
  ...synced(),
  name: varchar('name', { length: 120 }).notNull(),
  email: varchar('email', { length: 254 }).notNull().default(''),
  phone: varchar('phone', { length: 40 }).notNull().default(''),
  notes: text('notes').notNull(),
  playerUserId: uuid('player_user_id'),
}, t => [
  index('customers_shop_version_idx').on(t.shopId, t.version),
  index('customers_player_idx').on(t.playerUserId),
])

export const amps = mysqlTable('amps', {
  ...synced(),
  customerId: uuid('customer_id').notNull(),
  description: varchar('description', { length: 200 }).notNull(),
  serial: varchar('serial', { length: 80 }).notNull().default(''),
  tubeComplement: varchar('tube_complement', { length: 120 }).notNull().default(''),
  powerTubeCount: int('power_tube_count').notNull().default(2),
  biasMode: mysqlEnum('bias_mode', ['fixed', 'cathode']).notNull().default('fixed'),
  rectifier: varchar('rectifier', { length: 60 }).notNull().default(''),
  notes: text('notes').notNull(),
  // A player's rig shared with this shop, picked at check-in.
  rigId: uuid('rig_id'),
}, t => [
  index('amps_shop_version_idx').on(t.shopId, t.version),
  index('amps_customer_idx').on(t.customerId),
  index('amps_rig_idx').on(t.rigId),
])

export const jobs = mysqlTable('jobs', {
  ...synced(),
  customerId: uuid('customer_id').notNull(),
  ampId: uuid('amp_id').notNull(),
  complaint: text('complaint').notNull(),
  accessories: varchar('accessories', { length: 500 }).notNull().default(''),
  photos: json('photos').$type<string[]>().notNull(),
  promisedFor: varchar('promised_for', { length: 10 }).notNull().default(''),
  assignedTo: uuid('assigned_to'),
  priority: mysqlEnum('priority', JOB_PRIORITIES).notNull().default('normal'),
  status: mysqlEnum('status', JOB_STATES).notNull().default('checked-in'),
}, t => [
  index('jobs_shop_version_idx').on(t.shopId, t.version),
  index('jobs_customer_idx').on(t.customerId),
  index('jobs_shop_status_idx').on(t.shopId, t.status),
  // GET /api/jobs: one index per sort it offers (ties by updated_at, then the primary key), and the tech filter.
  index('jobs_list_updated_idx').on(t.shopId, t.deletedAt, t.updatedAt),
  index('jobs_list_promised_idx').on(t.shopId, t.deletedAt, t.promisedFor, t.updatedAt),
  index('jobs_list_status_idx').on(t.shopId, t.deletedAt, t.status, t.updatedAt),
  index('jobs_list_priority_idx').on(t.shopId, t.deletedAt, t.priority, t.updatedAt),
  index('jobs_assigned_idx').on(t.shopId, t.assignedTo, t.updatedAt),
])

export const jobParts = mysqlTable('job_parts', {
  ...synced(),
  jobId: uuid('job_id').notNull(),
  description: varchar('description', { length: 200 }).notNull(),
  quantity: double('quantity').notNull(),
  unitCostCents: int('unit_cost_cents').notNull().default(0),
  unitPriceCents: int('unit_price_cents').notNull(),
}, t => [
  index('job_parts_shop_version_idx').on(t.shopId, t.version),
  index('job_parts_job_idx').on(t.jobId),
])

export const jobLabour = mysqlTable('job_labour', {
  ...synced(),
  jobId: uuid('job_id').notNull(),
  description: varchar('description', { length: 200 }).notNull().default(''),
  minutes: int('minutes').notNull(),
  rateCents: int('rate_cents').notNull(),
  techId: uuid('tech_id'),
}, t => [
  index('job_labour_shop_version_idx').on(t.shopId, t.version),
  index('job_labour_job_idx').on(t.jobId),
])

/** The status timeline: written by the server whenever a job's status changes. */
export const jobEvents = mysqlTable('job_events', {
  id: uuid('id').primaryKey(),
  shopId: uuid('shop_id').notNull(),
  jobId: uuid('job_id').notNull(),
  fromStatus: mysqlEnum('from_status', JOB_STATES),
  toStatus: mysqlEnum('to_status', JOB_STATES).notNull(),
  byUser: uuid('by_user').notNull(),
  at: stamp('at').notNull(),
  version: bigint('version', { mode: 'number', unsigned: true }).notNull(),
}, t => [
  index('job_events_shop_version_idx').on(t.shopId, t.version),
  index('job_events_job_idx').on(t.jobId),
])

export const INVOICE_STATES = ['draft', 'sent', 'paid', 'void'] as const
export const PAYMENT_METHODS = ['online', 'cash', 'card'] as const

/** Invoices are numbered by the server in sequence per shop, so they are never created offline. */
export const invoices = mysqlTable('invoices', {
  id: uuid('id').primaryKey(),
  shopId: uuid('shop_id').notNull(),
  jobId: uuid('job_id').notNull(),
  number: int('number').notNull(),
  kind: mysqlEnum('kind', ['estimate', 'invoice']).notNull().default('invoice'),
  state: mysqlEnum('state', INVOICE_STATES).notNull().default('draft'),
  lines: json('lines').$type<{ kind: 'part' | 'labour', description: string, quantity: number, unitCents: number, totalCents: number }[]>().notNull(),
  partsCents: int('parts_cents').notNull(),
  labourCents: int('labour_cents').notNull(),
  subtotalCents: int('subtotal_cents').notNull(),
  taxRateBasisPoints: int('tax_rate_bp').notNull(),
  taxCents: int('tax_cents').notNull(),
  totalCents: int('total_cents').notNull(),
  currency: varchar('currency', { length: 3 }).notNull().default('usd'),
  issuedAt: stamp('issued_at'),
  paidAt: stamp('paid_at'),
  // How it was paid: online through the provider, or cash or card at the counter.
  paidWith: mysqlEnum('paid_with', PAYMENT_METHODS),
  version: bigint('version', { mode: 'number', unsigned: true }).notNull(),
  ...timestamps(),
}, t => [
  uniqueIndex('invoices_shop_number_uq').on(t.shopId, t.kind, t.number),
  index('invoices_shop_version_idx').on(t.shopId, t.version),
  index('invoices_job_idx').on(t.jobId),
])

export const invoiceCounters = mysqlTable('invoice_counters', {
  shopId: uuid('shop_id').notNull(),
  kind: mysqlEnum('kind', ['estimate', 'invoice']).notNull(),
  last: int('last').notNull().default(0),
}, t => [primaryKey({ columns: [t.shopId, t.kind] })])

export const payments = mysqlTable('payments', {
  id: uuid('id').primaryKey(),
  shopId: uuid('shop_id').notNull(),
  invoiceId: uuid('invoice_id').notNull(),
  // Null for money taken at the counter: no provider was involved.
  providerIntentId: varchar('provider_intent_id', { length: 255 }),
  method: mysqlEnum('method', PAYMENT_METHODS).notNull().default('online'),
  amountCents: int('amount_cents').notNull(),
  status: mysqlEnum('status', ['pending', 'succeeded', 'failed']).notNull().default('pending'),
  recordedBy: uuid('recorded_by'),
  ...timestamps(),
}, t => [
  uniqueIndex('payments_intent_uq').on(t.providerIntentId),
  index('payments_invoice_idx').on(t.invoiceId),
])

/**
 * A link that opens and pays one invoice without an account (sent in the invoice e-mail).
 * Only the token's SHA-256 is kept; the desk can revoke it, and it expires.
 */
export const payLinks = mysqlTable('pay_links', {
  id: uuid('id').primaryKey(),
  shopId: uuid('shop_id').notNull(),
  invoiceId: uuid('invoice_id').notNull(),
  tokenHash: varchar('token_hash', { length: 64 }).notNull(),
  expiresAt: stamp('expires_at').notNull(),
  revokedAt: stamp('revoked_at'),
  revokedBy: uuid('revoked_by'),
  createdBy: uuid('created_by'),
  ...timestamps(),
}, t => [
  uniqueIndex('pay_links_token_uq').on(t.tokenHash),
  index('pay_links_invoice_idx').on(t.invoiceId),
])

/** Webhook event ids already handled: a replay is acknowledged and ignored. */
export const webhookEvents = mysqlTable('webhook_events', {
  id: varchar('id', { length: 255 }).primaryKey(),
  type: varchar('type', { length: 100 }).notNull(),
  receivedAt: stamp('received_at').notNull().default(sql`CURRENT_TIMESTAMP(3)`),
})

export const shopSettings = mysqlTable('shop_settings', {
  shopId: uuid('shop_id').primaryKey(),
  labourRateCents: int('labour_rate_cents').notNull().default(9000),
  taxRateBasisPoints: int('tax_rate_bp').notNull().default(0),
  currency: varchar('currency', { length: 3 }).notNull().default('usd'),
  readyEmail: boolean('ready_email').notNull().default(true),
  invoiceEmail: boolean('invoice_email').notNull().default(true),
  paymentEmail: boolean('payment_email').notNull().default(true),
  // What records and e-mails say about the shop.
  address: varchar('address', { length: 300 }).notNull().default(''),
  phone: varchar('phone', { length: 40 }).notNull().default(''),
  email: varchar('email', { length: 254 }).notNull().default(''),
  ...timestamps(),
})

/** Every e-mail the app sent, for the owner's local Outbox page. */
export const sentMail = mysqlTable('sent_mail', {
  id: uuid('id').primaryKey(),
  shopId: uuid('shop_id'),
  toAddress: varchar('to_address', { length: 254 }).notNull(),
  subject: varchar('subject', { length: 300 }).notNull(),
  body: text('body').notNull(),
  replyTo: varchar('reply_to', { length: 254 }),
  delivered: boolean('delivered').notNull(),
  // The durable outbox: an undelivered message is tried again at next_attempt_at (null: delivered
  // or given up); a sender holds claimed_until while it talks to the mail server, so it goes once.
  attempts: int('attempts').notNull().default(0),
  nextAttemptAt: stamp('next_attempt_at'),
  claimedUntil: stamp('claimed_until'),
  createdAt: stamp('created_at').notNull().default(sql`CURRENT_TIMESTAMP(3)`),
}, t => [index('sent_mail_shop_idx').on(t.shopId, t.createdAt), index('sent_mail_due_idx').on(t.delivered, t.nextAttemptAt)])
