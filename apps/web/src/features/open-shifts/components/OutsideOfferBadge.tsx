import { Badge, Caption1, makeStyles, tokens } from '@fluentui/react-components';
import type { OutsideOfferDto } from '@rotaplex/contracts';

const useStyles = makeStyles({
  wrap: { display: 'inline-flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalXS, alignItems: 'center' },
  muted: { color: tokens.colorNeutralForeground3 },
  badge: { whiteSpace: 'nowrap' },
});

export interface OutsideOfferBadgeProps {
  offer: OutsideOfferDto | null | undefined;
}

/** "Offered outside the roster" (to whom, for managers), or how many outside staff fill it. */
export function OutsideOfferBadge({ offer }: OutsideOfferBadgeProps) {
  const styles = useStyles();
  if (!offer || offer.status === 'withdrawn') return null;
  const filled = offer.status === 'filled';
  return (
    <span className={styles.wrap} data-testid="outside-offer">
      <Badge className={styles.badge} appearance="tint" color={filled ? 'success' : 'informative'}>
        {filled ? `${offer.people ?? 0} filled outside the roster` : 'Offered outside the roster'}
      </Badge>
      {offer.offeredTo ? <Caption1 className={styles.muted}>to {offer.offeredTo}</Caption1> : null}
    </span>
  );
}
