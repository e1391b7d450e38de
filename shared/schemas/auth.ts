import { invitableRoles } from '../utils/vocabulary'
import { z } from 'zod'
import { emailSchema, passwordSchema, personNameSchema } from './common'

export const registerSchema = z.object({
  name: personNameSchema,
  email: emailSchema,
  password: passwordSchema,
  teamName: z.string({ error: 'Team name is required' }).trim().min(2, 'Team name needs at least 2 characters').max(100, 'Team name is at most 100 characters'),
  /** Copy the starter library and routines into the new team (or start empty). */
  starterSet: z.boolean({ error: 'Choose yes or no' }).default(false),
})

export const loginSchema = z.object({
  email: emailSchema,
  password: z.string({ error: 'Password is required' }).min(1, 'Password is required').max(200, 'Password is too long'),
})

export const inviteSchema = z.object({
  email: emailSchema,
  role: z.enum(invitableRoles, { error: 'Role must be athlete or coach' }),
  squadId: z.number().int().positive().optional(),
})

export const acceptInviteSchema = z.object({
  name: personNameSchema,
  password: passwordSchema,
})

export const passwordResetRequestSchema = z.object({ email: emailSchema })
export const passwordResetSchema = z.object({ password: passwordSchema })

export const squadSchema = z.object({
  name: z.string().trim().min(1, 'Name is required').max(80, 'Name is at most 80 characters'),
  description: z.string().trim().max(500, 'Description is at most 500 characters').default(''),
})

export const squadMembersSchema = z.object({
  athleteIds: z.array(z.number().int().positive()).max(500)
    .refine(ids => new Set(ids).size === ids.length, 'Each athlete can be listed only once'),
})

/** A squad change: only the fields sent are changed (no default fills in a missing description). */
export const squadPatchSchema = z.object({
  name: squadSchema.shape.name.optional(),
  description: z.string().trim().max(500, 'Description is at most 500 characters').optional(),
}).refine(value => value.name !== undefined || value.description !== undefined, 'Send a name or a description')

export const tokenParamsSchema = z.object({ token: z.string().min(20, 'Link is not valid').max(200, 'Link is not valid') })

export const changePasswordSchema = z.object({
  currentPassword: z.string({ error: 'Current password is required' }).min(1, 'Current password is required').max(200, 'Password is too long'),
  newPassword: passwordSchema,
})
