import { useState } from 'react';
import { Button } from '@fluentui/react-components';
import { ClockRegular, DataLineRegular } from '@fluentui/react-icons';
import { DEMAND_CSV_COLUMNS, type PutUnitDemandRequest, type UnitDto } from '@rotaplex/contracts';
import { useQuery } from '@tanstack/react-query';
import { PATHS } from '@/app/paths';
import { DemandPeriodsList } from '@/features/demand/components/DemandPeriodsList';
import { ContactDemandEditor, NEW_CONTACT_DEMAND } from '@/features/demand/components/ContactDemandEditor';
import { NEW_WARD_DEMAND, WardDemandEditor } from '@/features/demand/components/WardDemandEditor';
import { importContactsCsv, unitDemandQuery } from '@/features/demand/api/demand.queries';
import { useSaveDemand } from '@/features/demand/hooks/useSaveDemand';
import { shiftTypesQuery, skillsQuery } from '@/features/planning/api/planning.queries';
import { CsvImportDialog } from '@/features/planning/components/CsvImportDialog';
import { usePlanningStyles } from '@/features/planning/components/planningStyles';
import { UnitPicker } from '@/features/planning/components/UnitPicker';
import { UnitScope } from '@/features/planning/components/UnitScope';
import { useSelectedUnit } from '@/features/planning/hooks/useSelectedUnit';
import { AppLink } from '@/ui/AppLink';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { LoadingState } from '@/ui/LoadingState';
import { useNotify } from '@/ui/notify';
import { PageHeader } from '@/ui/PageHeader';

export function DemandPage() {
  const styles = usePlanningStyles();
  const selected = useSelectedUnit();
  return (
    <>
      <PageHeader
        title="Demand"
        description={
          <>
            The workload a unit expects: contacts per interval for a contact centre, patients per shift for a
            ward. Rotaplex turns it into the people each interval or shift needs, plans the shifts that cover
            it, and after you accept a period&apos;s plan it becomes that period&apos;s{' '}
            <AppLink to={PATHS.coverNeeds} inline>
              cover needs
            </AppLink>
            .
          </>
        }
      />
      <UnitScope selected={selected}>
        {(unit) => (
          <div className={styles.stack}>
            <div className={styles.toolbar}>
              <UnitPicker units={selected.units} value={unit.id} onChange={selected.setUnitId} />
            </div>
            <DemandOfUnit key={unit.id} unit={unit} />
          </div>
        )}
      </UnitScope>
    </>
  );
}

function DemandOfUnit({ unit }: { unit: UnitDto }) {
  const styles = usePlanningStyles();
  const notify = useNotify();
  const demand = useQuery(unitDemandQuery(unit.id));
  const shiftTypes = useQuery(shiftTypesQuery(unit.id));
  const skills = useQuery(skillsQuery());
  const save = useSaveDemand(unit.id);
  const [importing, setImporting] = useState(false);
  // Bumped after a CSV import so the grid starts again from the saved forecast.
  const [revision, setRevision] = useState(0);
  const [started, setStarted] = useState<'contact' | 'ward' | null>(null);

  const failed = demand.error ?? shiftTypes.error ?? skills.error;
  if (failed)
    return (
      <ErrorBanner
        error={failed}
        onRetry={() => {
          void demand.refetch();
          void shiftTypes.refetch();
          void skills.refetch();
        }}
      />
    );
  if (!demand.data || !shiftTypes.data || !skills.data) return <LoadingState label="Loading the demand" />;
  if (shiftTypes.data.length === 0)
    return (
      <EmptyState icon={<ClockRegular />} title={`${unit.name} has no shift types yet`}>
        Demand is covered by shifts.{' '}
        <AppLink to={`${PATHS.shiftTypes}?unit=${unit.id}`}>Add shift types</AppLink> first.
      </EmptyState>
    );
  const d = demand.data;
  const contact = d.contactCentre ?? (started === 'contact' ? NEW_CONTACT_DEMAND : null);
  const ward = d.ward ?? (started === 'ward' ? NEW_WARD_DEMAND : null);
  const put = (body: PutUnitDemandRequest, what: string) =>
    save.mutate(body, { onSuccess: () => notify(`${what} of ${unit.name} saved`) });

  return (
    <>
      {!contact && !ward && (
        <EmptyState icon={<DataLineRegular />} title={`No demand for ${unit.name} yet`}>
          <Button onClick={() => setStarted('contact')}>Start a contact forecast</Button>{' '}
          <Button onClick={() => setStarted('ward')}>Start patients and ratios</Button>
        </EmptyState>
      )}
      {contact && (
        <div className={styles.panel}>
          <ContactDemandEditor
            key={revision}
            saved={contact}
            shiftTypes={shiftTypes.data}
            skills={skills.data}
            saving={save.isPending}
            error={save.error}
            onSave={(value) => put({ contactCentre: value, ward: d.ward }, 'Contact forecast')}
            onUpload={() => setImporting(true)}
          />
        </div>
      )}
      {ward && (
        <div className={styles.panel}>
          <WardDemandEditor
            saved={ward}
            shiftTypes={shiftTypes.data}
            skills={skills.data}
            saving={save.isPending}
            error={save.error}
            onSave={(value) => put({ contactCentre: d.contactCentre, ward: value }, 'Patients and ratios')}
          />
        </div>
      )}
      {(d.contactCentre || d.ward) && (
        <div className={styles.panel}>
          <DemandPeriodsList unit={unit} />
        </div>
      )}
      {importing && (
        <CsvImportDialog
          title={`Upload the contact forecast of ${unit.name}`}
          columns={DEMAND_CSV_COLUMNS}
          help={
            d.contactCentre
              ? `day is a weekday (Mon … Sun) for the week pattern or a date YYYY-MM-DD for one day; start is HH:mm on a ${d.contactCentre.intervalMinutes}-minute boundary; aht is in seconds. Weekday rows replace the whole week pattern; date rows replace those dates.`
              : 'Save the contact forecast settings (interval, service target) first.'
          }
          send={(csv, dryRun) => importContactsCsv(unit.id, csv, dryRun)}
          onImported={(saved) => {
            void demand.refetch().then(() => setRevision((r) => r + 1));
            notify(`Imported ${saved} forecast row${saved === 1 ? '' : 's'}`);
            setImporting(false);
          }}
          onClose={() => setImporting(false)}
        />
      )}
    </>
  );
}
