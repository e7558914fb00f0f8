import { z } from 'zod'
import { ROLES } from '../types/auth'
import { canonicalEmail } from '../utils/email'

export const PASSWORD_MIN_LENGTH = 12

export const invitationCreateSchema = z.strictObject({
  email: z.string({ error: 'must be an e-mail address' }).max(1000, { error: 'must be at most 254 characters' }).transform(canonicalEmail)
    .pipe(z.string().max(254, { error: 'must be at most 254 characters' }))
    .pipe(z.email({ error: 'must be an e-mail address' })),
  name: z.string({ error: 'is required, 1 to 120 characters' }).trim().min(1, { error: 'is required, 1 to 120 characters' }).max(120, { error: 'is required, 1 to 120 characters' }),
  role: z.enum(ROLES, { error: `must be one of ${ROLES.join(', ')}` })
})

export const invitationAcceptSchema = z.strictObject({
  password: z.string({ error: `must be ${PASSWORD_MIN_LENGTH} to 200 characters` })
    .min(PASSWORD_MIN_LENGTH, { error: `must be ${PASSWORD_MIN_LENGTH} to 200 characters` })
    .max(200, { error: `must be ${PASSWORD_MIN_LENGTH} to 200 characters` })
})

export const invitationTokenSchema = z.object({
  token: z.string().regex(/^[\w-]{20,100}$/, { error: 'is not a valid invitation link' })
})

export type InvitationCreate = z.infer<typeof invitationCreateSchema>

/** An admin's change to a member: a new role, or deactivation / reactivation (at least one). */
export const memberUpdateSchema = z.strictObject({
  role: z.enum(ROLES, { error: `must be one of ${ROLES.join(', ')}` }).optional(),
  active: z.boolean({ error: 'must be true or false' }).optional()
}).refine(b => b.role !== undefined || b.active !== undefined, { error: 'give a new role, active, or both', path: ['role'] })

export type MemberUpdate = z.infer<typeof memberUpdateSchema>
