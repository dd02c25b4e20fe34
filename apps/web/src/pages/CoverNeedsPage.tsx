import { useState } from 'react';
import { Button, Subtitle1 } from '@fluentui/react-components';
import { ArrowUploadRegular, ClockRegular } from '@fluentui/react-icons';
import { COVER_CSV_COLUMNS, type UnitDto } from '@rotaplex/contracts';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { PATHS } from '@/app/paths';
import {
  coverNeedsQuery,
  importCoverCsv,
  planningKeys,
  shiftTypesQuery,
  skillsQuery,
} from '@/features/planning/api/planning.queries';
import { CoverOverrides } from '@/features/planning/components/CoverOverrides';
import { CoverPatternGrid } from '@/features/planning/components/CoverPatternGrid';
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

export function CoverNeedsPage() {
  const styles = usePlanningStyles();
  const selected = useSelectedUnit();
  const [importing, setImporting] = useState(false);
  // Bumped after a CSV import so the grid starts again from the saved pattern.
  const [revision, setRevision] = useState(0);
  return (
    <>
      <PageHeader
        title="Cover needs"
        description="How many people each shift needs, with which skill: a minimum that must be met and a target to aim for, for each day of the week, with overrides for single dates."
        actions={
          selected.unit && (
            <Button icon={<ArrowUploadRegular />} onClick={() => setImporting(true)}>
              Upload CSV
            </Button>
          )
        }
      />
      <UnitScope selected={selected}>
        {(unit) => (
          <div className={styles.stack}>
            <div className={styles.toolbar}>
              <UnitPicker units={selected.units} value={unit.id} onChange={selected.setUnitId} />
            </div>
            <CoverOfUnit key={unit.id} unit={unit} revision={revision} />
          </div>
        )}
      </UnitScope>
      {importing && selected.unit && (
        <CoverImport
          unit={selected.unit}
          onImported={() => setRevision((r) => r + 1)}
          onClose={() => setImporting(false)}
        />
      )}
    </>
  );
}

function CoverImport({
  unit,
  onImported,
  onClose,
}: {
  unit: UnitDto;
  onImported: () => void;
  onClose: () => void;
}) {
  const queryClient = useQueryClient();
  const notify = useNotify();
  return (
    <CsvImportDialog
      title={`Upload cover needs of ${unit.name}`}
      columns={COVER_CSV_COLUMNS}
      help="day is a weekday (Mon, Tue, …) for the weekly pattern or a date YYYY-MM-DD for an override; shift is a shift type code; skill is a skill code or empty. Pattern rows replace the whole weekly pattern."
      send={(csv, dryRun) => importCoverCsv(unit.id, csv, dryRun)}
      onImported={(saved) => {
        void queryClient.invalidateQueries({ queryKey: planningKeys.coverNeeds(unit.id) }).then(onImported);
        notify(`Imported ${saved} cover need${saved === 1 ? '' : 's'}`);
        onClose();
      }}
      onClose={onClose}
    />
  );
}

function CoverOfUnit({ unit, revision }: { unit: UnitDto; revision: number }) {
  const styles = usePlanningStyles();
  const needs = useQuery(coverNeedsQuery(unit.id));
  const shiftTypes = useQuery(shiftTypesQuery(unit.id));
  const skills = useQuery(skillsQuery());
  const failed = needs.error ?? shiftTypes.error ?? skills.error;
  if (failed)
    return (
      <ErrorBanner
        error={failed}
        onRetry={() => {
          void needs.refetch();
          void shiftTypes.refetch();
          void skills.refetch();
        }}
      />
    );
  if (!needs.data || !shiftTypes.data || !skills.data) return <LoadingState label="Loading cover needs" />;
  if (shiftTypes.data.length === 0)
    return (
      <EmptyState icon={<ClockRegular />} title={`${unit.name} has no shift types yet`}>
        Cover needs are set per shift type.{' '}
        <AppLink to={`${PATHS.shiftTypes}?unit=${unit.id}`}>Add shift types</AppLink> first.
      </EmptyState>
    );
  return (
    <>
      <section className={styles.panel} aria-labelledby="weekly-pattern">
        <Subtitle1 as="h2" id="weekly-pattern">
          Weekly pattern
        </Subtitle1>
        <CoverPatternGrid
          key={revision}
          unitId={unit.id}
          needs={needs.data}
          shiftTypes={shiftTypes.data}
          skills={skills.data}
        />
      </section>
      <section className={styles.panel} aria-labelledby="date-overrides">
        <Subtitle1 as="h2" id="date-overrides">
          Date overrides
        </Subtitle1>
        <CoverOverrides
          unitId={unit.id}
          overrides={needs.data.overrides}
          shiftTypes={shiftTypes.data}
          skills={skills.data}
        />
      </section>
    </>
  );
}
