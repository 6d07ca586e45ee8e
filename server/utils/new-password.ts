import { z } from 'zod'
import { PASSWORD_MAX_LENGTH, passwordProblem } from '#shared/accounts/password-policy'

/** The zod schema for a password someone chooses (sign-up, reset); see shared/accounts/password-policy.ts. */
export const newPasswordSchema = z.string().max(PASSWORD_MAX_LENGTH * 4).superRefine((password, ctx) => {
  const problem = passwordProblem(password)
  if (problem) ctx.addIssue({ code: 'custom', message: problem })
})
