import { useCan } from '@/features/auth/hooks/useCurrentUser';
import { usePlanningStyles } from '@/features/planning/components/planningStyles';
import { UnitPicker } from '@/features/planning/components/UnitPicker';
import { UnitScope } from '@/features/planning/components/UnitScope';
import { useSelectedUnit } from '@/features/planning/hooks/useSelectedUnit';
import { RequestsTable } from '@/features/requests/components/RequestsTable';
import { PageHeader } from '@/ui/PageHeader';

/** Managers: every date request and leave request of their units; leave is approved or declined here. */
export function RequestsPage() {
  const styles = usePlanningStyles();
  const selected = useSelectedUnit();
  const canApprove = useCan('requests:approve');
  return (
    <>
      <PageHeader
        title="Requests"
        description="Date requests and leave of your units. Approve or decline pending leave; approved leave keeps the person off the roster on those days."
      />
      {canApprove ? (
        <UnitScope selected={selected}>
          {(unit) => (
            <section className={styles.panel} aria-label="Requests">
              <div className={styles.toolbar}>
                <UnitPicker units={selected.units} value={unit.id} onChange={selected.setUnitId} />
              </div>
              <RequestsTable key={unit.id} unit={unit} />
            </section>
          )}
        </UnitScope>
      ) : null}
    </>
  );
}
