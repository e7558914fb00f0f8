import { z } from 'zod'
import { TOKEN_SCOPES } from '../types/tokens'

export const TOKEN_MAX_DAYS = 365

export const tokenCreateSchema = z.strictObject({
  name: z.string({ error: 'is required, 1 to 80 characters' }).trim()
    .min(1, { error: 'is required, 1 to 80 characters' }).max(80, { error: 'is required, 1 to 80 characters' })
    .regex(/^[^\p{Cc}]*$/u, { error: 'must be one line without control characters' }),
  scopes: z.array(z.enum(TOKEN_SCOPES, { error: `must be one of ${TOKEN_SCOPES.join(', ')}` }), { error: `must be a list of ${TOKEN_SCOPES.join(', ')}` })
    .min(1, { error: `must name at least one of ${TOKEN_SCOPES.join(', ')}` }).max(3, { error: `must be a list of ${TOKEN_SCOPES.join(', ')}` })
    .refine(s => new Set(s).size === s.length, { error: 'must not name a scope twice' }),
  expiresInDays: z.number({ error: `must be an integer from 1 to ${TOKEN_MAX_DAYS} (days)` }).int({ error: `must be an integer from 1 to ${TOKEN_MAX_DAYS} (days)` })
    .min(1, { error: `must be an integer from 1 to ${TOKEN_MAX_DAYS} (days)` }).max(TOKEN_MAX_DAYS, { error: `must be an integer from 1 to ${TOKEN_MAX_DAYS} (days)` }).default(90)
})

export type TokenCreate = z.infer<typeof tokenCreateSchema>
