// Client state of the report page: the filters and the selected line. Data stays in useFetch.
import { defineStore } from 'pinia'
import type { ClaimKind } from '#shared/types/claims'

export interface SelectedLine {
  file: string
  line: number
}

export const useReportStore = defineStore('report', () => {
  /** Only lines whose claims disagree (mismatch, or holds only under another convention). */
  const onlyDisagreements = ref(false)
  /** One kind of claim, or null for every kind. */
  const kind = ref<ClaimKind | null>(null)
  /** The file shown in the source view; null until the page picks the main file. */
  const file = ref<string | null>(null)
  const selected = ref<SelectedLine | null>(null)

  function select(line: SelectedLine) {
    file.value = line.file
    selected.value = line
  }
  function close() {
    selected.value = null
  }
  /** Start clean when the page shows another revision. */
  function reset() {
    onlyDisagreements.value = false
    kind.value = null
    file.value = null
    selected.value = null
  }

  return { onlyDisagreements, kind, file, selected, select, close, reset }
})
