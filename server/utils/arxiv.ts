import { setResponseHeader, type H3Event } from 'h3'
import { ArxivClient, ArxivError, type Eprint } from '../arxiv/client'

let client: ArxivClient | undefined

/** The one e-print client of this server (its cache is shared by every request), at NUXT_ARXIV_BASE_URL. */
export function useArxiv(): ArxivClient {
  client ??= new ArxivClient({
    baseUrl: String(useRuntimeConfig().arxivBaseUrl),
    userAgent: `Scholium/0.1 (checks worked examples in manuscripts; +${publicBaseUrl()})`,
    // A person is waiting on the form: wait out short rate limits only.
    maxWaitMs: 5_000,
  })
  return client
}

const STATUS: Record<ArxivError['code'], number> = {
  'invalid-id': 400, 'not-found': 404, 'pdf-only': 422, 'rate-limited': 503, 'unavailable': 502, 'unreadable': 502, 'too-large': 413,
}

/** Fetches an e-print, turning the client's errors into API errors (with Retry-After when arXiv asked for one). */
export async function fetchEprintOrFail(event: H3Event, identifier: string): Promise<Eprint> {
  try {
    return await useArxiv().fetchEprint(identifier)
  }
  catch (error) {
    if (!(error instanceof ArxivError)) throw error
    if (error.retryAfterSeconds !== undefined) setResponseHeader(event, 'retry-after', error.retryAfterSeconds)
    fail(STATUS[error.code], `arxiv-${error.code}`, error.message)
  }
}
