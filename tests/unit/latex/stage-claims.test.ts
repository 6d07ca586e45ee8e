// Stage "claims" (shared/latex/claims.ts): regions in, claims, bindings and not-read entries out.
import { describe, expect, it } from 'vitest'
import { ClaimOutput, ClaimReader, type ReadingState } from '../../../shared/latex/claims'
import { BindingScopes } from '../../../shared/latex/bindings'
import { lineStarts } from '../../../shared/latex/decode'
import { tokenize } from '../../../shared/latex/tokens'
import type { MathRegion, SourceFile } from '../../../shared/latex/regions'
import type { WarningCode } from '../../../shared/types/claims'

/** A file holding `text`, and a region over the math between its first `$…$` (or the whole text for display). */
function setup(text: string, display = false) {
  const file: SourceFile = { path: 'a.tex', original: text, masked: text, starts: lineStarts(text), lineTags: new Map() }
  const warnings: { code: WarningCode, message: string }[] = []
  const output = new ClaimOutput(10, (code, message) => warnings.push({ code, message }))
  const state: ReadingState = { bindings: new BindingScopes(), notation: new Map(), conventions: new Map() }
  const reader = new ClaimReader(output, state)
  const regionOf = (from: number, to: number): MathRegion => ({
    file, tokens: tokenize(text.slice(from, to)).map(t => ({ ...t, pos: t.pos + from, end: t.end + from })), pos: from - (display ? 0 : 1), end: to + 1, display,
  })
  return { file, output, state, reader, warnings, regionOf }
}

/** Read the inline math of a one-line text, in order. */
function readInline(text: string) {
  const s = setup(text)
  const re = /\$([^$]*)\$/g
  for (let m = re.exec(text); m; m = re.exec(text)) s.reader.readRegion(s.regionOf(m.index + 1, m.index + 1 + m[1]!.length))
  return s
}

describe('ClaimReader', () => {
  it('makes a ready claim of an equation about a known object', () => {
    const { output } = readInline('so $\\ell(213) = 1$.')
    expect(output.claims.map(c => [c.id, c.kind, c.status, c.source])).toEqual([['a.tex:1:1', 'length', 'ready', '\\ell(213) = 1']])
  })

  it('binds a symbol and records the binding in the claims that use it', () => {
    const { output, state } = readInline('Let $w = 213$. Then $\\ell(w) = 1$.')
    expect(state.bindings.visible.get('w')).toEqual({ kind: 'permutation', perm: { form: 'oneLine', entries: [2, 1, 3] } })
    expect(output.claims).toHaveLength(1)
    expect(output.claims[0]!.context).toEqual({ w: { kind: 'permutation', perm: { form: 'oneLine', entries: [2, 1, 3] } } })
  })

  it('stays silent on a substitution and lists a general identity as not read', () => {
    const { output } = readInline('Setting $x_2 = -y_2$ we get $s_\\lambda s_\\mu = s_\\mu s_\\lambda$.')
    expect(output.claims).toEqual([])
    expect(output.notRead.map(n => n.reason)).toEqual(['\\lambda is not bound here: a general statement, not an example (to check one, write "Let $\\lambda = (2,1)$" first)'])
  })

  it('checks a continued row against the last expression of the chain', () => {
    const text = '\\ell(321) &= 3 \\\\ &= 1 + 2'
    const s = setup(text, true)
    s.reader.readRegion({ ...s.regionOf(0, text.length), env: 'align' })
    expect(s.output.claims.map(c => [c.source, c.kind])).toEqual([['\\ell(321) = 3', 'length'], ['3 = 1 + 2', 'length']])
  })

  it('turns math that does not parse into an error claim', () => {
    const s = setup('{a = b')
    s.reader.readRegion({ ...s.regionOf(0, 6), display: true })
    expect(s.output.claims.map(c => c.status)).toEqual(['error'])
  })
})

describe('ClaimOutput', () => {
  it('numbers claims per line and stops at the limit with one warning', () => {
    const { output, file, warnings } = setup('x')
    for (let i = 0; i < 12; i++) {
      output.pushClaim({ file: file.path, line: 1, endLine: 1, column: 1, source: 'x', expandedSource: 'x', kind: 'unknown', status: 'unsupported', conventions: [], display: false })
    }
    expect(output.claims.map(c => c.id).slice(0, 3)).toEqual(['a.tex:1:1', 'a.tex:1:2', 'a.tex:1:3'])
    expect(output.claims).toHaveLength(10)
    expect(warnings.map(w => w.code)).toEqual(['limit'])
  })

  it('lists the same not-read math once when an overlay repeats it nearby', () => {
    const { output, file } = setup('s_\\lambda = t\ns_\\lambda = t')
    output.pushNotRead(file, 0, 13, 'r')
    output.pushNotRead(file, 14, 27, 'r')
    expect(output.notRead).toHaveLength(1)
  })
})
