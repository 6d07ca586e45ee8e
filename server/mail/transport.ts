/**
 * One SMTP sender for both processes: the web server (settings from Nitro's runtime
 * config, see server/utils/mail.ts) and the check worker (settings from the same
 * NUXT_SMTP_* variables, see `smtpSettingsFromEnv`). No Nitro imports here, so the
 * worker can load it with plain tsx.
 */
import nodemailer from 'nodemailer'
import { LOCAL_DEFAULTS } from '../config/defaults'

export interface SmtpSettings {
  host: string
  port: number | string
  secure: boolean | string
  user: string
  pass: string
  from: string
}

export interface MailMessage { to: string, subject: string, text: string }

/** Something that delivers one message or throws. */
export type MailSender = (message: MailMessage) => Promise<void>

/** One nodemailer transport for the settings, with the given connection, greeting and socket timeouts in ms. */
function transportFor(smtp: SmtpSettings, timeouts: { connect: number, greeting: number, socket: number }) {
  const secure = isTrue(smtp.secure)
  return nodemailer.createTransport({
    host: smtp.host,
    port: Number(smtp.port),
    secure,
    auth: smtp.user ? { user: smtp.user, pass: smtp.pass } : undefined,
    // The local fake offers no TLS; a real relay on 587 negotiates it.
    ignoreTLS: !secure && smtp.host === '127.0.0.1',
    connectionTimeout: timeouts.connect,
    greetingTimeout: timeouts.greeting,
    socketTimeout: timeouts.socket,
  })
}

/** A sender on one pooled transport. Example: `await createMailSender(settings)({ to, subject, text })` */
export function createMailSender(smtp: SmtpSettings): MailSender {
  // A relay that does not answer fails the send within seconds instead of holding a request or a run.
  const transport = transportFor(smtp, { connect: 10_000, greeting: 10_000, socket: 30_000 })
  return async (message) => {
    await transport.sendMail({ from: smtp.from, to: message.to, subject: message.subject, text: message.text })
  }
}

/** A probe for the health route: resolves once the relay greets us and accepts our login, throws otherwise. */
export function createMailProbe(smtp: SmtpSettings): () => Promise<void> {
  const transport = transportFor(smtp, { connect: 2000, greeting: 2000, socket: 2000 })
  return async () => {
    await transport.verify()
  }
}

/** The worker's SMTP settings: the NUXT_SMTP_* variables the web server reads, with the same local defaults. */
export function smtpSettingsFromEnv(env: NodeJS.ProcessEnv = process.env): SmtpSettings {
  const d = LOCAL_DEFAULTS.smtp
  return {
    host: env.NUXT_SMTP_HOST ?? d.host,
    port: env.NUXT_SMTP_PORT ?? d.port,
    secure: env.NUXT_SMTP_SECURE ?? d.secure,
    user: env.NUXT_SMTP_USER ?? d.user,
    pass: env.NUXT_SMTP_PASS ?? d.pass,
    from: env.NUXT_SMTP_FROM ?? d.from,
  }
}

/** The address links in mail point at (NUXT_PUBLIC_BASE_URL), without a trailing slash. */
export function publicBaseUrlFromEnv(env: NodeJS.ProcessEnv = process.env): string {
  return withoutTrailingSlash(env.NUXT_PUBLIC_BASE_URL ?? LOCAL_DEFAULTS.publicBaseUrl)
}

/** `withoutTrailingSlash('http://h:3000/')` is `'http://h:3000'`. */
export function withoutTrailingSlash(url: string): string {
  return url.replace(/\/+$/, '')
}

// Environment variables arrive as strings; Nitro's config may already have parsed them.
function isTrue(value: boolean | string): boolean {
  return value === true || value === 'true' || value === '1'
}
