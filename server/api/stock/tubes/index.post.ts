import { stockTubeCreateBody } from '#shared/utils/schemas/stock'

export default entityCreateRoute('stockTubes', stockTubeCreateBody)
