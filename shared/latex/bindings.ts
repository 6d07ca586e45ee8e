/**
 * Where a binding ("Let $\lambda = (4,1)$", "for $w = 3412$") holds.
 *
 * Convention (see /shared/NOTATION.md, "Theorem-like environments"): a binding made inside an
 * example, theorem, proof, remark, … environment lasts until that environment ends; one made
 * outside any of them lasts until the end of its paragraph. A section starts afresh. Ending a
 * binding early only makes the reader quieter (an unbound letter is never read as an example),
 * so when in doubt the scope is the smaller one.
 */
import type { ContextValue } from '../types/claims'

/** Environments that scope a binding, besides those a paper declares with \newtheorem. */
export const SCOPING_ENVIRONMENTS = new Set([
  'example', 'examples', 'theorem', 'proof', 'remark', 'remarks', 'lemma', 'proposition', 'corollary', 'definition',
  'conjecture', 'exercise', 'problem', 'solution', 'claim', 'question', 'observation', 'fact', 'notation', 'note',
  // beamer: a frame and a block are each a slide's own example.
  'frame', 'block', 'exampleblock', 'alertblock',
])

/** `\newtheorem{ex}{Example}`, `\newtheorem*{rem}{Remark}`, `\declaretheorem{example}`: the environment names declared. */
export function declaredTheoremNames(masked: string): string[] {
  const names: string[] = []
  for (const match of masked.matchAll(/\\(?:newtheorem\*?|declaretheorem(?:\[[^\]]*\])?)\s*\{([^{}]+)\}/g)) names.push(match[1]!.trim())
  return names
}

interface Scope {
  /** The environment that opened it; undefined for the paragraph outside every environment. */
  environment?: string
  /** Values the bindings made in this scope replaced (undefined: the name was unbound). */
  replaced: Map<string, ContextValue | undefined>
}

/** The bindings visible at the point being read, with the scopes that end them. */
export class BindingScopes {
  /** Every binding visible now, for reading claims. */
  readonly visible = new Map<string, ContextValue>()
  private readonly scopes: Scope[] = [{ replaced: new Map() }]

  bind(name: string, value: ContextValue): void {
    const scope = this.scopes[this.scopes.length - 1]!
    if (!scope.replaced.has(name)) scope.replaced.set(name, this.visible.get(name))
    this.visible.set(name, value)
  }

  /** `\begin{example}`: bindings made from here on end with it. */
  openEnvironment(name: string): void {
    this.scopes.push({ environment: name, replaced: new Map() })
  }

  /** `\end{example}`: forget what was bound since its \begin. An \end with no open scope of that name is ignored. */
  closeEnvironment(name: string): void {
    const at = this.scopes.findLastIndex(scope => scope.environment === name)
    if (at <= 0) return
    while (this.scopes.length > at) this.undo(this.scopes.pop()!)
  }

  /** A blank line: outside every scoping environment, the paragraph's bindings end. */
  endParagraph(): void {
    if (this.scopes.length !== 1) return
    this.undo(this.scopes[0]!)
    this.scopes[0] = { replaced: new Map() }
  }

  /** A new section or root file: nothing bound. Open environments stay open so that their \end still pairs. */
  clear(): void {
    this.visible.clear()
    for (const scope of this.scopes) scope.replaced.clear()
  }

  private undo(scope: Scope): void {
    for (const [name, previous] of scope.replaced) {
      if (previous === undefined) this.visible.delete(name)
      else this.visible.set(name, previous)
    }
  }
}
