import {
  Body,
  Controller,
  Delete,
  Get,
  Header,
  HttpCode,
  Param,
  Patch,
  Post,
  Query,
  Req,
} from '@nestjs/common';
import { ParseIdPipe } from '../common/pipes/parse-id.pipe';
import {
  ApiBadRequestResponse,
  ApiBody,
  ApiConsumes,
  ApiCreatedResponse,
  ApiNoContentResponse,
  ApiOkResponse,
  ApiProduces,
  ApiTags,
} from '@nestjs/swagger';
import { type CsvImportResult, type Page, STAFF_CSV_COLUMNS, type StaffMemberDto } from '@rotaplex/contracts';
import { type Request } from 'express';
import { type AuthUser } from '../common/auth-user';
import { readCsvBody } from '../common/csv';
import { CsvImportResponse } from '../common/csv-import.dto';
import { Authenticated, RequirePermissions } from '../common/decorators/access.decorator';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import {
  CreateStaffMemberDto,
  StaffExportQueryDto,
  StaffImportQueryDto,
  StaffMemberResponse,
  StaffPageResponse,
  StaffQueryDto,
  UpdateStaffMemberDto,
} from './dto/staff.dto';
import { StaffService } from './staff.service';

/**
 * Staff members of units. Planners (admins, managers of the unit) read and write them; a staff
 * member may read only their own record (GET /staff/:id), and is refused the list.
 */
@ApiTags('staff')
@Controller('staff')
export class StaffController {
  constructor(private readonly staff: StaffService) {}

  @Get()
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({ type: StaffPageResponse })
  list(@CurrentUser() user: AuthUser, @Query() query: StaffQueryDto): Promise<Page<StaffMemberDto>> {
    return this.staff.list(user, query);
  }

  @Get('export.csv')
  @RequirePermissions('rosters:plan')
  @Header('Content-Type', 'text/csv; charset=utf-8')
  @Header('Content-Disposition', 'attachment; filename="staff.csv"')
  @ApiProduces('text/csv')
  @ApiOkResponse({
    description: `CSV with the columns ${STAFF_CSV_COLUMNS.join(', ')}; formula cells neutralised`,
  })
  exportCsv(@CurrentUser() user: AuthUser, @Query() query: StaffExportQueryDto): Promise<string> {
    return this.staff.exportCsv(user, query.unitId);
  }

  @Post('import')
  @HttpCode(200)
  @RequirePermissions('rosters:plan')
  @ApiConsumes('text/csv')
  @ApiBody({
    schema: { type: 'string' },
    description: `CSV with a header line; columns ${STAFF_CSV_COLUMNS.join(', ')} (name required)`,
  })
  @ApiOkResponse({
    type: CsvImportResponse,
    description: 'Dry run: the row errors; otherwise every row saved',
  })
  @ApiBadRequestResponse({
    type: CsvImportResponse,
    description: 'A bad row: nothing saved; errors lists each',
  })
  async importCsv(
    @CurrentUser() user: AuthUser,
    @Query() query: StaffImportQueryDto,
    @Req() req: Request,
  ): Promise<CsvImportResult> {
    const body = await readCsvBody(req);
    return this.staff.importCsv(user, query, body);
  }

  @Get(':id')
  @Authenticated()
  @ApiOkResponse({ type: StaffMemberResponse })
  get(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<StaffMemberDto> {
    return this.staff.get(user, id);
  }

  @Post()
  @RequirePermissions('rosters:plan')
  @ApiCreatedResponse({ type: StaffMemberResponse })
  create(@CurrentUser() user: AuthUser, @Body() body: CreateStaffMemberDto): Promise<StaffMemberDto> {
    return this.staff.create(user, body);
  }

  @Patch(':id')
  @RequirePermissions('rosters:plan')
  @ApiOkResponse({ type: StaffMemberResponse })
  update(
    @CurrentUser() user: AuthUser,
    @Param('id', ParseIdPipe) id: string,
    @Body() body: UpdateStaffMemberDto,
  ): Promise<StaffMemberDto> {
    return this.staff.update(user, id, body);
  }

  @Delete(':id')
  @HttpCode(204)
  @RequirePermissions('rosters:plan')
  @ApiNoContentResponse()
  remove(@CurrentUser() user: AuthUser, @Param('id', ParseIdPipe) id: string): Promise<void> {
    return this.staff.remove(user, id);
  }
}
