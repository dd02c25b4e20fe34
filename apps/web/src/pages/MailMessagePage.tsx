import {
  Body1,
  Button,
  Caption1,
  Divider,
  Link,
  makeStyles,
  Subtitle2,
  Tab,
  TabList,
  tokens,
} from '@fluentui/react-components';
import { ArrowLeftRegular, OpenRegular } from '@fluentui/react-icons';
import { useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import { PATHS } from '@/app/paths';
import { mailboxMessageQuery } from '@/features/mailbox/api/mailbox.queries';
import { linksInText, sandboxDocument } from '@/features/mailbox/messageLinks';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { LoadingState } from '@/ui/LoadingState';
import { PageHeader } from '@/ui/PageHeader';
import { useSurfaceStyles } from '@/ui/surfaceStyles';

const useStyles = makeStyles({
  back: { marginBottom: tokens.spacingVerticalM },
  meta: {
    display: 'grid',
    gridTemplateColumns: 'max-content 1fr',
    columnGap: tokens.spacingHorizontalL,
    rowGap: tokens.spacingVerticalXS,
    margin: 0,
  },
  term: { color: tokens.colorNeutralForeground3 },
  detail: { margin: 0, overflowWrap: 'anywhere' },
  links: {
    margin: 0,
    paddingLeft: tokens.spacingHorizontalXL,
    display: 'grid',
    gap: tokens.spacingVerticalXS,
  },
  link: { overflowWrap: 'anywhere' },
  frame: {
    width: '100%',
    minHeight: '28rem',
    border: `${tokens.strokeWidthThin} solid ${tokens.colorNeutralStroke2}`,
    borderRadius: tokens.borderRadiusMedium,
    backgroundColor: tokens.colorNeutralBackground1,
  },
  text: {
    margin: 0,
    whiteSpace: 'pre-wrap',
    fontFamily: tokens.fontFamilyMonospace,
    fontSize: tokens.fontSizeBase200,
    padding: tokens.spacingHorizontalM,
    backgroundColor: tokens.colorNeutralBackground3,
    borderRadius: tokens.borderRadiusMedium,
  },
});

const when = new Intl.DateTimeFormat('en-GB', { dateStyle: 'full', timeStyle: 'medium' });

export function MailMessagePage() {
  const styles = useStyles();
  const surface = useSurfaceStyles();
  const navigate = useNavigate();
  const { messageId = '' } = useParams();
  const message = useQuery(mailboxMessageQuery(messageId));
  const [view, setView] = useState<'html' | 'text'>('html');

  const data = message.data;
  const links = data ? linksInText(data.text) : [];
  const showHtml = !!data?.html && view === 'html';
  return (
    <>
      <Button
        className={styles.back}
        appearance="subtle"
        icon={<ArrowLeftRegular />}
        onClick={() => navigate(PATHS.mailbox)}
      >
        Back to mailbox
      </Button>
      {message.isPending && <LoadingState label="Loading message" />}
      {message.isError && <ErrorBanner error={message.error} onRetry={() => void message.refetch()} />}
      {data && (
        <>
          <PageHeader title={data.subject || '(no subject)'} />
          <article className={surface.panel} aria-label="Message">
            <dl className={styles.meta}>
              <dt className={styles.term}>From</dt>
              <dd className={styles.detail}>{data.from}</dd>
              <dt className={styles.term}>To</dt>
              <dd className={styles.detail}>{data.to.join(', ')}</dd>
              <dt className={styles.term}>Received</dt>
              <dd className={styles.detail}>{when.format(new Date(data.receivedAt))}</dd>
            </dl>
            {links.length > 0 && (
              <section aria-labelledby="message-links">
                <Subtitle2 as="h2" id="message-links">
                  Links in this message
                </Subtitle2>
                <ul className={styles.links}>
                  {links.map((url) => (
                    <li key={url}>
                      <Link className={styles.link} href={url} target="_blank" rel="noopener noreferrer">
                        {url} <OpenRegular aria-label="(opens in a new tab)" />
                      </Link>
                    </li>
                  ))}
                </ul>
              </section>
            )}
            <Divider />
            {data.html && (
              <TabList
                selectedValue={view}
                onTabSelect={(_, d) => setView(d.value as 'html' | 'text')}
                aria-label="Message format"
              >
                <Tab value="html">Formatted</Tab>
                <Tab value="text">Plain text</Tab>
              </TabList>
            )}
            {showHtml && data.html ? (
              <iframe
                className={styles.frame}
                title={`Message: ${data.subject}`}
                sandbox="allow-popups allow-popups-to-escape-sandbox"
                referrerPolicy="no-referrer"
                srcDoc={sandboxDocument(data.html)}
              />
            ) : data.text ? (
              <pre className={styles.text}>{data.text}</pre>
            ) : (
              <Body1>
                <Caption1>This message has no text.</Caption1>
              </Body1>
            )}
          </article>
        </>
      )}
    </>
  );
}
