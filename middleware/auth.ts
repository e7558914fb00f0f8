// UX only: the server checks every request itself.
export default defineNuxtRouteMiddleware(async (to) => {
  const { status, getSession } = useAuth()
  if (status.value === 'loading' || status.value === 'unauthenticated') await getSession()
  if (status.value !== 'authenticated') {
    return navigateTo({ path: '/sign-in', query: { redirect: to.fullPath } })
  }
})
