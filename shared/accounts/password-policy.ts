/**
 * What a new password must be. Length over composition: current common guidance
 * (NIST SP 800-63B) asks for at least 8 characters, 15 where a password is the only
 * factor, allows every printable character including spaces, and forbids composition
 * rules. We ask for 12 (Scholium has one factor, but 15 would refuse passphrases people
 * already use, such as the 13-character demo password), count Unicode code points, and
 * refuse the two trivially guessable shapes: only whitespace, or one character repeated.
 */
export const PASSWORD_MIN_LENGTH = 12
export const PASSWORD_MAX_LENGTH = 200

/** Why `password` is not acceptable as a new password, or null when it is. Example: `passwordProblem('          ')` */
export function passwordProblem(password: string): string | null {
  const length = [...password].length
  if (length < PASSWORD_MIN_LENGTH) return `Use at least ${PASSWORD_MIN_LENGTH} characters`
  if (length > PASSWORD_MAX_LENGTH) return `Use at most ${PASSWORD_MAX_LENGTH} characters`
  if (password.trim() === '') return 'A password cannot be only spaces'
  if (new Set(password).size === 1) return 'A password cannot be one character repeated'
  return null
}
