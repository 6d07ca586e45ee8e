/**
 * A short, self-contained SymPy script per claim that recomputes both sides from the
 * definitions, without Scholium, and prints whether the manuscript's value matches. A referee
 * who doubts a verdict runs it in any Python with SymPy. The report stores each claim's own
 * lines (`reproduceSnippet`) and the shared definitions once (`reproduceLibrary`);
 * `reproduceScript` joins them into the runnable script.
 *
 * Definitions the scripts use (each the textbook one, not our engine's algorithm):
 * - S_{w0} = x_1^{n−1} x_2^{n−2} ⋯ x_{n−1}, and S_w = ∂_i S_{w s_i} whenever w(i) < w(i+1);
 *   double: S_{w0}(x;y) = ∏_{i+j≤n} (x_i − y_j) (or x_i + y_j under `xy-plus`), ∂_i acting on x.
 * - G_{w0} = x^δ and G_w = π_i G_{w s_i} with π_i f = ∂_i((1 + β x_{i+1}) f), β = −1 (`beta-minus`) or +1.
 * - s_λ = a_{λ+δ}/a_δ (the bialternant); e, h, p, m from their monomial definitions; a symmetric
 *   function in infinitely many variables is compared in enough variables to decide equality.
 * - c^ν_{λμ}: the coefficient of x^{ν+δ} in a_δ s_λ s_μ; K_{λμ}: the coefficient of x^μ in s_λ.
 * - ℓ(w) counts inversions; reduced words by the recursion over descents; pipe dreams and bumpless
 *   pipe dreams of w are both counted by S_w(1, …, 1).
 * Claims the scripts cannot restate this way (Stanley symmetric functions, Schubert structure
 * constants, double Grothendieck polynomials, the `shape-columns` convention) get no script.
 */
import type { EqualityQuestion, Expr, PermutationSpec } from '../types/claims'
import type { ConventionSet } from '../types/conventions'
import type { ReproduceLibrary, ReproduceSnippet } from '../types/report'
import { meantPermutation, permutationOf } from './evaluate'

export { reproduceScript } from './reproduce-script'

/** Helper definitions, each with the helpers it needs; a script carries only what it uses. */
const HELPERS: Record<string, { needs: string[], code: string }> = {
  ddiff: {
    needs: [],
    code: `def ddiff(f, i):
    """The divided difference on x_i, x_{i+1}."""
    a, b = X[i - 1], X[i]
    return expand(cancel((f - f.subs({a: b, b: a}, simultaneous=True)) / (a - b)))`,
  },
  climb: {
    needs: ['ddiff'],
    code: `def climb(w, top, step):
    """Apply step(f, i) from the top class of S_n down to w, one ascent at a time."""
    w = list(w)
    n = len(w)
    for i in range(1, n):
        if w[i - 1] < w[i]:
            up = w[:]
            up[i - 1], up[i] = up[i], up[i - 1]
            return step(climb(up, top, step), i)
    return top(n)`,
  },
  schubert: {
    needs: ['climb'],
    code: `def schubert(w):
    return climb(w, lambda n: prod(X[i] ** (n - 1 - i) for i in range(n - 1)), ddiff)`,
  },
  double_schubert: {
    needs: ['climb'],
    code: `def double_schubert(w, sign):
    return climb(w, lambda n: expand(prod(X[i] + sign * Y[j] for i in range(n) for j in range(n) if i + j + 2 <= n)), ddiff)`,
  },
  grothendieck: {
    needs: ['climb'],
    code: `def grothendieck(w, beta):
    return climb(w, lambda n: prod(X[i] ** (n - 1 - i) for i in range(n - 1)),
                 lambda f, i: ddiff(expand((1 + beta * X[i]) * f), i))`,
  },
  h: {
    needs: [],
    code: `def h(k, n):
    if k < 0:
        return Integer(0)
    return sum((prod(c) for c in combinations_with_replacement(X[:n], k)), Integer(0)) if k > 0 else Integer(1)`,
  },
  e: {
    needs: [],
    code: `def e(k, n):
    return sum((prod(c) for c in combinations(X[:n], k)), Integer(0)) if k > 0 else Integer(1)`,
  },
  p: {
    needs: [],
    code: `def p(k, n):
    return sum(X[i] ** k for i in range(n))`,
  },
  m: {
    needs: [],
    code: `def m(parts, n):
    if len(parts) > n:
        return Integer(0)
    exps = list(parts) + [0] * (n - len(parts))
    return sum((prod(X[i] ** a for i, a in enumerate(c)) for c in multiset_permutations(exps)), Integer(0))`,
  },
  alternant: {
    needs: [],
    code: `def alternant(exps, n):
    """det(x_i^{exps_j}) as a polynomial in x_1..x_n."""
    terms = {}
    for order in permutations(range(n)):
        inversions = sum(1 for i in range(n) for j in range(i + 1, n) if order[i] > order[j])
        key = tuple(exps[order[i]] for i in range(n))
        terms[key] = terms.get(key, 0) + (-1) ** inversions
    return Poly.from_dict(terms, *X[:n])`,
  },
  schur_poly: {
    needs: ['alternant'],
    code: `def schur_poly(parts, n):
    """s_parts(x_1..x_n) = a_{parts+delta} / a_delta, as a Poly."""
    if len(parts) > n:
        return Poly(0, *X[:n])
    lam = list(parts) + [0] * (n - len(parts))
    quotient, remainder = div(alternant([lam[j] + n - 1 - j for j in range(n)], n), alternant([n - 1 - j for j in range(n)], n))
    assert remainder.is_zero
    return quotient`,
  },
  schur: {
    needs: ['schur_poly'],
    code: `def schur(parts, n):
    return schur_poly(parts, n).as_expr()`,
  },
  lr: {
    needs: ['alternant', 'schur_poly'],
    code: `def lr(nu, lam, mu):
    """c^nu_{lam,mu}: the coefficient of x^(nu+delta) in a_delta s_lam s_mu = a_(lam+delta) s_mu, in l(nu) variables."""
    n = max(len(nu), 1)
    if sum(nu) != sum(lam) + sum(mu) or len(lam) > n or len(mu) > n:
        return Integer(0)
    padded = list(lam) + [0] * (n - len(lam))
    f = alternant([padded[j] + n - 1 - j for j in range(n)], n) * schur_poly(mu, n)
    target = [(list(nu) + [0] * n)[i] + n - 1 - i for i in range(n)]
    return Integer(f.coeff_monomial(tuple(target)))`,
  },
  kostka: {
    needs: ['schur_poly'],
    code: `def kostka(shape, content):
    n = max(len(content), 1)
    return Integer(schur_poly(shape, n).coeff_monomial(tuple(content)))`,
  },
  length: {
    needs: [],
    code: `def length(w):
    return sum(1 for i in range(len(w)) for j in range(i + 1, len(w)) if w[i] > w[j])`,
  },
  reduced_words: {
    needs: [],
    code: `def reduced_words(w, memo={}):
    w = tuple(w)
    if all(w[i] < w[i + 1] for i in range(len(w) - 1)):
        return 1
    if w not in memo:
        total = 0
        for i in range(len(w) - 1):
            if w[i] > w[i + 1]:
                v = list(w)
                v[i], v[i + 1] = v[i + 1], v[i]
                total += reduced_words(v)
        memo[w] = total
    return memo[w]`,
  },
  at_ones: {
    needs: [],
    code: `def at_ones(f):
    return f.subs({**{x: 1 for x in X}, **{y: 0 for y in Y}})`,
  },
}

const IMPORTS = 'from itertools import combinations, combinations_with_replacement, permutations\n'
  + 'from sympy import Integer, Matrix, Poly, cancel, div, expand, prod, symbols\n'
  + 'from sympy.utilities.iterables import multiset_permutations\n'
  + 'X = symbols(\'x1:31\')\nY = symbols(\'y1:31\')'

const ENDING = 'difference = expand(left - right)\n\n'
  + 'print(\'matches\' if difference == 0 else \'differs by \' + str(difference))'

class NotReproducible extends Error {}

/**
 * The claim's part of the SymPy script, or null when the claim is not of a kind the scripts restate.
 * e.g. `reproduceSnippet(question, conventions)` for S_132 = x_1 + x_2 is
 * `{ needs: ['ddiff', 'climb', 'schubert'], left: 'schubert([1, 3, 2])', right: '(X[0] + X[1])' }`.
 */
export function reproduceSnippet(question: EqualityQuestion, conventions: ConventionSet): ReproduceSnippet | null {
  if (conventions.partition === 'shape-columns') return null
  const used = new Set<string>()
  const variables = symmetricVariableCount(question)
  let left: string
  let right: string
  try {
    const write = (expr: Expr) => toPython(expr, { conventions, used, variables })
    left = write(question.lhs)
    right = write(question.rhs)
  }
  catch (error) {
    if (error instanceof NotReproducible) return null
    throw error
  }
  const order: string[] = []
  const visit = (name: string) => {
    if (order.includes(name)) return
    for (const need of HELPERS[name]!.needs) visit(need)
    order.push(name)
  }
  for (const name of used) visit(name)
  return { needs: order, left, right }
}

/** The imports and the helpers the given snippets need, each once. */
export function reproduceLibrary(snippets: readonly (ReproduceSnippet | undefined | null)[]): ReproduceLibrary {
  const helpers: Record<string, string> = {}
  for (const snippet of snippets) for (const name of snippet?.needs ?? []) helpers[name] ??= HELPERS[name]!.code
  return { imports: IMPORTS, helpers, ending: ENDING }
}

interface WriteContext {
  conventions: ConventionSet
  used: Set<string>
  /** Variables to evaluate symmetric functions in when the claim names none. */
  variables: number
}

function toPython(expr: Expr, context: WriteContext): string {
  const write = (e: Expr) => toPython(e, context)
  const use = (name: string) => { context.used.add(name) }
  switch (expr.type) {
    case 'integer': return `Integer(${expr.value})`
    case 'variable': return `${expr.name === 'x' ? 'X' : 'Y'}[${expr.index - 1}]`
    case 'add': return expr.terms.length === 0 ? 'Integer(0)' : `(${expr.terms.map(write).join(' + ')})`
    case 'negate': return `(-${write(expr.arg)})`
    case 'multiply': return expr.factors.length === 0 ? 'Integer(1)' : `(${expr.factors.map(write).join(' * ')})`
    case 'power': return `(${write(expr.base)}) ** ${expr.exponent}`
    case 'schubert': {
      const w = oneLine(expr.perm, context)
      if (expr.variant === 'double') {
        use('double_schubert')
        return `double_schubert(${w}, ${context.conventions.doubleSign === 'xy-plus' ? 1 : -1})`
      }
      use('schubert')
      return `schubert(${w})`
    }
    case 'grothendieck': {
      if (expr.variant === 'double') throw new NotReproducible()
      use('grothendieck')
      return `grothendieck(${oneLine(expr.perm, context)}, ${context.conventions.beta === 'beta-plus' ? 1 : -1})`
    }
    case 'symmetric': {
      const n = expr.variableCount ?? context.variables
      const parts = `[${expr.index.join(', ')}]`
      switch (expr.family) {
        case 'schur': use('schur'); return `schur(${parts}, ${n})`
        case 'monomial': use('m'); return `m(${parts}, ${n})`
        case 'elementary': use('e'); return productOverParts('e', expr.index, n)
        case 'complete': use('h'); return productOverParts('h', expr.index, n)
        case 'powerSum': use('p'); return productOverParts('p', expr.index, n)
      }
      break
    }
    case 'dividedDifference': use('ddiff'); return `ddiff(${write(expr.arg)}, ${expr.index})`
    case 'determinant': return `Matrix([${expr.rows.map(row => `[${row.map(write).join(', ')}]`).join(', ')}]).det()`
    case 'evaluateAtOnes': use('at_ones'); return `at_ones(${write(expr.arg)})`
    case 'length': use('length'); return `Integer(length(${oneLine(expr.perm, context)}))`
    case 'count': {
      if (expr.objects === 'reducedWords') { use('reduced_words'); return `Integer(reduced_words(${oneLine(expr.perm, context)}))` }
      use('schubert')
      use('at_ones')
      return `at_ones(schubert(${oneLine(expr.perm, context)}))`
    }
    case 'littlewoodRichardson': use('lr'); return `lr([${expr.nu.join(', ')}], [${expr.lambda.join(', ')}], [${expr.mu.join(', ')}])`
    case 'kostka': use('kostka'); return `kostka([${expr.shape.join(', ')}], [${expr.content.join(', ')}])`
    case 'stanley':
    case 'structureConstant':
      throw new NotReproducible()
  }
  throw new NotReproducible()
}

function productOverParts(name: string, parts: readonly number[], n: number): string {
  return parts.length === 0 ? 'Integer(1)' : `(${parts.map(k => `${name}(${k}, ${n})`).join(' * ')})`
}

function oneLine(spec: PermutationSpec, context: WriteContext): string {
  const meant = meantPermutation(permutationOf(spec), context.conventions)
  return `[${meant.oneLine.join(', ')}]`
}

/**
 * Symmetric functions written without variables are compared in n variables, n at least the
 * number of rows of every Schur function either side can contain: in n variables the s_ν with at
 * most n rows are independent and the others vanish, so equality there is equality of symmetric
 * functions. Rows add in products (s_λ s_μ has rows ≤ ℓ(λ) + ℓ(μ)); e_k, p_k and m_λ may reach
 * |λ| rows, h_λ and s_λ ℓ(λ). At least as many as the x's the claim names.
 */
function symmetricVariableCount(question: EqualityQuestion): number {
  let most = 1
  const rows = (expr: Expr): number => {
    switch (expr.type) {
      case 'variable': if (expr.name === 'x') most = Math.max(most, expr.index); return 0
      case 'symmetric': {
        if (expr.variableCount !== undefined) return 0
        const size = expr.index.reduce((a, b) => a + b, 0)
        return expr.family === 'schur' || expr.family === 'complete' ? expr.index.length : size
      }
      case 'add': return Math.max(0, ...expr.terms.map(rows))
      case 'negate': return rows(expr.arg)
      case 'multiply': return expr.factors.reduce((a, f) => a + rows(f), 0)
      case 'power': return rows(expr.base) * expr.exponent
      default: return 0
    }
  }
  return Math.max(most, rows(question.lhs), rows(question.rhs), 1)
}
