// Stage "statements" (shared/latex/statements.ts): rows, labels and chains of a display, before any object is read.
import { describe, expect, it } from 'vitest'
import { buildMathTree, renderNodes, splitRows } from '../../../shared/latex/math-tree'
import { joinContinuedRows, readStatements } from '../../../shared/latex/statements'
import { tokenize } from '../../../shared/latex/tokens'

const tree = (tex: string) => buildMathTree(tokenize(tex))
/** Each statement as its parts joined by " | ", with a mark for chain continuations. */
const shape = (tex: string, env?: string) =>
  readStatements(tree(tex), env).map(s => (s.continuesChain ? '…' : '') + s.parts.map(p => renderNodes(p)).join(' | '))

describe('readStatements', () => {
  it('cuts a display into statements at relations, rows and \\quad', () => {
    expect(shape('a = b \\quad c = d \\\\ e = f')).toEqual(['a | b', 'c | d', 'e | f'])
  })

  it('marks a row that starts with its relation as continuing the chain', () => {
    expect(shape('a &= b \\\\ &= c')).toEqual(['a | b', '… | c'])
  })

  it('does not mark the first statement of a display as continuing', () => {
    expect(readStatements(tree('= c'), undefined)[0]!.continuesChain).toBe(false)
  })

  it('gives every statement of a single-equation environment its label', () => {
    const statements = readStatements(tree('a = b \\\\ c = d \\label{eq:x}'), 'multline')
    expect(statements.map(s => s.label)).toEqual(['eq:x', 'eq:x'])
  })

  it('keeps row labels to their rows in align', () => {
    const statements = readStatements(tree('a = b \\label{r1} \\\\ c = d'), 'align')
    expect(statements.map(s => s.label)).toEqual(['r1', undefined])
  })
})

describe('joinContinuedRows', () => {
  const rows = (tex: string) => joinContinuedRows(splitRows(tree(tex))).map(r => renderNodes(r.nodes))

  it('joins a row that starts with + to the row before', () => {
    expect(rows('a &= b \\\\ &\\quad + c')).toEqual(['a=b+c'])
  })

  it('joins a row that starts with -', () => {
    expect(rows('a &= b \\\\ & - c \\\\ &= d')).toEqual(['a=b-c', '=d'])
  })

  it('leaves a first row that starts with a sign alone', () => {
    expect(rows('-a = b')).toEqual(['-a=b'])
  })

  it('leaves a signed row that is an equation of its own', () => {
    expect(rows('a = b \\\\ -c = d')).toEqual(['a=b', '-c=d'])
  })
})
