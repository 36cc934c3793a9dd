import { randomBytes, randomUUID } from 'node:crypto'
import { and, eq, gt, isNull } from 'drizzle-orm'
import type { H3Event } from 'h3'
import { payTokenParams } from '#shared/utils/schemas/jobs'

/** How long an e-mailed pay link opens its invoice. */
export const PAY_LINK_DAYS = 30

export const payUrl = (token: string) => `${useRuntimeConfig().publicOrigin}/pay/${token}`

/** What a wrong, expired or revoked link answers: the same 404 for each, so none can be told apart. */
export const payLinkNotFound = () => createError({ statusCode: 404, message: 'This payment link is not valid. Ask the shop for a new one.' })

/**
 * A new link for the invoice (256 random bits, only its hash kept); earlier live links of the same
 * invoice stop working, so the newest e-mail is the one that pays.
 */
export async function issuePayLink(tx: Tx, opts: { shopId: string, invoiceId: string, userId: string | null }) {
  await revokePayLinks(tx, opts)
  const token = randomBytes(32).toString('base64url')
  const expiresAt = new Date(Date.now() + PAY_LINK_DAYS * 86_400_000)
  await tx.insert(tables.payLinks).values({
    id: randomUUID(), shopId: opts.shopId, invoiceId: opts.invoiceId, tokenHash: hashToken(token), expiresAt, createdBy: opts.userId,
  })
  return { token, expiresAt }
}

export async function revokePayLinks(tx: Tx, opts: { shopId: string, invoiceId: string, userId: string | null }) {
  const t = tables.payLinks
  const r = await tx.update(t).set({ revokedAt: new Date(), revokedBy: opts.userId })
    .where(and(eq(t.shopId, opts.shopId), eq(t.invoiceId, opts.invoiceId), isNull(t.revokedAt), gt(t.expiresAt, new Date())))
  return r[0].affectedRows
}

/** The live link an invoice has (for the desk), or null. */
export async function livePayLinkOf(db: Db | Tx, shopId: string, invoiceId: string) {
  const t = tables.payLinks
  const [row] = await db.select({ expiresAt: t.expiresAt, createdAt: t.createdAt }).from(t)
    .where(and(eq(t.shopId, shopId), eq(t.invoiceId, invoiceId), isNull(t.revokedAt), gt(t.expiresAt, new Date())))
    .limit(1)
  return row ?? null
}

/** The token from the route; one that cannot be a token answers the same 404 as an unknown one. */
export function payTokenOf(event: H3Event) {
  const parsed = payTokenParams.safeParse(getRouterParams(event))
  if (!parsed.success) throw payLinkNotFound()
  return parsed.data.token
}

/** The invoice a raw token opens, or 404 when the token is unknown, revoked or expired. */
export async function invoiceOfPayToken(db: Db | Tx, token: string) {
  const t = tables.payLinks
  const [link] = await db.select().from(t).where(eq(t.tokenHash, hashToken(token))).limit(1)
  if (!link || link.revokedAt || link.expiresAt.getTime() <= Date.now()) throw payLinkNotFound()
  const invoice = await findInvoice(db, link.shopId, link.invoiceId).catch(() => null)
  if (!invoice || invoice.kind !== 'invoice' || invoice.state === 'draft') throw payLinkNotFound()
  return { link, invoice }
}
