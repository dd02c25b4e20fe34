import { useState, type FormEvent } from 'react';
import {
  Checkbox,
  Dialog,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  Field,
  Input,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { SKILL_CODE_PATTERN, type SkillDto } from '@rotaplex/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { formErrors } from '@/api/errors';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { useNotify } from '@/ui/notify';
import { createSkill, planningKeys, updateSkill } from '@/features/planning/api/planning.queries';
import { FormDialogActions } from '@/ui/FormDialogActions';

const useStyles = makeStyles({
  content: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalM,
    // A scrolling dialog must not squeeze its messages into each other.
    '& > *': { flexShrink: 0 },
  },
});

const FIELDS = ['code', 'name', 'registered'] as const;

export interface SkillFormDialogProps {
  skill?: SkillDto;
  onClose: () => void;
}

export function SkillFormDialog({ skill, onClose }: SkillFormDialogProps) {
  const styles = useStyles();
  const notify = useNotify();
  const queryClient = useQueryClient();
  const [code, setCode] = useState(skill?.code ?? '');
  const [name, setName] = useState(skill?.name ?? '');
  const [registered, setRegistered] = useState(skill?.registered ?? false);
  const [local, setLocal] = useState<Partial<Record<(typeof FIELDS)[number], string>>>({});

  const mutation = useMutation({
    mutationFn: () => {
      const body = { code: code.trim().toUpperCase(), name: name.trim(), registered };
      return skill ? updateSkill(skill.id, body) : createSkill(body);
    },
    onSuccess: async (saved) => {
      await queryClient.invalidateQueries({ queryKey: planningKeys.skills });
      notify(skill ? `Saved skill ${saved.code}` : `Added skill ${saved.code}`);
      onClose();
    },
  });
  const server = formErrors(mutation.error, FIELDS);
  const error = (f: (typeof FIELDS)[number]) => local[f] ?? server.fields[f];

  const handleSubmit = (event: FormEvent) => {
    event.preventDefault();
    const errors: typeof local = {};
    if (!SKILL_CODE_PATTERN.test(code.trim().toUpperCase()))
      errors.code = 'Use 1 to 16 capital letters, digits, "-" or "_", for example RN.';
    if (!name.trim()) errors.name = 'Give the skill a name.';
    setLocal(errors);
    if (Object.keys(errors).length === 0) mutation.mutate();
  };

  return (
    <Dialog open onOpenChange={(_, d) => !d.open && onClose()}>
      <DialogSurface aria-describedby={undefined}>
        <form onSubmit={handleSubmit} noValidate>
          <DialogBody>
            <DialogTitle>{skill ? `Edit skill ${skill.code}` : 'New skill'}</DialogTitle>
            <DialogContent className={styles.content}>
              <ErrorBanner messages={server.general} />
              <Field
                label="Code"
                required
                hint="Short, used in CSV files and on the roster, e.g. RN or FR."
                validationMessage={error('code')}
                validationState={error('code') ? 'error' : 'none'}
              >
                <Input
                  value={code}
                  maxLength={16}
                  autoComplete="off"
                  onChange={(_, d) => setCode(d.value.toUpperCase())}
                />
              </Field>
              <Field
                label="Name"
                required
                validationMessage={error('name')}
                validationState={error('name') ? 'error' : 'none'}
              >
                <Input value={name} autoComplete="off" onChange={(_, d) => setName(d.value)} />
              </Field>
              <Field
                hint={
                  'Shifts that need this skill are checked for the red flags of safe staffing (NICE SG1): ' +
                  'fewer than 2 on a shift that needs 2 or more, or a shortfall of more than 8 hours or 25%.'
                }
                validationMessage={error('registered')}
                validationState={error('registered') ? 'error' : 'none'}
              >
                <Checkbox
                  checked={registered}
                  onChange={(_, d) => setRegistered(d.checked === true)}
                  label="Registered (licensed) professional skill, such as registered nurse"
                />
              </Field>
            </DialogContent>
            <FormDialogActions
              pending={mutation.isPending}
              onCancel={onClose}
              submitLabel={skill ? 'Save changes' : 'Create skill'}
            />
          </DialogBody>
        </form>
      </DialogSurface>
    </Dialog>
  );
}
