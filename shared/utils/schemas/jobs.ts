// Payloads of the jobs, customers, amps, invoices and shop settings REST routes.
import { z } from 'zod'
import { ENTITY_FIELDS } from '../sync/entities'
import { JOB_STATES } from '../jobs/states'
import { createBody, id, page, pageSize, patchBody, q } from './records'

export { createBody, idParams, patchBody } from './records'

export const JOB_SORTS = ['updatedAt', 'promisedFor', 'status', 'priority'] as const

export const jobListQuery = z.object({
  status: z.string().optional().transform((s, ctx) => {
    if (!s) return undefined
    const list = s.split(',').map(x => x.trim()).filter(Boolean)
    const bad = list.find(x => !(JOB_STATES as readonly string[]).includes(x))
    if (bad) {
      ctx.addIssue({ code: 'custom', message: `unknown status "${bad.slice(0, 30)}"` })
      return z.NEVER
    }
    return list as (typeof JOB_STATES)[number][]
  }),
  tech: id.optional(),
  customer: id.optional(),
  q,
  sort: z.enum(JOB_SORTS).default('updatedAt'),
  dir: z.enum(['asc', 'desc']).default('desc'),
  page,
  pageSize,
})

export type JobListQuery = z.infer<typeof jobListQuery>

export const searchQuery = z.object({ q, page, pageSize })

export const jobCreateBody = createBody(ENTITY_FIELDS.jobs)
export const jobPatchBody = patchBody(ENTITY_FIELDS.jobs)
export const customerCreateBody = createBody(ENTITY_FIELDS.customers)
export const customerPatchBody = patchBody(ENTITY_FIELDS.customers)
export const ampCreateBody = createBody(ENTITY_FIELDS.amps)
export const ampPatchBody = patchBody(ENTITY_FIELDS.amps)

const shopText = (max: number) => z.string().trim().max(max, { message: `at most ${max} characters` })

export const settingsPatchBody = z.object({
  name: shopText(120).min(1, { message: 'enter the shop\'s name' }),
  address: shopText(300),
  phone: shopText(40),
  email: z.union([z.literal(''), z.email({ message: 'enter a valid e-mail address' })]),
  labourRateCents: z.number().int({ message: 'must be whole cents' }).min(0).max(10_000_000),
  taxRateBasisPoints: z.number().int({ message: 'must be whole basis points' }).min(0).max(10_000, { message: 'at most 10000 (100 %)' }),
  currency: z.string().regex(/^[A-Za-z]{3}$/, { message: 'use a three-letter currency code' }).transform(s => s.toLowerCase()),
  readyEmail: z.boolean(),
  invoiceEmail: z.boolean(),
  paymentEmail: z.boolean(),
}).partial().refine(f => Object.keys(f).length > 0, { message: 'change at least one setting' })

export const invoiceCreateBody = z.object({ kind: z.enum(['estimate', 'invoice']) })
export const invoicePatchBody = z.object({ state: z.enum(['sent', 'void']) })
export const counterPaymentBody = z.object({
  method: z.enum(['cash', 'card'], { message: 'choose cash or card' }),
  amountCents: z.number().int({ message: 'must be whole cents' }).min(1).max(100_000_000),
})
/** 256 random bits in base64url are 43 characters; anything else cannot be a pay link. */
export const payTokenParams = z.object({ token: z.string().regex(/^[\w-]{43}$/) })

/** The only invoice moves a person can make; 'paid' comes from the payment provider alone. */
export const INVOICE_MOVES: Record<string, readonly string[]> = {
  draft: ['sent', 'void'],
  sent: ['void'],
  paid: [],
  void: [],
}
