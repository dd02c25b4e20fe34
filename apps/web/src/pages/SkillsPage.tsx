import { useState } from 'react';
import {
  Button,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
} from '@fluentui/react-components';
import { AddRegular, DeleteRegular, EditRegular, RibbonRegular } from '@fluentui/react-icons';
import type { SkillDto } from '@rotaplex/contracts';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { deleteSkill, planningKeys, skillsQuery } from '@/features/planning/api/planning.queries';
import { usePlanningStyles } from '@/features/planning/components/planningStyles';
import { RowActions } from '@/features/planning/components/RowActions';
import { SkillFormDialog } from '@/features/planning/components/SkillFormDialog';
import { ConfirmDialog } from '@/ui/ConfirmDialog';
import { EmptyState } from '@/ui/EmptyState';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { TableSkeleton } from '@/ui/LoadingState';
import { useNotify } from '@/ui/notify';
import { PageHeader } from '@/ui/PageHeader';

export function SkillsPage() {
  const styles = usePlanningStyles();
  const skills = useQuery(skillsQuery());
  const [editing, setEditing] = useState<SkillDto | 'new' | null>(null);
  const [removing, setRemoving] = useState<SkillDto | null>(null);
  const notify = useNotify();
  const queryClient = useQueryClient();
  const removal = useMutation({
    mutationFn: (s: SkillDto) => deleteSkill(s.id),
    onSuccess: async (_, s) => {
      await queryClient.invalidateQueries({ queryKey: planningKeys.skills });
      notify(`Removed skill ${s.code}`);
      setRemoving(null);
    },
  });
  const list = skills.data;
  return (
    <>
      <PageHeader
        title="Skills"
        description="Qualifications and languages that cover needs can ask for. Skills are shared by every unit."
        actions={
          <Button appearance="primary" icon={<AddRegular />} onClick={() => setEditing('new')}>
            New skill
          </Button>
        }
      />
      <section className={styles.panel} aria-label="Skills">
        {skills.isError && <ErrorBanner error={skills.error} onRetry={() => void skills.refetch()} />}
        {skills.isPending && <TableSkeleton label="Loading skills" />}
        {list && list.length === 0 && (
          <EmptyState icon={<RibbonRegular />} title="No skills yet">
            Add the skills a shift needs, for example a registered nurse or a spoken language.
          </EmptyState>
        )}
        {list && list.length > 0 && (
          <Table aria-label="Skills">
            <TableHeader>
              <TableRow>
                <TableHeaderCell>Code</TableHeaderCell>
                <TableHeaderCell>Name</TableHeaderCell>
                <TableHeaderCell>Registered</TableHeaderCell>
                <TableHeaderCell className={styles.actionsCol}>
                  <span className="visually-hidden">Actions</span>
                </TableHeaderCell>
              </TableRow>
            </TableHeader>
            <TableBody>
              {list.map((s) => (
                <TableRow key={s.id}>
                  <TableCell>{s.code}</TableCell>
                  <TableCell>{s.name}</TableCell>
                  <TableCell>{s.registered ? 'Yes: checked for red flags' : 'No'}</TableCell>
                  <TableCell>
                    <RowActions
                      name={`${s.code} ${s.name}`}
                      actions={[
                        { label: 'Edit', icon: <EditRegular />, onClick: () => setEditing(s) },
                        {
                          label: 'Remove',
                          icon: <DeleteRegular />,
                          onClick: () => {
                            removal.reset();
                            setRemoving(s);
                          },
                        },
                      ]}
                    />
                  </TableCell>
                </TableRow>
              ))}
            </TableBody>
          </Table>
        )}
      </section>
      {editing && (
        <SkillFormDialog skill={editing === 'new' ? undefined : editing} onClose={() => setEditing(null)} />
      )}
      {removing && (
        <ConfirmDialog
          open
          title={`Remove skill ${removing.code}?`}
          confirmLabel="Remove"
          pending={removal.isPending}
          error={removal.error}
          onConfirm={() => removal.mutate(removing)}
          onCancel={() => setRemoving(null)}
        >
          {`${removing.name} will no longer be offered. A skill that staff or cover needs still use cannot be removed.`}
        </ConfirmDialog>
      )}
    </>
  );
}
