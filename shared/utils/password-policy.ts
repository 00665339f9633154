// Hobline's password rule, shown to people in these words. Length is what matters most
// (NIST SP 800-63B §3.1.1.2: at least 8 characters, allow at least 64, no composition rules;
// Hobline asks for 10), and a password must not be built from the account's own e-mail.

export const PASSWORD_MIN = 10
export const PASSWORD_MAX = 200

export function passwordProblem(password: string, email = ''): string | null {
  if (password.length < PASSWORD_MIN) return `Use at least ${PASSWORD_MIN} characters for the password.`
  if (password.length > PASSWORD_MAX) return `Use at most ${PASSWORD_MAX} characters for the password.`
  if (/^(.)\1*$/u.test(password)) return 'Use a password that is not one character repeated.'
  const lowered = password.toLowerCase()
  const address = email.trim().toLowerCase()
  const local = address.split('@')[0] ?? ''
  if (address && (lowered.includes(address) || (local.length >= 4 && lowered.includes(local)))) {
    return 'Use a password that does not contain your e-mail address.'
  }
  return null
}
