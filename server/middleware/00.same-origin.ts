const STATE_CHANGING = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])
const SAME_ORIGIN_SITES = new Set(['same-origin', 'none'])

/**
 * CSRF defence for every state-changing request, sign-in included. Browsers send Origin
 * on every POST, PUT, PATCH and DELETE, and Sec-Fetch-Site where they support it; a page
 * elsewhere cannot forge either. So a foreign Origin, or a Sec-Fetch-Site other than
 * same-origin (or none: typed by the user), is refused with 403 cross-site-request.
 * A request with neither header did not come from a browser page (curl, the CLI, tests):
 * nothing a cross-site attacker can make a victim's browser send, so it is let through.
 */
export default defineEventHandler((event) => {
  if (!STATE_CHANGING.has(event.method)) return
  const origin = getRequestHeader(event, 'origin')
  const site = getRequestHeader(event, 'sec-fetch-site')
  if (origin !== undefined && !isOwnOrigin(origin, getRequestURL(event).origin)) refuse()
  if (site !== undefined && !SAME_ORIGIN_SITES.has(site)) refuse()
})

function isOwnOrigin(origin: string, requestOrigin: string): boolean {
  if (origin === 'null') return false
  return origin === requestOrigin || origin === new URL(publicBaseUrl()).origin
}

function refuse(): never {
  fail(403, 'cross-site-request', 'This request came from another site and was refused')
}
