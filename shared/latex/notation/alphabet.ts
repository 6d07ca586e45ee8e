/**
 * Alphabets a claim declares in an argument list, other than the x_1, x_2, … and y_1, y_2, … the
 * engine uses:
 * - letters: `s_{21}(a,b,c)` means a = x_1, b = x_2, c = x_3 in the whole claim;
 * - from x_0: `m_{2}(x_0,x_1,x_2)` means x_i = x_{i+1} of the engine in the whole claim;
 * - indexed in another letter: `s_{21}(z_1,z_2)` means z_i = x_i in the whole claim (the indices
 *   must run 1, 2, …, k);
 * - a second alphabet z: `\mathfrak{S}_w(x;z)` or `(x|z)` means z_j = y_j.
 *
 * Conventions (precision first): a list declares an alphabet only when it follows a subscript
 * (the argument list of an object such as s_λ or \mathfrak{S}_w); two different declarations in
 * one claim, letters or another indexed alphabet next to explicit x_i or y_j, and a second
 * alphabet z next to explicit y_j, declare nothing.
 */
import { isChar, type MathNode } from '../math-tree'

export type Alphabet
  = | { kind: 'letters', letters: string[] }
    | { kind: 'fromZero' }
    | { kind: 'indexed', letter: string }
    | { kind: 'secondZ' }

/** Letters never taken as an alphabet: the engine's own, and z (a second alphabet, below). */
const RESERVED_LETTERS = new Set(['x', 'y', 'z'])
/** Letters of objects the reader knows (s_λ, e_k, c^ν_{λμ}, q, …): never an indexed alphabet. */
const OBJECT_LETTERS = new Set(['x', 's', 'e', 'h', 'm', 'p', 'c', 'q', 'w', 'u', 'v'])

const unwrapGroup = (nodes: MathNode[]): MathNode[] => (nodes.length === 1 && nodes[0]!.k === 'group' ? unwrapGroup(nodes[0]!.children) : nodes)

function splitTop(nodes: MathNode[], isSep: (n: MathNode) => boolean): MathNode[][] {
  const out: MathNode[][] = [[]]
  for (const n of nodes) {
    if (isSep(n)) out.push([])
    else out[out.length - 1]!.push(n)
  }
  return out
}

const isBold = (n: MathNode) => n.k === 'cs' && (n.v === 'mathbf' || n.v === 'boldsymbol' || n.v === 'bm')
const stripBold = (nodes: MathNode[]): MathNode[] => unwrapGroup(unwrapGroup(nodes).filter(n => !isBold(n)))

/** `a` → 'a' for one lowercase letter, else undefined. */
function singleLetter(nodes: MathNode[]): string | undefined {
  const ns = stripBold(nodes)
  return ns.length === 1 && ns[0]!.k === 'ch' && /^[a-z]$/.test(ns[0]!.v) ? ns[0]!.v : undefined
}

/** `z_3` → { letter: 'z', index: 3 } for one lowercase letter with a number index; undefined otherwise. */
function indexedVariable(nodes: MathNode[]): { letter: string, index: number } | undefined {
  const ns = stripBold(nodes)
  const letter = ns[0]?.k === 'ch' && /^[a-z]$/.test(ns[0].v) ? ns[0].v : undefined
  const index = letter === undefined ? undefined : indexOf(ns, letter)
  return letter === undefined || index === undefined ? undefined : { letter, index }
}

/** `x_3` → 3 for the letter given; undefined otherwise. */
function indexOf(nodes: MathNode[], letter: string): number | undefined {
  const ns = unwrapGroup(nodes)
  if (ns.length !== 3 || !isChar(ns[0], letter) || !isChar(ns[1], '_')) return undefined
  const digits = ns[2]!.k === 'group' ? ns[2]!.children : [ns[2]!]
  if (!digits.length || !digits.every(d => d.k === 'ch' && /^[0-9]$/.test(d.v))) return undefined
  return Number(digits.map(d => (d as { v: string }).v).join(''))
}

/** The alphabet one argument list declares, if any. */
export function alphabetOfList(content: MathNode[]): Alphabet | undefined {
  const groups = splitTop(content, n => isChar(n, ';') || isChar(n, '|') || (n.k === 'cs' && n.v === 'mid'))
  if (groups.length === 2) {
    if (singleLetter(groups[0]!) === 'x' && singleLetter(groups[1]!) === 'z') return { kind: 'secondZ' }
    return undefined
  }
  const items = splitTop(content, n => isChar(n, ','))
  const letters = items.map(singleLetter)
  if (letters.every(l => l !== undefined && !RESERVED_LETTERS.has(l)) && new Set(letters).size === letters.length) {
    return { kind: 'letters', letters: letters as string[] }
  }
  const indices = items.map(it => indexOf(it, 'x'))
  if (indices.length >= 1 && indices.every((v, k) => v === k)) return { kind: 'fromZero' }
  const indexed = items.map(indexedVariable)
  const letter = indexed[0]?.letter
  if (letter && !OBJECT_LETTERS.has(letter) && indexed.every((v, k) => v?.letter === letter && v.index === k + 1)) return { kind: 'indexed', letter }
  return undefined
}

/** True if x_i or y_j (of the letters given) occurs anywhere in the nodes. */
function mentionsEngineVariables(nodes: MathNode[], letters: readonly string[] = ['x', 'y']): boolean {
  return nodes.some((n, j) => (n.k === 'ch' && letters.includes(n.v) && isChar(nodes[j + 1], '_')) || ((n.k === 'group' || n.k === 'env') && mentionsEngineVariables(n.children, letters)))
}

/** Argument lists that follow a subscript: `s_{21}(a,b,c)` gives the nodes of `a,b,c`. */
function argumentLists(nodes: MathNode[]): MathNode[][] {
  const lists: MathNode[][] = []
  for (let j = 2; j < nodes.length; j++) {
    if (!isChar(nodes[j], '(') || !isChar(nodes[j - 2], '_')) continue
    let depth = 0
    for (let k = j + 1; k < nodes.length; k++) {
      if (isChar(nodes[k], '(')) depth++
      else if (isChar(nodes[k], ')')) {
        if (depth === 0) {
          lists.push(nodes.slice(j + 1, k))
          break
        }
        depth--
      }
    }
  }
  for (const n of nodes) if (n.k === 'group') lists.push(...argumentLists(n.children))
  return lists
}

const sameAlphabet = (a: Alphabet, b: Alphabet): boolean =>
  a.kind === b.kind && (a.kind !== 'letters' || (b.kind === 'letters' && a.letters.join() === b.letters.join())) && (a.kind !== 'indexed' || (b.kind === 'indexed' && a.letter === b.letter))

/**
 * The one alphabet the two sides of a claim declare, or undefined when they declare none or
 * disagree. e.g. the sides of `s_{21}(a,b,c) = a^2b + …` give `{ kind: 'letters', letters: ['a','b','c'] }`.
 */
export function declaredAlphabet(lhs: MathNode[], rhs: MathNode[]): Alphabet | undefined {
  const found = [...argumentLists(lhs), ...argumentLists(rhs)].map(alphabetOfList).filter((a): a is Alphabet => a !== undefined)
  if (!found.length || !found.every(a => sameAlphabet(a, found[0]!))) return undefined
  const alphabet = found[0]!
  if (alphabet.kind === 'letters' && (mentionsEngineVariables(lhs) || mentionsEngineVariables(rhs))) return undefined
  // z_i read as x_i (or z_j as y_j) only where no x_i or y_j of the engine's own stands beside it.
  const clashing = alphabet.kind === 'indexed' ? ['x', 'y'].filter(l => l !== alphabet.letter) : alphabet.kind === 'secondZ' ? ['y'] : []
  if (clashing.length && (mentionsEngineVariables(lhs, clashing) || mentionsEngineVariables(rhs, clashing))) return undefined
  return alphabet
}
