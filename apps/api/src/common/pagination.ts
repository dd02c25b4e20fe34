import { ApiPropertyOptional } from '@nestjs/swagger';
import { MAX_PAGE_SIZE, type Page, type PageQuery } from '@rotaplex/contracts';
import { Transform, Type } from 'class-transformer';
import { IsIn, IsInt, IsOptional, IsString, Max, MaxLength, Min } from 'class-validator';

/** Highest page number asked for (beyond it the offset would leave the database's integer range). */
export const MAX_PAGE = 1_000_000;
const pageMessage = { message: `page must be a whole number from 1 to ${MAX_PAGE}` };
const pageSizeMessage = { message: `pageSize must be a whole number from 1 to ${MAX_PAGE_SIZE}` };

/** page (1-based), pageSize, order and a free-text q; subclasses add `sort` with their own columns. */
export class PageQueryDto implements PageQuery {
  @ApiPropertyOptional({ minimum: 1, maximum: MAX_PAGE, default: 1 })
  @IsOptional()
  @Type(() => Number)
  @IsInt(pageMessage)
  @Min(1, pageMessage)
  @Max(MAX_PAGE, pageMessage)
  page: number = 1;

  @ApiPropertyOptional({ minimum: 1, maximum: MAX_PAGE_SIZE, default: 20 })
  @IsOptional()
  @Type(() => Number)
  @IsInt(pageSizeMessage)
  @Min(1, pageSizeMessage)
  @Max(MAX_PAGE_SIZE, pageSizeMessage)
  pageSize: number = 20;

  @ApiPropertyOptional({ enum: ['asc', 'desc'], default: 'asc' })
  @IsOptional()
  @IsIn(['asc', 'desc'])
  order: 'asc' | 'desc' = 'asc';

  @ApiPropertyOptional({ description: 'Free-text search' })
  @IsOptional()
  @IsString()
  @MaxLength(200)
  @Transform(({ value }: { value: unknown }) => (typeof value === 'string' ? value.trim() : value))
  q?: string;
}

export function toPage<T>(items: T[], total: number, query: PageQueryDto): Page<T> {
  return { items, total, page: query.page, pageSize: query.pageSize };
}

/**
 * Escapes % and _ for a SQL LIKE with ESCAPE '\'. Searches compare `LOWER(column) LIKE LOWER(:q)`:
 * SQLite's LIKE ignores case and PostgreSQL's does not, so both sides are lowered on both.
 */
export function likePattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}
