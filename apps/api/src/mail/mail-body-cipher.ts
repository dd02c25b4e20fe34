import { Injectable } from '@nestjs/common';
import { createCipheriv, createDecipheriv, hkdfSync, randomBytes } from 'node:crypto';
import { AppConfig } from '../config/app-config';

/** Marks a sealed value; anything else in a sealed column was written before sealing existed. */
export const SEALED_PREFIX = 'sealed:v1:';

const IV_BYTES = 12; // 96-bit nonce, the size GCM is defined for (NIST SP 800-38D §5.2.1.1)
const TAG_BYTES = 16;

/** A sealed value that cannot be opened: another key (JWT_SECRET changed), or changed bytes. */
export class UnreadableBodyError extends Error {
  constructor() {
    super(
      'the stored e-mail body cannot be decrypted (JWT_SECRET changed since it was stored, or it was altered)',
    );
    this.name = 'UnreadableBodyError';
  }
}

/**
 * Encrypts e-mail bodies at rest (outbox and local mail catcher), because they carry working
 * invitation, password-reset and decision links. AES-256-GCM (node:crypto) under a key derived
 * from JWT_SECRET with HKDF-SHA256 (RFC 5869) for this one purpose, so a copy of the database
 * file alone opens nothing. Each value is bound to where it is stored (`context`, e.g. the row
 * id) as additional authenticated data: a sealed body moved to another row does not open.
 */
@Injectable()
export class MailBodyCipher {
  private readonly key: Buffer;

  constructor(config: AppConfig) {
    if (!config.jwtSecret) throw new Error('MailBodyCipher needs the JWT secret (resolveJwtSecret)');
    this.key = Buffer.from(
      hkdfSync('sha256', config.jwtSecret, 'rotaplex', 'rotaplex/mail-bodies/aes-256-gcm/v1', 32),
    );
  }

  /** "sealed:v1:" + base64url(nonce | tag | ciphertext). */
  seal(plain: string, context: string): string {
    const iv = randomBytes(IV_BYTES);
    const cipher = createCipheriv('aes-256-gcm', this.key, iv);
    cipher.setAAD(Buffer.from(context, 'utf8'));
    const body = Buffer.concat([cipher.update(plain, 'utf8'), cipher.final()]);
    return SEALED_PREFIX + Buffer.concat([iv, cipher.getAuthTag(), body]).toString('base64url');
  }

  /** The plain text of a sealed value; throws {@link UnreadableBodyError} when it does not open. */
  open(sealed: string, context: string): string {
    if (!isSealed(sealed)) throw new UnreadableBodyError();
    const raw = Buffer.from(sealed.slice(SEALED_PREFIX.length), 'base64url');
    if (raw.length < IV_BYTES + TAG_BYTES) throw new UnreadableBodyError();
    try {
      const decipher = createDecipheriv('aes-256-gcm', this.key, raw.subarray(0, IV_BYTES));
      decipher.setAAD(Buffer.from(context, 'utf8'));
      decipher.setAuthTag(raw.subarray(IV_BYTES, IV_BYTES + TAG_BYTES));
      return Buffer.concat([decipher.update(raw.subarray(IV_BYTES + TAG_BYTES)), decipher.final()]).toString(
        'utf8',
      );
    } catch {
      throw new UnreadableBodyError();
    }
  }
}

export function isSealed(value: string | null): boolean {
  return value !== null && value.startsWith(SEALED_PREFIX);
}

/** What an outbox body is bound to (additional authenticated data): its row. */
export function outboxBodyContext(id: string): string {
  return `outbox_messages:${id}`;
}

/** What a body kept by the local mail catcher is bound to: its row and part. */
export function mailboxBodyContext(id: string, part: 'text' | 'html'): string {
  return `mail_messages:${id}:${part}`;
}
