import { BadRequestException, Injectable } from '@nestjs/common';
import { IsNull, type EntityManager } from 'typeorm';
import { randomToken, sha256 } from '../../common/crypto';
import { AppConfig } from '../../config/app-config';
import { OneTimeTokenEntity, type OneTimeTokenPurpose } from './one-time-token.entity';

/**
 * Single-use, expiring tokens for e-mailed links. Only the SHA-256 hash is stored and the lookup
 * is by hash, so no stored secret is ever compared character by character.
 */
@Injectable()
export class OneTimeTokensService {
  constructor(private readonly config: AppConfig) {}

  ttlSeconds(purpose: OneTimeTokenPurpose): number {
    return purpose === 'invitation' ? this.config.invitationTtl : this.config.passwordResetTtl;
  }

  /** Creates a token and retires the user's earlier unused tokens of the same purpose. */
  async create(em: EntityManager, userId: string, purpose: OneTimeTokenPurpose): Promise<string> {
    const now = new Date();
    await em.update(OneTimeTokenEntity, { userId, purpose, usedAt: IsNull() }, { usedAt: now });
    const token = randomToken();
    await em.insert(OneTimeTokenEntity, {
      userId,
      purpose,
      tokenHash: sha256(token),
      expiresAt: new Date(now.getTime() + this.ttlSeconds(purpose) * 1000),
      usedAt: null,
    });
    return token;
  }

  /** Marks the token used and returns its user id; 400 if unknown, used or expired. Call inside a transaction. */
  async consume(em: EntityManager, token: string, purpose: OneTimeTokenPurpose): Promise<string> {
    const what = purpose === 'invitation' ? 'invitation' : 'password reset';
    const row = await em.findOneBy(OneTimeTokenEntity, { tokenHash: sha256(token), purpose });
    if (!row || row.usedAt)
      throw new BadRequestException(`token: this ${what} link is invalid or has already been used`);
    if (row.expiresAt.getTime() <= Date.now())
      throw new BadRequestException(`token: this ${what} link has expired`);
    const { affected } = await em.update(
      OneTimeTokenEntity,
      { id: row.id, usedAt: IsNull() },
      { usedAt: new Date() },
    );
    if (affected !== 1) throw new BadRequestException(`token: this ${what} link has already been used`);
    return row.userId;
  }
}
