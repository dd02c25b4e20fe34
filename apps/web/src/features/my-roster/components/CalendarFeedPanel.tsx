import { useState } from 'react';
import {
  Body1,
  Button,
  Caption1,
  Field,
  Input,
  makeStyles,
  Subtitle1,
  tokens,
} from '@fluentui/react-components';
import { ArrowSyncRegular, CopyRegular } from '@fluentui/react-icons';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { ConfirmDialog } from '@/ui/ConfirmDialog';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { useNotify } from '@/ui/notify';
import { useSurfaceStyles } from '@/ui/surfaceStyles';
import { calendarFeedQuery, myRosterKeys, regenerateCalendarFeed } from '../api/myRoster.queries';

const useStyles = makeStyles({
  row: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS, alignItems: 'flex-end' },
  url: { flexGrow: 1, minWidth: '16rem' },
  muted: { color: tokens.colorNeutralForeground3 },
});

/** The secret address of my iCalendar feed, to paste into a calendar program; copy and regenerate. */
export function CalendarFeedPanel() {
  const styles = useStyles();
  const surface = useSurfaceStyles();
  const notify = useNotify();
  const client = useQueryClient();
  const feed = useQuery(calendarFeedQuery());
  const [confirming, setConfirming] = useState(false);
  const regenerate = useMutation({
    mutationFn: regenerateCalendarFeed,
    onSuccess: (data) => {
      client.setQueryData(myRosterKeys.feed(), data);
      setConfirming(false);
      notify('New feed address made; the old one no longer works');
    },
  });

  const handleCopy = async () => {
    if (!feed.data) return;
    try {
      await navigator.clipboard.writeText(feed.data.url);
      notify('Feed address copied');
    } catch {
      notify('Could not copy: select the address and copy it yourself', 'warning');
    }
  };

  return (
    <section className={surface.panel} aria-labelledby="calendar-feed-title">
      <Subtitle1 as="h2" id="calendar-feed-title">
        Calendar feed
      </Subtitle1>
      <Body1>
        Subscribe to this address in your calendar program to see your published shifts there. Changes to the
        roster reach your calendar when it next refreshes the feed.
      </Body1>
      <ErrorBanner error={feed.error} onRetry={() => void feed.refetch()} />
      <div className={styles.row}>
        <Field label="Feed address" className={styles.url}>
          <Input
            readOnly
            value={feed.data?.url ?? ''}
            placeholder={feed.isPending ? 'Loading…' : ''}
            onFocus={(e) => e.currentTarget.select()}
          />
        </Field>
        <Button icon={<CopyRegular />} disabled={!feed.data} onClick={() => void handleCopy()}>
          Copy
        </Button>
        <Button icon={<ArrowSyncRegular />} disabled={!feed.data} onClick={() => setConfirming(true)}>
          Regenerate
        </Button>
      </div>
      <Caption1 className={styles.muted}>
        Anyone with this address can see your shifts. If it has been shared by mistake, regenerate it.
      </Caption1>
      <ConfirmDialog
        open={confirming}
        title="Make a new feed address?"
        confirmLabel="Regenerate"
        pending={regenerate.isPending}
        error={regenerate.error}
        onConfirm={() => regenerate.mutate()}
        onCancel={() => {
          setConfirming(false);
          regenerate.reset();
        }}
      >
        The current address stops working at once. Calendars subscribed to it need the new one.
      </ConfirmDialog>
    </section>
  );
}
