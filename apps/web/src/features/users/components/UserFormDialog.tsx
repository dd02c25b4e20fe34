import { useState, type FormEvent } from 'react';
import {
  Dialog,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  Field,
  Input,
  makeStyles,
  Select,
  tokens,
} from '@fluentui/react-components';
import { ROLES, isUnitScoped, type Role, type UnitDto, type UserDto } from '@rotaplex/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { formErrors } from '@/api/errors';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { useNotify } from '@/ui/notify';
import { ROLE_LABELS, ROLE_SUMMARIES } from '@/features/auth/roleText';
import { UnitCheckboxes } from '@/features/units/components/UnitCheckboxes';
import { inviteUser, updateUser, userKeys } from '@/features/users/api/users.queries';
import { FormDialogActions } from '@/ui/FormDialogActions';

const useStyles = makeStyles({
  content: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
});

const FIELDS = ['email', 'displayName', 'role', 'unitIds'] as const;

export interface UserFormDialogProps {
  /** The person to edit; without one the dialog invites a new person. */
  user?: UserDto;
  units: readonly UnitDto[];
  open: boolean;
  onClose: () => void;
}

export function UserFormDialog({ user, units, open, onClose }: UserFormDialogProps) {
  const styles = useStyles();
  const notify = useNotify();
  const queryClient = useQueryClient();
  const [email, setEmail] = useState(user?.email ?? '');
  const [displayName, setDisplayName] = useState(user?.displayName ?? '');
  const [role, setRole] = useState<Role>(user?.role ?? 'staff');
  const [unitIds, setUnitIds] = useState<string[]>(user?.unitIds ?? []);
  const [unitsError, setUnitsError] = useState<string>();

  const mutation = useMutation({
    mutationFn: () =>
      user
        ? updateUser(user.id, { displayName: displayName.trim(), role, unitIds })
        : inviteUser({ email: email.trim(), displayName: displayName.trim(), role, unitIds }),
    onSuccess: async (saved) => {
      await queryClient.invalidateQueries({ queryKey: userKeys.all });
      notify(user ? `Saved changes to ${saved.displayName}` : `Invitation sent to ${saved.email}`);
      onClose();
    },
  });
  const errors = formErrors(mutation.error, FIELDS);

  const handleSubmit = (event: FormEvent) => {
    event.preventDefault();
    if (isUnitScoped(role) && unitIds.length === 0) {
      setUnitsError(`A ${ROLE_LABELS[role].toLowerCase()} belongs to at least one unit.`);
      return;
    }
    setUnitsError(undefined);
    mutation.mutate();
  };

  const title = user ? `Edit ${user.displayName}` : 'Invite a person';
  return (
    <Dialog open={open} onOpenChange={(_, data) => !data.open && onClose()}>
      <DialogSurface aria-describedby={undefined}>
        <form onSubmit={handleSubmit} noValidate>
          <DialogBody>
            <DialogTitle>{title}</DialogTitle>
            <DialogContent className={styles.content}>
              <ErrorBanner messages={errors.general} />
              {user ? (
                <Field
                  label="E-mail address"
                  hint="The address cannot be changed; invite the person again instead."
                >
                  <Input value={user.email} readOnly />
                </Field>
              ) : (
                <Field
                  label="E-mail address"
                  required
                  hint="The invitation goes here; the link works once and expires after 7 days."
                  validationMessage={errors.fields.email}
                  validationState={errors.fields.email ? 'error' : 'none'}
                >
                  <Input
                    type="email"
                    autoComplete="off"
                    value={email}
                    onChange={(_, d) => setEmail(d.value)}
                  />
                </Field>
              )}
              <Field
                label="Full name"
                required
                validationMessage={errors.fields.displayName}
                validationState={errors.fields.displayName ? 'error' : 'none'}
              >
                <Input autoComplete="off" value={displayName} onChange={(_, d) => setDisplayName(d.value)} />
              </Field>
              <Field
                label="Role"
                required
                hint={ROLE_SUMMARIES[role]}
                validationMessage={errors.fields.role}
                validationState={errors.fields.role ? 'error' : 'none'}
              >
                <Select value={role} onChange={(_, d) => setRole(d.value as Role)}>
                  {ROLES.map((r) => (
                    <option key={r} value={r}>
                      {ROLE_LABELS[r]}
                    </option>
                  ))}
                </Select>
              </Field>
              <UnitCheckboxes
                units={units}
                value={unitIds}
                onChange={setUnitIds}
                hint={
                  isUnitScoped(role)
                    ? 'Managers plan these units; staff work in them.'
                    : 'Administrators see every unit; units here are for information.'
                }
                error={unitsError ?? errors.fields.unitIds}
              />
            </DialogContent>
            <FormDialogActions
              pending={mutation.isPending}
              onCancel={onClose}
              submitLabel={user ? 'Save changes' : 'Send invitation'}
            />
          </DialogBody>
        </form>
      </DialogSurface>
    </Dialog>
  );
}
