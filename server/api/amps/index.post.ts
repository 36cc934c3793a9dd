import { ampCreateBody } from '#shared/utils/schemas/jobs'

export default entityCreateRoute('amps', ampCreateBody)
