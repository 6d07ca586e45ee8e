import { seedDemo } from '../services/demo-seed'

/**
 * `npm start` sets SCHOLIUM_SEED_DEMO=1: the demo scenario is seeded at start-up
 * through the same services the API uses (password hashing by nuxt-auth-utils,
 * uploads to S3). The LaTeX sources ship as server assets.
 */
export default defineNitroPlugin(() => {
  if (process.env.SCHOLIUM_SEED_DEMO !== '1') return
  demoSeed.state = 'pending'
  const assets = useStorage('assets:server')
  const readAssets = async (prefix: string) => {
    const keys = (await assets.getKeys(prefix)).filter(k => !k.endsWith('.gitkeep'))
    return Promise.all(keys.map(async key => ({
      // Storage keys use ':' for '/'; the upload sees the bundle-relative path.
      filename: key.slice(prefix.length + 1).replaceAll(':', '/'),
      data: Buffer.from((await assets.getItemRaw(key)) as Uint8Array),
    })))
  }
  seedDemo(useDb(), readAssets)
    .then(() => {
      demoSeed.state = 'ready'
      console.log('[demo] demo scenario ready')
    })
    .catch((error) => {
      demoSeed.state = 'failed'
      console.error('[demo] seeding failed', error)
    })
})
