/**
 * Bumpless pipe dreams.
 *
 * Conventions:
 * - An n × n grid, rows i (1 = top) and columns j (1 = left). One pipe enters from the
 *   bottom of each column; pipes travel north and east and each leaves through the right
 *   edge. The pipe entering column j leaves at row i with w(i) = j. Two pipes cross at most
 *   once (reduced), and two pipes never touch at an elbow pair (bumpless).
 * - Tile codes (row-major grid):
 *     'blank'        no pipe;
 *     'cross'        a vertical and a horizontal pipe crossing;
 *     'elbowSE'      a pipe from the bottom turning right  (┌ shape);
 *     'elbowNW'      a pipe from the left turning up        (┘ shape);
 *     'horizontal'   a pipe passing left to right;
 *     'vertical'     a pipe passing bottom to top.
 * - The Rothe BPD of w has its blank tiles exactly on the Rothe diagram D(w).
 * - Weight: S_w(x; y) = Σ over BPDs of ∏ over blank tiles (i, j) of (x_i − y_j)
 *   (Lam–Lee–Shimozono, "Back stable Schubert calculus", Compositio Math. 2021).
 * - Their number equals S_w(1,…,1), the number of reduced pipe dreams; `countBumplessPipeDreams`
 *   can use that identity (no listing) or count by a row-transfer walk that stores nothing.
 */
import { Permutation } from './permutation'
import { schubertAtOnes } from './schubert'
import { toMeter, type Budget, type BudgetMeter } from './budget'

export type BumplessTile = 'blank' | 'cross' | 'elbowSE' | 'elbowNW' | 'horizontal' | 'vertical'

/** A bumpless pipe dream: its tiles and its blank cells. */
export interface BumplessPipeDream {
  n: number
  tiles: BumplessTile[][]
  blanks: [number, number][]
}

/** Walk every BPD of w row by row from the bottom; `visit` gets the tile grid (reused: copy it to keep). */
function walkBumpless(w: Permutation, meter: BudgetMeter, visit: (tiles: BumplessTile[][]) => void): void {
  const t = w.trimmed()
  const n = Math.max(t.size, 1)
  const target = t.embed(n)
  const tiles: BumplessTile[][] = Array.from({ length: n }, () => new Array<BumplessTile>(n).fill('blank'))
  const crossed = new Uint8Array((n + 1) * (n + 1))
  // needAbove[i] = labels that must still travel north out of row i, i.e. {w(k) : k < i}.
  const needAbove: Uint8Array[] = []
  for (let i = 0; i <= n; i++) {
    const s = new Uint8Array(n + 1)
    for (let k = 1; k < i; k++) s[target.at(k)] = 1
    needAbove.push(s)
  }
  const doRow = (i: number, below: number[]): void => {
    if (i === 0) {
      visit(tiles)
      return
    }
    const out = new Array<number>(n + 1).fill(0)
    const need = needAbove[i]!
    const exit = target.at(i)
    const row = tiles[i - 1]!
    const col = (c: number, active: number): void => {
      meter.step()
      if (c > n) {
        if (active === exit) doRow(i - 1, out)
        return
      }
      const p = below[c]!
      if (p === 0 && active === 0) {
        row[c - 1] = 'blank'
        out[c] = 0
        col(c + 1, 0)
      }
      else if (active === 0) {
        if (need[p]) {
          row[c - 1] = 'vertical'
          out[c] = p
          col(c + 1, 0)
        }
        if (need[p] || p === exit) {
          row[c - 1] = 'elbowSE'
          out[c] = 0
          col(c + 1, p)
        }
      }
      else if (p === 0) {
        row[c - 1] = 'horizontal'
        out[c] = 0
        col(c + 1, active)
        if (need[active]) {
          row[c - 1] = 'elbowNW'
          out[c] = active
          col(c + 1, 0)
        }
      }
      else {
        const pair = p * (n + 1) + active
        const rev = active * (n + 1) + p
        if (crossed[pair] || crossed[rev]) return
        crossed[pair] = 1
        row[c - 1] = 'cross'
        out[c] = p
        col(c + 1, active)
        crossed[pair] = 0
      }
      out[c] = 0
    }
    col(1, 0)
  }
  const start = [0]
  for (let c = 1; c <= n; c++) start.push(c)
  doRow(n, start)
}

/** All bumpless pipe dreams of w; e.g. 132 has two. */
export function bumplessPipeDreams(w: Permutation, budget?: Budget | BudgetMeter): BumplessPipeDream[] {
  const meter = toMeter(budget)
  const out: BumplessPipeDream[] = []
  walkBumpless(w, meter, (tiles) => {
    const copy = tiles.map(r => r.slice())
    const blanks: [number, number][] = []
    copy.forEach((r, i) => r.forEach((tile, j) => { if (tile === 'blank') blanks.push([i + 1, j + 1]) }))
    out.push({ n: copy.length, tiles: copy, blanks })
    meter.terms(out.length, 'bumpless pipe dreams')
  })
  return out
}

/** Number of BPDs of w. 'identity' (default) uses #BPD(w) = S_w(1,…,1) via the transition recursion; 'walk' counts by enumeration without storing. */
export function countBumplessPipeDreams(w: Permutation, options: { method?: 'identity' | 'walk', budget?: Budget | BudgetMeter } = {}): bigint {
  const meter = toMeter(options.budget)
  if ((options.method ?? 'identity') === 'identity') return schubertAtOnes(w, meter)
  let count = 0n
  walkBumpless(w, meter, () => { count++ })
  return count
}
