import { matchedSetCreateBody } from '#shared/utils/schemas/stock'

export default entityCreateRoute('matchedSets', matchedSetCreateBody)
