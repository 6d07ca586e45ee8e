// Pages that need an account send visitors to the sign-in page, remembering where they were going.
export default defineNuxtRouteMiddleware((to) => {
  const { loggedIn } = useUserSession()
  if (!loggedIn.value) return navigateTo({ path: '/sign-in', query: { next: to.fullPath } })
})
