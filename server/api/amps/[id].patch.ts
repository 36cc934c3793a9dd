import { ampPatchBody } from '#shared/utils/schemas/jobs'

export default entityPatchRoute('amps', ampPatchBody)
