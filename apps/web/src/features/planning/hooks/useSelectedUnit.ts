import type { UnitDto } from '@rotaplex/contracts';
import { useQuery } from '@tanstack/react-query';
import { useSearchParams } from 'react-router-dom';
import { unitsQuery } from '@/features/units/api/units.queries';

export interface SelectedUnit {
  units: readonly UnitDto[];
  /** The chosen unit, or undefined while loading or when the caller has none. */
  unit: UnitDto | undefined;
  unitId: string;
  setUnitId: (id: string) => void;
  isPending: boolean;
  error: unknown;
  refetch: () => void;
}

/**
 * The unit a per-unit planning screen works on, kept in the address (?unit=) so a link or a reload
 * returns to it. Defaults to the first unit the caller may see.
 */
export function useSelectedUnit(): SelectedUnit {
  const units = useQuery(unitsQuery());
  const [search, setSearch] = useSearchParams();
  const list = units.data ?? [];
  const wanted = search.get('unit');
  const unit = list.find((u) => u.id === wanted) ?? list[0];
  return {
    units: list,
    unit,
    unitId: unit?.id ?? '',
    setUnitId: (id) => setSearch(new URLSearchParams({ unit: id }), { replace: true }),
    isPending: units.isPending,
    error: units.error,
    refetch: () => void units.refetch(),
  };
}
