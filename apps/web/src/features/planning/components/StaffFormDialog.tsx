import { useId, useState, type FormEvent } from 'react';
import {
  Caption1,
  Checkbox,
  Dialog,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  Field,
  Input,
  Label,
  makeStyles,
  Select,
  Switch,
  tokens,
} from '@fluentui/react-components';
import type { ContractDto, SkillDto, StaffMemberDto } from '@rotaplex/contracts';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { formErrors } from '@/api/errors';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { useNotify } from '@/ui/notify';
import {
  createStaffMember,
  planningKeys,
  unitUsersQuery,
  updateStaffMember,
} from '@/features/planning/api/planning.queries';
import { FormDialogActions } from '@/ui/FormDialogActions';

const useStyles = makeStyles({
  content: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalM,
    // A scrolling dialog must not squeeze its messages into each other.
    '& > *': { flexShrink: 0 },
  },
  row: { display: 'grid', gridTemplateColumns: '1fr 1fr', gap: tokens.spacingHorizontalM },
  group: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXS },
  error: { color: tokens.colorPaletteRedForeground1 },
  skills: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(12rem, 1fr))',
    columnGap: tokens.spacingHorizontalS,
  },
});

const FIELDS = ['name', 'email', 'userId', 'skills', 'contractId', 'hourlyCost', 'active'] as const;
type F = (typeof FIELDS)[number];

export interface StaffFormDialogProps {
  unitId: string;
  unitName: string;
  member?: StaffMemberDto;
  skills: readonly SkillDto[];
  /** Contracts usable in the unit (its own and organisation-wide). */
  contracts: readonly ContractDto[];
  onClose: () => void;
}

export function StaffFormDialog({
  unitId,
  unitName,
  member,
  skills,
  contracts,
  onClose,
}: StaffFormDialogProps) {
  const styles = useStyles();
  const notify = useNotify();
  const queryClient = useQueryClient();
  const [name, setName] = useState(member?.name ?? '');
  const [email, setEmail] = useState(member?.email ?? '');
  const [skillCodes, setSkillCodes] = useState<string[]>(member?.skills ?? []);
  const [contractId, setContractId] = useState(member?.contractId ?? '');
  const [cost, setCost] = useState(member?.hourlyCost === null || !member ? '' : String(member.hourlyCost));
  const [active, setActive] = useState(member?.active ?? true);
  const [userId, setUserId] = useState(member?.userId ?? '');
  const users = useQuery(unitUsersQuery(unitId));
  const skillsLabelId = useId();
  const [local, setLocal] = useState<Partial<Record<F, string>>>({});

  const mutation = useMutation({
    mutationFn: () => {
      const body = {
        name: name.trim(),
        email: email.trim() || null,
        userId: userId || null,
        skills: skillCodes,
        contractId: contractId || null,
        hourlyCost: cost.trim() === '' ? null : Number(cost.trim().replace(',', '.')),
        active,
      };
      return member ? updateStaffMember(member.id, body) : createStaffMember({ unitId, ...body });
    },
    onSuccess: async (saved) => {
      await queryClient.invalidateQueries({ queryKey: planningKeys.staff });
      notify(member ? `Saved ${saved.name}` : `Added ${saved.name} to ${unitName}`);
      onClose();
    },
  });
  const server = formErrors(mutation.error, FIELDS);
  const error = (f: F) => local[f] ?? server.fields[f];
  const state = (f: F) => (error(f) ? ('error' as const) : ('none' as const));

  const handleSubmit = (event: FormEvent) => {
    event.preventDefault();
    const errors: Partial<Record<F, string>> = {};
    if (!name.trim()) errors.name = 'Enter the person’s name.';
    if (email.trim() && !/^[^\s@]+@[^\s@]+\.[^\s@]+$/.test(email.trim()))
      errors.email = 'Enter an e-mail address like name@example.com, or leave it empty.';
    if (cost.trim() && !/^\d+([.,]\d{1,2})?$/.test(cost.trim()))
      errors.hourlyCost = 'Enter an amount such as 18.50, or leave it empty.';
    setLocal(errors);
    if (Object.keys(errors).length === 0) mutation.mutate();
  };

  const toggleSkill = (code: string, on: boolean) =>
    setSkillCodes((prev) => (on ? [...prev, code].sort() : prev.filter((c) => c !== code)));

  return (
    <Dialog open onOpenChange={(_, d) => !d.open && onClose()}>
      <DialogSurface aria-describedby={undefined}>
        <form onSubmit={handleSubmit} noValidate>
          <DialogBody>
            <DialogTitle>{member ? `Edit ${member.name}` : `Add a person to ${unitName}`}</DialogTitle>
            <DialogContent className={styles.content}>
              <ErrorBanner messages={server.general} />
              <Field label="Name" required validationMessage={error('name')} validationState={state('name')}>
                <Input value={name} autoComplete="off" onChange={(_, d) => setName(d.value)} />
              </Field>
              <Field
                label="E-mail address"
                hint="For roster notices; optional."
                validationMessage={error('email')}
                validationState={state('email')}
              >
                <Input type="email" value={email} autoComplete="off" onChange={(_, d) => setEmail(d.value)} />
              </Field>
              <Field
                label="Sign-in account"
                hint={
                  users.isError
                    ? 'The accounts of the unit could not be loaded.'
                    : 'Links the roster to the person’s own account, so they see their shifts.'
                }
                validationMessage={error('userId')}
                validationState={state('userId')}
              >
                <Select value={userId} onChange={(_, d) => setUserId(d.value)}>
                  <option value="">No account</option>
                  {(users.data ?? []).map((u) => (
                    <option key={u.id} value={u.id}>
                      {u.displayName} ({u.email})
                    </option>
                  ))}
                  {userId && users.data && !users.data.some((u) => u.id === userId) && (
                    <option value={userId}>The current account</option>
                  )}
                </Select>
              </Field>
              <div className={styles.group}>
                <Label id={skillsLabelId} weight="semibold">
                  Skills
                </Label>
                <div className={styles.skills} role="group" aria-labelledby={skillsLabelId}>
                  {skills.length === 0 && 'No skills are set up yet.'}
                  {skills.map((s) => (
                    <Checkbox
                      key={s.id}
                      label={`${s.code} · ${s.name}`}
                      checked={skillCodes.includes(s.code)}
                      onChange={(_, d) => toggleSkill(s.code, d.checked === true)}
                    />
                  ))}
                </div>
                {error('skills') && (
                  <Caption1 role="alert" className={styles.error}>
                    {error('skills')}
                  </Caption1>
                )}
              </div>
              <div className={styles.row}>
                <Field
                  label="Contract"
                  validationMessage={error('contractId')}
                  validationState={state('contractId')}
                >
                  <Select value={contractId} onChange={(_, d) => setContractId(d.value)}>
                    <option value="">No contract</option>
                    {contracts.map((c) => (
                      <option key={c.id} value={c.id}>
                        {c.name}
                      </option>
                    ))}
                  </Select>
                </Field>
                <Field
                  label="Hourly cost"
                  hint="Per paid hour, in the currency you pay in; reports add these up as cost units. Only planners see it."
                  validationMessage={error('hourlyCost')}
                  validationState={state('hourlyCost')}
                >
                  <Input inputMode="decimal" value={cost} onChange={(_, d) => setCost(d.value)} />
                </Field>
              </div>
              <Switch
                label={active ? 'On the roster (active)' : 'Not on the roster (inactive)'}
                checked={active}
                onChange={(_, d) => setActive(d.checked)}
              />
            </DialogContent>
            <FormDialogActions
              pending={mutation.isPending}
              onCancel={onClose}
              submitLabel={member ? 'Save changes' : 'Add person'}
            />
          </DialogBody>
        </form>
      </DialogSurface>
    </Dialog>
  );
}
