import { z } from 'zod'
import { ROLES } from '../roles'

export const MIN_PASSWORD_LENGTH = 10

export const emailSchema = z.string().trim().toLowerCase().pipe(z.email({ message: 'enter a valid e-mail address' })).pipe(z.string().max(254))
export const passwordSchema = z.string()
  .min(MIN_PASSWORD_LENGTH, { message: `use at least ${MIN_PASSWORD_LENGTH} characters` })
  .max(200, { message: 'use at most 200 characters' })

export const registerSchema = z.object({
  email: emailSchema,
  name: z.string().trim().min(1, { message: 'enter your name' }).max(120),
  password: passwordSchema,
  invitationToken: z.string().min(10).max(200).optional(),
})

export const loginSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, { message: 'enter your password' }).max(200),
})

export const roleSchema = z.enum(ROLES)
export const uuidSchema = z.uuid({ message: 'must be an id' })

export const shopCreateSchema = z.object({
  id: uuidSchema.optional(),
  name: z.string().trim().min(2, { message: 'use at least 2 characters' }).max(120),
})

export const activeShopSchema = z.object({ shopId: uuidSchema })
export const inviteSchema = z.object({ email: emailSchema, role: roleSchema })
export const roleChangeSchema = z.object({ role: roleSchema })
export const shopParamsSchema = z.object({ shopId: uuidSchema })
export const memberParamsSchema = z.object({ shopId: uuidSchema, userId: uuidSchema })
export const invitationParamsSchema = z.object({ shopId: uuidSchema, invitationId: uuidSchema })
export const tokenParamsSchema = z.object({ token: z.string().min(10).max(200) })

export const passwordChangeSchema = z.object({
  currentPassword: z.string().min(1, { message: 'enter your current password' }).max(200),
  newPassword: passwordSchema,
}).refine(b => b.newPassword !== b.currentPassword, { message: 'choose a password different from the current one', path: ['newPassword'] })
