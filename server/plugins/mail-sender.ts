/** Sends queued mail in the background of every app instance (the outbox row lock keeps them apart). */
export default defineNitroPlugin((nitroApp) => {
  const { mailPollMs } = useRuntimeConfig()
  let running = false
  const timer = setInterval(async () => {
    if (running) return
    running = true
    try {
      await deliverDueMail()
    } catch (error) {
      // The database may be down; the next tick tries again.
      if (!isDatabaseUnavailable(error)) console.error('[rungwise] mail delivery failed', error)
    } finally {
      running = false
    }
  }, Math.max(100, Number(mailPollMs)))
  timer.unref()
  nitroApp.hooks.hook('close', () => clearInterval(timer))
})
