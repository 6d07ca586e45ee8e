/**
 * Reading uploaded manuscript sources: plain files and zip / tar / tar.gz bundles, honest
 * and hostile. Archives are built in memory by tests/helpers/archives.ts; expected hashes
 * come from node:crypto computed here, independently of the module under test.
 */
import { execFileSync } from 'node:child_process'
import { createHash } from 'node:crypto'
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import zlib from 'node:zlib'
import { describe, expect, it } from 'vitest'
import { makeTar, makeTarGz, makeZip, type ArchiveEntry } from '../../helpers/archives'
import {
  UPLOAD_LIMITS,
  UploadRefusedError,
  describeEntryName,
  normaliseUploadPath,
  readUploadBundle,
  readUploadedFiles,
  type UploadLimits,
  type UploadRefusalCode,
  type UploadedFile,
} from '../../../server/uploads'

const MiB = 1024 * 1024

function sha256(data: string | Buffer): string {
  return createHash('sha256').update(data).digest('hex')
}

/** Awaits `work`, which must be refused; returns the refusal for further checks. */
async function refusal(work: Promise<unknown>): Promise<UploadRefusedError> {
  try {
    await work
  }
  catch (error) {
    expect(error).toBeInstanceOf(UploadRefusedError)
    return error as UploadRefusedError
  }
  throw new Error('expected the upload to be refused, but it was accepted')
}

async function refusalCode(work: Promise<unknown>): Promise<UploadRefusalCode> {
  return (await refusal(work)).code
}

type ArchiveFormat = 'zip' | 'tar' | 'tar.gz' | 'tgz'
const FORMATS: ArchiveFormat[] = ['zip', 'tar', 'tar.gz', 'tgz']

async function upload(format: ArchiveFormat, entries: ArchiveEntry[]): Promise<Extract<UploadedFile, { data: Buffer }>[]> {
  const data = format === 'zip' ? makeZip(entries) : format === 'tar' ? await makeTar(entries) : await makeTarGz(entries)
  return [{ filename: `bundle.${format}`, data }]
}

const MAIN_TEX = '\\documentclass{article}\n\\begin{document}\n\\input{sections/intro}\n\\end{document}\n'
const INTRO_TEX = '\\section{Introduction}\nWe compute a Schubert polynomial.\n'
const REFS_BIB = '@book{key, title={A Book}, year={2001}}\n'
const PNG_BYTES = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 1, 2, 3])

describe('the archive helpers themselves (checked by outside readers)', () => {
  it('writes a zip that Python\'s zipfile reads back with matching CRCs and Unix modes', () => {
    const dir = mkdtempSync(join(tmpdir(), 'scholium-zip-'))
    try {
      const file = join(dir, 'a.zip')
      writeFileSync(file, makeZip([
        { path: 'p/main.tex', content: MAIN_TEX },
        { path: 'p/link', kind: 'symlink', linkTarget: '../x' },
      ]))
      // Debian's python3 (outside reference): testzip() returns None when every CRC matches.
      const out = execFileSync('/usr/bin/python3', ['-c', [
        'import sys, zipfile',
        'z = zipfile.ZipFile(sys.argv[1])',
        'print(z.testzip())',
        'for i in z.infolist(): print(i.filename, oct(i.external_attr >> 16), z.read(i).decode())',
      ].join('\n'), file], { encoding: 'utf8' })
      const lines = out.trimEnd().split('\n')
      expect(lines[0]).toBe('None')
      expect(lines[1]).toBe(`p/main.tex 0o100644 ${MAIN_TEX.split('\n')[0]}`)
      expect(out).toContain('p/link 0o120777 ../x')
    }
    finally {
      rmSync(dir, { recursive: true, force: true })
    }
  })

  it('writes a tar.gz that GNU tar lists with the link and the file', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'scholium-tar-'))
    try {
      const file = join(dir, 'a.tar.gz')
      writeFileSync(file, await makeTarGz([
        { path: 'p/main.tex', content: MAIN_TEX },
        { path: 'p/link', kind: 'symlink', linkTarget: 'main.tex' },
      ]))
      const out = execFileSync('tar', ['-tvzf', file], { encoding: 'utf8' })
      expect(out).toMatch(/^-.* p\/main\.tex$/m)
      expect(out).toMatch(/^l.* p\/link -> main\.tex$/m)
    }
    finally {
      rmSync(dir, { recursive: true, force: true })
    }
  })
})

describe('plain file uploads', () => {
  it('takes a single .tex file as it is, with its SHA-256', async () => {
    const data = Buffer.from(MAIN_TEX)
    const files = await readUploadedFiles([{ filename: 'main.tex', data }])
    expect(files).toHaveLength(1)
    expect(files[0]).toEqual({ path: 'main.tex', bytes: data, sha256: sha256(MAIN_TEX), size: data.length })
  })

  it('takes several files, keeping relative paths sent by the client', async () => {
    const files = await readUploadedFiles([
      { filename: 'main.tex', data: Buffer.from(MAIN_TEX) },
      { filename: 'sections/intro.tex', data: Buffer.from(INTRO_TEX) },
      { filename: 'figures/plot.PNG', data: PNG_BYTES },
    ])
    expect(files.map(f => [f.path, f.sha256, f.size])).toEqual([
      ['main.tex', sha256(MAIN_TEX), Buffer.byteLength(MAIN_TEX)],
      ['sections/intro.tex', sha256(INTRO_TEX), Buffer.byteLength(INTRO_TEX)],
      ['figures/plot.PNG', sha256(PNG_BYTES), PNG_BYTES.length],
    ])
  })

  it.each([
    ['../evil.tex'],
    ['/etc/passwd.tex'],
    ['C:/Users/x/main.tex'],
    ['sections\\..\\..\\evil.tex'],
    ['a/../../b.tex'],
    ['ok\u0000.tex'],
    ['main\u202Exet.tex'],
  ])('refuses the unsafe file name %j', async (filename) => {
    expect(await refusalCode(readUploadedFiles([{ filename, data: Buffer.from(MAIN_TEX) }]))).toBe('path-unsafe')
  })

  it('refuses an archive sent together with other files', async () => {
    const zip = makeZip([{ path: 'main.tex', content: MAIN_TEX }])
    const code = await refusalCode(readUploadedFiles([
      { filename: 'main.tex', data: Buffer.from(MAIN_TEX) },
      { filename: 'more.zip', data: zip },
    ]))
    expect(code).toBe('mixed-upload')
  })

  it('refuses the same path twice, also after normalisation', async () => {
    const twice = [
      { filename: 'main.tex', data: Buffer.from('a') },
      { filename: './main.tex', data: Buffer.from('b') },
    ]
    expect(await refusalCode(readUploadedFiles(twice))).toBe('duplicate-path')
    // "é" precomposed (U+00E9) and decomposed (e + U+0301) name the same file once normalised to NFC.
    const accents = [
      { filename: 'r\u00e9sum\u00e9.tex', data: Buffer.from('a') },
      { filename: 're\u0301sume\u0301.tex', data: Buffer.from('b') },
    ]
    expect(await refusalCode(readUploadedFiles(accents))).toBe('duplicate-path')
  })

  it('refuses a path used both as a file and as a folder', async () => {
    const code = await refusalCode(readUploadedFiles([
      { filename: 'main.tex', data: Buffer.from(MAIN_TEX) },
      { filename: 'main.tex/inner.tex', data: Buffer.from(INTRO_TEX) },
    ]))
    expect(code).toBe('duplicate-path')
  })

  it('refuses a file over the single-file limit and an upload over the total limit', async () => {
    const big = Buffer.alloc(2048, 0x41)
    expect(await refusalCode(readUploadedFiles([{ filename: 'main.tex', data: big }], { maxFileBytes: 2047 }))).toBe('too-large')
    const halves = [
      { filename: 'a.tex', data: big },
      { filename: 'b.tex', data: big },
    ]
    expect(await refusalCode(readUploadedFiles(halves, { maxTotalBytes: 4095 }))).toBe('too-large')
    // The same files exactly at the limits are accepted: the limits are not off by one.
    expect(await readUploadedFiles(halves, { maxTotalBytes: 4096, maxFileBytes: 2048 })).toHaveLength(2)
  })

  it('refuses disallowed types and lists the accepted ones in the message', async () => {
    const error = await refusal(readUploadedFiles([
      { filename: 'main.tex', data: Buffer.from(MAIN_TEX) },
      { filename: 'setup.exe', data: Buffer.from('MZ') },
    ]))
    expect(error.code).toBe('file-type')
    expect(error.message).toContain('.exe')
    expect(error.message).toContain('.tex')
    expect(await refusalCode(readUploadedFiles([{ filename: 'Makefile', data: Buffer.from('all:') }]))).toBe('file-type')
  })

  it('refuses an empty upload and an upload without any .tex file', async () => {
    expect(await refusalCode(readUploadedFiles([]))).toBe('empty')
    expect(await refusalCode(readUploadedFiles([{ filename: 'refs.bib', data: Buffer.from(REFS_BIB) }]))).toBe('no-tex')
  })

  it('refuses more files than allowed', async () => {
    const uploads = Array.from({ length: 4 }, (_, i) => ({ filename: `part${i}.tex`, data: Buffer.from(`${i}`) }))
    expect(await refusalCode(readUploadedFiles(uploads, { maxFiles: 3 }))).toBe('too-many-files')
    expect(await readUploadedFiles(uploads, { maxFiles: 4 })).toHaveLength(4)
  })
})

describe('arXiv-style bundles', () => {
  const bundle: ArchiveEntry[] = [
    { path: 'paper-v2/', kind: 'directory' },
    { path: 'paper-v2/main.tex', content: MAIN_TEX },
    { path: 'paper-v2/sections/', kind: 'directory' },
    { path: 'paper-v2/sections/intro.tex', content: INTRO_TEX },
    { path: 'paper-v2/refs.bib', content: REFS_BIB },
    { path: 'paper-v2/figures/plot.png', content: PNG_BYTES },
  ]

  it.each(FORMATS)('reads a .%s bundle, strips the common top folder and hashes every file', async (format) => {
    const result = await readUploadBundle(await upload(format, bundle))
    const byPath = new Map(result.files.map(f => [f.path, f]))
    expect([...byPath.keys()].sort()).toEqual(['figures/plot.png', 'main.tex', 'refs.bib', 'sections/intro.tex'])
    expect(byPath.get('main.tex')?.sha256).toBe(sha256(MAIN_TEX))
    expect(byPath.get('sections/intro.tex')?.sha256).toBe(sha256(INTRO_TEX))
    expect(byPath.get('refs.bib')?.bytes.toString('utf8')).toBe(REFS_BIB)
    expect(byPath.get('figures/plot.png')?.bytes.equals(PNG_BYTES)).toBe(true)
    expect(byPath.get('figures/plot.png')?.size).toBe(PNG_BYTES.length)
    expect(result.strippedTopFolder).toBe('paper-v2')
    expect(result.skipped).toEqual([])
  })

  it('keeps the folders when some file sits at the top level', async () => {
    const files = await readUploadedFiles(await upload('zip', [
      { path: 'main.tex', content: MAIN_TEX },
      { path: 'sections/intro.tex', content: INTRO_TEX },
    ]))
    expect(files.map(f => f.path).sort()).toEqual(['main.tex', 'sections/intro.tex'])
  })

  it('leaves out macOS metadata and reports it', async () => {
    const result = await readUploadBundle(await upload('zip', [
      { path: 'paper/main.tex', content: MAIN_TEX },
      { path: '__MACOSX/paper/._main.tex', content: 'resource fork' },
      { path: 'paper/.DS_Store', content: 'finder data' },
    ]))
    expect(result.files.map(f => f.path)).toEqual(['main.tex'])
    expect(result.skipped.map(s => s.name)).toEqual(['__MACOSX/paper/._main.tex', 'paper/.DS_Store'])
  })

  it('refuses an archive with only folders as empty, and one without .tex as no-tex', async () => {
    expect(await refusalCode(readUploadedFiles(await upload('zip', [{ path: 'paper/', kind: 'directory' }])))).toBe('empty')
    expect(await refusalCode(readUploadedFiles(await upload('tar.gz', [{ path: 'refs.bib', content: REFS_BIB }])))).toBe('no-tex')
  })
})

describe('hostile entry names inside archives', () => {
  const hostile = [
    '../evil.tex',
    '/etc/passwd',
    'a/../../b.tex',
    'C:/evil.tex',
    'paper\\..\\..\\evil.tex',
  ]
  for (const format of FORMATS) {
    it.each(hostile)(`refuses %j in a .${format} archive`, async (name) => {
      const code = await refusalCode(readUploadedFiles(await upload(format, [
        { path: 'main.tex', content: MAIN_TEX },
        { path: name, content: 'x' },
      ])))
      expect(code).toBe('path-unsafe')
    })
  }

  it('refuses a zip entry whose raw name contains a NUL byte', async () => {
    const code = await refusalCode(readUploadedFiles(await upload('zip', [
      { path: 'main.tex', content: MAIN_TEX },
      { path: 'unused', content: 'x', zip: { rawName: Buffer.from('evil.tex\u0000.png', 'latin1') } },
    ])))
    expect(code).toBe('path-unsafe')
  })

  it('refuses paths that are too long or too deep', async () => {
    const deep = `${Array.from({ length: 11 }, (_, i) => `d${i}`).join('/')}/x.tex`
    expect(await refusalCode(readUploadedFiles(await upload('zip', [{ path: deep, content: 'x' }])))).toBe('path-too-long')
    const long = `${'n'.repeat(300)}.tex`
    expect(await refusalCode(readUploadedFiles(await upload('tar.gz', [{ path: long, content: 'x' }])))).toBe('path-too-long')
  })

  it('refuses duplicate entries, also when they differ only by "./" or "//"', async () => {
    for (const format of FORMATS) {
      const code = await refusalCode(readUploadedFiles(await upload(format, [
        { path: 'paper/main.tex', content: 'a' },
        { path: 'paper//main.tex', content: 'b' },
      ])))
      expect(code).toBe('duplicate-path')
    }
    const code = await refusalCode(readUploadedFiles(await upload('zip', [
      { path: 'main.tex', content: 'a' },
      { path: './main.tex', content: 'b' },
    ])))
    expect(code).toBe('duplicate-path')
  })

  it('names the offending entry only in sanitised, truncated form', async () => {
    const nasty = `<img src=x onerror=alert(1)>\u0007${'z'.repeat(200)}\u202E.exe`
    const error = await refusal(readUploadedFiles(await upload('zip', [
      { path: 'main.tex', content: MAIN_TEX },
      { path: nasty, content: 'x' },
    ])))
    expect(error.code).toBe('path-unsafe')
    // eslint-disable-next-line no-control-regex -- the point is that no control character survives
    expect(error.message).not.toMatch(/[<>\u0000-\u001f\u007f-\uffff]/)
    expect(error.entry).not.toBeNull()
    expect(error.entry?.length).toBeLessThanOrEqual(80)
    expect(error.entry?.startsWith('\\x3cimg src=x onerror=alert(1)\\x3e\\x07')).toBe(true)
    expect(error.entry?.endsWith('\\u{202e}.exe')).toBe(true)
  })
})

describe('links and special entries', () => {
  it.each(['tar', 'tar.gz'] as const)('refuses symbolic links, hard links and devices in .%s', async (format) => {
    const base: ArchiveEntry = { path: 'main.tex', content: MAIN_TEX }
    const cases: [ArchiveEntry, UploadRefusalCode][] = [
      [{ path: 'secret.tex', kind: 'symlink', linkTarget: '/etc/passwd' }, 'link-entry'],
      [{ path: 'copy.tex', kind: 'hardlink', linkTarget: 'main.tex' }, 'link-entry'],
      [{ path: 'tty.tex', kind: 'char-device' }, 'special-entry'],
      [{ path: 'pipe.tex', kind: 'fifo' }, 'special-entry'],
    ]
    for (const [entry, expected] of cases) {
      expect(await refusalCode(readUploadedFiles(await upload(format, [base, entry])))).toBe(expected)
    }
  })

  it('refuses a zip entry whose Unix mode marks a symlink, even with an allowed extension', async () => {
    const code = await refusalCode(readUploadedFiles(await upload('zip', [
      { path: 'main.tex', content: MAIN_TEX },
      { path: 'secret.tex', kind: 'symlink', linkTarget: '/etc/passwd' },
    ])))
    expect(code).toBe('link-entry')
    // The same bytes marked as a regular file are accepted: it is the mode that is refused.
    const files = await readUploadedFiles(await upload('zip', [
      { path: 'main.tex', content: MAIN_TEX },
      { path: 'secret.tex', content: '/etc/passwd' },
    ]))
    expect(files.map(f => f.path).sort()).toEqual(['main.tex', 'secret.tex'])
  })

  it('refuses a zip entry whose Unix mode marks a device', async () => {
    const code = await refusalCode(readUploadedFiles(await upload('zip', [
      { path: 'main.tex', content: MAIN_TEX },
      { path: 'dev.tex', kind: 'char-device' },
    ])))
    expect(code).toBe('special-entry')
  })
})

describe('types, nesting and counts inside archives', () => {
  it.each(FORMATS)('refuses an .exe inside a .%s', async (format) => {
    const error = await refusal(readUploadedFiles(await upload(format, [
      { path: 'main.tex', content: MAIN_TEX },
      { path: 'tools/run.exe', content: 'MZ' },
    ])))
    expect(error.code).toBe('file-type')
    expect(error.message).toContain('tools/run.exe')
  })

  it('refuses archives nested inside archives', async () => {
    const inner = makeZip([{ path: 'main.tex', content: MAIN_TEX }])
    expect(await refusalCode(readUploadedFiles(await upload('zip', [
      { path: 'main.tex', content: MAIN_TEX },
      { path: 'old/version1.zip', content: inner },
    ])))).toBe('nested-archive')
    const innerTgz = await makeTarGz([{ path: 'main.tex', content: MAIN_TEX }])
    expect(await refusalCode(readUploadedFiles(await upload('tar', [
      { path: 'main.tex', content: MAIN_TEX },
      { path: 'old/version1.tar.gz', content: innerTgz },
    ])))).toBe('nested-archive')
  })

  it.each(FORMATS)('refuses more files than the default limit in a .%s', async (format) => {
    const entries: ArchiveEntry[] = Array.from({ length: UPLOAD_LIMITS.maxFiles + 1 }, (_, i) => ({ path: `p/f${i}.tex`, content: `${i}` }))
    expect(await refusalCode(readUploadedFiles(await upload(format, entries)))).toBe('too-many-files')
    // One file fewer is accepted.
    expect(await readUploadedFiles(await upload(format, entries.slice(1)))).toHaveLength(UPLOAD_LIMITS.maxFiles)
  })

  it('refuses more archive entries than allowed even when they are only folders', async () => {
    const entries: ArchiveEntry[] = [
      { path: 'main.tex', content: MAIN_TEX },
      ...Array.from({ length: 20 }, (_, i): ArchiveEntry => ({ path: `empty${i}`, kind: 'directory' })),
    ]
    for (const format of ['zip', 'tar.gz'] as const) {
      expect(await refusalCode(readUploadedFiles(await upload(format, entries), { maxEntries: 20 }))).toBe('too-many-files')
    }
  })

  it('refuses a file over the single-file limit inside an archive', async () => {
    for (const format of FORMATS) {
      const entries = [{ path: 'main.tex', content: 'x'.repeat(5000) }]
      expect(await refusalCode(readUploadedFiles(await upload(format, entries), { maxFileBytes: 4999 }))).toBe('too-large')
      expect(await readUploadedFiles(await upload(format, entries), { maxFileBytes: 5000 })).toHaveLength(1)
    }
  })
})

describe('corrupt and unsupported archives', () => {
  const entries: ArchiveEntry[] = [
    { path: 'paper/main.tex', content: MAIN_TEX.repeat(50) },
    { path: 'paper/sections/intro.tex', content: INTRO_TEX.repeat(50) },
  ]

  it.each(FORMATS)('refuses a truncated .%s as archive-corrupt', async (format) => {
    const [whole] = await upload(format, entries)
    if (!whole) throw new Error('no upload built')
    // Cut inside the second file's data (tar) or the central directory (zip).
    const cut = whole.data.subarray(0, Math.floor(whole.data.length * 0.6))
    const error = await refusal(readUploadedFiles([{ filename: whole.filename, data: cut }]))
    expect(error.code).toBe('archive-corrupt')
    expect(error.message).toMatch(/damaged or incomplete|not gzip/)
  })

  it('refuses bytes that are not an archive at all, and an empty archive file', async () => {
    const junk = Buffer.from('this is not an archive, just text that happens to be long enough. '.repeat(20))
    for (const filename of ['a.zip', 'a.tar', 'a.tar.gz', 'a.tgz']) {
      expect(await refusalCode(readUploadedFiles([{ filename, data: junk }]))).toBe('archive-corrupt')
      expect(await refusalCode(readUploadedFiles([{ filename, data: Buffer.alloc(0) }]))).toBe('archive-corrupt')
    }
  })

  it('refuses a zip entry whose compressed data is garbage', async () => {
    const code = await refusalCode(readUploadedFiles(await upload('zip', [
      { path: 'main.tex', content: MAIN_TEX, zip: { compressedData: Buffer.from([0xff, 0xff, 0xff, 0xff, 0x00, 0x12]) } },
    ])))
    expect(code).toBe('archive-corrupt')
  })

  it('refuses a zip entry that inflates to more than its header claims (size not trusted)', async () => {
    const code = await refusalCode(readUploadedFiles(await upload('zip', [
      { path: 'main.tex', content: 'y'.repeat(100_000), zip: { declaredSize: 100 } },
    ])))
    expect(code).toBe('archive-corrupt')
  })

  it('refuses encrypted zip entries and unknown compression methods', async () => {
    expect(await refusalCode(readUploadedFiles(await upload('zip', [
      { path: 'main.tex', content: MAIN_TEX, zip: { encrypted: true, method: 'store' } },
    ])))).toBe('archive-unsupported')
    expect(await refusalCode(readUploadedFiles(await upload('zip', [
      { path: 'main.tex', content: MAIN_TEX, zip: { methodNumber: 12 } },
    ])))).toBe('archive-unsupported')
  })

  it('refuses a .tgz that is a plain tar', async () => {
    const tar = await makeTar([{ path: 'main.tex', content: MAIN_TEX }])
    const error = await refusal(readUploadedFiles([{ filename: 'paper.tgz', data: tar }]))
    expect(error.code).toBe('archive-corrupt')
    expect(error.message).toContain('not gzip-compressed')
  })
})

describe('decompression bombs', () => {
  const BOMB_BYTES = 60_000_000
  const zeros = Buffer.alloc(BOMB_BYTES)
  const roomyLimits: Partial<UploadLimits> = { maxFileBytes: 200 * MiB, maxTotalBytes: 200 * MiB }
  const deflatedZeros = zlib.deflateRawSync(zeros, { level: 9 })
  // The same deflate stream with its last bytes replaced: inflating it *to the end* fails,
  // so a reader that reports anything but archive-corrupt must have stopped before the end.
  const deflatedZerosBadTail = Buffer.concat([deflatedZeros.subarray(0, deflatedZeros.length - 16), Buffer.alloc(16, 0xff)])

  function zipBomb(compressedData: Buffer): Buffer {
    return makeZip([
      { path: 'main.tex', content: MAIN_TEX },
      { path: 'padding.txt', content: zeros, zip: { compressedData } },
    ])
  }

  it('the test bomb really compresses about 1000:1', () => {
    const ratio = BOMB_BYTES / zipBomb(deflatedZeros).length
    expect(ratio).toBeGreaterThan(900)
  })

  it('refuses a zip bomb under the default limits before inflating it (header size over the file limit)', async () => {
    const started = performance.now()
    const error = await refusal(readUploadedFiles([{ filename: 'paper.zip', data: zipBomb(deflatedZeros) }]))
    expect(error.code).toBe('too-large')
    expect(performance.now() - started).toBeLessThan(2000)
  })

  it('stops an honest-looking zip bomb by compression ratio while inflating', async () => {
    const error = await refusal(readUploadedFiles([{ filename: 'paper.zip', data: zipBomb(deflatedZeros) }], roomyLimits))
    expect(error.code).toBe('compression-ratio')
    expect(error.message).toContain('100 times')
  })

  it('stops the zip bomb early: its damaged tail is never reached', async () => {
    const bomb = zipBomb(deflatedZerosBadTail)
    expect(await refusalCode(readUploadedFiles([{ filename: 'paper.zip', data: bomb }], roomyLimits))).toBe('compression-ratio')
    // Control: with no ratio limit the reader inflates to the end and meets the damage.
    expect(await refusalCode(readUploadedFiles([{ filename: 'paper.zip', data: bomb }], { ...roomyLimits, maxCompressionRatio: Infinity }))).toBe('archive-corrupt')
  })

  it('stops a tar.gz bomb by compression ratio, before its damaged tail', async () => {
    const tgz = await makeTarGz([
      { path: 'main.tex', content: MAIN_TEX },
      { path: 'padding.txt', content: zeros },
    ])
    expect(BOMB_BYTES / tgz.length).toBeGreaterThan(500)
    expect(await refusalCode(readUploadedFiles([{ filename: 'paper.tar.gz', data: tgz }]))).toBe('too-large')
    expect(await refusalCode(readUploadedFiles([{ filename: 'paper.tar.gz', data: tgz }], roomyLimits))).toBe('compression-ratio')
    // Truncated gzip: reading it to the end fails, so compression-ratio proves an early stop.
    const truncated = tgz.subarray(0, tgz.length - 200)
    expect(await refusalCode(readUploadedFiles([{ filename: 'paper.tar.gz', data: truncated }], roomyLimits))).toBe('compression-ratio')
    expect(await refusalCode(readUploadedFiles([{ filename: 'paper.tar.gz', data: truncated }], { ...roomyLimits, maxCompressionRatio: Infinity }))).toBe('archive-corrupt')
  })

  it('lets well-compressing small sources through (ratio only enforced past the grace amount)', async () => {
    // 200 KiB of repetitive TeX compresses far beyond 100:1 but is a normal manuscript size.
    const repetitive = '\\item $x_1 x_2$\n'.repeat(12_800)
    const data = makeZip([{ path: 'main.tex', content: repetitive }])
    expect(repetitive.length / data.length).toBeGreaterThan(100)
    const files = await readUploadedFiles([{ filename: 'main.zip', data }])
    expect(files[0]?.sha256).toBe(sha256(repetitive))
  })
})

describe('name helpers', () => {
  it('normalises harmless redundancy and keeps the rest', () => {
    expect(normaliseUploadPath('./paper//sections/./intro.tex')).toBe('paper/sections/intro.tex')
    expect(() => normaliseUploadPath('paper/../intro.tex')).toThrow(UploadRefusedError)
  })

  it('describes names in printable ASCII and keeps both ends of long names', () => {
    expect(describeEntryName('fig "1" & <2>.png')).toBe('fig \\x221\\x22 \\x26 \\x3c2\\x3e.png')
    expect(describeEntryName('caf\u00e9\u{1F600}.tex')).toBe('caf\\xe9\\u{1f600}.tex')
    const shown = describeEntryName(`${'a'.repeat(100)}${'b'.repeat(100)}.tex`)
    expect(shown).toHaveLength(80)
    expect(shown.startsWith('aaaa')).toBe(true)
    expect(shown.endsWith('bbb.tex')).toBe(true)
    expect(shown).toContain('...')
  })
})

describe('archives read from a temporary file (as the web server receives them)', () => {
  const entries: ArchiveEntry[] = [
    { path: 'paper/main.tex', content: MAIN_TEX },
    { path: 'paper/sections/intro.tex', content: INTRO_TEX },
  ]

  it.each(FORMATS)('reads a .%s from disk exactly as from memory', async (format) => {
    const [inMemory] = await upload(format, entries)
    if (!inMemory) throw new Error('no upload built')
    const folder = mkdtempSync(join(tmpdir(), 'scholium-bundle-test-'))
    try {
      const tempPath = join(folder, 'upload')
      writeFileSync(tempPath, inMemory.data)
      const fromDisk = await readUploadBundle([{ filename: inMemory.filename, tempPath, size: inMemory.data.length }])
      const fromMemory = await readUploadBundle([inMemory])
      expect(fromDisk.files.map(f => [f.path, f.sha256])).toEqual(fromMemory.files.map(f => [f.path, f.sha256]))
      expect(fromDisk.files.map(f => f.path).sort()).toEqual(['main.tex', 'sections/intro.tex'])
    }
    finally {
      rmSync(folder, { recursive: true, force: true })
    }
  })

  it('refuses a gzip bomb read from disk by compression ratio', async () => {
    const folder = mkdtempSync(join(tmpdir(), 'scholium-bundle-test-'))
    try {
      const data = await makeTarGz([{ path: 'main.tex', content: MAIN_TEX }, { path: 'zeros.txt', content: Buffer.alloc(15 * 1024 * 1024) }])
      const tempPath = join(folder, 'upload')
      writeFileSync(tempPath, data)
      const error = await refusal(readUploadBundle([{ filename: 'bomb.tar.gz', tempPath, size: data.length }]))
      expect(error.code).toBe('compression-ratio')
    }
    finally {
      rmSync(folder, { recursive: true, force: true })
    }
  })
})
