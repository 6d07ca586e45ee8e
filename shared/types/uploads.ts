/**
 * Upload rules shared by the server, the CLI and the upload form: refusal codes and the file
 * types Scholium accepts. Declared once here; everything else derives from these lists.
 */

/** Why an upload was refused; the API answers `upload-<code>`. */
export const UPLOAD_REFUSAL_CODES = [
  'empty', // nothing to read: no uploads, or no files in the archive
  'too-large', // a file, the whole upload or the request body is over the size limits
  'too-many-files', // over the file or archive-entry count limits
  'file-type', // file extension not in the allowed list
  'path-unsafe', // absolute, drive letter, '..', backslash, control characters
  'path-too-long', // over the path length or folder depth limits
  'link-entry', // symbolic or hard link inside an archive
  'special-entry', // device, fifo or other non-file entry inside an archive
  'compression-ratio', // the archive inflates too much compared to its own size
  'archive-corrupt', // the archive cannot be read to the end
  'archive-unsupported', // encrypted zip entries, unknown compression methods
  'nested-archive', // an archive inside the archive
  'mixed-upload', // an archive sent together with other files
  'duplicate-path', // two entries with the same path, or a path used as file and folder
  'no-tex', // no .tex file at all
] as const

/** One of `UPLOAD_REFUSAL_CODES`, e.g. 'too-large'. */
export type UploadRefusalCode = typeof UPLOAD_REFUSAL_CODES[number]

/** The API error code of a refusal, e.g. 'upload-too-large'. */
export type UploadErrorCode = `upload-${UploadRefusalCode}`

/**
 * Accepted file extensions, lower case with the dot. TeX sources and their support files
 * (classes, class options, styles, configuration, bibliography data and styles, index styles,
 * TikZ/PGF pictures and their plain data tables), short notes (.txt .md), and figures a TeX
 * engine can include. Everything else, executables and fonts included, is refused with
 * 'file-type' so that authors see the rule instead of a silent drop.
 */
export const UPLOAD_FILE_EXTENSIONS: readonly string[] = Object.freeze([
  '.tex', '.sty', '.cls', '.clo', '.cfg', '.def',
  '.bib', '.bbl', '.bst', '.bbx', '.cbx', '.ist',
  '.tikz', '.pgf', '.csv', '.dat',
  '.txt', '.md',
  '.png', '.jpg', '.jpeg', '.gif', '.pdf', '.eps', '.ps', '.svg',
])

/** Archives that are unpacked (one level), lower case with the dot. */
export const UPLOAD_ARCHIVE_EXTENSIONS: readonly string[] = Object.freeze(['.zip', '.tar', '.tar.gz', '.tgz'])

/**
 * Every extension recognised as an archive, read or not, longest first so that `.tar.gz`
 * wins over `.gz`. The ones outside `UPLOAD_ARCHIVE_EXTENSIONS` are refused with a hint.
 */
export const KNOWN_ARCHIVE_EXTENSIONS: readonly string[] = Object.freeze([
  '.tar.gz', '.tar.bz2', '.tar.xz', '.tgz', '.tbz2', '.txz', '.zip', '.tar', '.gz', '.bz2', '.xz', '.7z', '.rar', '.zst',
])

/** The `accept` attribute of a file input: every accepted file and archive type. */
export const UPLOAD_ACCEPT_ATTRIBUTE = [...UPLOAD_FILE_EXTENSIONS, ...UPLOAD_ARCHIVE_EXTENSIONS].join(',')

/**
 * Sizes and counts the upload reader enforces (server/uploads/limits.ts builds UPLOAD_LIMITS from
 * these), declared here so the upload form can refuse the same things before sending them.
 */
export const UPLOAD_SIZE_LIMITS = Object.freeze({
  /** Sum of the sizes of all kept files, after unpacking. */
  maxTotalBytes: 50 * 1024 * 1024,
  /** Number of kept files. */
  maxFiles: 500,
  /** Size of one file, after unpacking. */
  maxFileBytes: 20 * 1024 * 1024,
  /** Segments of a path, file name included. */
  maxPathDepth: 10,
  /** Bytes of a multipart request body: the files' limit plus room for the form's framing. */
  maxRequestBytes: 60 * 1024 * 1024,
})
