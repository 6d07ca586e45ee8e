import type { InboxMessage } from '#shared/types/api'

/** Password-reset links are live credentials: the admin sees that one was sent, never the token. */
const RESET_LINK = /(\/password-reset\/)[A-Za-z0-9_-]+/g

/** The mail the local fake SMTP server received, for a site administrator, with reset links masked. */
export default defineEventHandler(async (event): Promise<{ configured: boolean, messages: InboxMessage[] }> => {
  await authorize(event, { siteAdmin: true })
  const { mailInboxUrl } = useRuntimeConfig()
  if (!mailInboxUrl) return { configured: false, messages: [] }
  try {
    const messages = await $fetch<InboxMessage[]>('/messages', { baseURL: mailInboxUrl, timeout: 3000 })
    return { configured: true, messages: messages.map(m => ({ id: m.id, receivedAt: m.receivedAt, from: m.from, to: m.to, subject: m.subject, text: m.text.replace(RESET_LINK, '$1[hidden]') })) }
  }
  catch {
    fail(502, 'mail-inbox-unavailable', 'The local mail inbox does not answer')
  }
})
