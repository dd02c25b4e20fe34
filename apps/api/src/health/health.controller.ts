import { Controller, Get, Res } from '@nestjs/common';
import { ApiOkResponse, ApiServiceUnavailableResponse, ApiTags } from '@nestjs/swagger';
import { type HealthResponse } from '@rotaplex/contracts';
import { type Response } from 'express';
import { DataSource } from 'typeorm';
import { Public } from '../common/decorators/public.decorator';
import { AppConfig } from '../config/app-config';
import { HealthResponseDto } from './health-response.dto';

@ApiTags('health')
@Controller('health')
export class HealthController {
  constructor(
    private readonly dataSource: DataSource,
    private readonly config: AppConfig,
  ) {}

  @Get()
  @Public()
  @ApiOkResponse({ description: 'The API and its database answer', type: HealthResponseDto })
  @ApiServiceUnavailableResponse({ description: 'The database does not answer', type: HealthResponseDto })
  async check(@Res({ passthrough: true }) res: Response): Promise<HealthResponse> {
    let up: boolean;
    try {
      up = (await this.dataSource.query('SELECT 1 AS ok'))[0]?.ok === 1;
    } catch {
      up = false;
    }
    res.setHeader('Cache-Control', 'no-store');
    if (!up) res.status(503);
    return { status: up ? 'ok' : 'error', database: up ? 'up' : 'down', version: this.config.version };
  }
}
