import { applyDecorators, SetMetadata } from '@nestjs/common';
import { ApiBearerAuth, ApiForbiddenResponse, ApiUnauthorizedResponse } from '@nestjs/swagger';
import { ApiErrorResponse } from '../api-error.dto';
import { type Permission } from '@rotaplex/contracts';

export const ACCESS_KEY = 'rotaplex:access';

/** Access rule of a route: the permissions the caller's role must hold (none: any signed-in user). */
export interface AccessRule {
  permissions: readonly Permission[];
}

/** Any signed-in, active user. */
export const Authenticated = () =>
  applyDecorators(
    SetMetadata(ACCESS_KEY, { permissions: [] } satisfies AccessRule),
    ApiBearerAuth(),
    ApiUnauthorizedResponse({ description: 'No valid access token', type: ApiErrorResponse }),
  );

/**
 * Signed-in users whose role holds every listed permission (see ROLE_PERMISSIONS in contracts).
 * Unit limits (managers: their units; staff: themselves) are applied by the services.
 */
export const RequirePermissions = (...permissions: Permission[]) =>
  applyDecorators(
    SetMetadata(ACCESS_KEY, { permissions } satisfies AccessRule),
    ApiBearerAuth(),
    ApiUnauthorizedResponse({ description: 'No valid access token', type: ApiErrorResponse }),
    ApiForbiddenResponse({ description: `Requires ${permissions.join(', ')}`, type: ApiErrorResponse }),
  );
