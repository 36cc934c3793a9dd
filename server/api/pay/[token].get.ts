// No session: the unguessable token in the e-mailed link is the key, to this one invoice only.
export default defineEventHandler(async (event) => {
  const { link, invoice } = await invoiceOfPayToken(useDb(), payTokenOf(event))
  const shop = await shopSettingsOf(useDb(), link.shopId)
  const pending = invoice.state === 'sent' && await hasPendingPayment(invoice.id)
  return {
    shop: { name: shop.name, address: shop.address, phone: shop.phone, email: shop.email },
    invoice: {
      number: invoice.number, state: invoice.state, lines: invoice.lines, partsCents: invoice.partsCents, labourCents: invoice.labourCents,
      subtotalCents: invoice.subtotalCents, taxRateBasisPoints: invoice.taxRateBasisPoints, taxCents: invoice.taxCents,
      totalCents: invoice.totalCents, currency: invoice.currency, issuedAt: invoice.issuedAt, paidAt: invoice.paidAt, paidWith: invoice.paidWith,
    },
    paymentPending: pending,
    expiresAt: link.expiresAt,
  }
})
