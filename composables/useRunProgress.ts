import type { CheckRunView } from '#shared/types/api'

const waiting = (run: CheckRunView | null | undefined) => run?.status === 'queued' || run?.status === 'running'

/**
 * Follows a run that waits or works through its small progress answer (`GET /api/check-runs/:id`),
 * once a second, never the whole report: `onProgress` gets each answer while the run goes on,
 * `onEnded` is called once when it has ended. Stops when the page goes. Used by the report and
 * compare pages. e.g. `useRunProgress(() => view.value?.run, { onEnded: () => refresh() })`
 */
export function useRunProgress(run: () => CheckRunView | null | undefined, handlers: { onProgress?: (now: CheckRunView) => void, onEnded: (now: CheckRunView) => unknown }) {
  let timer: ReturnType<typeof setInterval> | undefined
  async function poll() {
    const current = run()
    if (!current) return
    const now = await $fetch<CheckRunView>(`/api/check-runs/${current.id}`).catch(() => null)
    if (!now) return
    if (waiting(now)) handlers.onProgress?.(now)
    else {
      clearInterval(timer)
      await handlers.onEnded(now)
    }
  }
  onMounted(() => watch(() => waiting(run()) ? run()!.id : null, (id) => {
    clearInterval(timer)
    if (id) timer = setInterval(poll, 1000)
  }, { immediate: true }))
  onBeforeUnmount(() => clearInterval(timer))
}
