/**
 * Reduced pipe dreams (RC-graphs).
 *
 * Conventions:
 * - Rows i and columns j are 1-based, row 1 at the top. A pipe dream of w ∈ S_n is a set
 *   of crosses in the staircase cells i + j ≤ n; the cross at (i, j) stands for s_{i+j−1}.
 * - Reading the crosses row by row from the top, each row from RIGHT to LEFT, gives a word
 *   a_1 … a_ℓ; the pipe dream is a reduced pipe dream of w when ℓ = ℓ(w) and
 *   s_{a_1} ⋯ s_{a_ℓ} = w (composition as in permutation.ts).
 * - Weights: S_w(x) = Σ_P ∏_{(i,j) ∈ P} x_i and S_w(x; y) = Σ_P ∏_{(i,j) ∈ P} (x_i − y_j).
 * - Tile codes of the drawing grid (n × n, row-major):
 *     'cross'  two pipes crossing;        'bump'  two elbows (pipes touch and turn);
 *     'turn'   a single elbow on the antidiagonal i + j = n + 1, where a pipe leaves;
 *     'empty'  below the antidiagonal, no pipe.
 * - The number of reduced pipe dreams is S_w(1, …, 1); `countPipeDreams` obtains it from the
 *   transition recursion without listing them.
 */
import { Permutation } from './permutation'
import { schubertAtOnes } from './schubert'
import { toMeter, type Budget, type BudgetMeter } from './budget'

export type PipeDreamTile = 'cross' | 'bump' | 'turn' | 'empty'

/** A reduced pipe dream: its crosses as [row, column] cells (reading order) and its drawing grid. */
export interface PipeDream {
  n: number
  crosses: [number, number][]
  /** The reduced word read off the crosses. */
  word: number[]
  tiles: PipeDreamTile[][]
}

/** All reduced pipe dreams of w; throws BudgetExceededError past the budget. e.g. 132 has two. */
export function pipeDreams(w: Permutation, budget?: Budget | BudgetMeter): PipeDream[] {
  const meter = toMeter(budget)
  const t = w.trimmed()
  const n = Math.max(t.size, 1)
  const target = t.embed(n)
  const pos = new Array<number>(n + 2)
  for (let i = 1; i <= n; i++) pos[target.at(i)] = i
  const cells: [number, number][] = []
  for (let i = 1; i < n; i++) for (let j = n - i; j >= 1; j--) cells.push([i, j])
  const len = target.length()
  const prefix = Array.from({ length: n }, (_, k) => k + 1)
  const chosen: [number, number][] = []
  const out: PipeDream[] = []
  const walk = (k: number, have: number): void => {
    meter.step()
    if (have === len) {
      out.push(build(n, chosen))
      meter.terms(out.length, 'pipe dreams')
      return
    }
    if (cells.length - k < len - have) return
    const cell = cells[k]!
    const a = cell[0] + cell[1] - 1
    const lo = prefix[a - 1]!
    const hi = prefix[a]!
    // Right weak order: adding s_a keeps the prefix below w iff the value pair (lo, hi) is an inversion of w.
    if (lo < hi && pos[hi]! < pos[lo]!) {
      prefix[a - 1] = hi
      prefix[a] = lo
      chosen.push(cell)
      walk(k + 1, have + 1)
      chosen.pop()
      prefix[a - 1] = lo
      prefix[a] = hi
    }
    walk(k + 1, have)
  }
  walk(0, 0)
  return out
}

function build(n: number, crosses: [number, number][]): PipeDream {
  const tiles: PipeDreamTile[][] = []
  const set = new Set(crosses.map(([i, j]) => i * 1000 + j))
  for (let i = 1; i <= n; i++) {
    const row: PipeDreamTile[] = []
    for (let j = 1; j <= n; j++) {
      if (i + j <= n) row.push(set.has(i * 1000 + j) ? 'cross' : 'bump')
      else row.push(i + j === n + 1 ? 'turn' : 'empty')
    }
    tiles.push(row)
  }
  return { n, crosses: crosses.map(c => [c[0], c[1]]), word: crosses.map(([i, j]) => i + j - 1), tiles }
}

/** Number of reduced pipe dreams of w = S_w(1,…,1), without listing them; e.g. 5n for 1432. */
export function countPipeDreams(w: Permutation, budget?: Budget | BudgetMeter): bigint {
  return schubertAtOnes(w, budget)
}
