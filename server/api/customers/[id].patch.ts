import { customerPatchBody } from '#shared/utils/schemas/jobs'

export default entityPatchRoute('customers', customerPatchBody)
