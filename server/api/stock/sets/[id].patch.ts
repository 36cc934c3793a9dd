import { matchedSetPatchBody } from '#shared/utils/schemas/stock'

export default entityPatchRoute('matchedSets', matchedSetPatchBody)
