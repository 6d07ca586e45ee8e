import { createSourceStore, type SourceStore } from '../storage/source-store'

let store: SourceStore | undefined

function sources(): SourceStore {
  const { s3 } = useRuntimeConfig()
  store ??= createSourceStore({ ...s3, forcePathStyle: Boolean(s3.forcePathStyle) })
  return store
}

/** Stores bytes under their content key unless already there; `created` says whether this call added them. */
export const putSource = (bytes: Uint8Array, sha256: string) => sources().put(bytes, sha256)
export const getSource = (key: string) => sources().get(key)
export const deleteSource = (key: string) => sources().remove(key)
/** The store itself, for services that take a SourceStore (server/services/storage-sweep.ts). */
export const sourceStore = () => sources()

/** Throws unless the bucket answers (the health route). */
export const pingStorage = () => sources().ping()
