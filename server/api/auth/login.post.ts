import bcrypt from 'bcryptjs'
import { signInSchema } from '#shared/schemas/study'

// A real hash to compare against when the account does not exist, so timing does not reveal it.
const DUMMY_HASH = bcrypt.hashSync('not-a-real-password', 12)

export default defineApiHandler(async (event) => {
  const parsed = signInSchema.safeParse(await readBody(event).catch(() => null))
  const fail = () => createError({ statusCode: 401, statusMessage: MESSAGES.signInFailed, data: { message: MESSAGES.signInFailed } })
  if (!parsed.success || !parsed.data.email || !parsed.data.password) throw fail()
  const { email, password } = parsed.data
  const ip = clientAddress(event)
  if (await signInBlocked(email, ip)) {
    await writeAudit({ teamId: null, actorId: null, action: 'sign_in_blocked', targetType: 'user', targetId: null, detail: { email, ip } })
    throw createError({ statusCode: 429, statusMessage: MESSAGES.signInRateLimited, data: { message: MESSAGES.signInRateLimited } })
  }
  const user = await useDb()('users').where({ email, active: true }).first('id', 'password_hash', 'team_id')
  const ok = await bcrypt.compare(password, user?.password_hash ?? DUMMY_HASH)
  if (!user || !ok) {
    await recordFailedSignIn(email, ip)
    // The attempted address and where from; never the password.
    await writeAudit({ teamId: user?.team_id ?? null, actorId: null, action: 'sign_in_failed', targetType: 'user', targetId: user?.id ?? null, detail: { email, ip } })
    throw fail()
  }
  await clearAccountFailures(email)
  await startSession(event, user.id)
  await writeAudit({ teamId: user.team_id, actorId: user.id, action: 'sign_in', targetType: 'user', targetId: user.id, detail: { ip } })
  return { token: displayToken() }
})
