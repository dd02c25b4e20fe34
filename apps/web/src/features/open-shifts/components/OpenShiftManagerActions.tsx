import { useState } from 'react';
import { Button, Field, Input, makeStyles, tokens } from '@fluentui/react-components';
import type { OpenShiftDto } from '@rotaplex/contracts';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { swapKeys } from '@/features/swaps/api/swaps.queries';
import { dayLabel } from '@/features/swaps/utils/swapText';
import { ConfirmDialog } from '@/ui/ConfirmDialog';
import { useNotify } from '@/ui/notify';
import { fillOutsideOffer, withdrawOutsideOffer } from '../api/openShifts.queries';
import { OutsideOfferDialog } from './OutsideOfferDialog';
import { WhatItWouldTakeDialog } from './WhatItWouldTakeDialog';

const useStyles = makeStyles({
  row: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalXS },
});

export interface OpenShiftManagerActionsProps {
  openShift: OpenShiftDto;
}

type Open = 'what' | 'offer' | 'fill' | 'withdraw' | null;

/**
 * A manager's actions on one open shift beyond the e-mail: what it would take (which rule for whom),
 * offer it outside the roster, and for a current offer mark it filled or withdraw it.
 */
export function OpenShiftManagerActions({ openShift: o }: OpenShiftManagerActionsProps) {
  const styles = useStyles();
  const notify = useNotify();
  const queryClient = useQueryClient();
  const [open, setOpen] = useState<Open>(null);
  const [people, setPeople] = useState(String(o.short));
  const offer = o.outsideOffer && o.outsideOffer.status !== 'withdrawn' ? o.outsideOffer : null;
  const refresh = () => queryClient.invalidateQueries({ queryKey: swapKeys.openShifts() });
  const fill = useMutation({
    mutationFn: () => fillOutsideOffer(offer!.id, { people: Number(people) }),
    onSuccess: async (r) => {
      await refresh();
      notify(`Marked filled: ${r.people} from ${r.offeredTo}`, 'success');
      setOpen(null);
    },
  });
  const withdraw = useMutation({
    mutationFn: () => withdrawOutsideOffer(offer!.id),
    onSuccess: async () => {
      await refresh();
      notify('Offer withdrawn: the shift is open on the roster only', 'success');
      setOpen(null);
    },
  });
  const label = `${o.shiftName} on ${dayLabel(o.date)}${o.skillCode ? `, ${o.skillCode}` : ''}`;
  return (
    <span className={styles.row}>
      <Button size="small" onClick={() => setOpen('what')} aria-label={`What it would take: ${label}`}>
        What it would take
      </Button>
      {offer?.status === 'offered' ? (
        <>
          <Button size="small" onClick={() => setOpen('fill')} aria-label={`Mark filled: ${label}`}>
            Mark filled
          </Button>
          <Button size="small" appearance="subtle" onClick={() => setOpen('withdraw')}>
            Withdraw offer
          </Button>
        </>
      ) : null}
      {open === 'what' ? (
        <WhatItWouldTakeDialog
          openShift={o}
          onClose={() => setOpen(null)}
          onOfferOutside={offer ? undefined : () => setOpen('offer')}
        />
      ) : null}
      {open === 'offer' ? <OutsideOfferDialog openShift={o} onClose={() => setOpen(null)} /> : null}
      {offer ? (
        <>
          <ConfirmDialog
            open={open === 'fill'}
            title="Filled outside the roster?"
            confirmLabel="Mark filled"
            pending={fill.isPending}
            error={fill.error}
            onConfirm={() => fill.mutate()}
            onCancel={() => setOpen(null)}
          >
            <Field
              label={`People from ${offer.offeredTo} who will work it`}
              hint={`${o.short} still wanted. The shift counts that many fewer open; the roster itself stays as published.`}
            >
              <Input
                type="number"
                min={1}
                max={o.short}
                value={people}
                onChange={(_, d) => setPeople(d.value)}
              />
            </Field>
          </ConfirmDialog>
          <ConfirmDialog
            open={open === 'withdraw'}
            title="Withdraw the offer?"
            confirmLabel="Withdraw offer"
            pending={withdraw.isPending}
            error={withdraw.error}
            onConfirm={() => withdraw.mutate()}
            onCancel={() => setOpen(null)}
          >
            The shift stays open on the roster; the offer to {offer.offeredTo} is kept in the audit trail as
            withdrawn.
          </ConfirmDialog>
        </>
      ) : null}
    </span>
  );
}
