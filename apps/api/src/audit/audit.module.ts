import { Global, Module } from '@nestjs/common';
import { AuditService } from './audit.service';

export { AuditService, type AuditRecord } from './audit.service';

/**
 * The audit trail of changes to published rosters. Global: any module may inject AuditService and
 * call `record(em, entry)` inside the transaction of its change.
 */
@Global()
@Module({
  providers: [AuditService],
  exports: [AuditService],
})
export class AuditModule {}
