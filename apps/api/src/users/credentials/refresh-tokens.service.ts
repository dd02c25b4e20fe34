import { Injectable, Logger, UnauthorizedException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { randomUUID } from 'node:crypto';
import { DataSource, IsNull, Not, Repository } from 'typeorm';
import { randomToken, sha256 } from '../../common/crypto';
import { AppConfig } from '../../config/app-config';
import { RefreshTokenEntity } from './refresh-token.entity';

export interface IssuedRefreshToken {
  token: string;
  familyId: string;
  expiresAt: Date;
}

/**
 * Rotating refresh tokens (RFC 9700 §4.14.2): each token is usable once and replaced by a new one
 * of the same family; presenting a replaced token again revokes the whole family. A short grace
 * period (REFRESH_REUSE_GRACE, 10 s) lets two tabs that refresh at the same moment both succeed
 * instead of signing the person out (common practice, e.g. a "reuse interval").
 */
@Injectable()
export class RefreshTokensService {
  private readonly logger = new Logger(RefreshTokensService.name);

  constructor(
    private readonly config: AppConfig,
    private readonly dataSource: DataSource,
    @InjectRepository(RefreshTokenEntity) private readonly tokens: Repository<RefreshTokenEntity>,
  ) {}

  /** Starts a new family (sign-in). */
  issue(userId: string): Promise<IssuedRefreshToken> {
    return this.insert(this.tokens, userId, randomUUID());
  }

  /**
   * Exchanges a token for its successor. Throws 401 for unknown, expired or revoked tokens, and
   * revokes the family when a token is used twice. `isUserActive` is checked inside the exchange.
   */
  async rotate(
    token: string,
    isUserActive: (userId: string) => Promise<boolean>,
  ): Promise<IssuedRefreshToken & { userId: string }> {
    const now = new Date();
    const result = await this.dataSource.transaction(async (em) => {
      const repo = em.getRepository(RefreshTokenEntity);
      const row = await repo.findOneBy({ tokenHash: sha256(token) });
      if (!row) return { error: 'Unknown refresh token' } as const;
      if (row.revokedAt) return { error: 'Refresh token revoked' } as const;
      const withinGrace =
        row.replacedAt !== null &&
        now.getTime() - row.replacedAt.getTime() <= this.config.refreshReuseGrace * 1000;
      if (row.replacedAt && !withinGrace) {
        await this.revokeFamilyWith(repo, row.familyId, now);
        this.logger.warn(
          `Refresh token reuse detected for user ${row.userId}; family ${row.familyId} revoked`,
        );
        return { error: 'Refresh token already used: every session of this sign-in has been ended' } as const;
      }
      if (row.expiresAt.getTime() <= now.getTime()) return { error: 'Refresh token expired' } as const;
      if (!(await isUserActive(row.userId))) {
        await this.revokeFamilyWith(repo, row.familyId, now);
        return { error: 'This account is deactivated' } as const;
      }
      if (!row.replacedAt) {
        row.replacedAt = now;
        await repo.save(row);
      }
      const next = await this.insert(repo, row.userId, row.familyId);
      return { ...next, userId: row.userId };
    });
    if ('error' in result) throw new UnauthorizedException(result.error);
    return result;
  }

  /** Ends the sign-in the token belongs to (logout). Unknown tokens are ignored. */
  async revokeByToken(token: string): Promise<void> {
    const row = await this.tokens.findOneBy({ tokenHash: sha256(token) });
    if (row) await this.revokeFamilyWith(this.tokens, row.familyId, new Date());
  }

  /** The family of a token, if the token is known. */
  async familyOf(token: string | undefined): Promise<string | null> {
    if (!token) return null;
    return (await this.tokens.findOneBy({ tokenHash: sha256(token) }))?.familyId ?? null;
  }

  /** Ends every sign-in of a user, optionally keeping one family (the caller's own session). */
  async revokeAllForUser(userId: string, keepFamilyId: string | null = null): Promise<void> {
    await this.tokens.update(
      { userId, revokedAt: IsNull(), ...(keepFamilyId ? { familyId: Not(keepFamilyId) } : {}) },
      { revokedAt: new Date() },
    );
  }

  private async revokeFamilyWith(
    repo: Repository<RefreshTokenEntity>,
    familyId: string,
    now: Date,
  ): Promise<void> {
    await repo.update({ familyId, revokedAt: IsNull() }, { revokedAt: now });
  }

  private async insert(
    repo: Repository<RefreshTokenEntity>,
    userId: string,
    familyId: string,
  ): Promise<IssuedRefreshToken> {
    const token = randomToken();
    const expiresAt = new Date(Date.now() + this.config.refreshTtl * 1000);
    await repo.insert({
      userId,
      familyId,
      tokenHash: sha256(token),
      expiresAt,
      replacedAt: null,
      revokedAt: null,
    });
    return { token, familyId, expiresAt };
  }
}
