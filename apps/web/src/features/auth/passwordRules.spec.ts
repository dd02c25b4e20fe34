import { checkNewPassword } from './passwordRules';

// NIST SP 800-63B, section 5.1.1.2: memorized secrets of at least 8 characters; verifiers
// SHOULD permit at least 64; no composition rules (so letters only is fine).
describe('new password checks', () => {
  it('refuses fewer than 8 characters', () => {
    expect(checkNewPassword('abcdefg', 'abcdefg').password).toMatch(/at least 8/);
  });

  it('accepts 8 characters with no composition rules', () => {
    expect(checkNewPassword('abcdefgh', 'abcdefgh')).toEqual({});
  });

  it('accepts a 64-character passphrase', () => {
    const phrase = 'correct horse battery staple '.repeat(3).slice(0, 64);
    expect(phrase).toHaveLength(64);
    expect(checkNewPassword(phrase, phrase)).toEqual({});
  });

  it('asks for the same password twice', () => {
    expect(checkNewPassword('abcdefgh', 'abcdefgx').confirmation).toMatch(/not the same/);
  });
});
