/**
 * Permutations.
 *
 * Conventions (used throughout the engine):
 * - Values and positions are 1-based: `oneLine[i-1] = w(i)`.
 * - A permutation of {1..n} is identified with its image in S_{n+1} (w(n+1) = n+1);
 *   `key` drops trailing fixed points so equal elements of S_∞ have equal keys.
 * - Composition is right-to-left as maps: `u.compose(v)` is u∘v, (u∘v)(i) = u(v(i)).
 *   Hence `w.compose(s_i)` (written w s_i) swaps the POSITIONS i, i+1 of the one-line
 *   notation, and `s_i.compose(w)` swaps the VALUES i, i+1.
 * - A word [a_1,…,a_k] denotes s_{a_1} s_{a_2} ⋯ s_{a_k} (product in this order).
 * - Cycle notation (a b c) maps a→b→c→a.
 * - Lehmer code: c_i = #{ j > i : w(j) < w(i) }; length ℓ(w) = Σ c_i.
 * - Rothe diagram D(w) = { (i, j) : w(i) > j and w⁻¹(j) > i } (row i, column j).
 * - Descent: position i with w(i) > w(i+1).
 */
import { InvalidArgumentError, ParseError } from './errors'
import { toMeter, type Budget, type BudgetMeter } from './budget'
import { addChecked } from './coefficient'

/** Specs another module can build permutations from without strings. */
export type PermutationSpec
  = | { oneLine: readonly number[] }
    | { cycles: readonly (readonly number[])[], size?: number }
    | { word: readonly number[], size?: number }
    | { longest: number }

/**
 * A one-line notation without its trailing fixed points: the same element of S_∞, in its shortest
 * form (the array itself when there is nothing to trim). e.g. `trimFixedPoints([2, 1, 3, 4])` is [2, 1].
 */
export function trimFixedPoints(line: readonly number[]): readonly number[] {
  let n = line.length
  while (n > 0 && line[n - 1] === n) n--
  return n === line.length ? line : line.slice(0, n)
}

/** An element of S_n (and, by embedding, of S_∞). Immutable. */
export class Permutation {
  /** One-line notation, 1-based values: oneLine[i-1] = w(i). */
  readonly oneLine: readonly number[]

  private constructor(oneLine: readonly number[]) {
    this.oneLine = oneLine
  }

  /** From one-line notation; e.g. `Permutation.fromOneLine([2,1,4,3])`. */
  static fromOneLine(oneLine: readonly number[]): Permutation {
    const n = oneLine.length
    const seen = new Array<boolean>(n + 1).fill(false)
    for (const v of oneLine) {
      if (!Number.isInteger(v) || v < 1 || v > n || seen[v]) {
        throw new InvalidArgumentError(`[${oneLine.join(',')}] is not a permutation of 1..${n}`)
      }
      seen[v] = true
    }
    return new Permutation(oneLine.slice())
  }

  /** Trusted constructor for internal hot paths (no validation). */
  static unchecked(oneLine: readonly number[]): Permutation {
    return new Permutation(oneLine)
  }

  /** The identity of S_n; e.g. `Permutation.identity(3)` is 123. */
  static identity(n: number): Permutation {
    return new Permutation(Array.from({ length: n }, (_, i) => i + 1))
  }

  /** The longest element w0 = n n−1 … 1 of S_n; e.g. `longest(3)` is 321. */
  static longest(n: number): Permutation {
    if (!Number.isInteger(n) || n < 0) throw new InvalidArgumentError(`w0 needs a size n ≥ 0, got ${n}`)
    return new Permutation(Array.from({ length: n }, (_, i) => n - i))
  }

  /** The simple transposition s_i in S_max(n, i+1); e.g. `simple(1)` is 21. */
  static simple(i: number, n = i + 1): Permutation {
    if (!Number.isInteger(i) || i < 1) throw new InvalidArgumentError(`s_i needs i ≥ 1, got ${i}`)
    const line = Array.from({ length: Math.max(n, i + 1) }, (_, k) => k + 1)
    line[i - 1] = i + 1
    line[i] = i
    return new Permutation(line)
  }

  /** From a word: [a_1..a_k] ↦ s_{a_1}⋯s_{a_k}; e.g. `fromWord([1,2])` is 231. */
  static fromWord(word: readonly number[], size = 0): Permutation {
    let n = size
    for (const a of word) {
      if (!Number.isInteger(a) || a < 1) throw new InvalidArgumentError(`s_${a} is not a simple transposition`)
      n = Math.max(n, a + 1)
    }
    const line = Array.from({ length: n }, (_, k) => k + 1)
    // w s_a swaps positions a, a+1; apply the letters left to right.
    for (const a of word) {
      const t = line[a - 1]!
      line[a - 1] = line[a]!
      line[a] = t
    }
    return new Permutation(line)
  }

  /** From disjoint cycles; e.g. `fromCycles([[1,2],[3,4]])` is 2143. */
  static fromCycles(cycles: readonly (readonly number[])[], size = 0): Permutation {
    let n = size
    for (const c of cycles) for (const v of c) {
      if (!Number.isInteger(v) || v < 1) throw new InvalidArgumentError(`cycle entry ${v} is not a positive integer`)
      n = Math.max(n, v)
    }
    const line = Array.from({ length: n }, (_, k) => k + 1)
    const used = new Set<number>()
    for (const c of cycles) {
      for (let k = 0; k < c.length; k++) {
        const a = c[k]!
        if (used.has(a)) throw new InvalidArgumentError(`cycles are not disjoint: ${a} appears twice`)
        used.add(a)
        line[a - 1] = c[(k + 1) % c.length]!
      }
    }
    return new Permutation(line)
  }

  /** From a Lehmer code; e.g. `fromLehmerCode([1,0,1])` is 2143. */
  static fromLehmerCode(code: readonly number[]): Permutation {
    let n = code.length
    for (let i = 0; i < code.length; i++) {
      const c = code[i]!
      if (!Number.isInteger(c) || c < 0) throw new InvalidArgumentError(`Lehmer code entry ${c} is not a nonnegative integer`)
      n = Math.max(n, i + c + 1)
    }
    const available = Array.from({ length: n }, (_, k) => k + 1)
    const line: number[] = []
    for (let i = 0; i < n; i++) {
      const c = code[i] ?? 0
      line.push(available.splice(c, 1)[0]!)
    }
    return new Permutation(line)
  }

  /** From a spec produced by another module; e.g. `fromSpec({ longest: 4 })`. */
  static fromSpec(spec: PermutationSpec): Permutation {
    if ('oneLine' in spec) return Permutation.fromOneLine(spec.oneLine)
    if ('cycles' in spec) return Permutation.fromCycles(spec.cycles, spec.size)
    if ('word' in spec) return Permutation.fromWord(spec.word, spec.size)
    return Permutation.longest(spec.longest)
  }

  /** Number of letters n in the one-line notation. */
  get size(): number {
    return this.oneLine.length
  }

  /** w(i), with w(i) = i beyond the one-line notation. */
  at(i: number): number {
    return i <= this.oneLine.length ? this.oneLine[i - 1]! : i
  }

  /** Key identifying the element of S_∞ (trailing fixed points dropped); e.g. "2,1,4,3". */
  get key(): string {
    return this.trimmed().oneLine.join(',')
  }

  /** One-line notation as text: digits run together when n ≤ 9 ("2143"), else "[2,1,10,…]". */
  toString(): string {
    return this.oneLine.length <= 9 ? this.oneLine.join('') : `[${this.oneLine.join(',')}]`
  }

  /** The same element of S_∞ with trailing fixed points removed. */
  trimmed(): Permutation {
    const line = trimFixedPoints(this.oneLine)
    return line === this.oneLine ? this : new Permutation(line.slice())
  }

  /** Image under S_n ⊂ S_m (m ≥ n); e.g. `fromOneLine([2,1]).embed(4)` is 2134. */
  embed(m: number): Permutation {
    const t = this.trimmed()
    if (m < t.size) throw new InvalidArgumentError(`${this.toString()} does not lie in S_${m}`)
    const line = this.oneLine.slice(0, Math.min(m, this.size))
    for (let i = line.length + 1; i <= m; i++) line.push(i)
    return new Permutation(line)
  }

  /** 1^m × w: fix 1..m and shift w; e.g. `fromOneLine([2,1]).shift(1)` is 132. */
  shift(m: number): Permutation {
    const line = Array.from({ length: m }, (_, k) => k + 1)
    for (const v of this.oneLine) line.push(v + m)
    return new Permutation(line)
  }

  /** Equality in S_∞. */
  equals(other: Permutation): boolean {
    return this.key === other.key
  }

  /** u∘v (apply v first); e.g. `w.compose(Permutation.simple(i))` is w s_i. */
  compose(v: Permutation): Permutation {
    const n = Math.max(this.size, v.size)
    const line: number[] = []
    for (let i = 1; i <= n; i++) line.push(this.at(v.at(i)))
    return new Permutation(line)
  }

  /** w⁻¹; e.g. 231 ↦ 312. */
  inverse(): Permutation {
    const line = new Array<number>(this.size)
    for (let i = 0; i < this.size; i++) line[this.oneLine[i]! - 1] = i + 1
    return new Permutation(line)
  }

  /** w s_i: swap positions i, i+1. */
  rightMultiplySimple(i: number): Permutation {
    const line = this.oneLine.slice()
    while (line.length < i + 1) line.push(line.length + 1)
    const t = line[i - 1]!
    line[i - 1] = line[i]!
    line[i] = t
    return new Permutation(line)
  }

  /** s_i w: swap values i, i+1. */
  leftMultiplySimple(i: number): Permutation {
    const line = this.oneLine.slice()
    while (line.length < i + 1) line.push(line.length + 1)
    return new Permutation(line.map(v => (v === i ? i + 1 : v === i + 1 ? i : v)))
  }

  /** Number of inversions ℓ(w); e.g. ℓ(321) = 3. */
  length(): number {
    let count = 0
    const line = this.oneLine
    for (let i = 0; i < line.length; i++) for (let j = i + 1; j < line.length; j++) if (line[i]! > line[j]!) count++
    return count
  }

  /** Positions i with w(i) > w(i+1); e.g. descents(2143) = [1, 3]. */
  descents(): number[] {
    const out: number[] = []
    for (let i = 1; i < this.size; i++) if (this.oneLine[i - 1]! > this.oneLine[i]!) out.push(i)
    return out
  }

  /** Lehmer code c_i = #{j > i : w(j) < w(i)}, length n; e.g. 2143 ↦ [1,0,1,0]. */
  lehmerCode(): number[] {
    const line = this.oneLine
    const code: number[] = []
    for (let i = 0; i < line.length; i++) {
      let c = 0
      for (let j = i + 1; j < line.length; j++) if (line[j]! < line[i]!) c++
      code.push(c)
    }
    return code
  }

  /** Parse one-line ("2143", "[2,1,10,3,…]"), cycles ("(1 2)(3 4)"), words ("s_1 s_2", "s_{1}s_{2}") or "w0"/"w_0" with a size. */
  static parse(text: string, size?: number): Permutation {
    return parsePermutation(text, size)
  }
}

/** Parse a permutation from text; see `Permutation.parse`. e.g. `parsePermutation('2143')`. */
export function parsePermutation(text: string, size?: number): Permutation {
  const s = text.trim()
  if (s === '') throw new ParseError('empty permutation')
  if (/^w_?\{?0\}?$/.test(s) || /^w_?\{?o\}?$/.test(s)) {
    if (size === undefined) throw new ParseError(`"${s}" needs a size n to mean the longest element of S_n`)
    return Permutation.longest(size)
  }
  if (/^\d+$/.test(s)) {
    return fromOneLineText(s.split('').map(Number), s)
  }
  if (/^\[[\d\s,]*\]$/.test(s)) {
    const inner = s.slice(1, -1).trim()
    const parts = inner === '' ? [] : inner.split(',').map(p => p.trim())
    if (parts.some(p => !/^\d+$/.test(p))) throw new ParseError(`"${s}": expected a comma-separated list of positive integers`)
    return fromOneLineText(parts.map(Number), s)
  }
  if (s.startsWith('(')) {
    const cycles: number[][] = []
    const re = /\(([^()]*)\)/y
    let pos = 0
    while (pos < s.length) {
      while (s[pos] === ' ') pos++
      if (pos >= s.length) break
      re.lastIndex = pos
      const m = re.exec(s)
      if (!m) throw new ParseError(`"${s}": cycle notation must be a sequence of (a b c) groups`)
      const body = m[1]!.trim()
      const entries = body === '' ? [] : body.split(/[\s,]+/)
      if (entries.some(e => !/^\d+$/.test(e) || Number(e) < 1)) throw new ParseError(`"${s}": cycle entries must be positive integers`)
      cycles.push(entries.map(Number))
      pos = re.lastIndex
    }
    try {
      return Permutation.fromCycles(cycles, size ?? 0)
    }
    catch (e) {
      throw new ParseError(`"${s}": ${(e as Error).message}`)
    }
  }
  if (/^s/.test(s)) {
    const word: number[] = []
    const re = /s_?(?:\{(\d+)\}|(\d))\s*/y
    let pos = 0
    while (pos < s.length) {
      re.lastIndex = pos
      const m = re.exec(s)
      if (!m) throw new ParseError(`"${s}": expected a word such as "s_1 s_2 s_1" or "s_{10}s_{9}"`)
      word.push(Number(m[1] ?? m[2]))
      pos = re.lastIndex
    }
    if (word.some(a => a < 1)) throw new ParseError(`"${s}": s_0 is not a simple transposition`)
    return Permutation.fromWord(word, size ?? 0)
  }
  throw new ParseError(`"${s}" is not a permutation in one-line, cycle, word or w0 notation`)
}

function fromOneLineText(line: number[], text: string): Permutation {
  try {
    return Permutation.fromOneLine(line)
  }
  catch {
    throw new ParseError(`"${text}" is not a permutation of 1..${line.length}`)
  }
}

/** Lehmer code back to a permutation; e.g. `fromLehmerCode([2,0,0])` is 312. */
export function fromLehmerCode(code: readonly number[]): Permutation {
  return Permutation.fromLehmerCode(code)
}

/** Lehmer code of w; e.g. `toLehmerCode(fromOneLine([3,1,2]))` is [2,0,0]. */
export function toLehmerCode(w: Permutation): number[] {
  return w.lehmerCode()
}

/** Rothe diagram as [row, column] cells, rows top to bottom; e.g. 2143 ↦ [[1,1],[3,3]]. */
export function rotheDiagram(w: Permutation): [number, number][] {
  const inv = w.inverse()
  const cells: [number, number][] = []
  for (let i = 1; i <= w.size; i++) for (let j = 1; j <= w.size; j++) {
    if (w.at(i) > j && inv.at(j) > i) cells.push([i, j])
  }
  return cells
}

/** Fulton's essential set: cells of D(w) whose right and lower neighbours lie outside D(w). */
export function essentialSet(w: Permutation): [number, number][] {
  const cells = rotheDiagram(w)
  const inD = new Set(cells.map(([i, j]) => `${i},${j}`))
  return cells.filter(([i, j]) => !inD.has(`${i + 1},${j}`) && !inD.has(`${i},${j + 1}`))
}

/** Rank r_w(i, j) = #{k ≤ i : w(k) ≤ j}; e.g. rank(2143, 1, 1) = 0. */
export function rank(w: Permutation, i: number, j: number): number {
  let r = 0
  for (let k = 1; k <= i; k++) if (w.at(k) <= j) r++
  return r
}

/** Rank conditions on the essential set: each essential cell with its rank r_w(i, j). */
export function rankConditions(w: Permutation): { row: number, column: number, rank: number }[] {
  return essentialSet(w).map(([i, j]) => ({ row: i, column: j, rank: rank(w, i, j) }))
}

/** Whether w contains the pattern p (as one-line sequences); e.g. 2143 contains 21. */
export function containsPattern(w: Permutation, pattern: Permutation): boolean {
  const k = pattern.size
  const line = w.oneLine
  const p = pattern.oneLine
  const chosen: number[] = []
  // Depth-first choice of positions, pruning on relative order with the prefix chosen so far.
  const search = (start: number): boolean => {
    const d = chosen.length
    if (d === k) return true
    for (let pos = start; pos <= line.length - (k - d); pos++) {
      const v = line[pos]!
      let ok = true
      for (let t = 0; t < d; t++) {
        if ((line[chosen[t]!]! < v) !== (p[t]! < p[d]!)) { ok = false; break }
      }
      if (!ok) continue
      chosen.push(pos)
      if (search(pos + 1)) return true
      chosen.pop()
    }
    return false
  }
  return search(0)
}

/** Whether w avoids the pattern; e.g. 123 avoids 21. */
export function avoidsPattern(w: Permutation, pattern: Permutation): boolean {
  return !containsPattern(w, pattern)
}

const P132 = Permutation.fromOneLine([1, 3, 2])
const P2143 = Permutation.fromOneLine([2, 1, 4, 3])

/** Dominant = 132-avoiding = Lehmer code weakly decreasing; e.g. 321. */
export function isDominant(w: Permutation): boolean {
  return avoidsPattern(w, P132)
}

/** Vexillary = 2143-avoiding; e.g. 2143 is not. */
export function isVexillary(w: Permutation): boolean {
  return avoidsPattern(w, P2143)
}

/** At most one descent; e.g. 1423 (descent at 2). */
export function isGrassmannian(w: Permutation): boolean {
  return w.descents().length <= 1
}

/** Shape λ(w) of a vexillary permutation: its Lehmer code sorted decreasingly, zeros dropped; e.g. 1432 ↦ [2,1]. */
export function vexillaryShape(w: Permutation): number[] {
  if (!isVexillary(w)) throw new InvalidArgumentError(`${w.toString()} is not vexillary (it contains 2143)`)
  return w.lehmerCode().filter(c => c > 0).sort((a, b) => b - a)
}

/** Number of reduced words of w (exact, as bigint); e.g. 16n for 4321. */
export function countReducedWords(w: Permutation, budget?: Budget | BudgetMeter): bigint {
  return sumOverReducedWords(w, () => 1n, budget)
}

/**
 * Σ over reduced words a of w of ∏ weight(a_k), by recursion on the last letter (a reduced
 * word ends in a right descent) with memoisation: #R(w) for weight 1, Macdonald's numerator
 * for weight a ↦ a.
 */
function sumOverReducedWords(w: Permutation, weight: (letter: number) => bigint, budget?: Budget | BudgetMeter): bigint {
  const meter = toMeter(budget)
  const memo = new Map<string, bigint>()
  const go = (line: number[]): bigint => {
    const key = line.join(',')
    const hit = memo.get(key)
    if (hit !== undefined) return hit
    meter.step()
    let total = 0n
    let any = false
    for (let i = 0; i + 1 < line.length; i++) {
      if (line[i]! > line[i + 1]!) {
        any = true
        const next = line.slice()
        next[i] = line[i + 1]!
        next[i + 1] = line[i]!
        total += weight(i + 1) * go(next)
      }
    }
    if (!any) total = 1n
    memo.set(key, total)
    meter.terms(memo.size, 'memoised permutations')
    return total
  }
  return go(w.oneLine.slice())
}

/** All reduced words of w (each a list of indices a with w = s_{a_1}⋯s_{a_ℓ}); e.g. 321 ↦ [[1,2,1],[2,1,2]]. */
export function reducedWords(w: Permutation, budget?: Budget | BudgetMeter): number[][] {
  const meter = toMeter(budget)
  const out: number[][] = []
  const suffix: number[] = []
  const walk = (line: number[]): void => {
    let any = false
    for (let i = 0; i + 1 < line.length; i++) {
      if (line[i]! > line[i + 1]!) {
        any = true
        const next = line.slice()
        next[i] = line[i + 1]!
        next[i + 1] = line[i]!
        suffix.push(i + 1)
        walk(next)
        suffix.pop()
      }
    }
    if (!any) {
      meter.step()
      out.push(suffix.slice().reverse())
      meter.terms(out.length, 'reduced words')
    }
  }
  walk(w.oneLine.slice())
  return out
}

/** Σ over reduced words a of a_1⋯a_ℓ (exact), the numerator of Macdonald's identity. */
export function sumOverReducedWordsOfProducts(w: Permutation, budget?: Budget | BudgetMeter): bigint {
  return sumOverReducedWords(w, letter => BigInt(letter), budget)
}

/** All permutations of S_n in lexicographic one-line order; e.g. `allPermutations(3).length === 6`. */
export function allPermutations(n: number): Permutation[] {
  const out: Permutation[] = []
  const line = Array.from({ length: n }, (_, k) => k + 1)
  const used = new Array<boolean>(n + 1).fill(false)
  const cur: number[] = []
  const rec = (): void => {
    if (cur.length === n) { out.push(Permutation.unchecked(cur.slice())); return }
    for (const v of line) if (!used[v]) { used[v] = true; cur.push(v); rec(); cur.pop(); used[v] = false }
  }
  rec()
  return out
}

/** Length-additive check helper: is ℓ(u v) = ℓ(u) + ℓ(v)? */
export function isLengthAdditive(u: Permutation, v: Permutation): boolean {
  return u.compose(v).length() === addChecked(u.length(), v.length())
}
