import { Body, Controller, Get, HttpCode, Param, Post, Query, Req, Res } from '@nestjs/common';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';
import {
  ApiAcceptedResponse,
  ApiConflictResponse,
  ApiOkResponse,
  ApiOperation,
  ApiProduces,
  ApiTags,
} from '@nestjs/swagger';
import {
  type Page,
  type SolveRunDto,
  type SolveRunEventName,
  type SolveRunStartedDto,
  type SolveRunSummaryDto,
  isSolveRunEnded,
} from '@rotaplex/contracts';
import { type Request, type Response } from 'express';
import { type AuthUser } from '../common/auth-user';
import { RequirePermissions } from '../common/decorators/access.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import {
  SolveRunListQuery,
  SolveRunPageResponse,
  SolveRunResponse,
  SolveRunStartedResponse,
  StartSolveRunDto,
} from './dto/solve-run.dto';
import { type SolveRunEvent, SolveRunsService } from './solve-runs.service';

/** A comment line this often keeps proxies from closing a quiet event stream. */
const KEEP_ALIVE_MS = 15_000;

/** Solve runs: generate a period's roster with the solver, follow its progress, stop it. */
@ApiTags('solve runs')
@Controller()
export class SolveRunsController {
  constructor(private readonly runs: SolveRunsService) {}

  @Post('roster-periods/:id/solve-runs')
  @HttpCode(202)
  @RequirePermissions('rosters:plan')
  @ApiAcceptedResponse({ type: SolveRunStartedResponse, description: 'Queued; follow it by its id' })
  @ApiConflictResponse({ description: 'The period is not a draft, or already has a queued or running run' })
  start(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
    @Body() body: StartSolveRunDto,
  ): Promise<SolveRunStartedDto> {
    return this.runs.start(user, id, body);
  }

  @Get('roster-periods/:id/solve-runs')
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({
    type: SolveRunPageResponse,
    description: "The period's runs, newest first, without results",
  })
  list(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
    @Query() query: SolveRunListQuery,
  ): Promise<Page<SolveRunSummaryDto>> {
    return this.runs.list(user, id, query);
  }

  @Get('solve-runs/:id')
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({ type: SolveRunResponse })
  get(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<SolveRunDto> {
    return this.runs.get(user, id);
  }

  @Post('solve-runs/:id/cancel')
  @HttpCode(200)
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({
    type: SolveRunResponse,
    description: 'The run once stopped; a running solve keeps its best roster',
  })
  @ApiConflictResponse({ description: 'The run has already ended' })
  cancel(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<SolveRunDto> {
    return this.runs.cancel(user, id);
  }

  @Get('solve-runs/:id/events')
  @RequirePermissions('rosters:plan')
  @ApiOperation({
    summary: 'Progress as server-sent events',
    description:
      'Events: `status` (the run when the stream opens), `progress` (elapsedSeconds, objective, bound, gap) ' +
      'and `end` (the run once ended); the stream closes after `end`. Send the access token in the ' +
      'Authorization header: read the stream with fetch() (EventSource cannot send headers).',
  })
  @ApiProduces('text/event-stream')
  @ApiOkResponse({ description: 'A text/event-stream of status, progress and end events' })
  async events(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
    @Req() req: Request,
    @Res() res: Response,
  ): Promise<void> {
    let open = true;
    const write = (event: SolveRunEventName, data: unknown) => {
      if (!open) return;
      res.write(`event: ${event}\ndata: ${JSON.stringify(data)}\n\n`);
      if (event === 'end') close();
    };
    // Events relayed while the run is read (from any instance, through Redis) wait for the status:
    // written before it, they would send the response's head without its event-stream headers and
    // come ahead of the `status` the stream promises first.
    let early: SolveRunEvent[] | null = [];
    // Listen before reading the run, so an end between the two is not missed.
    const unsubscribe = this.runs.subscribe(id, (e) => (early ? early.push(e) : write(e.event, e.data)));
    const timers: NodeJS.Timeout[] = [];
    const close = () => {
      if (!open) return;
      open = false;
      unsubscribe();
      timers.forEach((t) => clearInterval(t));
      res.end();
    };
    let run: SolveRunDto;
    try {
      run = await this.runs.get(user, id);
    } catch (err) {
      unsubscribe();
      throw err;
    }
    res.status(200);
    res.setHeader('Content-Type', 'text/event-stream; charset=utf-8');
    res.setHeader('Cache-Control', 'no-cache, no-transform');
    res.setHeader('X-Accel-Buffering', 'no');
    res.flushHeaders();
    req.on('close', close);
    timers.push(setInterval(() => open && res.write(': keep-alive\n\n'), KEEP_ALIVE_MS));
    write('status', run);
    const waiting = early;
    early = null;
    // An ended run's own row is its end; otherwise what came meanwhile follows, in order.
    if (isSolveRunEnded(run.status)) write('end', run);
    else for (const e of waiting) write(e.event, e.data);
  }
}
