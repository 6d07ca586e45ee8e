/**
 * Conventions a manuscript may follow, each with a stable short id.
 *
 * Every convention is a pair of choices on one axis. The first choice of
 * each axis is Scholium's reference convention, the one the engine computes
 * in; a claim written in the other choice is translated before comparison.
 * The ids are part of the public JSON report and the command line, so they
 * never change meaning once released.
 */
export const CONVENTION_AXES = {
  /** Sign inside the factors of double Schubert polynomials. */
  doubleSign: {
    label: 'Double polynomial factors',
    choices: {
      'xy-minus': 'factors written x_i − y_j, so that S_{w0} = ∏_{i+j≤n} (x_i − y_j)',
      'xy-plus': 'factors written x_i + y_j (y_j replaced by −y_j)',
    },
  },
  /** Which permutation indexes a Schubert-type object. */
  indexing: {
    label: 'Permutation indexing',
    choices: {
      'perm-w': 'the permutation is used as written',
      'perm-inverse': 'the written permutation stands for w⁻¹',
    },
  },
  /** Whether a partition label is read as written or transposed. */
  partition: {
    label: 'Partition labels',
    choices: {
      'shape-rows': 'partitions list row lengths (as written)',
      'shape-columns': 'partitions list column lengths (the transpose, ω applied)',
    },
  },
  /** The parameter β of Grothendieck polynomials. */
  beta: {
    label: 'Grothendieck parameter',
    choices: {
      'beta-minus': 'β = −1',
      'beta-plus': 'β = +1',
    },
  },
} as const

/**
 * The same choices for typesetting: prose with `$…$` math, rendered with KaTeX in the app
 * (the plain texts above stay for the command line, messages and e-mail).
 */
export const CONVENTION_CHOICE_TEX: Partial<Record<string, string>> = {
  'xy-minus': 'factors $x_i - y_j$, so that $\\mathfrak{S}_{w_0} = \\prod_{i+j\\le n} (x_i - y_j)$',
  'xy-plus': 'factors $x_i + y_j$ (that is, $y_j$ replaced by $-y_j$)',
  'perm-w': 'the permutation $w$ is used as written',
  'perm-inverse': 'the written permutation stands for $w^{-1}$',
  'shape-rows': 'a partition $\\lambda$ lists row lengths (as written)',
  'shape-columns': 'a partition lists column lengths: the transpose $\\lambda\'$, with $\\omega$ applied',
  'beta-minus': '$\\beta = -1$',
  'beta-plus': '$\\beta = +1$',
}

export type ConventionAxis = keyof typeof CONVENTION_AXES
export type ConventionId = {
  [A in ConventionAxis]: keyof (typeof CONVENTION_AXES)[A]['choices']
}[ConventionAxis]

/** One choice per axis. */
export type ConventionSet = {
  [A in ConventionAxis]: keyof (typeof CONVENTION_AXES)[A]['choices']
}

/** The engine's own convention: the first choice on every axis. */
export const REFERENCE_CONVENTIONS: ConventionSet = {
  doubleSign: 'xy-minus',
  indexing: 'perm-w',
  partition: 'shape-rows',
  beta: 'beta-minus',
}

export const ALL_CONVENTION_IDS: readonly ConventionId[] = Object.values(CONVENTION_AXES).flatMap(
  axis => Object.keys(axis.choices) as ConventionId[],
)

/** The axis a convention id belongs to, or undefined for an unknown id. */
export function axisOfConvention(id: string): ConventionAxis | undefined {
  for (const [axis, def] of Object.entries(CONVENTION_AXES)) {
    if (id in def.choices) return axis as ConventionAxis
  }
  return undefined
}
