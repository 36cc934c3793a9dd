export default defineEventHandler(async (event) => {
  const { link, invoice } = await invoiceOfPayToken(useDb(), payTokenOf(event))
  const started = await startOnlinePayment(link.shopId, invoice.id, null)
  setResponseStatus(event, 202)
  return started
})
