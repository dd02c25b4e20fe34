import { loadConfig, resolveJwtSecret } from '../config/app-config';
import { MailBodyCipher, SEALED_PREFIX, UnreadableBodyError } from './mail-body-cipher';

const cipherFor = (secret: string) =>
  new MailBodyCipher(resolveJwtSecret(loadConfig({ NODE_ENV: 'test', JWT_SECRET: secret })));

describe('MailBodyCipher (AES-256-GCM under an HKDF key from JWT_SECRET)', () => {
  const cipher = cipherFor('a'.repeat(48));
  const body = 'Set your password: https://rotaplex.test/accept-invitation?token=Zm9vYmFyYmF6cXV4';

  it('seals without the plain text, differently each time, and opens again', () => {
    const a = cipher.seal(body, 'outbox_messages:1');
    const b = cipher.seal(body, 'outbox_messages:1');
    expect(a.startsWith(SEALED_PREFIX)).toBe(true);
    expect(a).not.toContain('token=');
    expect(a).not.toBe(b); // a fresh nonce per value
    expect(cipher.open(a, 'outbox_messages:1')).toBe(body);
    expect(cipher.open(cipher.seal('', 'x'), 'x')).toBe('');
  });

  it('opens nothing under another secret, for another row, or after a changed byte', () => {
    const sealed = cipher.seal(body, 'outbox_messages:1');
    expect(() => cipherFor('b'.repeat(48)).open(sealed, 'outbox_messages:1')).toThrow(UnreadableBodyError);
    expect(() => cipher.open(sealed, 'outbox_messages:2')).toThrow(UnreadableBodyError);
    const i = SEALED_PREFIX.length + 30;
    const changed = sealed.slice(0, i) + (sealed[i] === 'A' ? 'B' : 'A') + sealed.slice(i + 1);
    expect(() => cipher.open(changed, 'outbox_messages:1')).toThrow(UnreadableBodyError);
    expect(() => cipher.open(body, 'outbox_messages:1')).toThrow(UnreadableBodyError);
    expect(() => cipher.open(`${SEALED_PREFIX}abc`, 'outbox_messages:1')).toThrow(UnreadableBodyError);
  });
});
