import { describe, expect, it } from 'vitest'
import { passwordProblem } from '../../../shared/accounts/password-policy'

describe('password policy (length over composition; NIST SP 800-63B, common practice)', () => {
  it('accepts the 13-character demo password and passphrases with spaces', () => {
    expect(passwordProblem('scholium-demo')).toBeNull()
    expect(passwordProblem('correct horse battery')).toBeNull()
  })
  it('refuses fewer than 12 code points, counting an emoji as one', () => {
    expect(passwordProblem('elevenchars')).toMatch(/12/)
    expect(passwordProblem('😀'.repeat(5) + 'abcdef')).toMatch(/12/)
  })
  it('refuses only whitespace and one repeated character', () => {
    expect(passwordProblem(' '.repeat(12))).toMatch(/spaces/)
    expect(passwordProblem('\t \t \t \t \t \t ')).toMatch(/spaces/)
    expect(passwordProblem('a'.repeat(12))).toMatch(/repeated/)
  })
})
