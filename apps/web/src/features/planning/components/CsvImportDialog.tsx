import { useId, useState } from 'react';
import {
  Body1,
  Button,
  Caption1,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  Label,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Spinner,
  TableCell,
  TableRow,
  tokens,
} from '@fluentui/react-components';
import type { CsvImportResult } from '@rotaplex/contracts';
import { useMutation } from '@tanstack/react-query';
import { ErrorBanner } from '@/ui/ErrorBanner';
import { DataTable } from '@/ui/DataTable';

const useStyles = makeStyles({
  surface: { maxWidth: '48rem', width: '100%' },
  content: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalM,
    // A scrolling dialog must not squeeze its messages into each other.
    '& > *': { flexShrink: 0 },
  },
  file: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXS },
  muted: { color: tokens.colorNeutralForeground3 },
  code: { fontFamily: tokens.fontFamilyMonospace, fontSize: tokens.fontSizeBase200 },
  errors: { maxHeight: '40vh', overflowY: 'auto' },
});

/** The most a browser hands over; the API refuses bodies over 2 MB anyway. */
const MAX_BYTES = 2 * 1024 * 1024;

export interface CsvImportDialogProps {
  title: string;
  /** The columns, for the explanation. */
  columns: readonly string[];
  /** One sentence on what the columns hold. */
  help: string;
  /** Checks (dryRun) or saves the file. */
  send: (csv: string, dryRun: boolean) => Promise<CsvImportResult>;
  /** Called after a successful import, with the number of rows saved. */
  onImported: (saved: number) => void;
  onClose: () => void;
}

/**
 * Upload in two steps: the API checks the file first (a dry run) and the row errors are shown with
 * their line and column; only a file with no errors can then be imported, and nothing is saved before.
 */
export function CsvImportDialog({ title, columns, help, send, onImported, onClose }: CsvImportDialogProps) {
  const styles = useStyles();
  const inputId = useId();
  const [file, setFile] = useState<{ name: string; text: string } | null>(null);
  const [readError, setReadError] = useState<string>();

  const check = useMutation({ mutationFn: (text: string) => send(text, true) });
  const save = useMutation({
    mutationFn: (text: string) => send(text, false),
    onSuccess: (result) => {
      if (result.errors.length === 0) onImported(result.saved);
    },
  });

  const handleFile = async (chosen: File | undefined) => {
    check.reset();
    save.reset();
    setFile(null);
    setReadError(undefined);
    if (!chosen) return;
    if (chosen.size > MAX_BYTES) {
      setReadError('The file is larger than 2 MB. Split it into smaller files.');
      return;
    }
    const text = await chosen.text();
    setFile({ name: chosen.name, text });
    check.mutate(text);
  };

  const result = save.data && save.data.errors.length > 0 ? save.data : check.data;
  const busy = check.isPending || save.isPending;
  const ready = !!file && !!check.data && check.data.errors.length === 0 && check.data.rows > 0;

  return (
    <Dialog open onOpenChange={(_, d) => !d.open && !busy && onClose()}>
      <DialogSurface className={styles.surface} aria-describedby={undefined}>
        <DialogBody>
          <DialogTitle>{title}</DialogTitle>
          <DialogContent className={styles.content}>
            <Body1>
              A CSV file with a header line and the columns{' '}
              <span className={styles.code}>{columns.join(', ')}</span>. {help} The file is checked first;
              nothing is saved until you import a file without errors.
            </Body1>
            <div className={styles.file}>
              <Label htmlFor={inputId} weight="semibold">
                CSV file
              </Label>
              <input
                id={inputId}
                type="file"
                accept=".csv,text/csv"
                onChange={(e) => void handleFile(e.target.files?.[0])}
              />
            </div>
            <ErrorBanner messages={readError ? [readError] : undefined} />
            <ErrorBanner error={check.error ?? save.error} />
            {check.isPending && <Spinner size="small" label="Checking the file…" />}
            {result && result.errors.length > 0 && (
              <>
                <MessageBar intent="error" layout="multiline" role="alert">
                  <MessageBarBody>
                    <MessageBarTitle>Nothing was saved</MessageBarTitle>
                    {`${result.errors.length} problem${result.errors.length === 1 ? '' : 's'} in ${result.rows} row${
                      result.rows === 1 ? '' : 's'
                    } of ${file?.name ?? 'the file'}. Correct the file and choose it again.`}
                  </MessageBarBody>
                </MessageBar>
                <div className={styles.errors}>
                  <DataTable label="Row errors" columns={['Line', 'Column', 'Problem']} size="small">
                    {result.errors.map((e, i) => (
                      <TableRow key={`${e.line}-${e.field}-${i}`}>
                        <TableCell>{e.line}</TableCell>
                        <TableCell className={styles.code}>{e.field}</TableCell>
                        <TableCell>{e.message}</TableCell>
                      </TableRow>
                    ))}
                  </DataTable>
                </div>
              </>
            )}
            {ready && !save.data && (
              <MessageBar intent="success" role="status">
                <MessageBarBody>
                  {`${check.data.rows} row${check.data.rows === 1 ? '' : 's'} checked, no problems found. Nothing is saved yet.`}
                </MessageBarBody>
              </MessageBar>
            )}
            {check.data?.cautions && check.data.cautions.length > 0 && (
              <MessageBar intent="warning" layout="multiline">
                <MessageBarBody>
                  <MessageBarTitle>Check before you import</MessageBarTitle>
                  <ul aria-label="Cautions on this file">
                    {check.data.cautions.map((text) => (
                      <li key={text}>{text}</li>
                    ))}
                  </ul>
                </MessageBarBody>
              </MessageBar>
            )}
            <Caption1 className={styles.muted}>Line numbers count the header as line 1.</Caption1>
          </DialogContent>
          <DialogActions>
            <Button appearance="secondary" onClick={onClose} disabled={busy}>
              Cancel
            </Button>
            <Button
              appearance="primary"
              disabled={!ready || busy}
              icon={save.isPending ? <Spinner size="tiny" /> : undefined}
              onClick={() => file && save.mutate(file.text)}
            >
              {ready ? `Import ${check.data.rows} row${check.data.rows === 1 ? '' : 's'}` : 'Import'}
            </Button>
          </DialogActions>
        </DialogBody>
      </DialogSurface>
    </Dialog>
  );
}
