import { Global, Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { UsersModule } from '../users/users.module';
import { AuditEntryEntity } from './audit-entry.entity';
import { AuditService } from './audit.service';

export { AuditService, type AuditRecord } from './audit.service';

/**
 * The audit trail of changes to published rosters. Global: any module may inject AuditService and
 * call `record(em, entry)` inside the transaction of its change.
 */
@Global()
@Module({
  imports: [TypeOrmModule.forFeature([AuditEntryEntity]), UsersModule],
  providers: [AuditService],
  exports: [AuditService],
})
export class AuditModule {}
