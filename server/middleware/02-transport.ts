/**
 * Strict-Transport-Security only when the app is served over https (NUXT_HTTPS=true): a browser
 * that saw HSTS on a plain-http deployment would refuse to reach it at all. NUXT_HSTS_MAX_AGE_S=0
 * turns the header off.
 */
export default defineEventHandler((event) => {
  const { https, hstsMaxAgeS } = useRuntimeConfig()
  if (!https || !hstsMaxAgeS) return
  setResponseHeader(event, 'strict-transport-security', `max-age=${Number(hstsMaxAgeS)}; includeSubDomains`)
})
