import { useCallback, useEffect, useRef, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { SolveProgressDto, SolveRunDto } from '@rotaplex/contracts';
import { errorText } from '@/api/errors';
import { boardKeys, cancelSolveRun, followSolveRun, startSolveRun } from '../api/board.queries';

export interface SolveRunState {
  run: SolveRunDto | null;
  progress: SolveProgressDto | null;
  error: string | null;
  starting: boolean;
  stopping: boolean;
  start: (timeLimitSeconds: number) => void;
  stop: () => void;
}

/** Starts, follows (server-sent events over fetch) and stops the solve runs of one period. */
export function useSolveRun(periodId: string, latest: SolveRunDto | undefined): SolveRunState {
  const queryClient = useQueryClient();
  const [run, setRun] = useState<SolveRunDto | null>(null);
  const [progress, setProgress] = useState<SolveProgressDto | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [starting, setStarting] = useState(false);
  const [stopping, setStopping] = useState(false);
  const following = useRef<{ id: string; abort: AbortController } | null>(null);

  const follow = useCallback(
    (runId: string) => {
      following.current?.abort.abort();
      const abort = new AbortController();
      following.current = { id: runId, abort };
      setProgress(null);
      followSolveRun(
        runId,
        {
          onStatus: (r) => {
            setRun(r);
            if (r.progress) setProgress(r.progress);
          },
          onProgress: setProgress,
          onEnd: (r) => {
            setRun(r);
            if (r.progress) setProgress(r.progress);
            setStopping(false);
            void queryClient.invalidateQueries({ queryKey: boardKeys.grid(periodId) });
            void queryClient.invalidateQueries({ queryKey: boardKeys.runs(periodId) });
            // A saved roster raised the period's version: the next publish must send the new one.
            void queryClient.invalidateQueries({ queryKey: ['roster-periods'] });
          },
        },
        abort.signal,
      ).catch((e: unknown) => {
        if (!abort.signal.aborted) setError(errorText(e));
      });
    },
    [periodId, queryClient],
  );

  // Show the period's latest run; keep following one that has not ended (e.g. after a reload).
  useEffect(() => {
    if (!latest || run) return;
    setRun(latest);
    if (latest.progress) setProgress(latest.progress);
    if (latest.status === 'queued' || latest.status === 'running') follow(latest.id);
  }, [latest, run, follow]);

  useEffect(() => () => following.current?.abort.abort(), []);

  const start = (timeLimitSeconds: number) => {
    setError(null);
    setStarting(true);
    startSolveRun(periodId, timeLimitSeconds)
      .then(({ id }) => follow(id))
      .catch((e: unknown) => setError(errorText(e)))
      .finally(() => setStarting(false));
  };

  const stop = () => {
    if (!run) return;
    setStopping(true);
    cancelSolveRun(run.id).catch((e: unknown) => {
      setStopping(false);
      setError(errorText(e));
    });
  };

  return { run, progress, error, starting, stopping, start, stop };
}
