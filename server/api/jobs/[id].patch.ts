import { jobPatchBody } from '#shared/utils/schemas/jobs'

export default entityPatchRoute('jobs', jobPatchBody)
