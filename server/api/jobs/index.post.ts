import { jobCreateBody } from '#shared/utils/schemas/jobs'

export default entityCreateRoute('jobs', jobCreateBody)
