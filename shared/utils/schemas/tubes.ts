import { z } from 'zod'
import type { RatingSystem } from '../tubes/builtin'

export const RATING_SYSTEMS = ['design-centre', 'design-maximum', 'absolute-maximum'] as const satisfies readonly RatingSystem[]

export const RATING_SYSTEM_LABELS: Record<RatingSystem, string> = {
  'design-centre': 'Design centre',
  'design-maximum': 'Design maximum',
  'absolute-maximum': 'Absolute maximum',
}

const amount = (what: string, unit: string, max: number) => {
  const error = `enter the ${what} in ${unit}, a positive number`
  return z.number({ error }).positive({ error }).max(max, { error: `${what} above ${max} ${unit} is not a tube rating` })
}

const fields = {
  name: z.string({ error: 'enter a name' }).trim().min(1, { error: 'enter a name' }).max(80, { error: 'use at most 80 characters' }),
  maxPlateWatts: amount('maximum plate dissipation', 'W', 2000),
  maxScreenWatts: amount('maximum screen dissipation', 'W', 2000).nullable(),
  maxPlateVolts: amount('maximum plate voltage', 'V', 20000),
  heater: z.string({ error: 'enter the heater rating' }).trim().min(1, { error: 'enter the heater rating, e.g. 6.3 V 0.9 A' }).max(60, { error: 'use at most 60 characters' }),
  ratingSystem: z.enum(RATING_SYSTEMS, { error: 'choose design centre, design maximum or absolute maximum' }),
  source: z.string({ error: 'say where the figures come from' }).trim().min(3, { error: 'say where the figures come from (the data sheet)' }).max(500, { error: 'use at most 500 characters' }),
}

export const tubeCreateSchema = z.object({
  id: z.uuid({ error: 'must be an id' }).optional(),
  ...fields,
  maxScreenWatts: fields.maxScreenWatts.default(null),
})

export const tubePatchSchema = z.object(fields).partial().refine(p => Object.keys(p).length > 0, { error: 'change at least one figure' })

export const tubeParamsSchema = z.object({ id: z.string().min(1).max(64) })

export type TubeCreate = z.input<typeof tubeCreateSchema>
export type TubePatch = z.input<typeof tubePatchSchema>
