import { type SolveRunDto } from '@rotaplex/contracts';
import { type Request, type Response } from 'express';
import { EventEmitter } from 'node:events';
import { type AuthUser } from '../common/auth-user';
import { SolveRunsController } from './solve-runs.controller';
import { type SolveRunEvent, type SolveRunsService } from './solve-runs.service';

const RUN_ID = '00000000-0000-4000-8000-000000000001';

/** A response that records what is written, and refuses headers once the head has gone, as Node does. */
function recordingResponse() {
  const written: string[] = [];
  const headers: Record<string, string> = {};
  let headSent = false;
  let ended = false;
  const res = {
    status: () => res,
    setHeader: (name: string, value: string) => {
      if (headSent) throw new Error(`headers already sent: ${name}`);
      headers[name.toLowerCase()] = value;
    },
    flushHeaders: () => {
      headSent = true;
    },
    write: (chunk: string) => {
      if (ended) throw new Error('write after end');
      headSent = true;
      written.push(chunk);
      return true;
    },
    end: () => {
      headSent = true;
      ended = true;
    },
  };
  const events = () =>
    written
      .filter((chunk) => !chunk.startsWith(':'))
      .map((chunk) => {
        const [event, data] = chunk.trim().split('\n');
        return { event: event.slice('event: '.length), data: JSON.parse(data.slice('data: '.length)) };
      });
  return { res, headers, events, ended: () => ended };
}

function run(status: SolveRunDto['status']): SolveRunDto {
  return { id: RUN_ID, status } as SolveRunDto;
}

/**
 * The run is read while events keep coming (relayed from the solver worker through Redis): each
 * test delivers its events during that read.
 */
async function followWhile(
  snapshot: SolveRunDto,
  duringRead: SolveRunEvent[],
): Promise<ReturnType<typeof recordingResponse> & { listeners: () => number }> {
  const bus = new EventEmitter();
  const service = {
    subscribe: (id: string, listener: (e: SolveRunEvent) => void) => {
      bus.on(id, listener);
      return () => bus.off(id, listener);
    },
    get: async () => {
      for (const e of duringRead) bus.emit(RUN_ID, e);
      return snapshot;
    },
  } as unknown as SolveRunsService;
  const recording = recordingResponse();
  const req = new EventEmitter() as unknown as Request;
  await new SolveRunsController(service).events(
    {} as AuthUser,
    RUN_ID,
    req,
    recording.res as unknown as Response,
  );
  (req as unknown as EventEmitter).emit('close');
  return { ...recording, listeners: () => bus.listenerCount(RUN_ID) };
}

describe('SolveRunsController events: what arrives while the run is read', () => {
  const progress = { elapsedSeconds: 0.5, objective: 120, bound: null, gap: null };

  it('sends the status first, with its headers, then the progress that came meanwhile', async () => {
    const stream = await followWhile(run('running'), [{ event: 'progress', data: progress }]);
    expect(stream.headers['content-type']).toMatch(/^text\/event-stream/);
    expect(stream.events()).toEqual([
      { event: 'status', data: run('running') },
      { event: 'progress', data: progress },
    ]);
  });

  it('ends after the status when the run ended meanwhile, once, and stops listening', async () => {
    const stream = await followWhile(run('finished'), [
      { event: 'progress', data: progress },
      { event: 'end', data: run('finished') },
    ]);
    expect(stream.events().map((e) => e.event)).toEqual(['status', 'end']);
    expect(stream.ended()).toBe(true);
    expect(stream.listeners()).toBe(0);
  });

  it('relays an end that came while a still-running row was read, and closes', async () => {
    const stream = await followWhile(run('running'), [
      { event: 'progress', data: progress },
      { event: 'end', data: run('finished') },
    ]);
    expect(stream.events()).toEqual([
      { event: 'status', data: run('running') },
      { event: 'progress', data: progress },
      { event: 'end', data: run('finished') },
    ]);
    expect(stream.ended()).toBe(true);
  });
});
