// The server refuses non-admins anyway; this only spares them a page of errors.
export default defineNuxtRouteMiddleware(() => {
  const { loggedIn, user } = useUserSession()
  if (!loggedIn.value) return navigateTo('/sign-in')
  if (user.value?.siteRole !== 'admin') return navigateTo('/desk')
})
