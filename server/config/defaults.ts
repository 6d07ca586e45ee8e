/**
 * Local defaults: the private cluster and the fakes on loopback that `npm start` runs.
 * The web server reads them through runtimeConfig (overridden by NUXT_* variables),
 * the worker process through `workerSettingsFromEnv` (the same variables).
 */
export const LOCAL_DEFAULTS = {
  databaseUrl: 'postgres://postgres@127.0.0.1:54329/scholium',
  s3: {
    endpoint: 'http://127.0.0.1:4569',
    region: 'us-east-1',
    bucket: 'scholium-sources',
    accessKeyId: 'S3RVER',
    secretAccessKey: 'S3RVER',
    forcePathStyle: true,
  },
  smtp: { host: '127.0.0.1', port: 2525, secure: false, user: '', pass: '', from: 'Scholium <no-reply@scholium.local>' },
  mailInboxUrl: 'http://127.0.0.1:2526',
  /** The e-print endpoint (`/e-print/<id>` is appended): the fake on loopback; https://arxiv.org in production. */
  arxivBaseUrl: 'http://127.0.0.1:2527',
  publicBaseUrl: 'http://127.0.0.1:3000',
}
