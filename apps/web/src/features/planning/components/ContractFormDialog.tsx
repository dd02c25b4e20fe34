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
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Select,
  tokens,
} from '@fluentui/react-components';
import {
  CONTRACT_PRESETS,
  contractCautions,
  GUARD_RAIL_DEFERRAL,
  type ContractDto,
  type ContractPresetDto,
  type ContractRules,
  type UnitDto,
} from '@rotaplex/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { formErrors } from '@/api/errors';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { useNotify } from '@/ui/notify';
import { createContract, planningKeys, updateContract } from '@/features/planning/api/planning.queries';
import {
  formatPerTypeLimits,
  loosenedRestRules,
  parsePerTypeLimits,
  RULE_HELP,
  ruleInputs,
  rulesFromInputs,
  type RuleInputs,
} from '@/features/planning/utils/contractRules';
import { WorkingTimeCaution } from './WorkingTimeCaution';
import { FormDialogActions } from '@/ui/FormDialogActions';

const useStyles = makeStyles({
  surface: { maxWidth: '52rem', width: '100%' },
  content: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalM,
    // A scrolling dialog must not squeeze its messages into each other.
    '& > *': { flexShrink: 0 },
  },
  rules: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(18rem, 1fr))',
    gap: tokens.spacingHorizontalL,
    rowGap: tokens.spacingVerticalM,
  },
  basis: { color: tokens.colorNeutralForeground3 },
});

const ORG = 'organisation';

export interface ContractFormDialogProps {
  /** The contract to edit. */
  contract?: ContractDto;
  /** The preset a new contract starts from. */
  preset?: ContractPresetDto;
  units: readonly UnitDto[];
  /** Admins may write organisation-wide contracts; managers only their units'. */
  mayWriteOrganisation: boolean;
  onClose: () => void;
}

export function ContractFormDialog({
  contract,
  preset,
  units,
  mayWriteOrganisation,
  onClose,
}: ContractFormDialogProps) {
  const styles = useStyles();
  const notify = useNotify();
  const queryClient = useQueryClient();
  // What loosening a rest rule is measured against: the saved contract, the preset, or the EU preset.
  const baseline: ContractRules = contract ?? preset?.rules ?? CONTRACT_PRESETS[0].rules;
  const [name, setName] = useState(contract?.name ?? preset?.name ?? '');
  const [scope, setScope] = useState<string>(
    contract ? (contract.unitId ?? ORG) : mayWriteOrganisation ? ORG : (units[0]?.id ?? ''),
  );
  const [inputs, setInputs] = useState<RuleInputs>(ruleInputs(contract ?? preset?.rules ?? {}));
  const [perType, setPerType] = useState(
    formatPerTypeLimits(contract?.maxShiftsPerType ?? preset?.rules.maxShiftsPerType ?? null),
  );
  const [nameError, setNameError] = useState<string>();
  const parsed = rulesFromInputs(inputs);
  const perTypeParsed = parsePerTypeLimits(perType);
  const loosened = loosenedRestRules(parsed.rules, baseline);
  const outside = contractCautions(parsed.rules);
  const loosenedFields = new Set(loosened.map((r) => r.field));
  const baselineName = contract
    ? 'the saved rules'
    : preset
      ? 'the preset'
      : 'the EU Working Time Directive preset';

  const mutation = useMutation({
    mutationFn: () => {
      const rules = { ...parsed.rules, maxShiftsPerType: perTypeParsed.limits };
      if (contract) return updateContract(contract.id, { name: name.trim(), ...rules });
      return createContract({ name: name.trim(), unitId: scope === ORG ? null : scope, ...rules });
    },
    onSuccess: async (saved) => {
      await queryClient.invalidateQueries({ queryKey: planningKeys.contracts });
      notify(contract ? `Saved contract ${saved.name}` : `Created contract ${saved.name}`);
      onClose();
    },
  });
  const fields = ['name', 'unitId', 'maxShiftsPerType', ...RULE_HELP.map((r) => r.field)] as const;
  const server = formErrors(mutation.error, fields);

  const handleSubmit = (event: FormEvent) => {
    event.preventDefault();
    const missing = name.trim() ? undefined : 'Give the contract a name.';
    setNameError(missing);
    if (!missing && Object.keys(parsed.errors).length === 0 && !perTypeParsed.error) mutation.mutate();
  };

  const title = contract
    ? `Edit contract ${contract.name}`
    : preset
      ? `New contract from a preset`
      : 'New contract';
  return (
    <Dialog open onOpenChange={(_, d) => !d.open && onClose()}>
      <DialogSurface className={styles.surface} aria-describedby={undefined}>
        <form onSubmit={handleSubmit} noValidate>
          <DialogBody>
            <DialogTitle>{title}</DialogTitle>
            <DialogContent className={styles.content}>
              <WorkingTimeCaution />
              {preset && <span className={styles.basis}>{preset.basis}</span>}
              <ErrorBanner messages={server.general} />
              <Field
                label="Name"
                required
                validationMessage={nameError ?? server.fields.name}
                validationState={(nameError ?? server.fields.name) ? 'error' : 'none'}
              >
                <Input value={name} autoComplete="off" onChange={(_, d) => setName(d.value)} />
              </Field>
              <Field
                label="Applies to"
                hint={
                  contract
                    ? 'Where a contract applies cannot be changed.'
                    : 'Organisation-wide contracts serve every unit; only administrators write them.'
                }
                validationMessage={server.fields.unitId}
                validationState={server.fields.unitId ? 'error' : 'none'}
              >
                <Select value={scope} disabled={!!contract} onChange={(_, d) => setScope(d.value)}>
                  {(mayWriteOrganisation || scope === ORG) && (
                    <option value={ORG}>The whole organisation</option>
                  )}
                  {units.map((u) => (
                    <option key={u.id} value={u.id}>
                      {u.name}
                    </option>
                  ))}
                </Select>
              </Field>
              <div className={styles.rules}>
                {RULE_HELP.map((r) => {
                  const error = parsed.errors[r.field] ?? server.fields[r.field];
                  const looser = !error && loosenedFields.has(r.field);
                  return (
                    <Field
                      key={r.field}
                      label={r.label}
                      hint={`${r.help} Leave empty for no such rule.`}
                      validationMessage={
                        error ?? (looser ? `Looser than ${baselineName}: a fatigue risk.` : undefined)
                      }
                      validationState={error ? 'error' : looser ? 'warning' : 'none'}
                    >
                      <Input
                        inputMode="decimal"
                        value={inputs[r.field]}
                        contentAfter={r.unit === 'hours' ? 'h' : undefined}
                        onChange={(_, d) => setInputs((prev) => ({ ...prev, [r.field]: d.value }))}
                      />
                    </Field>
                  );
                })}
                <Field
                  label="Most shifts of a type a week"
                  hint='Shift type codes with a number, e.g. "N 2; L 5" (N 0: never nights). Leave empty for no limit.'
                  validationMessage={perTypeParsed.error ?? server.fields.maxShiftsPerType}
                  validationState={(perTypeParsed.error ?? server.fields.maxShiftsPerType) ? 'error' : 'none'}
                >
                  <Input value={perType} autoComplete="off" onChange={(_, d) => setPerType(d.value)} />
                </Field>
              </div>
              {loosened.length > 0 && (
                <MessageBar intent="warning" layout="multiline" role="alert">
                  <MessageBarBody>
                    <MessageBarTitle>Fatigue warning</MessageBarTitle>
                    {`This contract loosens ${loosened.map((r) => r.label.toLowerCase()).join(', ')} against ${
                      contract
                        ? 'its saved rules'
                        : preset
                          ? 'the preset'
                          : 'the EU Working Time Directive preset'
                    }. Shorter rest and longer runs of work raise the risk of fatigue and error; check local law and agreements first.`}
                  </MessageBarBody>
                </MessageBar>
              )}
              {outside.length > 0 && (
                <MessageBar intent="warning" layout="multiline">
                  <MessageBarBody>
                    <MessageBarTitle>Outside the working-time presets</MessageBarTitle>
                    <ul aria-label="Limits outside the working-time presets">
                      {outside.map((text) => (
                        <li key={text}>{text}</li>
                      ))}
                    </ul>
                    {GUARD_RAIL_DEFERRAL}
                  </MessageBarBody>
                </MessageBar>
              )}
            </DialogContent>
            <FormDialogActions
              pending={mutation.isPending}
              onCancel={onClose}
              submitLabel={contract ? 'Save changes' : 'Create contract'}
            />
          </DialogBody>
        </form>
      </DialogSurface>
    </Dialog>
  );
}
