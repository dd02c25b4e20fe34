import { Controller, Get, Res } from '@nestjs/common';
import { ApiOkResponse, ApiServiceUnavailableResponse, ApiTags } from '@nestjs/swagger';
import { type HealthResponse } from '@rotaplex/contracts';
import { type Response } from 'express';
import { DataSource } from 'typeorm';
import { Public } from '../common/decorators/public.decorator';
import { AppConfig } from '../config/app-config';
import { SolveRunsService } from '../solve-runs/solve-runs.service';
import { HealthResponseDto } from './health-response.dto';

@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(
    private readonly dataSource: DataSource,
    private readonly config: AppConfig,
    private readonly solveRuns: SolveRunsService,
  ) {}

  @Get()
  @Public()
  @ApiOkResponse({ description: 'The API, its database and its solve queue answer', type: HealthResponseDto })
  @ApiServiceUnavailableResponse({
    description: 'The database or the solve queue (Redis) does not answer',
    type: HealthResponseDto,
  })
  async check(@Res({ passthrough: true }) res: Response): Promise<HealthResponse> {
    let up: boolean;
    try {
      up = (await this.dataSource.query('SELECT 1 AS ok'))[0]?.ok === 1;
    } catch {
      up = false;
    }
    const queue = await this.solveRuns.queueHealth();
    const ok = up && queue.state === 'up';
    res.setHeader('Cache-Control', 'no-store');
    if (!ok) res.status(503);
    return { status: ok ? 'ok' : 'error', database: up ? 'up' : 'down', version: this.config.version, queue };
  }
}
