import { stockTubePatchBody } from '#shared/utils/schemas/stock'

export default entityPatchRoute('stockTubes', stockTubePatchBody)
