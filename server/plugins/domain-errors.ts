import type { H3Error } from 'h3'
import { DomainError } from '../services/domain-error'

/**
 * The route edge for domain errors: a DomainError thrown by a service reaches h3 as the
 * cause of a generic 500; here it becomes the HTTP answer its code stands for, once for all routes.
 */
export default defineNitroPlugin((nitro) => {
  const original = nitro.h3App.options.onError
  nitro.h3App.options.onError = (error, event) => {
    const cause = (error as H3Error).cause
    if (cause instanceof DomainError) {
      const status = httpStatusOf(cause.code)
      Object.assign(error, { statusCode: status, statusMessage: cause.message, message: cause.message, data: { code: cause.code }, unhandled: false })
      setResponseStatus(event, status, cause.message)
    }
    return original?.(error, event)
  }
})
