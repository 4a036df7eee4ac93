/** Shortest password the console accepts when an invitation is taken up (the server checks too). */
export const MIN_PASSWORD_LENGTH = 12;

/** Plain-language problems with a new password, empty when it is acceptable. */
export function passwordProblems(password: string, repeat: string, email?: string): string[] {
  const problems: string[] = [];
  if (password.length < MIN_PASSWORD_LENGTH) {
    problems.push(`Use at least ${MIN_PASSWORD_LENGTH} characters (${password.length} so far).`);
  }
  if (password.length > 256) problems.push('Use at most 256 characters.');
  if (password && password.trim() !== password) problems.push('Do not start or end with a space.');
  const local = email?.split('@')[0]?.toLowerCase();
  if (local && local.length >= 3 && password.toLowerCase().includes(local)) {
    problems.push('Do not build the password from your e-mail address.');
  }
  if (repeat !== password) problems.push('The two passwords differ.');
  return problems;
}
