import { type Role } from '@rotaplex/contracts';

/** The signed-in caller, loaded fresh from the database on every request by the JWT strategy. */
export interface AuthUser {
  id: string;
  email: string;
  displayName: string;
  role: Role;
  organisationId: string;
  unitIds: string[];
}

/** Claims of our access tokens. */
export interface AccessTokenPayload {
  sub: string;
  role: Role;
}
