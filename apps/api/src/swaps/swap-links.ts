import { BadRequestException, GoneException, Injectable } from '@nestjs/common';
import { SWAP_DECISION_WEB_PATH } from '@rotaplex/contracts';
import { type EntityManager, IsNull } from 'typeorm';
import { randomToken, sha256 } from '../common/crypto';
import { AppConfig } from '../config/app-config';
import { type SwapLinkRole, SwapLinkTokenEntity } from './swap-request.entity';

/**
 * E-mailed decision links: single use, expiring, one decision step of one request by one user.
 * Only the SHA-256 hash of a token is stored; the token itself exists only in the mail.
 */
@Injectable()
export class SwapLinks {
  /** Lifetime of an e-mailed decision link (AppConfig.swapLinkTtl, SWAP_LINK_TTL, default 72 h). */
  readonly ttlSeconds: number;

  constructor(private readonly config: AppConfig) {
    this.ttlSeconds = config.swapLinkTtl;
  }

  /** Stores a new link for the step in the caller's transaction; answers the token (for the mail only). */
  async create(em: EntityManager, requestId: string, userId: string, role: SwapLinkRole): Promise<string> {
    const token = randomToken();
    await em.insert(SwapLinkTokenEntity, {
      swapRequestId: requestId,
      userId,
      role,
      tokenHash: sha256(token),
      expiresAt: new Date(Date.now() + this.ttlSeconds * 1000),
      usedAt: null,
    });
    return token;
  }

  /** Uses up the unused links of one step (it was decided another way). */
  async retire(em: EntityManager, requestId: string, role: SwapLinkRole): Promise<void> {
    await em.update(
      SwapLinkTokenEntity,
      { swapRequestId: requestId, role, usedAt: IsNull() },
      { usedAt: new Date() },
    );
  }

  /** Uses up every unused link of a request (it reached a final status). */
  async retireAll(em: EntityManager, requestId: string): Promise<void> {
    await em.update(
      SwapLinkTokenEntity,
      { swapRequestId: requestId, usedAt: IsNull() },
      { usedAt: new Date() },
    );
  }

  /** Uses up one link; 410 when a racing request used it first. */
  async useUp(em: EntityManager, link: SwapLinkTokenEntity): Promise<void> {
    const { affected } = await em.update(
      SwapLinkTokenEntity,
      { id: link.id, usedAt: IsNull() },
      { usedAt: new Date() },
    );
    if (affected !== 1) throw new GoneException('This link has already been used');
  }

  /** The stored link for a token, or a clear refusal (unknown or tampered, used, expired). Changes nothing. */
  async valid(em: EntityManager, token: string): Promise<SwapLinkTokenEntity> {
    if (typeof token !== 'string' || !/^[A-Za-z0-9_-]{20,100}$/.test(token)) {
      throw new BadRequestException(['token: this link is not valid (it may have been cut or changed)']);
    }
    const link = await em.findOneBy(SwapLinkTokenEntity, { tokenHash: sha256(token) });
    if (!link)
      throw new BadRequestException(['token: this link is not valid (it may have been cut or changed)']);
    if (link.usedAt) {
      throw new GoneException('This link has already been used, or the decision was made another way');
    }
    if (link.expiresAt.getTime() <= Date.now()) {
      throw new GoneException(
        `This link has expired: please decide in Rotaplex under ${link.role === 'manager' ? 'Swap approvals' : 'Swaps'}`,
      );
    }
    return link;
  }

  /** The web address a token opens (the decision page of the web app). */
  url(token: string): string {
    return `${this.config.publicUrl ?? ''}${SWAP_DECISION_WEB_PATH}?token=${encodeURIComponent(token)}`;
  }
}
