import { BadRequestException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import {
  COVER_CSV_COLUMNS,
  type CoverNeedsDto,
  type CoverOverrideDto,
  type CsvImportResult,
  type CsvRowError,
  GUARD_RAIL_DEFERRAL,
  type CoverMinimumRow,
  loweredToZeroCautions,
  WEEKDAY_NAMES,
} from '@rotaplex/contracts';
import { DataSource, type EntityManager, In, IsNull, Repository } from 'typeorm';
import { type AuthUser } from '../common/auth-user';
import { isRealDate } from '../common/dates';
import { type ShiftTypeEntity } from '../shift-types/shift-type.entity';
import { ShiftTypesService } from '../shift-types/shift-types.service';
import { type SkillEntity } from '../skills/skill.entity';
import { SkillsService } from '../skills/skills.service';
import { parseCsv } from '../common/csv';
import { UnitsService } from '../units/units.service';
import { CoverOverrideEntity, CoverPatternRowEntity } from './cover-need.entity';
import {
  type CoverImportQueryDto,
  type CoverPatternRowBody,
  type CreateCoverOverrideDto,
  DATE_PATTERN,
} from './dto/cover-need.dto';

type Need = { shiftTypeId: string; skillId: string | null; min: number; target: number };
type PatternRow = Need & { weekday: number };
type OverrideRow = Need & { date: string };

@Injectable()
export class CoverNeedsService {
  constructor(
    @InjectRepository(CoverPatternRowEntity) private readonly pattern: Repository<CoverPatternRowEntity>,
    @InjectRepository(CoverOverrideEntity) private readonly overrides: Repository<CoverOverrideEntity>,
    private readonly units: UnitsService,
    private readonly dataSource: DataSource,
    private readonly shiftTypes: ShiftTypesService,
    private readonly skills: SkillsService,
  ) {}

  async get(user: AuthUser, unitId: string): Promise<CoverNeedsDto> {
    await this.units.get(user, unitId);
    const [pattern, overrides] = await Promise.all([
      this.pattern.find({ where: { unitId }, order: { weekday: 'ASC', shiftTypeId: 'ASC', skillId: 'ASC' } }),
      this.overrides.find({ where: { unitId }, order: { date: 'ASC', shiftTypeId: 'ASC', skillId: 'ASC' } }),
    ]);
    return {
      unitId,
      pattern: pattern.map((r) => ({
        weekday: r.weekday,
        shiftTypeId: r.shiftTypeId,
        skillId: r.skillId,
        min: r.min,
        target: r.target,
      })),
      overrides: overrides.map(toOverrideDto),
    };
  }

  /** Replaces the whole weekly pattern in one transaction. */
  async replacePattern(user: AuthUser, unitId: string, rows: CoverPatternRowBody[]): Promise<CoverNeedsDto> {
    await this.units.get(user, unitId);
    const refs = await this.references(user, unitId);
    const errors: string[] = [];
    const seen = new Set<string>();
    rows.forEach((r, i) => {
      const at = `rows.${i}`;
      if (!refs.shiftIds.has(r.shiftTypeId))
        errors.push(`${at}.shiftTypeId must be a shift type of this unit`);
      if (r.skillId !== null && !refs.skillIds.has(r.skillId)) errors.push(`${at}.skillId must be a skill`);
      if (r.target < r.min) errors.push(`${at}.target must be at least min`);
      const key = `${r.weekday}|${r.shiftTypeId}|${r.skillId}`;
      if (seen.has(key)) errors.push(`${at} repeats the weekday, shift type and skill of an earlier row`);
      seen.add(key);
    });
    if (errors.length) throw new BadRequestException(errors);
    const before = await this.pattern.findBy({ unitId });
    await this.dataSource.transaction((em) => this.writePattern(em, unitId, rows));
    const cautions = withDeferral(
      loweredToZeroCautions(
        before.map((r) => ({ ...r, day: r.weekday })),
        rows.map((r) => ({ ...r, day: r.weekday })),
        needLabel(refs, (day) => `on ${WEEKDAY_NAMES[Number(day)]}`),
      ),
    );
    return { ...(await this.get(user, unitId)), cautions };
  }

  /** Adds an override, replacing one with the same date, shift type and skill. */
  async putOverride(user: AuthUser, unitId: string, body: CreateCoverOverrideDto): Promise<CoverOverrideDto> {
    await this.units.get(user, unitId);
    if (!isRealDate(body.date)) throw new BadRequestException(['date must be a real calendar date']);
    const refs = await this.references(user, unitId);
    const errors: string[] = [];
    if (!refs.shiftIds.has(body.shiftTypeId)) errors.push('shiftTypeId must be a shift type of this unit');
    if (body.skillId !== null && !refs.skillIds.has(body.skillId)) errors.push('skillId must be a skill');
    if (body.target < body.min) errors.push('target must be at least min');
    if (errors.length) throw new BadRequestException(errors);
    // What the date asked for before: its own override, or else the weekly pattern's row.
    const weekday = new Date(`${body.date}T00:00:00Z`).getUTCDay();
    const same = { unitId, shiftTypeId: body.shiftTypeId, skillId: body.skillId ?? IsNull() };
    const earlier =
      (await this.overrides.findOneBy({ ...same, date: body.date })) ??
      (await this.pattern.findOneBy({ ...same, weekday }));
    const saved = await this.dataSource.transaction(async (em) => {
      const [row] = await this.writeOverrides(em, unitId, [body]);
      return row;
    });
    const cautions = withDeferral(
      loweredToZeroCautions(
        earlier ? [{ ...body, min: earlier.min, day: body.date }] : [],
        [{ ...body, day: body.date }],
        needLabel(refs, (day) => `on ${String(day)}`),
      ),
    );
    return { ...toOverrideDto(saved), cautions };
  }

  async removeOverride(user: AuthUser, unitId: string, id: string): Promise<void> {
    await this.units.get(user, unitId);
    const res = await this.overrides.delete({ id, unitId });
    if (!res.affected) throw new NotFoundException('Cover override not found');
  }

  /**
   * CSV upload (columns COVER_CSV_COLUMNS). Weekday rows replace the whole pattern (when there are
   * any); date rows add or replace overrides. All in one transaction, or nothing when a row is bad.
   */
  async importCsv(
    user: AuthUser,
    unitId: string,
    query: CoverImportQueryDto,
    text: unknown,
  ): Promise<CsvImportResult> {
    if (typeof text !== 'string') {
      throw new BadRequestException(['body must be CSV text sent with Content-Type: text/csv']);
    }
    await this.units.get(user, unitId);
    const refs = await this.references(user, unitId);
    const parsed = parseCsv(
      text,
      COVER_CSV_COLUMNS,
      COVER_CSV_COLUMNS.filter((c) => c !== 'skill'),
    );
    const errors: CsvRowError[] = [...parsed.errors];
    const pattern: PatternRow[] = [];
    const overrides: OverrideRow[] = [];
    const seen = new Map<string, number>();
    for (const { line, cells } of parsed.rows) {
      const err = (field: string, message: string) => errors.push({ line, field, message });
      const day = cells.day ?? '';
      let weekday: number | null = null;
      let date: string | null = null;
      const named = WEEKDAY_NAMES.findIndex((n) => n.toLowerCase() === day.slice(0, 3).toLowerCase());
      if (/^[0-6]$/.test(day)) weekday = Number(day);
      else if (DATE_PATTERN.test(day) && isRealDate(day)) date = day;
      else if (named >= 0 && /^[a-z]+$/i.test(day)) weekday = named;
      else err('day', `"${day}" must be a weekday (Mon … Sun, or 0-6 with 0 = Sunday) or a date YYYY-MM-DD`);
      const shift = refs.shiftByCode.get((cells.shift ?? '').toUpperCase());
      if (!shift) err('shift', `no shift type with the code "${cells.shift ?? ''}" in this unit`);
      let skillId: string | null = null;
      if (cells.skill) {
        const skill = refs.skillByCode.get(cells.skill.toUpperCase());
        if (skill) skillId = skill.id;
        else err('skill', `unknown skill code "${cells.skill}"`);
      }
      const count = (field: 'min' | 'target') => {
        const v = cells[field] ?? '';
        if (!/^\d{1,3}$/.test(v) || Number(v) > 500) {
          err(field, `"${v}" must be a whole number 0-500`);
          return null;
        }
        return Number(v);
      };
      const min = count('min');
      const target = count('target');
      if (min !== null && target !== null && target < min) err('target', 'target must be at least min');
      const key = `${weekday ?? date}|${shift?.id}|${skillId}`;
      if (seen.has(key)) err('day', `repeats line ${seen.get(key)} (same day, shift and skill)`);
      else seen.set(key, line);
      if (shift && min !== null && target !== null) {
        const need = { shiftTypeId: shift.id, skillId, min, target };
        if (weekday !== null) pattern.push({ ...need, weekday });
        else if (date !== null) overrides.push({ ...need, date });
      }
    }
    if (!errors.length && !parsed.rows.length)
      errors.push({ line: 2, field: 'file', message: 'no data rows' });
    const result: CsvImportResult = {
      dryRun: query.dryRun,
      rows: parsed.rows.length,
      saved: 0,
      errors,
      cautions: errors.length ? [] : await this.importCautions(unitId, refs, pattern, overrides),
    };
    if (query.dryRun) return result;
    if (errors.length) {
      throw new BadRequestException({
        statusCode: 400,
        error: 'Bad Request',
        message: errors.map((e) => `line ${e.line}, ${e.field}: ${e.message}`),
        ...result,
      });
    }
    await this.dataSource.transaction(async (em) => {
      if (pattern.length) await this.writePattern(em, unitId, pattern);
      await this.writeOverrides(em, unitId, overrides);
    });
    return { ...result, saved: pattern.length + overrides.length };
  }

  /**
   * Date overrides written inside the caller's transaction (the demand plan's accept step, which
   * records its acceptance in the same transaction). Checks every row like the other writes (400,
   * nothing written). Answers the overrides of the same date, shift type and skill before, the
   * saved ones, and the cautions of minimums lowered to 0.
   */
  async writeOverridesIn(
    em: EntityManager,
    user: AuthUser,
    unitId: string,
    rows: readonly OverrideRow[],
  ): Promise<{ before: CoverOverrideDto[]; saved: CoverOverrideDto[]; cautions: string[] }> {
    const refs = await this.references(user, unitId);
    const errors: string[] = [];
    const seen = new Set<string>();
    rows.forEach((r, i) => {
      const at = `rows.${i}`;
      if (!isRealDate(r.date)) errors.push(`${at}.date must be a real calendar date`);
      if (!refs.shiftIds.has(r.shiftTypeId))
        errors.push(`${at}.shiftTypeId must be a shift type of this unit`);
      if (r.skillId !== null && !refs.skillIds.has(r.skillId)) errors.push(`${at}.skillId must be a skill`);
      if (r.target < r.min) errors.push(`${at}.target must be at least min`);
      const key = `${r.date}|${r.shiftTypeId}|${r.skillId}`;
      if (seen.has(key)) errors.push(`${at} repeats the date, shift type and skill of an earlier row`);
      seen.add(key);
    });
    if (errors.length) throw new BadRequestException(errors);
    const dates = [...new Set(rows.map((r) => r.date))];
    const earlier = dates.length ? await em.findBy(CoverOverrideEntity, { unitId, date: In(dates) }) : [];
    const keys = new Set(rows.map((r) => `${r.date}|${r.shiftTypeId}|${r.skillId}`));
    const before = earlier
      .filter((o) => keys.has(`${o.date}|${o.shiftTypeId}|${o.skillId}`))
      .map(toOverrideDto);
    const cautions = await this.importCautions(unitId, refs, [], [...rows]);
    const saved = (await this.writeOverrides(em, unitId, [...rows])).map(toOverrideDto);
    return { before, saved, cautions };
  }

  /**
   * Minimums above 0 that an upload sets to 0: pattern rows it replaces (when it has any) and
   * dates whose override or pattern row asked for someone.
   */
  private async importCautions(
    unitId: string,
    refs: Awaited<ReturnType<CoverNeedsService['references']>>,
    pattern: PatternRow[],
    overrides: OverrideRow[],
  ): Promise<string[]> {
    const before = await this.pattern.findBy({ unitId });
    const out: string[] = [];
    if (pattern.length) {
      out.push(
        ...loweredToZeroCautions(
          before.map((r) => ({ ...r, day: r.weekday })),
          pattern.map((r) => ({ ...r, day: r.weekday })),
          needLabel(refs, (day) => `on ${WEEKDAY_NAMES[Number(day)]}`),
        ),
      );
    }
    const dated = overrides.length
      ? await this.overrides.findBy({ unitId, date: In(overrides.map((o) => o.date)) })
      : [];
    for (const o of overrides) {
      const same = (r: { shiftTypeId: string; skillId: string | null }) =>
        r.shiftTypeId === o.shiftTypeId && r.skillId === o.skillId;
      const weekday = new Date(`${o.date}T00:00:00Z`).getUTCDay();
      const earlier =
        dated.find((r) => r.date === o.date && same(r)) ??
        before.find((r) => r.weekday === weekday && same(r));
      if (!earlier) continue;
      out.push(
        ...loweredToZeroCautions(
          [{ ...o, min: earlier.min, day: o.date }],
          [{ ...o, day: o.date }],
          needLabel(refs, (day) => `on ${String(day)}`),
        ),
      );
    }
    return withDeferral(out);
  }

  private async writePattern(em: EntityManager, unitId: string, rows: PatternRow[]): Promise<void> {
    await em.delete(CoverPatternRowEntity, { unitId });
    for (const r of rows) {
      await em.save(
        em.create(CoverPatternRowEntity, {
          unitId,
          weekday: r.weekday,
          shiftTypeId: r.shiftTypeId,
          skillId: r.skillId,
          min: r.min,
          target: r.target,
        }),
      );
    }
  }

  private async writeOverrides(em: EntityManager, unitId: string, rows: OverrideRow[]) {
    const saved: CoverOverrideEntity[] = [];
    for (const r of rows) {
      await em
        .createQueryBuilder()
        .delete()
        .from(CoverOverrideEntity)
        .where('"unitId" = :unitId AND "date" = :date AND "shiftTypeId" = :shiftTypeId', { unitId, ...r })
        .andWhere(r.skillId === null ? '"skillId" IS NULL' : '"skillId" = :skillId', { skillId: r.skillId })
        .execute();
      saved.push(
        await em.save(
          em.create(CoverOverrideEntity, {
            unitId,
            date: r.date,
            shiftTypeId: r.shiftTypeId,
            skillId: r.skillId,
            min: r.min,
            target: r.target,
          }),
        ),
      );
    }
    return saved;
  }

  /**
   * What rows of cover needs (and of demand) may name: the unit's shift types and the caller's
   * organisation's skills, by id and by code.
   */
  async references(user: AuthUser, unitId: string) {
    const [shifts, skills] = await Promise.all([
      this.shiftTypes.findForUnit(unitId),
      this.skills.ofOrganisation(user.organisationId),
    ]);
    return {
      shiftIds: new Set(shifts.map((s) => s.id)),
      skillIds: new Set(skills.map((s) => s.id)),
      shiftByCode: new Map(shifts.map((s) => [s.code, s])),
      skillByCode: new Map(skills.map((s) => [s.code, s])),
    };
  }
}

/** "Night (N) on Sat, skill RN": a cover need in a manager's words. */
function needLabel(
  refs: { shiftByCode: Map<string, ShiftTypeEntity>; skillByCode: Map<string, SkillEntity> },
  when: (day: number | string) => string,
): (row: CoverMinimumRow) => string {
  const shifts = new Map([...refs.shiftByCode.values()].map((s) => [s.id, s]));
  const skills = new Map([...refs.skillByCode.values()].map((s) => [s.id, s]));
  return (row) => {
    const st = shifts.get(row.shiftTypeId);
    const skill = row.skillId === null ? '' : `, skill ${skills.get(row.skillId)?.code ?? row.skillId}`;
    return `${st ? `${st.name} (${st.code})` : 'A shift'} ${when(row.day)}${skill}`;
  };
}

/** The cautions, closed by the deferral to local law and agreements when there are any. */
function withDeferral(cautions: string[]): string[] {
  return cautions.length ? [...cautions, GUARD_RAIL_DEFERRAL] : [];
}

function toOverrideDto(o: CoverOverrideEntity): CoverOverrideDto {
  return {
    id: o.id,
    date: o.date,
    shiftTypeId: o.shiftTypeId,
    skillId: o.skillId,
    min: o.min,
    target: o.target,
  };
}
