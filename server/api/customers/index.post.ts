import { customerCreateBody } from '#shared/utils/schemas/jobs'

export default entityCreateRoute('customers', customerCreateBody)
