/**
 * SVG paths for the tiles of pipe dreams and bumpless pipe dreams, in a unit cell of side `s`.
 *
 * Conventions: the cell's top-left corner is (0, 0), y grows downwards; W, N, E, S are the
 * midpoints of the left, top, right and bottom edges. Pipes are strokes between those points;
 * a crossing is drawn as a bridge (the vertical pipe passes over a gap in the horizontal one).
 */
import type { BumplessTile, PipeDreamTile } from '#shared/math'

export interface TilePaths {
  /** Strokes of the pipes. */
  pipes: string[]
  /** Whether the vertical stroke is a bridge over the horizontal one. */
  bridge: boolean
  /** Whether the cell carries weight (a cross of a pipe dream, a blank of a bumpless one). */
  weighted: boolean
}

/** Paths of one tile; e.g. `pipeDreamTile('cross', 24).bridge === true`. */
export function pipeDreamTile(tile: PipeDreamTile, s: number): TilePaths {
  const h = s / 2
  switch (tile) {
    case 'cross': return { pipes: [`M0 ${h}H${s}`, `M${h} ${s}V0`], bridge: true, weighted: true }
    case 'bump': return { pipes: [westToNorth(h), southToEast(h, s)], bridge: false, weighted: false }
    case 'turn': return { pipes: [westToNorth(h)], bridge: false, weighted: false }
    case 'empty': return { pipes: [], bridge: false, weighted: false }
  }
}

/** Paths of one bumpless tile; e.g. `bumplessTile('blank', 24).weighted === true`. */
export function bumplessTile(tile: BumplessTile, s: number): TilePaths {
  const h = s / 2
  switch (tile) {
    case 'blank': return { pipes: [], bridge: false, weighted: true }
    case 'cross': return { pipes: [`M0 ${h}H${s}`, `M${h} ${s}V0`], bridge: true, weighted: false }
    case 'elbowSE': return { pipes: [southToEast(h, s)], bridge: false, weighted: false }
    case 'elbowNW': return { pipes: [westToNorth(h)], bridge: false, weighted: false }
    case 'horizontal': return { pipes: [`M0 ${h}H${s}`], bridge: false, weighted: false }
    case 'vertical': return { pipes: [`M${h} ${s}V0`], bridge: false, weighted: false }
  }
}

function westToNorth(h: number): string {
  return `M0 ${h}A${h} ${h} 0 0 0 ${h} 0`
}

function southToEast(h: number, s: number): string {
  return `M${h} ${s}A${h} ${h} 0 0 1 ${s} ${h}`
}
