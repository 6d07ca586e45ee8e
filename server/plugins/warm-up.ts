/**
 * Loads the lazily imported parts of the server (Vue's server renderer, the page and route chunks,
 * the S3 client) at start-up, by rendering the sign-in page once internally. On first use they took
 * 150–350 ms of the main thread in one go, which every request arriving meanwhile waited out
 * (scripts/bench-stall.ts saw it on a freshly started server).
 */
export default defineNitroPlugin((nitroApp) => {
  setTimeout(() => {
    nitroApp.localFetch('/sign-in', { headers: { accept: 'text/html' } })
      .then(response => response.text())
      .catch(() => {})
  }, 0)
})
