import { Injectable } from '@nestjs/common';
import * as argon2 from 'argon2';
import { AppConfig } from '../../config/app-config';

/**
 * Password hashing with argon2id (salt and parameters are part of the encoded hash). Production
 * cost follows the OWASP Password Storage Cheat Sheet minimum (m = 19 MiB, t = 2, p = 1); tests
 * lower it through ARGON2_TIME_COST / ARGON2_MEMORY_KIB.
 */
@Injectable()
export class PasswordService {
  private dummyHash: Promise<string> | null = null;

  constructor(private readonly config: AppConfig) {}

  hash(password: string): Promise<string> {
    return argon2.hash(password, { type: argon2.argon2id, ...this.config.argon2 });
  }

  async verify(hash: string, password: string): Promise<boolean> {
    try {
      return await argon2.verify(hash, password);
    } catch {
      return false;
    }
  }

  /** Spends the same time as a real check, so unknown e-mails cannot be told apart by timing. */
  async verifyNothing(password: string): Promise<false> {
    this.dummyHash ??= this.hash('rotaplex-timing-equaliser');
    await this.verify(await this.dummyHash, password);
    return false;
  }
}
