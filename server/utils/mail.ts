import { createMailProbe, createMailSender, withoutTrailingSlash, type MailMessage, type MailSender } from '../mail/transport'

let send: MailSender | undefined

/** Sends one plain-text message through the configured SMTP relay (the local fake by default). */
export async function sendMail(message: MailMessage): Promise<void> {
  send ??= createMailSender(useRuntimeConfig().smtp)
  await send(message)
}

let probe: (() => Promise<void>) | undefined

/** Throws unless the SMTP relay answers (the health route). */
export async function pingMailRelay(): Promise<void> {
  probe ??= createMailProbe(useRuntimeConfig().smtp)
  await probe()
}

/** The address links in mail point at, from runtime config (NUXT_PUBLIC_BASE_URL), without a trailing slash. */
export function publicBaseUrl(): string {
  return withoutTrailingSlash(String(useRuntimeConfig().publicBaseUrl))
}
