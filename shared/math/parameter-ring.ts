/**
 * Polynomials in x and y with coefficients in ℤ[β, q, t, γ, …]: a ring of named parameters.
 *
 * Conventions:
 * - A parameter is a name (an identifier such as `beta`, `q`, `t`, `gamma`, `c1`), never a
 *   number: parameters are formal symbols, and a value is only ever given to one by an explicit
 *   `substitute` (a claim's "at β = 0"). Which letters are parameters is the caller's decision
 *   (the reader's, from the paper); this module knows no letters.
 * - A value is Σ_m m · P_m over parameter monomials m, with P_m a Polynomial in x, y (polynomial.ts),
 *   stored as a map from the monomial's key to a nonzero P_m. The key lists `name^exponent` pairs
 *   sorted by name, joined by `*` (e.g. `beta^2*q^1`); the empty key is the monomial 1. So the
 *   exact polynomial arithmetic of polynomial.ts does all the coefficient work, and values stay
 *   canonical (no zero parts, keys normalised): structural equality is equality.
 * - Parameter exponents are nonnegative integers; there are no denominators here (the ⊖ of
 *   K-theory, with its 1/(1 + βy), is handled by the caller as an explicit denominator).
 */
import { Polynomial, monomialLatex, polynomialDifference, type Term } from './polynomial'
import { absCoefficient, type Coefficient } from './coefficient'
import { InvalidArgumentError } from './errors'
import type { Budget, BudgetMeter } from './budget'

/** Exponents of a parameter monomial, by name; e.g. `{ beta: 2, q: 1 }`. */
export type ParameterExponents = Record<string, number>

const NAME = /^[A-Za-z][A-Za-z0-9]*$/

/** Canonical key of a parameter monomial; e.g. `parameterKey({ q: 1, beta: 2 }) === 'beta^2*q^1'`. */
export function parameterKey(e: ParameterExponents): string {
  return Object.keys(e).filter(k => e[k]! > 0).sort().map(k => `${k}^${e[k]}`).join('*')
}

/** Inverse of parameterKey; e.g. `'beta^2'` ↦ `{ beta: 2 }`. */
export function parameterExponents(key: string): ParameterExponents {
  const out: ParameterExponents = {}
  if (key === '') return out
  for (const part of key.split('*')) {
    const [name, exp] = part.split('^') as [string, string]
    out[name] = Number(exp)
  }
  return out
}

function multiplyKeys(a: string, b: string): string {
  if (a === '') return b
  if (b === '') return a
  const e = parameterExponents(a)
  for (const [k, v] of Object.entries(parameterExponents(b))) e[k] = (e[k] ?? 0) + v
  return parameterKey(e)
}

/** One term: a parameter monomial, an x,y monomial and an integer. */
export interface ParametricTerm extends Term {
  parameters: ParameterExponents
}

/** Σ_m m · P_m(x, y) over parameter monomials m. Immutable from the outside. */
export class ParametricPolynomial {
  /** Parameter-monomial key → nonzero polynomial in x, y. Treat as read-only. */
  readonly parts: ReadonlyMap<string, Polynomial>

  /** Wraps a map the caller promises is canonical (no zero parts, canonical keys). */
  constructor(parts: Map<string, Polynomial>) {
    this.parts = parts
  }

  static zero(): ParametricPolynomial {
    return new ParametricPolynomial(new Map())
  }

  /** A polynomial in x, y with no parameters; e.g. `ParametricPolynomial.from(Polynomial.x(1))`. */
  static from(p: Polynomial): ParametricPolynomial {
    return new ParametricPolynomial(p.isZero() ? new Map() : new Map([['', p]]))
  }

  static constant(c: number | bigint): ParametricPolynomial {
    return ParametricPolynomial.from(Polynomial.constant(c))
  }

  /** The parameter itself; e.g. `ParametricPolynomial.parameter('beta')` is β. */
  static parameter(name: string, power = 1): ParametricPolynomial {
    if (!NAME.test(name)) throw new InvalidArgumentError(`a parameter name is an identifier, got "${name}"`)
    if (!Number.isInteger(power) || power < 0) throw new InvalidArgumentError(`a parameter exponent is a nonnegative integer, got ${power}`)
    return new ParametricPolynomial(new Map([[parameterKey({ [name]: power }), Polynomial.one()]]))
  }

  /** Σ_k name^k · coefficients[k]; e.g. the β-expansion of a Grothendieck polynomial. */
  static series(name: string, coefficients: readonly Polynomial[]): ParametricPolynomial {
    const parts = new Map<string, Polynomial>()
    coefficients.forEach((p, k) => { if (!p.isZero()) parts.set(parameterKey({ [name]: k }), p) })
    return new ParametricPolynomial(parts)
  }

  isZero(): boolean {
    return this.parts.size === 0
  }

  /** The parameters that occur. */
  parameterNames(): Set<string> {
    const out = new Set<string>()
    for (const k of this.parts.keys()) for (const name of Object.keys(parameterExponents(k))) out.add(name)
    return out
  }

  /** The polynomial when no parameter occurs; undefined otherwise. */
  withoutParameters(): Polynomial | undefined {
    if (this.parts.size === 0) return Polynomial.zero()
    return this.parts.size === 1 && this.parts.has('') ? this.parts.get('')! : undefined
  }

  equals(other: ParametricPolynomial): boolean {
    if (this.parts.size !== other.parts.size) return false
    for (const [k, p] of this.parts) {
      const q = other.parts.get(k)
      if (!q || !q.equals(p)) return false
    }
    return true
  }

  add(other: ParametricPolynomial): ParametricPolynomial {
    const out = new Map(this.parts)
    for (const [k, p] of other.parts) put(out, k, (out.get(k) ?? Polynomial.zero()).add(p))
    return new ParametricPolynomial(out)
  }

  neg(): ParametricPolynomial {
    return this.map(p => p.neg())
  }

  sub(other: ParametricPolynomial): ParametricPolynomial {
    return this.add(other.neg())
  }

  mul(other: ParametricPolynomial, budget?: Budget | BudgetMeter): ParametricPolynomial {
    const out = new Map<string, Polynomial>()
    for (const [ka, a] of this.parts) {
      for (const [kb, b] of other.parts) {
        const k = multiplyKeys(ka, kb)
        put(out, k, (out.get(k) ?? Polynomial.zero()).add(a.mul(b, budget)))
      }
    }
    return new ParametricPolynomial(out)
  }

  pow(k: number, budget?: Budget | BudgetMeter): ParametricPolynomial {
    if (!Number.isInteger(k) || k < 0) throw new InvalidArgumentError(`exponent must be a nonnegative integer, got ${k}`)
    let r = ParametricPolynomial.constant(1)
    for (let i = 0; i < k; i++) r = r.mul(this, budget)
    return r
  }

  /** Apply an additive map of polynomials to every part (y ↦ −y, truncations, …); e.g. `f.map(p => p.negateY())`. */
  map(f: (p: Polynomial) => Polynomial): ParametricPolynomial {
    const out = new Map<string, Polynomial>()
    for (const [k, p] of this.parts) put(out, k, f(p))
    return new ParametricPolynomial(out)
  }

  /** Give the parameter `name` a value (an integer or a polynomial in x, y); e.g. β = 0. */
  substitute(name: string, value: number | bigint | Polynomial, budget?: Budget | BudgetMeter): ParametricPolynomial {
    const v = value instanceof Polynomial ? value : Polynomial.constant(value)
    const out = new Map<string, Polynomial>()
    for (const [k, p] of this.parts) {
      const e = parameterExponents(k)
      const power = e[name] ?? 0
      if (power === 0) { put(out, k, (out.get(k) ?? Polynomial.zero()).add(p)); continue }
      delete e[name]
      const rest = parameterKey(e)
      put(out, rest, (out.get(rest) ?? Polynomial.zero()).add(p.mul(v.pow(power, budget), budget)))
    }
    return new ParametricPolynomial(out)
  }

  /** Every term, parameter monomials in key order, then the canonical x,y order of polynomial.ts. */
  termList(): ParametricTerm[] {
    const keys = [...this.parts.keys()].sort()
    return keys.flatMap(k => this.parts.get(k)!.termList().map(t => ({ ...t, parameters: parameterExponents(k) })))
  }

  /** LaTeX, each parameter written by `name` (default `\name` for Greek names); e.g. `x_{1} + \beta x_{1}y_{1}`. */
  toLatex(maxTerms = Infinity, name: (parameter: string) => string = parameterLatex): string {
    const list = this.termList()
    if (list.length === 0) return '0'
    let out = ''
    list.slice(0, maxTerms).forEach((t, idx) => {
      const mono = parametricMonomialLatex(t.parameters, t.x, t.y, name)
      const abs = absCoefficient(t.coefficient)
      const body = mono === '' ? String(abs) : abs === 1 ? mono : `${abs}${mono}`
      if (idx === 0) out += t.coefficient < 0 ? `-${body}` : body
      else out += t.coefficient < 0 ? ` - ${body}` : ` + ${body}`
    })
    return list.length > maxTerms ? `${out} + \\cdots \\;\\text{(${list.length} terms)}` : out
  }
}

function put(out: Map<string, Polynomial>, key: string, p: Polynomial): void {
  if (p.isZero()) out.delete(key)
  else out.set(key, p)
}

const GREEK = new Set(['alpha', 'beta', 'gamma', 'delta', 'epsilon', 'eta', 'theta', 'kappa', 'lambda', 'mu', 'nu', 'xi', 'rho', 'sigma', 'tau', 'phi', 'chi', 'psi', 'omega'])

/** `beta` ↦ `\beta`, `q` ↦ `q`, `c1` ↦ `c_{1}`. */
export function parameterLatex(name: string): string {
  if (GREEK.has(name)) return `\\${name}`
  const m = /^([A-Za-z]+)(\d+)$/.exec(name)
  return m ? `${m[1]}_{${m[2]}}` : name
}

/** LaTeX of parameters times an x,y monomial; e.g. `\beta^{2}x_{1}`. Empty for 1. */
export function parametricMonomialLatex(parameters: ParameterExponents, x: readonly number[], y: readonly number[], name: (parameter: string) => string = parameterLatex): string {
  let s = ''
  for (const k of Object.keys(parameters).sort()) {
    const e = parameters[k]!
    if (e > 0) s += e === 1 ? `${name(k)} ` : `${name(k)}^{${e}} `
  }
  const mono = monomialLatex(x, y)
  return mono === '' ? s.trimEnd() : s + mono
}

/** Term-by-term difference of two parametric polynomials (expected first, as in polynomialDifference). */
export interface ParametricDifference {
  equal: boolean
  missing: ParametricTerm[]
  extra: ParametricTerm[]
  wrongCoefficient: { parameters: ParameterExponents, x: number[], y: number[], expected: Coefficient, actual: Coefficient }[]
}

/** Compare two values part by part; e.g. `parametricDifference(computed, claimed).equal`. */
export function parametricDifference(expected: ParametricPolynomial, actual: ParametricPolynomial): ParametricDifference {
  const keys = [...new Set([...expected.parts.keys(), ...actual.parts.keys()])].sort()
  const out: ParametricDifference = { equal: true, missing: [], extra: [], wrongCoefficient: [] }
  for (const k of keys) {
    const parameters = parameterExponents(k)
    const d = polynomialDifference(expected.parts.get(k) ?? Polynomial.zero(), actual.parts.get(k) ?? Polynomial.zero())
    if (d.equal) continue
    out.equal = false
    out.missing.push(...d.missing.map(t => ({ ...t, parameters })))
    out.extra.push(...d.extra.map(t => ({ ...t, parameters })))
    out.wrongCoefficient.push(...d.wrongCoefficient.map(t => ({ ...t, parameters })))
  }
  return out
}
