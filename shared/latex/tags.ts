/**
 * Tags: instructions an author leaves in LaTeX comments, so the compiled paper is unchanged.
 *
 * Syntax (documented with examples in docs/tags.md): a comment whose text starts with
 * `scholium:` followed by directives separated by `;`:
 *   skip                      do not check the claim(s) this tag is attached to
 *   claim [kind]              this is a claim (report it even if unreadable), optionally of that kind
 *   use <convention ids>      conventions for the attached claim(s) only
 *   set <convention ids>      conventions from here to the end of the manuscript
 *   \name means <object>      the macro \name denotes a Schubert-type object or symmetric function
 *   in Gr(k,n) | in QH Gr(k,n) | in Sym
 *                             from here on σ_λ are classes of H*(Gr(k,n)) or QH*(Gr(k,n)), until the
 *                             next such tag ("in Sym" ends it); text naming a Grassmannian overrides
 *                             it inside its own environment or section
 *   parameters <names>        these letters are formal parameters from here on (q t \gamma); β is one
 *                             in K-theory claims without a tag (notation/k-theory.ts)
 *   chern <letter> <h|e>      in back-stable claims c_k stands for h_k (or e_k) in x_0, x_{-1}, …
 *                             (notation/back-stable.ts)
 * A tag at the end of a line attaches to claims on that line; a tag on a line of its own attaches
 * to the next line that is not blank or a comment (and to every claim of a display starting there).
 */
import { axisOfConvention, type ConventionId } from '../types/conventions'
import { CLAIM_KINDS, type ClaimKind, type GrassmannianSetting } from '../types/claims'
import { settingFromTagWords } from './notation/grassmannian'
import { chernFromTagWords, type ChernFamily } from './notation/back-stable'

/** Objects a macro can be declared to mean. */
export const NOTATION_OBJECTS = ['schubert', 'grothendieck', 'stanley', 'schur', 'elementary', 'complete', 'monomial', 'powersum'] as const
export type NotationObject = (typeof NOTATION_OBJECTS)[number]

export type TagDirective
  = | { type: 'skip' }
    | { type: 'claim', kind?: ClaimKind }
    | { type: 'use', conventions: ConventionId[] }
    | { type: 'set', conventions: ConventionId[] }
    | { type: 'means', macro: string, object: NotationObject }
  /** `in Gr(2,4)`, `in QH Gr(2,5)`; `setting: null` for `in Sym`. */
    | { type: 'grassmannian', setting: GrassmannianSetting | null }
    | { type: 'parameters', names: string[] }
    | { type: 'chern', letter: string, family: ChernFamily }

export interface ParsedTag {
  directives: TagDirective[]
  errors: string[]
}

/** Letters that already name something the reader reads (variables, symmetric functions, coefficients). */
const RESERVED_PARAMETER_LETTERS = new Set(['x', 'y', 'z', 's', 'e', 'h', 'm', 'p', 'c', 'C', 'F', 'K'])

const TAG_PREFIX = /^\s*scholium\s*:/i

/** True if a comment's text is a tag: `isTagComment(' scholium: skip') === true`. */
export function isTagComment(text: string): boolean {
  return TAG_PREFIX.test(text)
}

/** Parse a tag comment's text: `parseTag(' scholium: use xy-plus').directives[0]` is `{ type: 'use', conventions: ['xy-plus'] }`. */
export function parseTag(text: string): ParsedTag {
  const directives: TagDirective[] = []
  const errors: string[] = []
  const body = text.replace(TAG_PREFIX, '')
  for (const part of body.split(';')) {
    const words = part.trim().split(/[\s,]+/).filter(Boolean)
    const head = words[0]
    if (!head) continue
    const lower = head.toLowerCase()
    const ring = lower === 'in' ? settingFromTagWords(part) : undefined
    if (ring) {
      if ('error' in ring) errors.push(ring.error)
      else directives.push({ type: 'grassmannian', setting: ring.setting })
    }
    else if (lower === 'skip' && words.length === 1) directives.push({ type: 'skip' })
    else if (lower === 'claim') {
      const kindWord = words[1]
      if (words.length > 2) errors.push(`"claim" takes at most one kind, got "${words.slice(1).join(' ')}"`)
      else if (kindWord === undefined) directives.push({ type: 'claim' })
      else if ((CLAIM_KINDS as readonly string[]).includes(kindWord)) directives.push({ type: 'claim', kind: kindWord as ClaimKind })
      else errors.push(`unknown claim kind "${kindWord}" (known: ${CLAIM_KINDS.join(', ')})`)
    }
    else if (lower === 'use' || lower === 'set') {
      const ids: ConventionId[] = []
      for (const w of words.slice(1)) {
        if (axisOfConvention(w)) ids.push(w as ConventionId)
        else errors.push(`unknown convention "${w}"`)
      }
      if (words.length === 1) errors.push(`"${lower}" needs at least one convention id`)
      if (ids.length) directives.push({ type: lower, conventions: ids })
    }
    else if (lower === 'parameters' || lower === 'parameter') {
      const names: string[] = []
      for (const w of words.slice(1)) {
        const name = w.replace(/^\\/, '')
        if (/^[A-Za-z]$/.test(name) && !RESERVED_PARAMETER_LETTERS.has(name)) names.push(name)
        else if (/^[A-Za-z]{2,}$/.test(name) && w.startsWith('\\')) names.push(name)
        else errors.push(`"${w}" cannot be a parameter (a letter other than ${[...RESERVED_PARAMETER_LETTERS].join(', ')}, or a Greek letter such as \\gamma)`)
      }
      if (words.length === 1) errors.push('"parameters" needs at least one name')
      if (names.length) directives.push({ type: 'parameters', names })
    }
    else if (lower === 'chern') {
      const chern = chernFromTagWords(words.slice(1))
      if ('error' in chern) errors.push(chern.error)
      else directives.push({ type: 'chern', ...chern })
    }
    else if (head.startsWith('\\') && words[1]?.toLowerCase() === 'means') {
      const obj = (words[2] ?? '').toLowerCase().replace(/-/g, '')
      const macro = head.slice(1)
      if (!/^[A-Za-z@]+$/.test(macro)) errors.push(`"${head}" is not a macro name`)
      else if ((NOTATION_OBJECTS as readonly string[]).includes(obj) && words.length === 3) {
        directives.push({ type: 'means', macro, object: obj as NotationObject })
      }
      else errors.push(`"${head} means …" expects one of: ${NOTATION_OBJECTS.join(', ')}`)
    }
    else errors.push(`unknown directive "${part.trim()}"`)
  }
  return { directives, errors }
}
