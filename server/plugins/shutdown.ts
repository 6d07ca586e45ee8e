// Close the queue and the database pool when the server stops, so Ctrl-C ends cleanly.
export default defineNitroPlugin((nitro) => {
  nitro.hooks.hookOnce('close', async () => {
    await stopQueue()
    await closeDb()
  })
})
