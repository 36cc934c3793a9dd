import { gateCreateBody } from '#shared/utils/schemas/procedures'

export default entityCreateRoute('procedureGates', gateCreateBody)
