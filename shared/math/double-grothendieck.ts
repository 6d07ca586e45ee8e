/**
 * Double Grothendieck polynomials G_w(x; y), their normalisations, and K-theoretic products.
 *
 * Conventions (indices from 1; operators act on x only, so y-only factors pass through them):
 * - π^β_i f = ∂_i((1 + β x_{i+1}) f), as for single Grothendieck polynomials (grothendieck.ts).
 * - ⊕ normalisation, convention id 'k-oplus' (Fomin–Kirillov's β-deformation, "Grothendieck
 *   polynomials and the Yang–Baxter equation", 1994): x ⊕ y = x + y + β x y and
 *       G_{w0}(x; y) = ∏_{i+j≤n} (x_i ⊕ y_j),   G_{w s_i} = π^β_i G_w when ℓ(w s_i) < ℓ(w).
 *   Then G_w(x; 0) is the single G^β_w, and at β = 0 G_w(x; y) = S_w(x; −y): factors x_i + y_j.
 * - ⊖ normalisation, convention id 'k-ominus': the formal-group difference
 *       x ⊖ y = (x − y) / (1 + β y)   (so that (x ⊖ y) ⊕ y = x),
 *   and G^⊖_w(x; y) = G^⊕_w(x; ⊖y) with ⊖y = −y/(1 + βy), i.e. the top class is ∏_{i+j≤n}(x_i ⊖ y_j).
 *   For β = −1 this is the factor (x_i − y_j)/(1 − y_j). It is a rational function of y; we keep it
 *   as numerator / ∏_j (1 + β y_j)^{d_j} with the d_j as small as exact division allows.
 *   At β = 0 G^⊖_w(x; y) = S_w(x; y): factors x_i − y_j, the engine's double Schubert convention.
 * - β is an integer (β = −1 and β = +1 are the common choices). β formal: with deg β = −1 both
 *   normalisations are homogeneous of degree ℓ(w), so the coefficient of β^k is the part of
 *   x,y-degree ℓ(w) + k of the value at β = 1 (betaCoefficients). A parameter ring is not needed.
 * - We start at the dominant u reached from w by ascents (schubert.ts climbToDominant), where
 *   G_u = ∏_{(i,j)∈λ} (x_i ⊕ y_j); tests/reference/math/sympy-grothendieck.test.ts starts at w0.
 * - A second route, doubleGrothendieckByHecke, is the Cauchy formula of Fomin–Kirillov (1994):
 *       G_w(x; y) = Σ_{v⁻¹ ∗ u = w} β^{ℓ(u)+ℓ(v)−ℓ(w)} G_u(x) G_v(y),
 *   ∗ the Demazure (0-Hecke) product; u and v⁻¹ range over the Bruhat interval below w. It avoids the
 *   large dominant top class and is the one to use beyond S_5 (agreement tested on S_4 and S_5).
 * - Products: G^β_u G^β_v = Σ_w c^w_{uv}(β) G^β_w (single, y = 0), c^w_{uv}(β) = c^w_{uv}(1) β^{ℓ(w)−ℓ(u)−ℓ(v)}.
 */
import { Permutation } from './permutation'
import { Polynomial, decodeMonomial, encodeMonomial } from './polynomial'
import { grothendieckOperator } from './divided-difference'
import { grothendieckPolynomial } from './grothendieck'
import { climbToDominant, doubleSchubertPolynomial } from './schubert'
import { schubertExpansion, type SchubertCombination } from './schubert-basis'
import { accumulate, mulChecked, negateCoefficient, type Coefficient } from './coefficient'
import { InvalidArgumentError, NotInSpanError } from './errors'
import { toMeter, type Budget, type BudgetMeter } from './budget'

/** The two normalisations of double Grothendieck polynomials, by convention id. */
export type GrothendieckNormalisation = 'k-oplus' | 'k-ominus'

/** A rational function numerator / ∏_j (1 + β y_j)^{denominator[j−1]}. */
export interface RationalInY {
  numerator: Polynomial
  beta: number
  /** Exponent of (1 + β y_j) at index j − 1; trailing zeros dropped. */
  denominator: number[]
}

function checkBeta(beta: number): void {
  if (!Number.isSafeInteger(beta)) throw new InvalidArgumentError(`β must be an integer (or use betaCoefficients for β formal), got ${beta}`)
}

/** a ⊕ b = a + b + β a b; e.g. `kOplus(x_1, y_1, -1)` is x_1 + y_1 − x_1y_1. */
export function kOplus(a: Polynomial, b: Polynomial, beta: number): Polynomial {
  checkBeta(beta)
  return a.add(b).add(a.mul(b).scale(beta))
}

/** G_w(x; y) in the ⊕ normalisation (top class ∏(x_i ⊕ y_j)); e.g. G_{21} = x_1 + y_1 + βx_1y_1. */
export function doubleGrothendieckPolynomial(w: Permutation, beta = -1, budget?: Budget | BudgetMeter): Polynomial {
  checkBeta(beta)
  const meter = toMeter(budget)
  const { steps, shape } = climbToDominant(w.trimmed())
  let f = Polynomial.one()
  shape.forEach((len, r) => {
    for (let j = 1; j <= len; j++) f = f.mul(kOplus(Polynomial.x(r + 1), Polynomial.y(j), beta), meter)
  })
  for (let k = steps.length - 1; k >= 0; k--) f = grothendieckOperator(f, steps[k]!, beta, meter)
  return f
}

/** G^⊖_w(x; y) = G_w(x; ⊖y) as numerator / ∏(1 + βy_j)^{d_j}; e.g. G^⊖_{21} = (x_1 − y_1)/(1 + βy_1). */
export function doubleGrothendieckOminus(w: Permutation, beta = -1, budget?: Budget | BudgetMeter): RationalInY {
  checkBeta(beta)
  const meter = toMeter(budget)
  const { steps, shape } = climbToDominant(w.trimmed())
  let f = Polynomial.one()
  const denominator: number[] = []
  shape.forEach((len, r) => {
    for (let j = 1; j <= len; j++) {
      f = f.mul(Polynomial.x(r + 1).sub(Polynomial.y(j)), meter)
      denominator[j - 1] = (denominator[j - 1] ?? 0) + 1
    }
  })
  for (let k = steps.length - 1; k >= 0; k--) f = grothendieckOperator(f, steps[k]!, beta, meter)
  return reduceRational({ numerator: f, beta, denominator })
}

/** The permutation of a combination key ("2,1,3" or "" for the identity). */
export function permutationFromKey(key: string): Permutation {
  return Permutation.fromOneLine(key === '' ? [] : key.split(',').map(Number))
}

/** Divide f by (1 + β y_j) exactly, or return undefined when it does not divide. */
function divideByOnePlusBetaY(f: Polynomial, j: number, beta: number): Polynomial | undefined {
  if (beta === 0) return f
  // Group f = Σ_k f_k y_j^k; then f = (1 + βy_j) Σ q_k y_j^k with q_k = f_k − β q_{k−1}.
  const byPower = new Map<number, Map<string, Coefficient>>()
  let top = 0
  for (const [key, c] of f.terms) {
    const e = decodeMonomial(key)
    const k = e.y[j - 1] ?? 0
    if (k > 0) e.y[j - 1] = 0
    top = Math.max(top, k)
    let m = byPower.get(k)
    if (!m) byPower.set(k, (m = new Map()))
    m.set(encodeMonomial(e.x, e.y), c)
  }
  if (f.isZero()) return f
  const out = new Map<string, Coefficient>()
  let prev = new Map<string, Coefficient>()
  for (let k = 0; k <= top; k++) {
    const q = new Map(byPower.get(k) ?? [])
    for (const [key, c] of prev) accumulate(q, key, negateCoefficient(mulChecked(beta, c)))
    if (k === top) return q.size === 0 ? new Polynomial(out) : undefined
    for (const [key, c] of q) {
      const e = decodeMonomial(key)
      while (e.y.length < j) e.y.push(0)
      e.y[j - 1] = k
      out.set(encodeMonomial(e.x, e.y), c)
    }
    prev = q
  }
  return undefined
}

/** Cancel common factors (1 + βy_j) between numerator and denominator. */
export function reduceRational(r: RationalInY): RationalInY {
  let f = r.numerator
  const d = r.denominator.map(e => e ?? 0)
  for (let j = 1; j <= d.length; j++) {
    while (d[j - 1]! > 0) {
      const q = divideByOnePlusBetaY(f, j, r.beta)
      if (q === undefined) break
      f = q
      d[j - 1]!--
    }
  }
  if (r.beta === 0) d.fill(0)
  while (d.length > 0 && d[d.length - 1] === 0) d.pop()
  return { numerator: f, beta: r.beta, denominator: d }
}

/** ∏_j (1 + βy_j)^{e_j} as a polynomial. */
function denominatorPolynomial(beta: number, e: readonly number[]): Polynomial {
  let p = Polynomial.one()
  e.forEach((k, j) => { if (k > 0) p = p.mul(Polynomial.one().add(Polynomial.y(j + 1).scale(beta)).pow(k)) })
  return p
}

/** Equality of two rational functions of the RationalInY form (same β); cross-multiplies. */
export function rationalsEqual(a: RationalInY, b: RationalInY): boolean {
  if (a.beta !== b.beta) throw new InvalidArgumentError(`compare rational functions with the same β (got ${a.beta} and ${b.beta})`)
  return a.numerator.mul(denominatorPolynomial(b.beta, b.denominator)).equals(b.numerator.mul(denominatorPolynomial(a.beta, a.denominator)))
}

/**
 * β formal: the coefficient of β^k (index k) of a homogeneous-in-(x, y, β) value of degree `degree`,
 * given its value at β = 1; e.g. `betaCoefficients(doubleGrothendieckPolynomial(w, 1), w.length())`.
 */
export function betaCoefficients(atBetaOne: Polynomial, degree: number): Polynomial[] {
  const out: Polynomial[] = []
  const top = atBetaOne.degree()
  if (atBetaOne.lowestDegreePart().degree() < degree) throw new InvalidArgumentError(`a term has degree below ${degree}: the value is not homogeneous with deg β = −1`)
  for (let d = degree; d <= top; d++) out.push(atBetaOne.homogeneousComponent(d))
  return out
}

/** The specialisation β = 0 a normalisation implies: S_w(x; −y) for 'k-oplus', S_w(x; y) for 'k-ominus'. */
export function betaZeroSpecialisation(w: Permutation, normalisation: GrothendieckNormalisation, budget?: Budget | BudgetMeter): Polynomial {
  const s = doubleSchubertPolynomial(w, budget)
  return normalisation === 'k-oplus' ? s.negateY() : s
}

/** Verdict on a claimed β = 0 specialisation of G_w(x; y). */
export interface BetaZeroCheck {
  holds: boolean
  expected: Polynomial
  /** 'y-sign' when the claim is the double Schubert polynomial of the other sign (y ↦ −y). */
  slip?: 'y-sign'
  message: string
}

/**
 * Check "G_w(x; y) at β = 0 is `claimed`" under a normalisation and name a sign slip; e.g. under
 * 'k-oplus' a claim S_{21}(x;y) = x_1 − y_1 gets slip 'y-sign' (the normalisation gives x_1 + y_1).
 */
export function checkBetaZeroSpecialisation(w: Permutation, normalisation: GrothendieckNormalisation, claimed: Polynomial, budget?: Budget | BudgetMeter): BetaZeroCheck {
  const expected = betaZeroSpecialisation(w, normalisation, budget)
  const factor = normalisation === 'k-oplus' ? 'x_i ⊕ y_j' : 'x_i ⊖ y_j'
  const gives = normalisation === 'k-oplus' ? 'S_w(x; −y), factors x_i + y_j' : 'S_w(x; y), factors x_i − y_j'
  if (claimed.equals(expected)) return { holds: true, expected, message: `at β = 0 the ${factor} normalisation gives ${gives}` }
  if (!expected.isZero() && claimed.equals(expected.negateY()) && expected.degreeIn('y') > 0) {
    const other = normalisation === 'k-oplus' ? 'S_w(x; y), factors x_i − y_j' : 'S_w(x; −y), factors x_i + y_j'
    return {
      holds: false,
      expected,
      slip: 'y-sign',
      message: `sign of y: at β = 0 the ${factor} normalisation gives ${gives}, but the stated polynomial is ${other}`,
    }
  }
  return { holds: false, expected, message: `at β = 0 the ${factor} normalisation gives ${gives}, which differs from the stated polynomial` }
}

/**
 * A polynomial in x as Σ c_w G^β_w (single Grothendieck polynomials, β an integer ≠ 0 or 0).
 * Peels the lowest-degree part in the Schubert basis, since G^β_w = S_w + (higher degree).
 * `maxDegree` bounds the search (NotInSpanError beyond it).
 */
export function grothendieckExpansion(f: Polynomial, beta = -1, options: { maxDegree?: number, budget?: Budget | BudgetMeter } = {}): SchubertCombination {
  checkBeta(beta)
  const meter = toMeter(options.budget)
  const cap = options.maxDegree ?? 64
  let rest = f
  const out: SchubertCombination = new Map()
  while (!rest.isZero()) {
    meter.step(rest.size)
    const low = rest.lowestDegreePart()
    if (low.degree() > cap) throw new NotInSpanError(`the Grothendieck expansion does not end below degree ${cap}`)
    for (const [key, c] of schubertExpansion(low, { budget: meter })) {
      accumulate(out, key, c)
      const w = permutationFromKey(key)
      rest = rest.sub(grothendieckPolynomial(w, beta, meter).scale(c))
    }
  }
  return out
}

/** G^β_u · G^β_v in the Grothendieck basis (K-theoretic structure constants); e.g. β = −1. */
export function grothendieckProduct(u: Permutation, v: Permutation, beta = -1, budget?: Budget | BudgetMeter): SchubertCombination {
  const meter = toMeter(budget)
  return grothendieckExpansion(grothendieckPolynomial(u, beta, meter).mul(grothendieckPolynomial(v, beta, meter), meter), beta, { budget: meter })
}

/** G_u G_v with β formal: each w with its integer c and the power of β, c^w_{uv}(β) = c · β^{power}. */
export function grothendieckProductFormal(u: Permutation, v: Permutation, budget?: Budget | BudgetMeter): { permutation: Permutation, coefficient: Coefficient, betaPower: number }[] {
  const base = u.length() + v.length()
  return [...grothendieckProduct(u, v, 1, budget)].map(([key, c]) => {
    const w = permutationFromKey(key)
    return { permutation: w, coefficient: c, betaPower: w.length() - base }
  }).sort((a, b) => a.betaPower - b.betaPower || (a.permutation.key < b.permutation.key ? -1 : 1))
}

/** Demazure (0-Hecke) product a ∗ b: along a reduced word of b, multiply by s_i only when it lengthens. */
export function demazureProduct(a: Permutation, b: Permutation): Permutation {
  let x = a
  for (const i of reducedWordOf(b)) if (x.at(i) < x.at(i + 1)) x = x.rightMultiplySimple(i)
  return x.trimmed()
}

function reducedWordOf(w: Permutation): number[] {
  const word: number[] = []
  let x = w.trimmed()
  while (x.length() > 0) {
    const i = x.descents()[0]!
    word.push(i)
    x = x.rightMultiplySimple(i).trimmed()
  }
  return word.reverse()
}

/** The lower Bruhat interval [e, w], by downward covers w t_{ij} with ℓ one less. */
export function bruhatLowerInterval(w: Permutation): Permutation[] {
  const seen = new Map<string, Permutation>([[w.trimmed().key, w.trimmed()]])
  const stack = [w.trimmed()]
  while (stack.length > 0) {
    const x = stack.pop()!
    const line = [...x.oneLine]
    for (let i = 0; i < line.length; i++) {
      for (let j = i + 1; j < line.length; j++) {
        if (line[i]! < line[j]!) continue
        let cover = true
        for (let k = i + 1; k < j; k++) if (line[k]! < line[i]! && line[k]! > line[j]!) { cover = false; break }
        if (!cover) continue
        const next = line.slice()
        next[i] = line[j]!
        next[j] = line[i]!
        const p = Permutation.fromOneLine(next).trimmed()
        if (!seen.has(p.key)) { seen.set(p.key, p); stack.push(p) }
      }
    }
  }
  return [...seen.values()]
}

/** G_w(x; y) in the ⊕ normalisation by the Cauchy formula over the 0-Hecke monoid (see the module header). */
export function doubleGrothendieckByHecke(w: Permutation, beta = -1, budget?: Budget | BudgetMeter): Polynomial {
  checkBeta(beta)
  const meter = toMeter(budget)
  const target = w.trimmed()
  const lower = bruhatLowerInterval(target)
  const gx = new Map<string, Polynomial>()
  const single = (u: Permutation) => {
    let g = gx.get(u.key)
    if (!g) gx.set(u.key, (g = grothendieckPolynomial(u, beta, meter)))
    return g
  }
  let total = Polynomial.zero()
  for (const a of lower) {
    const v = a.inverse().trimmed()
    const gy = single(v).swapXY()
    for (const u of lower) {
      meter.step()
      if (!demazureProduct(a, u).equals(target)) continue
      const k = u.length() + v.length() - target.length()
      total = total.add(single(u).mul(gy, meter).scale(beta ** k))
      meter.terms(total.size)
    }
  }
  return total
}
