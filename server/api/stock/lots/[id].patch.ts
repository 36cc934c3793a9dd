import { tubeLotPatchBody } from '#shared/utils/schemas/stock'

export default entityPatchRoute('tubeLots', tubeLotPatchBody)
