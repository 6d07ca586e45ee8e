import { z } from 'zod'
import { CONVENTION_AXES, type ConventionAxis } from '#shared/types/conventions'

/** A partial convention set: each axis optional, each value one of that axis's ids. */
export const ConventionChoices = z.object(Object.fromEntries(
  (Object.keys(CONVENTION_AXES) as ConventionAxis[]).map(axis => [axis, z.enum(Object.keys(CONVENTION_AXES[axis].choices) as [string, ...string[]]).optional()]),
)).strict()
