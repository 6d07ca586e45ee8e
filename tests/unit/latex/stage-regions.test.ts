// Stage "math regions" (shared/latex/regions.ts): collecting a piece of math up to its closer.
import { describe, expect, it } from 'vitest'
import { Expander, MacroTable } from '../../../shared/latex/macros'
import { Tokenizer, renderTokens } from '../../../shared/latex/tokens'
import { DEFAULT_LIMITS } from '../../../shared/latex/limits'
import { collectMath, readEnvName, type Closer } from '../../../shared/latex/regions'

/** An expander over `text` positioned just after its first token (the opener). */
function afterOpener(text: string, macros = new MacroTable()) {
  const expander = new Expander(new Tokenizer(text), macros, new Set(), DEFAULT_LIMITS, { produced: 0 })
  const open = expander.next()!
  return { expander, open }
}

function collect(text: string, closer: Closer, maxTokens = 1000) {
  const { expander, open } = afterOpener(text)
  return { ...collectMath(expander, open, closer, maxTokens), expander }
}

describe('collectMath', () => {
  it('stops at the closing dollar and reports where the region ends', () => {
    const got = collect('$a+b$ tail', { kind: '$' })
    expect(renderTokens(got.tokens)).toBe('a+b')
    expect(got.end).toBe(5)
    expect(got.failure).toBeUndefined()
  })

  it('does not stop at a dollar inside braces', () => {
    const got = collect('$\\text{$x$} = 1$', { kind: '$' })
    expect(got.end).toBe(16)
  })

  it('fails on inline math that runs into a paragraph break', () => {
    const got = collect('$a = b\n\nmore', { kind: '$' })
    expect(got.failure?.message).toMatch(/not closed before the end of the paragraph/)
  })

  it('closes an environment at its own \\end, past nested environments of the same name', () => {
    const text = '\\begin{align}\\begin{align}a\\end{align} b\\end{align} after'
    const { expander } = afterOpener(text)
    readEnvName(expander)
    const got = collectMath(expander, { k: 'cs', v: 'begin', pos: 0, end: 6, depth: 0 }, { kind: 'env', name: 'align' }, 1000)
    expect(renderTokens(got.tokens)).toBe('\\begin{align}a\\end{align} b')
    expect(text.slice(got.end)).toBe(' after')
  })

  it('puts the reader back after the opener when the region never closes', () => {
    const got = collect('\\[ a = b', { kind: 'cs', name: ']' })
    expect(got.failure?.message).toBe('\\[ is never closed')
    expect(got.expander.tokenizer.pos).toBe(2)
  })

  it('gives up past the token limit instead of reading on', () => {
    const got = collect('$' + 'a '.repeat(50) + '$', { kind: '$' }, 10)
    expect(got.failure?.message).toMatch(/not closed within 10 tokens/)
  })
})

describe('readEnvName', () => {
  it('reads the name in braces', () => {
    const { expander } = afterOpener('\\begin{align*}')
    expect(readEnvName(expander)).toBe('align*')
  })

  it('leaves a token that is not a brace in place', () => {
    const { expander } = afterOpener('\\begin x')
    expect(readEnvName(expander)).toBeUndefined()
    expect(expander.nextRawNonSpace()?.v).toBe('x')
  })
})
