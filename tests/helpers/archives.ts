/**
 * Builders for small zip and tar(.gz) archives in memory, for tests, including hostile ones
 * (unsafe names, links, devices, lying sizes, replaced compressed data).
 *
 * Conventions: entry content is a string (UTF-8) or a Buffer; `kind` defaults to 'file';
 * directory entries get a trailing '/' added in zip when missing. The zip writer is written
 * here from the format description (PKWARE APPNOTE, local headers + central directory +
 * end record, no zip64), so that tests can set any field, not only what a library allows.
 */
import { Buffer } from 'node:buffer'
import zlib from 'node:zlib'
import tarStream from 'tar-stream'
import type { Header as TarHeader } from 'tar-stream'

export type ArchiveEntryKind = 'file' | 'directory' | 'symlink' | 'hardlink' | 'char-device' | 'fifo'

/** Zip-only knobs for crafting damaged or hostile entries. */
export interface ZipEntryOptions {
  /** 'deflate' (default) or 'store'. */
  method?: 'deflate' | 'store'
  /** Compression method number written to the headers, overriding `method` (e.g. 12 for bzip2). */
  methodNumber?: number
  /** Bytes written as the entry's compressed data instead of compressing `content`. */
  compressedData?: Buffer
  /** Uncompressed size written to the headers (default: the real size of `content`). */
  declaredSize?: number
  /** Full Unix st_mode written to the high 16 bits of the external attributes (default from `kind`). */
  unixMode?: number
  /** Set the "encrypted" flag bit (the data is not actually encrypted). */
  encrypted?: boolean
  /** Raw name bytes, for names that are not valid strings (e.g. containing NUL). */
  rawName?: Buffer
}

export interface ArchiveEntry {
  path: string
  content?: string | Buffer
  kind?: ArchiveEntryKind
  /** Target of a symlink or hard link. */
  linkTarget?: string
  zip?: ZipEntryOptions
}

const UNIX_MODE: Record<Exclude<ArchiveEntryKind, 'hardlink'>, number> = {
  'file': 0o100644,
  'directory': 0o040755,
  'symlink': 0o120777,
  'char-device': 0o020644,
  'fifo': 0o010644,
}

function contentBytes(entry: ArchiveEntry): Buffer {
  if (entry.kind === 'symlink' || entry.kind === 'hardlink') return Buffer.from(entry.linkTarget ?? '', 'utf8')
  const content = entry.content ?? ''
  return typeof content === 'string' ? Buffer.from(content, 'utf8') : content
}

// 2024-01-02 03:04:06 in MS-DOS date/time format; any fixed value keeps archives reproducible.
const DOS_TIME = (3 << 11) | (4 << 5) | (6 >> 1)
const DOS_DATE = ((2024 - 1980) << 9) | (1 << 5) | 2
const VERSION_MADE_BY_UNIX = (3 << 8) | 20
const VERSION_NEEDED = 20
const FLAG_ENCRYPTED = 0x1
const FLAG_UTF8 = 0x800

/** A zip archive of `entries`, e.g. `makeZip([{ path: 'paper/main.tex', content: '\\documentclass{article}' }])`. */
export function makeZip(entries: readonly ArchiveEntry[]): Buffer {
  const locals: Buffer[] = []
  const centrals: Buffer[] = []
  let offset = 0
  for (const entry of entries) {
    const kind = entry.kind ?? 'file'
    if (kind === 'hardlink') throw new Error('makeZip: zip has no hard links')
    const options = entry.zip ?? {}
    const path = kind === 'directory' && !entry.path.endsWith('/') ? `${entry.path}/` : entry.path
    const name = options.rawName ?? Buffer.from(path, 'utf8')
    const data = contentBytes(entry)
    const store = options.method === 'store' || kind !== 'file'
    const method = options.methodNumber ?? (store ? 0 : 8)
    let compressed = options.compressedData ?? (store ? data : zlib.deflateRawSync(data))
    // Traditional PKWARE encryption puts a 12-byte header before the data; readers check for it.
    if (options.encrypted && !options.compressedData) compressed = Buffer.concat([Buffer.alloc(12, 0xa5), compressed])
    const crc = zlib.crc32(data)
    const declaredSize = options.declaredSize ?? data.length
    const flags = FLAG_UTF8 | (options.encrypted ? FLAG_ENCRYPTED : 0)
    const mode = options.unixMode ?? UNIX_MODE[kind]
    const external = ((mode << 16) | (kind === 'directory' ? 0x10 : 0)) >>> 0

    const local = Buffer.alloc(30)
    local.writeUInt32LE(0x04034b50, 0)
    local.writeUInt16LE(VERSION_NEEDED, 4)
    local.writeUInt16LE(flags, 6)
    local.writeUInt16LE(method, 8)
    local.writeUInt16LE(DOS_TIME, 10)
    local.writeUInt16LE(DOS_DATE, 12)
    local.writeUInt32LE(crc, 14)
    local.writeUInt32LE(compressed.length, 18)
    local.writeUInt32LE(declaredSize, 22)
    local.writeUInt16LE(name.length, 26)
    local.writeUInt16LE(0, 28)
    locals.push(local, name, compressed)

    const central = Buffer.alloc(46)
    central.writeUInt32LE(0x02014b50, 0)
    central.writeUInt16LE(VERSION_MADE_BY_UNIX, 4)
    central.writeUInt16LE(VERSION_NEEDED, 6)
    central.writeUInt16LE(flags, 8)
    central.writeUInt16LE(method, 10)
    central.writeUInt16LE(DOS_TIME, 12)
    central.writeUInt16LE(DOS_DATE, 14)
    central.writeUInt32LE(crc, 16)
    central.writeUInt32LE(compressed.length, 20)
    central.writeUInt32LE(declaredSize, 24)
    central.writeUInt16LE(name.length, 28)
    central.writeUInt16LE(0, 30) // extra field length
    central.writeUInt16LE(0, 32) // comment length
    central.writeUInt16LE(0, 34) // disk number
    central.writeUInt16LE(0, 36) // internal attributes
    central.writeUInt32LE(external, 38)
    central.writeUInt32LE(offset, 42)
    centrals.push(central, name)

    offset += local.length + name.length + compressed.length
  }
  const centralDirectory = Buffer.concat(centrals)
  const end = Buffer.alloc(22)
  end.writeUInt32LE(0x06054b50, 0)
  end.writeUInt16LE(0, 4)
  end.writeUInt16LE(0, 6)
  end.writeUInt16LE(entries.length, 8)
  end.writeUInt16LE(entries.length, 10)
  end.writeUInt32LE(centralDirectory.length, 12)
  end.writeUInt32LE(offset, 16)
  end.writeUInt16LE(0, 20)
  return Buffer.concat([...locals, centralDirectory, end])
}

const TAR_TYPE: Record<ArchiveEntryKind, TarHeader['type']> = {
  'file': 'file',
  'directory': 'directory',
  'symlink': 'symlink',
  'hardlink': 'link',
  'char-device': 'character-device',
  'fifo': 'fifo',
}

/** An uncompressed tar archive of `entries` (ustar, written by tar-stream's pack). */
export async function makeTar(entries: readonly ArchiveEntry[]): Promise<Buffer> {
  const pack = tarStream.pack()
  const chunks: Buffer[] = []
  const collected = new Promise<Buffer>((resolve, reject) => {
    pack.on('data', (chunk: unknown) => chunks.push(chunk as Buffer))
    pack.on('end', () => resolve(Buffer.concat(chunks)))
    pack.on('error', reject)
  })
  for (const entry of entries) {
    const kind = entry.kind ?? 'file'
    const header: Partial<TarHeader> & Pick<TarHeader, 'name'> = { name: entry.path, type: TAR_TYPE[kind], mtime: new Date(Date.UTC(2024, 0, 2)) }
    if (kind === 'symlink' || kind === 'hardlink') header.linkname = entry.linkTarget ?? ''
    if (kind === 'file') {
      await new Promise<void>((resolve, reject) => {
        pack.entry(header, contentBytes(entry), error => (error ? reject(error) : resolve()))
      })
    }
    else {
      pack.entry(header)
    }
  }
  pack.finalize()
  return collected
}

/** A gzip-compressed tar archive of `entries`, e.g. `await makeTarGz([{ path: 'main.tex', content: '...' }])`. */
export async function makeTarGz(entries: readonly ArchiveEntry[]): Promise<Buffer> {
  return zlib.gzipSync(await makeTar(entries))
}
