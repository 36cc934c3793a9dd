import { tubeLotCreateBody } from '#shared/utils/schemas/stock'

export default entityCreateRoute('tubeLots', tubeLotCreateBody)
