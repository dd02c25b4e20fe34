import { useState } from 'react';
import {
  Body1,
  Button,
  DrawerBody,
  DrawerHeader,
  DrawerHeaderTitle,
  Field,
  Input,
  makeStyles,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  OverlayDrawer,
  ProgressBar,
  Subtitle2,
  tokens,
} from '@fluentui/react-components';
import { DismissRegular, PlayRegular, StopRegular, TextBulletListLtrRegular } from '@fluentui/react-icons';
import {
  RED_FLAG_CAUTION,
  RED_FLAG_SOURCE,
  type RedFlagDto,
  SOLVE_TIME_LIMIT_MAX_SECONDS,
  SOLVE_TIME_LIMIT_MIN_SECONDS,
  type ShiftTypeDto,
  type SkillDto,
  type SolveRunStatus,
} from '@rotaplex/contracts';
import { ConfirmDialog } from '@/ui/ConfirmDialog';
import type { SolveRunState } from '../hooks/useSolveRun';
import { type DraftContents, replaceWarning } from '../utils/draftContents';
import { gapPercent, type GradedNeed } from '../utils/boardQuality';
import { ExplanationsPanel } from './ExplanationsPanel';

const useStyles = makeStyles({
  root: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
  controls: { display: 'flex', flexWrap: 'wrap', alignItems: 'flex-end', gap: tokens.spacingHorizontalM },
  limit: { width: '9rem' },
  quality: { display: 'flex', flexWrap: 'wrap', alignItems: 'center', gap: tokens.spacingHorizontalM },
  figures: {
    display: 'flex',
    flexWrap: 'wrap',
    gap: tokens.spacingHorizontalXL,
    margin: 0,
    '& dt': { color: tokens.colorNeutralForeground3, fontSize: tokens.fontSizeBase200 },
    '& dd': { margin: 0, fontWeight: tokens.fontWeightSemibold },
  },
});

const STATUS_TEXT: Record<SolveRunStatus, string> = {
  queued: 'Waiting for the solver',
  running: 'Generating',
  finished: 'Finished',
  failed: 'Failed',
  cancelled: 'Stopped',
};

const number = new Intl.NumberFormat('en-GB', { maximumFractionDigits: 1 });

export interface SolvePanelProps {
  solve: SolveRunState;
  readOnly: boolean;
  shiftTypes: Map<string, ShiftTypeDto>;
  skills: Map<string, SkillDto>;
  staffNames: Map<string, string>;
  /** What the draft holds now: Generate asks before it replaces any unpinned shift. */
  draft: DraftContents;
  /** The last run's unmet needs graded against the board's cover, worst first. */
  graded: GradedNeed[];
  /** Red flags of safe staffing on the board as it stands (NICE SG1), by date. */
  redFlags: RedFlagDto[];
  /** The roster's quality in words (shortfalls, requests, hours, how much better is possible). */
  qualityText: string | null;
}

/** Generate with a time limit, the live progress of the run, Stop, and the result once it ends. */
export function SolvePanel(props: SolvePanelProps) {
  const { solve, readOnly, shiftTypes, skills, staffNames, draft, graded, redFlags, qualityText } = props;
  const styles = useStyles();
  const [details, setDetails] = useState(false);
  const [explaining, setExplaining] = useState(false);
  const [limit, setLimit] = useState('30');
  const [limitError, setLimitError] = useState<string | null>(null);
  /** Seconds of a Generate waiting for the planner to confirm that it replaces the draft. */
  const [confirming, setConfirming] = useState<number | null>(null);
  const { run, progress } = solve;
  const active = run?.status === 'queued' || run?.status === 'running';

  const generate = () => {
    const seconds = Number(limit);
    if (
      !Number.isInteger(seconds) ||
      seconds < SOLVE_TIME_LIMIT_MIN_SECONDS ||
      seconds > SOLVE_TIME_LIMIT_MAX_SECONDS
    ) {
      setLimitError(
        `Enter whole seconds from ${SOLVE_TIME_LIMIT_MIN_SECONDS} to ${SOLVE_TIME_LIMIT_MAX_SECONDS}.`,
      );
      return;
    }
    setLimitError(null);
    if (draft.replaced > 0) setConfirming(seconds);
    else solve.start(seconds);
  };

  const handleConfirm = () => {
    if (confirming !== null) solve.start(confirming);
    setConfirming(null);
  };

  const elapsed = progress?.elapsedSeconds ?? 0;
  const limitSeconds = run?.timeLimitSeconds ?? 0;

  return (
    <section className={styles.root} aria-label="Generate">
      <Subtitle2 as="h2">Generate</Subtitle2>
      {readOnly ? (
        <Body1>This period is published, so it cannot be generated or edited here.</Body1>
      ) : (
        <div className={styles.controls}>
          <Field
            label="Time limit (seconds)"
            validationMessage={limitError ?? undefined}
            validationState={limitError ? 'error' : 'none'}
          >
            <Input
              className={styles.limit}
              inputMode="numeric"
              value={limit}
              onChange={(_, d) => setLimit(d.value)}
              disabled={active}
            />
          </Field>
          <Button
            appearance="primary"
            icon={<PlayRegular />}
            onClick={generate}
            disabled={active || solve.starting}
          >
            Generate
          </Button>
          {active && (
            <Button icon={<StopRegular />} onClick={solve.stop} disabled={solve.stopping}>
              {solve.stopping ? 'Stopping…' : 'Stop'}
            </Button>
          )}
        </div>
      )}
      <ConfirmDialog
        open={confirming !== null}
        title="Replace the draft?"
        confirmLabel="Replace and generate"
        onConfirm={handleConfirm}
        onCancel={() => setConfirming(null)}
      >
        {replaceWarning(draft)}
      </ConfirmDialog>
      {solve.error && (
        <MessageBar intent="error">
          <MessageBarBody>{solve.error}</MessageBarBody>
        </MessageBar>
      )}
      {run && (
        <div role="status" aria-live="polite" aria-label="Solve progress">
          <Body1>
            {STATUS_TEXT[run.status]}
            {limitSeconds > 0 && ` · ${number.format(elapsed)} s of ${limitSeconds} s`}
          </Body1>
          {active && (
            <Field
              validationMessage={`${Math.round((100 * elapsed) / Math.max(1, limitSeconds))}% of the time limit`}
              validationState="none"
            >
              <ProgressBar
                aria-label="Time used of the limit"
                value={Math.min(1, elapsed / Math.max(1, limitSeconds))}
                max={1}
              />
            </Field>
          )}
          {active && progress?.gap != null && (
            <Body1 block>
              At most {gapPercent(progress.gap)} better is possible than the best roster so far.
            </Body1>
          )}
          {details && (
            <dl className={styles.figures} aria-label="Calculation details">
              <div>
                <dt>Best objective</dt>
                <dd>{progress?.objective != null ? number.format(progress.objective) : 'none yet'}</dd>
              </div>
              <div>
                <dt>Bound</dt>
                <dd>{progress?.bound != null ? number.format(progress.bound) : 'unknown'}</dd>
              </div>
              <div>
                <dt>Gap</dt>
                <dd>{progress?.gap != null ? gapPercent(progress.gap) : 'unknown'}</dd>
              </div>
              {run.result && (
                <div>
                  <dt>Solver's statement</dt>
                  <dd>{run.result.quality}</dd>
                </div>
              )}
            </dl>
          )}
        </div>
      )}
      {run?.status === 'failed' && (
        <MessageBar intent="error">
          <MessageBarBody>
            <MessageBarTitle>The run failed</MessageBarTitle>
            {run.errorMessage ?? 'No reason was given.'}
          </MessageBarBody>
        </MessageBar>
      )}
      {redFlags.length > 0 && !active && (
        // A red flag of safe staffing is named where the roster is made, whether a solve or edits left it.
        <MessageBar intent="error" layout="multiline" data-testid="red-flags">
          <MessageBarBody>
            <MessageBarTitle>
              {redFlags.length === 1
                ? 'Red flag of safe staffing'
                : `${redFlags.length} red flags of safe staffing`}
            </MessageBarTitle>
            Red flag ({RED_FLAG_SOURCE}): {redFlags[0].text}
            {redFlags.length > 1 ? `; and ${redFlags.length - 1} more (see Explanations).` : '.'}{' '}
            {RED_FLAG_CAUTION}
          </MessageBarBody>
        </MessageBar>
      )}
      {run?.result && !active && (
        <>
          {run.result.staffingStatement ? (
            // Below minimum cover is a safety finding: it comes first and is never shown as a success.
            <MessageBar intent="error" data-testid="staffing-safety">
              <MessageBarBody>
                <MessageBarTitle>Below minimum staffing</MessageBarTitle>
                {run.result.staffingStatement}
              </MessageBarBody>
            </MessageBar>
          ) : null}
          <MessageBar
            intent={run.result.objective === null || run.result.staffingStatement ? 'warning' : 'success'}
          >
            <MessageBarBody>
              <MessageBarTitle>Quality</MessageBarTitle>
              <span data-testid="quality-statement">{qualityText ?? run.result.quality}</span>
            </MessageBarBody>
          </MessageBar>
          <div className={styles.quality}>
            <Button icon={<TextBulletListLtrRegular />} onClick={() => setExplaining(true)}>
              Explanations (
              {redFlags.length + graded.length + run.result.explanations.requestsNotHonoured.length})
            </Button>
            <Button appearance="subtle" aria-expanded={details} onClick={() => setDetails(!details)}>
              {details ? 'Hide the calculation details' : 'Show the calculation details'}
            </Button>
          </div>
          <OverlayDrawer
            position="end"
            size="medium"
            open={explaining}
            onOpenChange={(_, d) => setExplaining(d.open)}
            aria-label="Why the roster is not perfect"
          >
            <DrawerHeader>
              <DrawerHeaderTitle
                action={
                  <Button
                    appearance="subtle"
                    aria-label="Close the explanations"
                    icon={<DismissRegular />}
                    onClick={() => setExplaining(false)}
                  />
                }
              >
                Why the roster is not perfect
              </DrawerHeaderTitle>
            </DrawerHeader>
            <DrawerBody>
              <ExplanationsPanel
                explanations={run.result.explanations}
                graded={graded}
                redFlags={redFlags}
                shiftTypes={shiftTypes}
                skills={skills}
                staffNames={staffNames}
              />
            </DrawerBody>
          </OverlayDrawer>
        </>
      )}
    </section>
  );
}
