import nodemailer, { type Transporter } from 'nodemailer'

let transport: Transporter | undefined

/** Sends one plain-text message through the configured SMTP relay (the local fake by default). */
export async function sendMail(message: { to: string, subject: string, text: string }): Promise<void> {
  const { smtp } = useRuntimeConfig()
  transport ??= nodemailer.createTransport({
    host: smtp.host,
    port: Number(smtp.port),
    secure: Boolean(smtp.secure),
    auth: smtp.user ? { user: smtp.user, pass: smtp.pass } : undefined,
    // The local fake offers no TLS; a real relay on 587 negotiates it.
    ignoreTLS: !smtp.secure && smtp.host === '127.0.0.1',
  })
  await transport.sendMail({ from: smtp.from, to: message.to, subject: message.subject, text: message.text })
}
