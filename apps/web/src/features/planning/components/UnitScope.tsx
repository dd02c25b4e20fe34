import type { ReactNode } from 'react';
import { GridRegular } from '@fluentui/react-icons';
import type { UnitDto } from '@rotaplex/contracts';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { LoadingState } from '@/ui/LoadingState';
import type { SelectedUnit } from '@/features/planning/hooks/useSelectedUnit';

export interface UnitScopeProps {
  selected: SelectedUnit;
  children: (unit: UnitDto) => ReactNode;
}

/** Loading, error and "no unit" states shared by the per-unit planning screens; renders children for the unit. */
export function UnitScope({ selected, children }: UnitScopeProps) {
  if (selected.error) return <ErrorBanner error={selected.error} onRetry={selected.refetch} />;
  if (selected.isPending) return <LoadingState label="Loading units" />;
  if (!selected.unit)
    return (
      <EmptyState icon={<GridRegular />} title="No unit to plan">
        You do not plan any unit yet. An administrator adds units and gives managers their units.
      </EmptyState>
    );
  return <>{children(selected.unit)}</>;
}
