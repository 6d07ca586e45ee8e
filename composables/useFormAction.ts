import { describeApiError } from './useApiError'

/**
 * The pending flag and described error of a form's one action, so every form reports
 * failures the same way. Example:
 *   const { pending, error, run } = useFormAction(() => $fetch('/api/…', { method: 'POST', body }))
 *   <form @submit.prevent="run">
 * `run` resolves to the action's result, or undefined when it failed (the error is then set).
 */
export function useFormAction<A extends unknown[], T>(action: (...args: A) => Promise<T>) {
  const pending = ref(false)
  const error = ref<ReturnType<typeof describeApiError> | null>(null)
  async function run(...args: A): Promise<T | undefined> {
    pending.value = true
    error.value = null
    try {
      return await action(...args)
    }
    catch (e) {
      error.value = describeApiError(e)
      return undefined
    }
    finally {
      pending.value = false
    }
  }
  return { pending, error, run }
}
