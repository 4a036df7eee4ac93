import { MIN_PASSWORD_LENGTH, passwordProblems } from './password-rules';

describe('passwordProblems', () => {
  it('accepts a long passphrase typed twice', () => {
    expect(passwordProblems('correct horse battery', 'correct horse battery')).toEqual([]);
  });

  it('counts the characters typed so far when the password is too short', () => {
    expect(MIN_PASSWORD_LENGTH).toBe(12);
    expect(passwordProblems('short', 'short')).toEqual(['Use at least 12 characters (5 so far).']);
  });

  it('reports a mismatch, leading spaces and a password built from the e-mail', () => {
    expect(passwordProblems(' padded-passphrase', ' padded-passphrase')).toContain(
      'Do not start or end with a space.',
    );
    expect(passwordProblems('alexandra-2026!', 'alexandra-2026?')).toContain('The two passwords differ.');
    expect(passwordProblems('my-Alexandra-pass', 'my-Alexandra-pass', 'alexandra@kestrel.example')).toContain(
      'Do not build the password from your e-mail address.',
    );
  });

  it('refuses a password longer than 256 characters', () => {
    const long = 'x'.repeat(257);
    expect(passwordProblems(long, long)).toEqual(['Use at most 256 characters.']);
  });
});
