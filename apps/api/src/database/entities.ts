import { OneTimeTokenEntity } from '../auth/one-time-token.entity';
import { RefreshTokenEntity } from '../auth/refresh-token.entity';
import { MailMessageEntity } from '../mail/mail-message.entity';
import { OrganisationEntity } from '../organisation/organisation.entity';
import { UnitEntity } from '../units/unit.entity';
import { UserEntity } from '../users/user.entity';

/** Every entity of the schema; the migrations in ./migrations must produce exactly these tables. */
export const ENTITIES = [
  OrganisationEntity,
  UnitEntity,
  UserEntity,
  RefreshTokenEntity,
  OneTimeTokenEntity,
  MailMessageEntity,
];
