/**
 * Math as a tree, cut into rows, statements and relation chains.
 *
 * Conventions: spacing commands and whitespace are dropped; braces become `group` nodes and
 * \begin…\end become `env` nodes; alignment structure (aligned, split, gathered) is dissolved
 * into the rows of the display around it. Matrices stay whole (they are determinant entries).
 * Every node keeps `pos`/`end` from its tokens: offsets in the original file.
 */
import { splitRuns, type Token } from './tokens'

export type MathNode
  = | { k: 'cs', v: string, pos: number, end: number }
    | { k: 'ch', v: string, pos: number, end: number }
    | { k: 'group', children: MathNode[], pos: number, end: number }
    | { k: 'env', name: string, children: MathNode[], pos: number, end: number }

/** True if `n` is the character `v`: `isChar({ k: 'ch', v: '=', pos: 0, end: 1 }, '=') === true`. */
export function isChar(n: MathNode | undefined, v: string): boolean {
  return !!n && n.k === 'ch' && n.v === v
}

export class MathSyntaxError extends Error {
  constructor(message: string, readonly pos: number) {
    super(message)
  }
}

/** Commands that only change spacing or size: dropped. */
const SPACING = new Set([
  ',', ';', '!', ':', ' ', '>', 'thinspace', 'medspace', 'thickspace', 'negthinspace', 'displaystyle', 'textstyle',
  'scriptstyle', 'limits', 'nolimits', 'big', 'Big', 'bigg', 'Bigg', 'bigl', 'bigr', 'Bigl', 'Bigr', 'biggl', 'biggr',
  'Biggl', 'Biggr', 'bigm', 'Bigm', 'nonumber', 'notag', 'allowbreak', 'nobreak', 'relax', 'noindent', 'protect',
])
/** Commands with one argument that only change spacing: dropped with their argument. */
const SPACING_WITH_ARG = new Set(['hspace', 'vspace', 'hspace*', 'phantom', 'hphantom', 'vphantom', 'intertext', 'shortintertext'])
/** Environments whose rows are rows of the surrounding display. */
const DISSOLVED_ENVS = new Set(['aligned', 'split', 'gathered', 'alignedat', 'multlined', 'gather', 'align', 'align*', 'gather*', 'eqnarray', 'eqnarray*'])
export const MATRIX_ENVS = new Set(['matrix', 'pmatrix', 'bmatrix', 'Bmatrix', 'vmatrix', 'Vmatrix', 'smallmatrix', 'array'])

/** Build the tree from a math region's tokens; throws MathSyntaxError on unbalanced braces or environments. */
export function buildMathTree(tokens: Token[]): MathNode[] {
  const toks = splitRuns(tokens).filter(t => t.k !== 'sp' && t.k !== 'par')
  const root: MathNode[] = []
  const stack: { node: MathNode & { children: MathNode[] }, open: Token }[] = []
  const top = () => (stack.length ? stack[stack.length - 1]!.node.children : root)
  const readName = (i: number): { name: string, next: number } | undefined => {
    const open = toks[i]
    if (!open || open.k !== 'ch' || open.v !== '{') return undefined
    let name = ''
    let j = i + 1
    while (j < toks.length && !(toks[j]!.k === 'ch' && toks[j]!.v === '}')) {
      const t = toks[j]!
      name += t.k === 'cs' ? '\\' + t.v : t.v
      j++
      if (j - i > 40) return undefined
    }
    if (j >= toks.length) return undefined
    return { name: name.trim(), next: j + 1 }
  }
  for (let i = 0; i < toks.length; i++) {
    const t = toks[i]!
    if (t.k === 'ch' && t.v === '{') {
      const g: MathNode & { children: MathNode[] } = { k: 'group', children: [], pos: t.pos, end: t.end }
      top().push(g)
      stack.push({ node: g, open: t })
    }
    else if (t.k === 'ch' && t.v === '}') {
      const s = stack.pop()
      if (!s || s.node.k !== 'group') throw new MathSyntaxError('unbalanced braces: "}" without a matching "{"', t.pos)
      s.node.end = Math.max(s.node.end, t.end)
    }
    else if (t.k === 'cs' && (t.v === 'begin' || t.v === 'end')) {
      const r = readName(i + 1)
      if (!r) throw new MathSyntaxError(`\\${t.v} without an environment name`, t.pos)
      if (t.v === 'begin') {
        const e: MathNode & { children: MathNode[] } = { k: 'env', name: r.name, children: [], pos: t.pos, end: t.end }
        top().push(e)
        stack.push({ node: e, open: t })
        i = r.next - 1
        // Column specifications of array and alignedat are not content.
        if ((r.name === 'array' || r.name === 'alignedat' || r.name === 'alignat' || r.name === 'alignat*') && toks[i + 1]?.v === '{') {
          let depth = 0
          for (i = i + 1; i < toks.length; i++) {
            if (toks[i]!.v === '{' && toks[i]!.k === 'ch') depth++
            if (toks[i]!.v === '}' && toks[i]!.k === 'ch' && --depth === 0) break
          }
        }
      }
      else {
        const s = stack.pop()
        if (!s || s.node.k !== 'env' || s.node.name !== r.name) {
          throw new MathSyntaxError(`\\end{${r.name}} does not match ${s ? (s.node.k === 'env' ? `\\begin{${s.node.name}}` : 'an open "{"') : 'any \\begin'}`, t.pos)
        }
        s.node.end = toks[r.next - 1]!.end
        i = r.next - 1
      }
    }
    else if (t.k === 'cs' && SPACING.has(t.v)) {
      continue
    }
    else if (t.k === 'ch' && t.v === '~') {
      continue
    }
    else {
      top().push({ k: t.k === 'cs' ? 'cs' : 'ch', v: t.v, pos: t.pos, end: t.end })
    }
  }
  if (stack.length) {
    const s = stack[stack.length - 1]!
    throw new MathSyntaxError(
      s.node.k === 'env' ? `\\begin{${s.node.name}} is never closed` : 'unbalanced braces: "{" is never closed',
      s.open.pos,
    )
  }
  return dropDecorations(dropSpacingArgs(root))
}

/** Beamer and colour commands whose last argument is math that stays: `\alert<2>{s_{21}}` → `{s_{21}}`. */
const DECORATIONS: Record<string, { overlay: boolean, dropped: number, kept: boolean }> = {
  alert: { overlay: true, dropped: 0, kept: true },
  only: { overlay: true, dropped: 0, kept: true },
  uncover: { overlay: true, dropped: 0, kept: true },
  visible: { overlay: true, dropped: 0, kept: true },
  onslide: { overlay: true, dropped: 0, kept: true },
  structure: { overlay: true, dropped: 0, kept: true },
  textcolor: { overlay: true, dropped: 1, kept: true },
  colorbox: { overlay: false, dropped: 1, kept: true },
  color: { overlay: true, dropped: 1, kept: false },
  pause: { overlay: false, dropped: 0, kept: false },
}
/** Characters of an overlay specification: `<2>`, `<2->`, `<1,3>`, `<alert@2>`, `<+->`, `<.->`. */
const OVERLAY_CHARS = /^[0-9a-z@+\-,|.*]$/

/** The index after an overlay specification starting at `i` (`<2->`), or `i` when there is none. */
function skipOverlay(nodes: MathNode[], i: number): number {
  if (!isChar(nodes[i], '<')) return i
  for (let j = i + 1; j < nodes.length && j <= i + 16; j++) {
    const n = nodes[j]!
    if (isChar(n, '>')) return j > i + 1 ? j + 1 : i
    if (n.k !== 'ch' || !OVERLAY_CHARS.test(n.v)) return i
  }
  return i
}

/**
 * Beamer overlays and colours inside math: the decoration goes, the content stays. `\alert{s_{11}}`
 * and `\only<2>{+ s_{11}}` keep their argument as a group, `\textcolor{red}{2}` keeps `{2}`,
 * `\color{red}`, `\pause` and `\onslide<2->` without an argument go. A command without the
 * argument it needs is left as it is (and the math stays unread).
 */
function dropDecorations(nodes: MathNode[]): MathNode[] {
  const out: MathNode[] = []
  for (let i = 0; i < nodes.length; i++) {
    const n = nodes[i]!
    const command = n.k === 'cs' ? n.v : ''
    const decoration = command ? DECORATIONS[command] : undefined
    if (decoration) {
      let j = decoration.overlay ? skipOverlay(nodes, i + 1) : i + 1
      if (isChar(nodes[j], '[') && command.endsWith('color')) {
        while (j < nodes.length && !isChar(nodes[j], ']')) j++
        j++
      }
      let ok = true
      for (let d = 0; d < decoration.dropped; d++, j++) if (nodes[j]?.k !== 'group') ok = false
      const content = nodes[j]
      if (ok && decoration.kept && content?.k === 'group') {
        out.push({ ...content, pos: n.pos, children: dropDecorations(content.children) })
        i = j
        continue
      }
      if (ok && (!decoration.kept || command === 'onslide')) {
        i = j - 1
        continue
      }
    }
    if (n.k === 'group' || n.k === 'env') out.push({ ...n, children: dropDecorations(n.children) })
    else out.push(n)
  }
  return out
}

function dropSpacingArgs(nodes: MathNode[]): MathNode[] {
  const out: MathNode[] = []
  for (let i = 0; i < nodes.length; i++) {
    const n = nodes[i]!
    if (n.k === 'cs' && SPACING_WITH_ARG.has(n.v)) {
      if (isChar(nodes[i + 1], '*')) i++
      if (nodes[i + 1]?.k === 'group') i++
      continue
    }
    if (n.k === 'group' || n.k === 'env') out.push({ ...n, children: dropSpacingArgs(n.children) })
    else out.push(n)
  }
  return out
}

/**
 * An array whose rows are equations is a display's rows, not a matrix or a table:
 * `{rcl}` with `a & = & b`, `{rl}` with `a & = b`, or `{c}` with `a = b` in its one column.
 * Rows that continue the one above (`& = & c`, `& & + x_3`) may follow. Every row must have one
 * of these shapes and one at least must hold a relation, so that an index table
 * (`132 & x_1 + x_2`), a matrix, or cells that are equations of their own
 * (`w = 132 & \mathfrak{S}_w = x_1 + x_2`) are never run together.
 */
export function isRelationArray(env: MathNode & { k: 'env' }): boolean {
  if (env.name !== 'array') return false
  const rows: MathNode[][][] = [[[]]]
  for (const n of env.children) {
    if (n.k === 'cs' && (n.v === '\\' || n.v === 'cr')) rows.push([[]])
    else if (isChar(n, '&')) rows[rows.length - 1]!.push([])
    else if (!(n.k === 'cs' && n.v === 'hline')) rows[rows.length - 1]![rows[rows.length - 1]!.length - 1]!.push(n)
  }
  const filled = rows.filter(cells => cells.some(cell => cell.length))
  const holdsRelation = (cell: MathNode[]) => toStatement(cell).relations.length > 0
  const startsWithRelation = (cell: MathNode[] | undefined) => {
    const statement = cell ? toStatement(cell) : undefined
    return !!statement && statement.relations.length > 0 && statement.parts[0]!.length === 0
  }
  const equationRow = (cells: MathNode[][]) => cells.length === 1
    ? holdsRelation(cells[0]!)
    : cells[0]!.length > 0 && !holdsRelation(cells[0]!) && startsWithRelation(cells[1])
  const continuationRow = (cells: MathNode[][]) => cells.length >= 2 && cells[0]!.length === 0
  return filled.some(equationRow) && filled.every(cells => equationRow(cells) || continuationRow(cells))
}

export interface MathRow {
  nodes: MathNode[]
  label?: string
  /** Where the row's `&` stood: indices into `nodes` (the `&` themselves are taken out). */
  alignPoints?: number[]
}

/** Cut a display into rows at \\ (dissolving aligned/split/gathered), taking out labels, tags and &. */
export function splitRows(nodes: MathNode[]): MathRow[] {
  const flat: MathNode[] = []
  const flatten = (ns: MathNode[]) => {
    for (const n of ns) {
      if (n.k === 'env' && (DISSOLVED_ENVS.has(n.name) || isRelationArray(n))) {
        flat.push({ k: 'cs', v: '\\', pos: n.pos, end: n.pos })
        flatten(n.children)
        flat.push({ k: 'cs', v: '\\', pos: n.end, end: n.end })
      }
      else flat.push(n)
    }
  }
  flatten(nodes)
  const rows: MathRow[] = []
  let cur: MathNode[] = []
  let label: string | undefined
  let alignPoints: number[] = []
  const endRow = () => {
    if (cur.length) rows.push({ nodes: cur, label, ...(alignPoints.length ? { alignPoints } : {}) })
    cur = []
    label = undefined
    alignPoints = []
  }
  for (let i = 0; i < flat.length; i++) {
    const n = flat[i]!
    if (n.k === 'cs' && (n.v === '\\' || n.v === 'cr')) {
      endRow()
      if (isChar(flat[i + 1], '*')) i++
      if (isChar(flat[i + 1], '[')) {
        // \\[3pt]: skip the spacing argument.
        let j = i + 2
        while (j < flat.length && !isChar(flat[j], ']')) j++
        if (j < flat.length) i = j
      }
      continue
    }
    if (n.k === 'cs' && (n.v === 'label' || n.v === 'tag' || n.v === 'eqref')) {
      const arg = flat[i + 1]
      if (n.v === 'tag' && isChar(arg, '*')) i++
      const a = flat[i + 1]
      if (a?.k === 'group') {
        if (n.v === 'label') label = plainText(a.children)
        i++
      }
      continue
    }
    if (n.k === 'ch' && n.v === '&') {
      alignPoints.push(cur.length)
      continue
    }
    cur.push(n)
  }
  endRow()
  return rows
}

/** Characters of a node list without markup: `plainText` of `{eq:a}`'s children is "eq:a". */
export function plainText(nodes: MathNode[]): string {
  let s = ''
  for (const n of nodes) {
    if (n.k === 'ch') s += n.v
    else if (n.k === 'cs') s += n.v.length === 1 && !/[A-Za-z]/.test(n.v) ? n.v : ''
    else s += plainText(n.children)
  }
  return s
}

/** Words in \text{…} that mark a break between two statements. */
const PROSE_WORDS = new Set([
  'and', 'or', 'where', 'for', 'with', 'since', 'so', 'hence', 'thus', 'then', 'if', 'while', 'i.e.', 'e.g.', 'also',
  'whereas', 'but', 'because', 'as', 'when', 'by', 'using', 'we', 'get', 'have', 'gives', 'giving', 'yields',
])
const TEXT_COMMANDS = new Set(['text', 'textrm', 'mbox', 'textnormal', 'hbox', 'textup', 'textit', 'emph'])

/** Relation symbols other than "=": a statement using one is not an equality claim. */
const OTHER_RELATIONS = new Set([
  'ne', 'neq', 'le', 'leq', 'ge', 'geq', 'leqslant', 'geqslant', 'lt', 'gt', 'equiv', 'approx', 'sim', 'simeq', 'cong',
  'in', 'notin', 'subset', 'subseteq', 'supset', 'supseteq', 'to', 'mapsto', 'rightarrow', 'leftarrow', 'Rightarrow',
  'Leftarrow', 'iff', 'implies', 'longrightarrow', 'mid', 'nmid', 'prec', 'preceq', 'succ', 'succeq', 'propto',
  'coloneqq', 'eqqcolon', 'stackrel', 'overset', 'underset', 'triangleq', 'doteq', 'leftrightarrow', 'ni',
])

export type Relation = '=' | ':=' | 'other'

export interface Statement {
  /** Parts between relation symbols; an empty first part means the row continues the previous one. */
  parts: MathNode[][]
  /** relations[i] sits between parts[i] and parts[i+1]. */
  relations: { rel: Relation, node: MathNode, name: string }[]
}

/** Bracket depth after node `n`: ( [ and \left open, ) ] and \right close (never below 0). */
function bracketDepthAfter(n: MathNode, depth: number): number {
  if ((n.k === 'ch' && (n.v === '(' || n.v === '[')) || (n.k === 'cs' && n.v === 'left')) return depth + 1
  if ((n.k === 'ch' && (n.v === ')' || n.v === ']')) || (n.k === 'cs' && n.v === 'right')) return Math.max(0, depth - 1)
  return depth
}

/**
 * Cut a row into statements at \quad, \qquad, top-level commas and semicolons, and prose such as
 * \text{and}; then each statement into parts at relation symbols.
 */
export function splitStatements(nodes: MathNode[]): Statement[] {
  const statements: MathNode[][] = []
  let cur: MathNode[] = []
  let depth = 0
  for (let i = 0; i < nodes.length; i++) {
    const n = nodes[i]!
    depth = bracketDepthAfter(n, depth)
    let isBreak = false
    if (n.k === 'cs' && (n.v === 'quad' || n.v === 'qquad')) isBreak = true
    else if (depth === 0 && n.k === 'ch' && (n.v === ',' || n.v === ';')) isBreak = true
    else if (n.k === 'cs' && TEXT_COMMANDS.has(n.v) && nodes[i + 1]?.k === 'group') {
      const words = plainText((nodes[i + 1] as { children: MathNode[] }).children).trim().toLowerCase()
      if (words === '' || PROSE_WORDS.has(words) || /\s/.test(words) || /^[.,;:]+$/.test(words)) {
        isBreak = true
        i++
      }
    }
    if (isBreak) {
      if (cur.length) statements.push(cur)
      cur = []
      continue
    }
    cur.push(n)
  }
  if (cur.length) statements.push(cur)
  return statements.map(trimPunctuation).filter(s => s.length).map(toStatement)
}

function trimPunctuation(nodes: MathNode[]): MathNode[] {
  let end = nodes.length
  while (end > 0) {
    const n = nodes[end - 1]!
    if (n.k === 'ch' && (n.v === '.' || n.v === ',' || n.v === ';')) end--
    else break
  }
  return nodes.slice(0, end)
}

function toStatement(nodes: MathNode[]): Statement {
  const parts: MathNode[][] = [[]]
  const relations: Statement['relations'] = []
  let depth = 0
  for (let i = 0; i < nodes.length; i++) {
    const n = nodes[i]!
    depth = bracketDepthAfter(n, depth)
    let rel: Relation | undefined
    let name = ''
    if (depth === 0 && isChar(n, ':') && isChar(nodes[i + 1], '=')) {
      rel = ':='
      name = ':='
      i++
    }
    else if (depth === 0 && n.k === 'ch' && n.v === '=') {
      rel = '='
      name = '='
    }
    else if (depth === 0 && n.k === 'ch' && (n.v === '<' || n.v === '>')) {
      rel = 'other'
      name = n.v
    }
    else if (depth === 0 && n.k === 'cs' && OTHER_RELATIONS.has(n.v)) {
      rel = n.v === 'coloneqq' ? ':=' : 'other'
      name = '\\' + n.v
      if (n.v === 'stackrel' || n.v === 'overset' || n.v === 'underset') i += 2
    }
    if (rel) {
      relations.push({ rel, node: n, name })
      parts.push([])
    }
    else parts[parts.length - 1]!.push(n)
  }
  return { parts, relations }
}

/** LaTeX text of nodes (for expanded sources): `renderNodes` of the tree of `x_{1}` is "x_{1}". */
export function renderNodes(nodes: MathNode[]): string {
  let out = ''
  for (const n of nodes) {
    if (n.k === 'cs') {
      const word = /^[A-Za-z@]+$/.test(n.v)
      out += '\\' + n.v + (word ? ' ' : '')
    }
    else if (n.k === 'ch') out += n.v
    else if (n.k === 'group') out += '{' + renderNodes(n.children).trim() + '}'
    else out += `\\begin{${n.name}}` + renderNodes(n.children) + `\\end{${n.name}}`
  }
  return out.replace(/ (?=[^A-Za-z@])/g, '').trim()
}

/** Smallest start and largest end offset of nodes. */
export function spanOf(nodes: MathNode[]): { pos: number, end: number } | undefined {
  if (!nodes.length) return undefined
  let pos = Infinity
  let end = -Infinity
  for (const n of nodes) {
    pos = Math.min(pos, n.pos)
    end = Math.max(end, n.end)
  }
  return { pos, end }
}

/** Split a node list at top-level commas (outside parentheses and brackets): `1,(2,3)` → `1` and `(2,3)`. */
export function splitCommas(nodes: MathNode[]): MathNode[][] {
  const out: MathNode[][] = [[]]
  let depth = 0
  for (const n of nodes) {
    if (isChar(n, '(') || isChar(n, '[')) depth++
    if (isChar(n, ')') || isChar(n, ']')) depth--
    if (depth === 0 && isChar(n, ',')) out.push([])
    else out[out.length - 1]!.push(n)
  }
  return out
}
