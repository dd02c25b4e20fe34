import {
  type AcceptDemandPlanResultDto,
  type CoverNeedsDto,
  type CsvImportResult,
  DEMAND_ROUTES as D,
  type DemandAcceptanceDto,
  type DemandPlanDto,
  ERLANG_CAUTION,
  type Page,
  PLANNING_ROUTES as P,
  type PutUnitDemandRequest,
  RATIO_CAUTION,
  type RosterPeriodDto,
  type SkillDto,
  type UnitDemandDto,
  UNDER_COVER_CAUTION,
  type UnitDto,
} from '@rotaplex/contracts';
import { UnitDemandEntity } from '../src/demand/demand.entities';
import { CoverOverrideEntity } from '../src/cover-needs/cover-need.entity';
import { findUnit, shiftTypesByCode } from './support/planning';
import { api, bearer, startTestApp, type TestApp } from './support/test-app';

/**
 * From demand to cover through the real API on a real SQLite file with the demo data: the seeded
 * contact-centre forecast and ward ratios, the plan computed on HiGHS, the accept step writing
 * cover needs, and bad input refused with nothing saved.
 */
describe('demand: forecast, plan and accept', () => {
  let t: TestApp;
  let admin: string;
  let wardManager: string;
  let centreManager: string;
  let staff: string;
  let centre: UnitDto;
  let ward: UnitDto;
  let centrePeriod: RosterPeriodDto;
  let wardPeriod: RosterPeriodDto;
  let skills: Record<string, SkillDto>;

  beforeAll(async () => {
    t = await startTestApp();
    admin = (await t.login('admin@example.com')).token;
    wardManager = (await t.login('manager@example.com')).token;
    centreManager = (await t.login('manager2@example.com')).token;
    staff = (await t.login('staff@example.com')).token;
    centre = await findUnit(t, admin, 'Contact Centre North');
    ward = await findUnit(t, admin);
    const periodOf = async (unitId: string) =>
      (
        (await t.http().get(api(P.rosterPeriods)).query({ unitId }).set(bearer(admin)).expect(200))
          .body as Page<RosterPeriodDto>
      ).items[0];
    centrePeriod = await periodOf(centre.id);
    wardPeriod = await periodOf(ward.id);
    const sk = (await t.http().get(api(P.skills)).set(bearer(admin)).expect(200)).body as SkillDto[];
    skills = Object.fromEntries(sk.map((s) => [s.code, s]));
  });
  afterAll(() => t.close());

  const getDemand = async (unitId: string, token = admin) =>
    (
      await t
        .http()
        .get(api(D.demand(unitId)))
        .set(bearer(token))
        .expect(200)
    ).body as UnitDemandDto;
  const storedRow = (unitId: string) => t.dataSource.getRepository(UnitDemandEntity).findOneBy({ unitId });

  describe('access', () => {
    it('refuses anonymous callers (401), staff (403) and a manager of another unit (403)', async () => {
      await t
        .http()
        .get(api(D.demand(centre.id)))
        .expect(401);
      await t
        .http()
        .get(api(D.demand(centre.id)))
        .set(bearer(staff))
        .expect(403);
      await t
        .http()
        .get(api(D.demand(centre.id)))
        .set(bearer(wardManager))
        .expect(403);
      await t
        .http()
        .get(api(D.plan(centrePeriod.id)))
        .set(bearer(wardManager))
        .expect(403);
      await t
        .http()
        .post(api(D.accept(centrePeriod.id)))
        .set(bearer(staff))
        .send({ rows: [] })
        .expect(403);
    });
  });

  describe('the seeded demand', () => {
    it('the contact centre has a half-hour forecast for Monday to Saturday with the Erlang caution', async () => {
      const d = await getDemand(centre.id, centreManager);
      expect(d.contactCentre?.intervalMinutes).toBe(30);
      expect(d.contactCentre?.pattern.map((p) => p.weekday)).toEqual([1, 2, 3, 4, 5, 6]);
      expect(d.ward).toBeNull();
      expect(d.cautions).toContain(ERLANG_CAUTION);
    });

    it('the ward has patients and ratios, with the caution that a ratio is a floor set by law', async () => {
      const d = await getDemand(ward.id, wardManager);
      expect(d.ward?.ratios.map((r) => r.skillId).sort()).toEqual([skills.HCA.id, skills.RN.id].sort());
      expect(d.cautions).toContain(RATIO_CAUTION);
    });
  });

  describe('the plan for a roster period', () => {
    let plan: DemandPlanDto;
    beforeAll(async () => {
      plan = (
        await t
          .http()
          .get(api(D.plan(centrePeriod.id)))
          .set(bearer(centreManager))
          .expect(200)
      ).body as DemandPlanDto;
    });

    it('has one requirement row per half hour of the 28 days, and Erlang C numbers in it', () => {
      const c = plan.contactCentre!;
      expect(plan.dates).toHaveLength(28);
      expect(c.requirement).toHaveLength(28 * 48);
      expect(c.cover).toHaveLength(28 * 48);
      const busy = c.requirement.filter((r) => r.contacts > 0);
      expect(busy.length).toBeGreaterThan(0);
      for (const r of busy) {
        // every busy interval meets the target with its agents, and scheduled = ceil(agents / 0.7)
        expect(r.serviceLevelPercent!).toBeGreaterThanOrEqual(80 - 1e-9);
        expect(r.scheduled).toBe(Math.ceil(r.agents / 0.7 - 1e-9));
      }
      expect(plan.cautions).toContain(ERLANG_CAUTION);
    });

    it('covers every interval (no cap) with whole people per shift, and states paid hours', async () => {
      const c = plan.contactCentre!;
      expect(c.underCoverPersonIntervals).toBe(0);
      c.cover.forEach((iv, k) => expect(iv.planned).toBeGreaterThanOrEqual(c.requirement[k].scheduled));
      const shifts = await shiftTypesByCode(t, admin, centre.id);
      const paid = Object.fromEntries(Object.values(shifts).map((s) => [s.id, s.paidMinutes]));
      const hours = c.starts.reduce((h, s) => h + (s.people * paid[s.shiftTypeId]) / 60, 0);
      expect(c.paidHours).toBeCloseTo(hours, 6);
      for (const s of c.starts) expect(s.people).toBeGreaterThanOrEqual(s.minimum);
      // Sundays are closed in the demo forecast: nobody starts
      const sunday = c.starts.filter((s) => new Date(`${s.date}T00:00:00Z`).getUTCDay() === 0);
      expect(sunday.every((s) => s.people === 0)).toBe(true);
      expect(c.solverStatus).toBe('optimal');
    });

    it('the ward plan is patients / ratio rounded up, never below the floor', async () => {
      const wp = (
        await t
          .http()
          .get(api(D.plan(wardPeriod.id)))
          .set(bearer(wardManager))
          .expect(200)
      ).body as DemandPlanDto;
      expect(wp.contactCentre).toBeNull();
      const shifts = await shiftTypesByCode(t, admin, ward.id);
      const early = wp.ward!.requirement.find(
        (r) => r.shiftTypeId === shifts.E.id && r.skillId === skills.RN.id,
      )!;
      // demo: 12 low at 1:8, 6 medium at 1:6, 2 high at 1:4 -> 1.5 + 1 + 0.5 = 3
      expect(early).toMatchObject({ byRatio: 3, floor: 2, required: 3 });
      expect(wp.cautions).toContain(RATIO_CAUTION);
      for (const r of wp.ward!.requirement) expect(r.required).toBeGreaterThanOrEqual(r.floor);
    });
    it('a cap on people per day leaves intervals short, priced, with the under-cover caution', async () => {
      const stored = await getDemand(centre.id, centreManager);
      const capped = { contactCentre: { ...stored.contactCentre!, maxPeoplePerDay: 4 }, ward: null };
      await t
        .http()
        .put(api(D.demand(centre.id)))
        .set(bearer(centreManager))
        .send(capped)
        .expect(200);
      try {
        const p = (
          await t
            .http()
            .get(api(D.plan(centrePeriod.id)))
            .set(bearer(centreManager))
            .expect(200)
        ).body as DemandPlanDto;
        const c = p.contactCentre!;
        expect(c.underCoverPersonIntervals).toBeGreaterThan(0);
        expect(p.cautions).toContain(UNDER_COVER_CAUTION);
        for (const date of p.dates) {
          const day = c.starts.filter((s) => s.date === date);
          expect(day.reduce((n, s) => n + s.people, 0)).toBeLessThanOrEqual(4);
        }
        // short = scheduled - planned wherever the plan falls below the requirement
        c.cover.forEach((iv, k) =>
          expect(iv.short).toBe(Math.max(0, c.requirement[k].scheduled - iv.planned)),
        );
      } finally {
        const restore = { contactCentre: stored.contactCentre, ward: null };
        await t
          .http()
          .put(api(D.demand(centre.id)))
          .set(bearer(centreManager))
          .send(restore)
          .expect(200);
      }
    });
  });

  describe('accept', () => {
    it('writes the plan as date overrides of the cover needs, records who did it, and reads back', async () => {
      const plan = (
        await t
          .http()
          .get(api(D.plan(centrePeriod.id)))
          .set(bearer(centreManager))
          .expect(200)
      ).body as DemandPlanDto;
      const rows = plan
        .contactCentre!.starts.filter((s) => s.people > 0)
        .map((s) => ({
          date: s.date,
          shiftTypeId: s.shiftTypeId,
          skillId: null,
          min: s.minimum,
          target: s.people,
        }));
      const res = await t
        .http()
        .post(api(D.accept(centrePeriod.id)))
        .set(bearer(centreManager))
        .send({ rows })
        .expect(201);
      const result = res.body as AcceptDemandPlanResultDto;
      expect(result.written).toBe(rows.length);
      const needs = (
        await t
          .http()
          .get(api(P.coverNeeds(centre.id)))
          .set(bearer(centreManager))
          .expect(200)
      ).body as CoverNeedsDto;
      for (const r of rows) {
        expect(needs.overrides).toContainEqual(expect.objectContaining(r));
      }
      const log = (
        await t
          .http()
          .get(api(D.acceptances(centrePeriod.id)))
          .set(bearer(centreManager))
          .expect(200)
      ).body as DemandAcceptanceDto[];
      expect(log[0]).toMatchObject({ id: result.acceptanceId, written: rows.length });
      expect(log[0].actorName).toBeTruthy();
    });

    it('accepting ward rows for a skill with a ratio carries the ratio caution', async () => {
      const wp = (
        await t
          .http()
          .get(api(D.plan(wardPeriod.id)))
          .set(bearer(wardManager))
          .expect(200)
      ).body as DemandPlanDto;
      const rows = wp
        .ward!.requirement.filter((r) => r.date === wardPeriod.startDate)
        .map((r) => ({
          date: r.date,
          shiftTypeId: r.shiftTypeId,
          skillId: r.skillId,
          min: r.required,
          target: r.required,
        }));
      const res = await t
        .http()
        .post(api(D.accept(wardPeriod.id)))
        .set(bearer(wardManager))
        .send({ rows })
        .expect(201);
      expect((res.body as AcceptDemandPlanResultDto).cautions).toContain(RATIO_CAUTION);
      expect((res.body as AcceptDemandPlanResultDto).written).toBe(rows.length);
    });

    it('refuses rows outside the period, a foreign shift type or target below min: 400, nothing written', async () => {
      const before = await t.dataSource.getRepository(CoverOverrideEntity).count();
      const shifts = await shiftTypesByCode(t, admin, centre.id);
      const wardShifts = await shiftTypesByCode(t, admin, ward.id);
      const ok = { date: centrePeriod.startDate, shiftTypeId: shifts.D.id, skillId: null, min: 1, target: 2 };
      const probes: object[] = [
        { rows: [ok, { ...ok, date: '1999-01-01' }] },
        { rows: [ok, { ...ok, date: centrePeriod.startDate, shiftTypeId: wardShifts.E.id }] },
        { rows: [{ ...ok, min: 3, target: 2 }] },
        { rows: [ok, ok] },
        { rows: [{ ...ok, min: -1 }] },
        { rows: [{ ...ok, date: '2027-02-30' }] },
        { rows: [] },
        { rows: [{ ...ok, extra: 1 }] },
        {},
      ];
      for (const body of probes) {
        const res = await t
          .http()
          .post(api(D.accept(centrePeriod.id)))
          .set(bearer(centreManager))
          .send(body);
        expect({ body, status: res.status }).toEqual({ body, status: 400 });
      }
      expect(await t.dataSource.getRepository(CoverOverrideEntity).count()).toBe(before);
    });
  });

  describe('writing the demand', () => {
    const valid = (): PutUnitDemandRequest => ({
      contactCentre: {
        intervalMinutes: 15,
        skillId: null,
        service: { targetPercent: 80, targetSeconds: 20, maxOccupancyPercent: 85, shrinkagePercent: 30 },
        pattern: [{ weekday: 1, intervals: [{ start: '09:00', contacts: 90, ahtSeconds: 240 }] }],
        dates: [],
        shiftTypeIds: [],
        maxPeoplePerDay: null,
      },
      ward: null,
    });

    it('PUT replaces both parts and GET reads them back', async () => {
      const unit = (
        await t
          .http()
          .post(api('/units'))
          .set(bearer(admin))
          .send({ name: 'Demand Test Desk', timeZone: 'Europe/London' })
          .expect(201)
      ).body as UnitDto;
      const res = await t
        .http()
        .put(api(D.demand(unit.id)))
        .set(bearer(admin))
        .send(valid())
        .expect(200);
      expect((res.body as UnitDemandDto).contactCentre?.pattern[0].intervals[0]).toEqual({
        start: '09:00',
        contacts: 90,
        ahtSeconds: 240,
      });
      expect((await getDemand(unit.id)).contactCentre?.intervalMinutes).toBe(15);
    });

    it('refuses bad bodies with 400 and keeps what was stored', async () => {
      const before = await storedRow(centre.id);
      const shifts = await shiftTypesByCode(t, admin, ward.id);
      const cc = valid().contactCentre!;
      const probes: object[] = [
        { ...valid(), contactCentre: { ...cc, intervalMinutes: 20 } },
        { ...valid(), contactCentre: { ...cc, service: { ...cc.service, targetPercent: 100 } } },
        { ...valid(), contactCentre: { ...cc, service: { ...cc.service, shrinkagePercent: 90 } } },
        { ...valid(), contactCentre: { ...cc, pattern: [{ weekday: 7, intervals: [] }] } },
        {
          ...valid(),
          contactCentre: {
            ...cc,
            pattern: [{ weekday: 1, intervals: [{ start: '09:10', contacts: 5, ahtSeconds: 200 }] }],
          },
        },
        {
          ...valid(),
          contactCentre: {
            ...cc,
            pattern: [
              {
                weekday: 1,
                intervals: [
                  { start: '09:00', contacts: 5, ahtSeconds: 200 },
                  { start: '09:00', contacts: 6, ahtSeconds: 200 },
                ],
              },
            ],
          },
        },
        {
          ...valid(),
          contactCentre: {
            ...cc,
            pattern: [{ weekday: 1, intervals: [{ start: '09:00', contacts: -1, ahtSeconds: 200 }] }],
          },
        },
        {
          ...valid(),
          contactCentre: {
            ...cc,
            pattern: [{ weekday: 1, intervals: [{ start: '09:00', contacts: 5, ahtSeconds: 0 }] }],
          },
        },
        { ...valid(), contactCentre: { ...cc, shiftTypeIds: [shifts.E.id] } },
        { ...valid(), contactCentre: { ...cc, skillId: '00000000-0000-4000-8000-000000000000' } },
        { ...valid(), contactCentre: { ...cc, dates: [{ date: '2027-02-30', intervals: [] }] } },
        {
          contactCentre: null,
          ward: {
            patients: [
              { weekday: 1, date: null, shiftTypeId: shifts.E.id, patients: { low: 1, medium: 0, high: 0 } },
            ],
            ratios: [
              {
                skillId: skills.RN.id,
                patientsPerStaff: { low: 0, medium: 5, high: 2 },
                minimumPerShift: 2,
                source: 'x',
              },
            ],
          },
        },
        {
          contactCentre: null,
          ward: {
            patients: [
              {
                weekday: 1,
                date: '2027-01-04',
                shiftTypeId: shifts.E.id,
                patients: { low: 1, medium: 0, high: 0 },
              },
            ],
            ratios: [],
          },
        },
        { contactCentre: 'yes', ward: null },
        { ward: null },
        { ...valid(), extra: true },
      ];
      for (const body of probes) {
        const res = await t
          .http()
          .put(api(D.demand(centre.id)))
          .set(bearer(centreManager))
          .send(body);
        expect({ body, status: res.status }).toEqual({ body, status: 400 });
      }
      expect(await storedRow(centre.id)).toEqual(before);
    });
  });

  describe('CSV upload of contacts', () => {
    const upload = (csv: string, dryRun = false, token = centreManager) =>
      t
        .http()
        .post(api(D.contactsImport(centre.id)))
        .query({ dryRun: String(dryRun) })
        .set(bearer(token))
        .set('Content-Type', 'text/csv')
        .send(csv);

    it('a bad row anywhere: 400 with per-row errors and nothing saved', async () => {
      const before = await storedRow(centre.id);
      const res = await upload(
        [
          'day,start,contacts,aht',
          'Mon,09:00,12,300',
          'Funday,09:30,5,300',
          'Tue,09:10,5,300',
          'Wed,10:00,-3,0',
          'Mon,09:00,4,300',
        ].join('\n'),
      );
      expect(res.status).toBe(400);
      const body = res.body as CsvImportResult;
      expect(body.saved).toBe(0);
      expect(body.errors).toEqual(
        expect.arrayContaining([
          expect.objectContaining({ line: 3, field: 'day' }),
          expect.objectContaining({ line: 4, field: 'start' }),
          expect.objectContaining({ line: 5, field: 'contacts' }),
          expect.objectContaining({ line: 5, field: 'aht' }),
          expect.objectContaining({ line: 6, field: 'start' }),
        ]),
      );
      expect(await storedRow(centre.id)).toEqual(before);
    });

    it('a dry run checks without saving; a good file replaces the week and adds a date', async () => {
      const before = await storedRow(centre.id);
      const csv = [
        'day,start,contacts,aht',
        'Mon,09:00,12,300',
        'Mon,09:30,14.5,280',
        '2027-03-01,10:00,40,300',
      ].join('\n');
      const dry = await upload(csv, true).expect(200);
      expect((dry.body as CsvImportResult).errors).toEqual([]);
      expect(await storedRow(centre.id)).toEqual(before);
      const res = await upload(csv).expect(200);
      expect((res.body as CsvImportResult).saved).toBe(3);
      const d = await getDemand(centre.id, centreManager);
      expect(d.contactCentre?.pattern).toEqual([
        {
          weekday: 1,
          intervals: [
            { start: '09:00', contacts: 12, ahtSeconds: 300 },
            { start: '09:30', contacts: 14.5, ahtSeconds: 280 },
          ],
        },
      ]);
      expect(d.contactCentre?.dates).toEqual([
        { date: '2027-03-01', intervals: [{ start: '10:00', contacts: 40, ahtSeconds: 300 }] },
      ]);
    });

    it('a unit without a contact-centre part cannot take a CSV (400), and JSON is not CSV', async () => {
      await t
        .http()
        .post(api(D.contactsImport(ward.id)))
        .set(bearer(wardManager))
        .set('Content-Type', 'text/csv')
        .send('day,start,contacts,aht\nMon,09:00,1,300')
        .expect(400);
      expect([400, 415]).toContain((await upload('').set('Content-Type', 'application/json')).status);
    });
  });
});
