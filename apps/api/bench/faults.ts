/**
 * Fault and load suite (issue 11, point 7). Starts the built API (production mode, demo data, a
 * fresh data directory, its own SMTP server in this process) and runs, in order:
 *
 *   A. 20 concurrent users for --duration seconds while a solve runs on another unit: 8 planners
 *      editing and pinning cells of one draft period (each in their own rows, so every answer can
 *      be checked), 2 clients publishing it with stale versions (each must be 409), 6 staff and
 *      manager readers, 4 clients sending bad input in bursts (each must be 4xx). The SMTP server
 *      is stopped for a while in the middle and started again.
 *   B. The period published with its version, then swaps of one shift asked of three colleagues,
 *      accepted, and their approvals racing (in the app and through the e-mailed links).
 *   C. kill -9 of the API during cell writes, then during a publish and swap approvals; restart on
 *      the same data directory; the database is checked for half-written changes.
 *   D. Every queued mail delivered, and counted per outbox message (exactly once is the aim).
 *
 * Lost updates are counted from the database itself: a planner's acknowledged cell that does not
 * hold its value, a version that does not equal the changes recorded, an approved swap whose cells,
 * journal entry or audit entry are missing, two approvals of one shift, a stale publish accepted.
 * Prints one table of requests, status classes and latency per phase, then the checks.
 *
 *   npx nx run api:build && npm run bench:faults -- [--duration 120] [--dist dist/api]
 *
 * (--dist: a compiled tree made by `tsc -p apps/api/tsconfig.app.json --outDir <dir>`.)
 */
import Database from 'better-sqlite3';
import { type ChildProcess, spawn } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { SMTPServer } from 'smtp-server';

const ROOT = resolve(__dirname, '../../..');
const API = '/api';
const PASSWORD = 'rotaplex-demo'; // demo data (apps/api/src/demo/demo-data.ts)
const PEOPLE = {
  a: 'staff@example.com',
  b: 'priya.wendover@example.com',
  c: 'tomasz.kellaway@example.com',
  d: 'grace.holloway@example.com',
} as const;

function option(name: string, fallback: string): string {
  const at = process.argv.indexOf(`--${name}`);
  return at > 0 ? process.argv[at + 1] : fallback;
}
const DURATION = Number(option('duration', '120'));
const DIST = resolve(ROOT, option('dist', 'dist/api'));
if (!Number.isInteger(DURATION) || DURATION < 10) throw new Error('--duration needs at least 10 seconds');

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const pick = <T>(xs: readonly T[]): T => xs[Math.floor(Math.random() * xs.length)];

// ---------------------------------------------------------------- measurements

interface Tally {
  requests: number;
  s2: number;
  s4: number;
  s5: number;
  /** No answer (connection refused or reset: the kills). */
  none: number;
  ms: number[];
}
const tallies = new Map<string, Tally>();
let phase = 'setup';
const fiveXX: string[] = [];

function tally(): Tally {
  let t = tallies.get(phase);
  if (!t) tallies.set(phase, (t = { requests: 0, s2: 0, s4: 0, s5: 0, none: 0, ms: [] }));
  return t;
}

interface Answer {
  status: number; // 0: no answer
  body: any; // eslint-disable-line @typescript-eslint/no-explicit-any
}

let baseUrl = '';

/** One HTTP call, counted in the current phase. */
async function call(
  token: string | null,
  method: string,
  path: string,
  body?: unknown,
  headers: Record<string, string> = {},
): Promise<Answer> {
  const t = tally();
  t.requests++;
  const started = performance.now();
  try {
    const res = await fetch(`${baseUrl}${API}${path}`, {
      method,
      headers: {
        ...(body !== undefined && typeof body !== 'string' ? { 'content-type': 'application/json' } : {}),
        ...(token ? { authorization: `Bearer ${token}` } : {}),
        ...headers,
      },
      body: body === undefined ? undefined : typeof body === 'string' ? body : JSON.stringify(body),
    });
    const text = await res.text();
    t.ms.push(performance.now() - started);
    if (res.status < 300) t.s2++;
    else if (res.status < 500) t.s4++;
    else {
      t.s5++;
      fiveXX.push(`${phase}: ${method} ${path} -> ${res.status} ${text.slice(0, 300)}`);
    }
    let parsed: unknown = text;
    try {
      parsed = JSON.parse(text);
    } catch {
      // not JSON
    }
    return { status: res.status, body: parsed };
  } catch {
    t.none++;
    return { status: 0, body: null };
  }
}

const quantile = (sorted: number[], q: number) =>
  sorted.length ? sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1))] : NaN;

function table(header: string[], rows: (string | number)[][]): string {
  const cells = [header, ...rows.map((r) => r.map(String))];
  const widths = header.map((_, c) => Math.max(...cells.map((r) => r[c].length)));
  const line = (r: string[]) => r.map((v, c) => v.padEnd(widths[c])).join('  ');
  return [line(cells[0]), widths.map((w) => '-'.repeat(w)).join('  '), ...cells.slice(1).map(line)].join(
    '\n',
  );
}

// ---------------------------------------------------------------- the SMTP server (the mail catcher)

/** Deliveries by outbox message id (from the Message-ID the outbox gives each message). */
const received = new Map<string, number>();
let smtp: SMTPServer | null = null;
let smtpPort = 0;

async function smtpUp(): Promise<void> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    onData(stream, _session, done) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', () => {
        const head = Buffer.concat(chunks)
          .toString('utf8')
          .split(/\r?\n\r?\n/)[0];
        const id =
          /^message-id:\s*<([^@>]+)@outbox\.rotaplex>/im.exec(head)?.[1] ?? `unknown-${received.size}`;
        received.set(id, (received.get(id) ?? 0) + 1);
        done();
      });
    },
  });
  await new Promise<void>((ok, fail) => {
    server.once('error', fail);
    server.listen(smtpPort, '127.0.0.1', () => ok());
  });
  // A connection the killed API left half-way is reset: that is expected here, not a failure.
  server.on('error', () => undefined);
  smtp = server;
}

async function smtpDown(): Promise<void> {
  const server = smtp;
  smtp = null;
  if (server) await new Promise<void>((ok) => server.close(() => ok()));
}

// ---------------------------------------------------------------- the API process

function freePort(): Promise<number> {
  return new Promise((ok, fail) => {
    const probe = createServer();
    probe.once('error', fail);
    probe.listen(0, '127.0.0.1', () => {
      const a = probe.address();
      const port = typeof a === 'object' && a ? a.port : 0;
      probe.close(() => ok(port));
    });
  });
}

let api: ChildProcess | null = null;
const apiLog: string[] = [];

async function startApi(dataDir: string, port: number): Promise<void> {
  // As apps/api/start.js, with the compiled tree from --dist.
  const boot = `require('tsconfig-paths').register({ baseUrl: ${JSON.stringify(DIST)}, paths: {
    '@rotaplex/contracts': ['libs/contracts/src/index.js'],
    '@rotaplex/roster-model': ['libs/roster-model/src/index.js'] } });
    require(${JSON.stringify(join(DIST, 'apps/api/src/main.js'))});`;
  const child = spawn(process.execPath, ['-e', boot], {
    cwd: ROOT,
    env: {
      ...process.env,
      NODE_ENV: 'production',
      PORT: String(port),
      PUBLIC_URL: `http://127.0.0.1:${port}`,
      DATA_DIR: dataDir,
      JWT_SECRET: 'fault-suite-secret-not-for-production-use-0123456789',
      SEED_DEMO: 'true',
      LOGIN_RATE_LIMIT: '1000',
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: String(smtpPort),
      OUTBOX_BASE_DELAY_MS: '250',
      OUTBOX_MAX_DELAY_MS: '2000',
      OUTBOX_MAX_ATTEMPTS: '100',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const keep = (c: Buffer) => {
    apiLog.push(c.toString());
    if (apiLog.length > 300) apiLog.shift();
  };
  child.stdout?.on('data', keep);
  child.stderr?.on('data', keep);
  api = child;
  baseUrl = `http://127.0.0.1:${port}`;
  const until = Date.now() + 120_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`The API stopped during start-up:\n${apiLog.join('')}`);
    try {
      const res = await fetch(`${baseUrl}${API}/health`);
      if (res.ok) return;
    } catch {
      // not listening yet
    }
    if (Date.now() > until) throw new Error(`The API did not start within 120 s:\n${apiLog.join('')}`);
    await sleep(250);
  }
}

async function stopApi(signal: NodeJS.Signals): Promise<void> {
  const child = api;
  api = null;
  if (!child || child.exitCode !== null || child.signalCode !== null) return;
  const exited = new Promise<void>((r) => child.once('exit', () => r()));
  child.kill(signal);
  await exited;
}

// ---------------------------------------------------------------- the product, through its API

async function signIn(email: string): Promise<string> {
  const res = await call(null, 'POST', '/auth/login', { email, password: PASSWORD });
  if (res.status !== 200) throw new Error(`sign-in of ${email}: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.accessToken as string;
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- answers of many routes, read by field
async function must(token: string, method: string, path: string, body?: unknown): Promise<any> {
  const res = await call(token, method, path, body);
  if (res.status >= 300) throw new Error(`${method} ${path}: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body;
}

const addDays = (date: string, n: number) =>
  new Date(Date.parse(`${date}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);

interface Grid {
  dates: string[];
  rows: { staffMemberId: string; name: string; cells: { shiftTypeId: string | null; pinned: boolean }[] }[];
}
type CellState = { shiftTypeId: string | null; pinned: boolean };
const key = (staffId: string, date: string) => `${staffId}|${date}`;

/**
 * A planner who owns some rows of the period: edits and pins only those, so after each answer the
 * planner knows what the cells must hold. `unsure` are cells whose last write got no answer.
 */
class Planner {
  readonly known = new Map<string, CellState>();
  readonly unsure = new Map<string, CellState[]>();
  wrongAnswers = 0;
  writes = 0;
  changed = 0;

  constructor(
    private readonly token: string,
    private readonly periodId: string,
    readonly staffIds: string[],
    private readonly dates: string[],
    private readonly shiftIds: string[],
  ) {}

  seed(grid: Grid): void {
    for (const row of grid.rows.filter((r) => this.staffIds.includes(r.staffMemberId)))
      row.cells.forEach((c, i) => this.known.set(key(row.staffMemberId, grid.dates[i]), { ...c }));
  }

  async step(): Promise<void> {
    const staffMemberId = pick(this.staffIds);
    const date = pick(this.dates);
    const k = key(staffMemberId, date);
    const before = this.known.get(k) ?? { shiftTypeId: null, pinned: false };
    const pin = Math.random() < 0.25;
    const intended: CellState = pin
      ? { shiftTypeId: before.shiftTypeId, pinned: !before.pinned }
      : { shiftTypeId: pick([null, ...this.shiftIds]), pinned: before.pinned };
    const path = `/roster-periods/${this.periodId}/assignments/${pin ? (before.pinned ? 'unpin' : 'pin') : 'cell'}`;
    const body = pin
      ? { staffMemberId, date }
      : { staffMemberId, date, shiftTypeId: intended.shiftTypeId, overrideReason: 'fault suite' };
    this.writes++;
    const res = await call(this.token, pin ? 'POST' : 'PUT', path, body);
    if (res.status === 0 || res.status >= 500) {
      this.unsure.set(k, [before, intended]);
      return;
    }
    if (res.status !== 200) return; // refused: the cell keeps what it had
    const grid = res.body as Grid;
    const row = grid.rows.find((r) => r.staffMemberId === staffMemberId)!;
    const now = row.cells[grid.dates.indexOf(date)];
    if (now.shiftTypeId !== intended.shiftTypeId || now.pinned !== intended.pinned) this.wrongAnswers++;
    if (now.shiftTypeId !== before.shiftTypeId || now.pinned !== before.pinned) this.changed++;
    this.known.set(k, { shiftTypeId: now.shiftTypeId, pinned: now.pinned });
    this.unsure.delete(k);
  }

  /** Cells that do not hold what the planner was told (lost updates), from the database. */
  lost(db: Database.Database): number {
    const rows = db
      .prepare(
        `SELECT "staffMemberId", "date", "shiftTypeId", "pinned" FROM "assignments" WHERE "rosterPeriodId" = ?`,
      )
      .all(this.periodId) as {
      staffMemberId: string;
      date: string;
      shiftTypeId: string | null;
      pinned: number;
    }[];
    const stored = new Map(rows.map((r) => [key(r.staffMemberId, r.date), r]));
    let lost = this.wrongAnswers;
    for (const [k, want] of this.known) {
      const r = stored.get(k);
      const have = { shiftTypeId: r?.shiftTypeId ?? null, pinned: !!r?.pinned };
      const options = this.unsure.get(k) ?? [want];
      if (!options.some((o) => o.shiftTypeId === have.shiftTypeId && o.pinned === have.pinned)) lost++;
    }
    return lost;
  }
}

/** Bad input of the kinds issue 11 found answering 500: each must be a 4xx. */
function badInputs(
  periodId: string,
  staffId: string,
  unitId: string,
): [string, string, unknown, Record<string, string>?][] {
  const deep = '['.repeat(2000) + ']'.repeat(2000);
  return [
    ['POST', '/auth/login', deep, { 'content-type': 'application/json' }],
    ['PUT', `/roster-periods/${periodId}/assignments/cell`, deep, { 'content-type': 'application/json' }],
    [
      'PUT',
      `/roster-periods/${periodId}/assignments/cell`,
      { staffMemberId: staffId, date: '2026-02-30', shiftTypeId: null },
    ],
    ['PUT', `/roster-periods/${periodId}/assignments/cell`, { staffMemberId: null, date: null }],
    ['PUT', `/roster-periods/${periodId}/assignments/cell`, { staffMemberId: 'x'.repeat(5000), date: 7 }],
    ['POST', `/roster-periods/${periodId}/publish`, { version: 'seven' }],
    ['POST', `/roster-periods/${periodId}/publish`, { version: -1 }],
    ['PATCH', `/units/${unitId}`, { name: null }],
    ['PATCH', `/units/${unitId}`, 'name=x', { 'content-type': 'text/plain' }],
    ['PATCH', `/units/${unitId}`, '<unit><name>x</name></unit>', { 'content-type': 'application/xml' }],
    ['GET', '/users?page=99999999999999999999', undefined],
    ['GET', '/swaps?pageSize=100000', undefined],
    ['GET', '/roster-periods/not-a-uuid', undefined],
    ['POST', '/swaps', { rosterPeriodId: periodId, kind: 'trade', myDate: '2031-13-01' }],
    ['POST', '/swap-links', { token: '../../etc/passwd', decision: 'approve' }],
    [
      'POST',
      '/auth/login',
      JSON.stringify({ email: 'a@b.c', password: 'x'.repeat(3_000_000) }),
      { 'content-type': 'application/json' },
    ],
  ];
}

// ---------------------------------------------------------------- checks on the database file

interface Checks {
  lostUpdates: number;
  stalePublishAccepted: number;
  doubleApprovals: number;
  halfWritten: number;
  integrity: string;
}
const checks: Checks = {
  lostUpdates: 0,
  stalePublishAccepted: 0,
  doubleApprovals: 0,
  halfWritten: 0,
  integrity: '',
};
const notes: string[] = [];

/** The period's version against its change journal: every cell change recorded, none half-written. */
function periodConsistent(
  db: Database.Database,
  periodId: string,
  baseVersion: number,
  baseChanges: number,
): boolean {
  const p = db.prepare(`SELECT "version", "status" FROM "roster_periods" WHERE "id" = ?`).get(periodId) as {
    version: number;
  };
  const changes = db
    .prepare(`SELECT "version" FROM "roster_period_changes" WHERE "rosterPeriodId" = ? ORDER BY "version"`)
    .all(periodId) as { version: number }[];
  const cellVersions = changes.length - baseChanges;
  // Each recorded cell change raised the version by one, in order, with no gap at the end.
  const contiguous = changes.every((c, i) => i === 0 || c.version > changes[i - 1].version);
  const last = changes.at(-1)?.version ?? baseVersion;
  const ok = contiguous && p.version >= last && p.version - baseVersion >= cellVersions;
  if (!ok)
    notes.push(
      `period ${periodId}: version ${p.version}, base ${baseVersion}, ${cellVersions} change(s) recorded, last at ${last}`,
    );
  return ok;
}

/** Every approved request: its cells hold their "after", its journal and audit entries exist. */
function swapsConsistent(db: Database.Database, periodId: string): number {
  const rows = db
    .prepare(`SELECT "id", "status", "changes", "kind" FROM "swap_requests" WHERE "rosterPeriodId" = ?`)
    .all(periodId) as { id: string; status: string; changes: string; kind: string }[];
  const cell = db.prepare(
    `SELECT "shiftTypeId" FROM "assignments" WHERE "rosterPeriodId" = ? AND "staffMemberId" = ? AND "date" = ?`,
  );
  let bad = 0;
  const byCell = new Map<string, number>();
  for (const r of rows.filter((x) => x.status === 'approved')) {
    for (const c of JSON.parse(r.changes) as {
      staffMemberId: string;
      date: string;
      before: string | null;
      after: string | null;
    }[]) {
      if (c.before !== null) {
        const k = key(c.staffMemberId, c.date);
        byCell.set(k, (byCell.get(k) ?? 0) + 1);
      }
    }
  }
  checks.doubleApprovals += [...byCell.values()].filter((n) => n > 1).length;
  const approved = rows.filter((x) => x.status === 'approved').length;
  const journal = (
    db
      .prepare(
        `SELECT COUNT(*) AS n FROM "roster_period_changes" WHERE "rosterPeriodId" = ? AND "kind" IN ('swap', 'open-shift-claim')`,
      )
      .get(periodId) as { n: number }
  ).n;
  const audit = (
    db
      .prepare(
        `SELECT COUNT(*) AS n FROM "audit_entries" WHERE "rosterPeriodId" = ? AND "kind" IN ('swap', 'open-shift-claim')`,
      )
      .get(periodId) as { n: number }
  ).n;
  if (journal !== approved || audit !== approved) {
    notes.push(
      `period ${periodId}: ${approved} approved request(s), ${journal} journal and ${audit} audit entries`,
    );
    bad++;
  }
  // An approved request's cells hold its "after" unless a later approved request changed them.
  const later = new Set([...byCell].filter(([, n]) => n > 1).map(([k]) => k));
  for (const r of rows.filter((x) => x.status === 'approved')) {
    for (const c of JSON.parse(r.changes) as {
      staffMemberId: string;
      date: string;
      after: string | null;
    }[]) {
      const have =
        (cell.get(periodId, c.staffMemberId, c.date) as { shiftTypeId: string | null } | undefined)
          ?.shiftTypeId ?? null;
      if (have !== c.after && !later.has(key(c.staffMemberId, c.date))) bad++;
    }
  }
  return bad;
}

// ---------------------------------------------------------------- the run

async function main(): Promise<void> {
  const dataDir = mkdtempSync(join(tmpdir(), 'rotaplex-faults-'));
  const port = await freePort();
  smtpPort = await freePort();
  await smtpUp();
  const t0 = Date.now();
  try {
    await startApi(dataDir, port);
    const manager = await signIn('manager@example.com');
    const admin = await signIn('admin@example.com');
    const manager2 = await signIn('manager2@example.com');
    const staff = Object.fromEntries(
      await Promise.all(Object.entries(PEOPLE).map(async ([k, e]) => [k, await signIn(e)] as const)),
    ) as Record<keyof typeof PEOPLE, string>;

    const units = (await must(admin, 'GET', '/units')) as { id: string; name: string }[];
    const ward = units.find((u) => u.name === 'Ward 7 Acute Medicine')!;
    const contact = units.find((u) => u.name === 'Contact Centre North');
    const shiftTypes = (await must(manager, 'GET', `/units/${ward.id}/shift-types`)) as {
      id: string;
      code: string;
    }[];
    const early = shiftTypes.find((s) => s.code === 'E')!.id;
    const late = shiftTypes.find((s) => s.code === 'L')!.id;
    // Two new periods of the ward, far enough ahead that no demo period overlaps them.
    const today = new Date().toISOString().slice(0, 10);
    let start = addDays(today, 120);
    while (new Date(`${start}T00:00:00Z`).getUTCDay() !== 1) start = addDays(start, 1);
    const p1 = await must(manager, 'POST', '/roster-periods', {
      unitId: ward.id,
      startDate: start,
      days: 28,
    });
    const p2 = await must(manager, 'POST', '/roster-periods', {
      unitId: ward.id,
      startDate: addDays(start, 28),
      days: 28,
    });
    const grid1 = (await must(manager, 'GET', `/roster-periods/${p1.id}/assignments`)) as Grid;
    const people = Object.fromEntries(
      await Promise.all(
        Object.keys(PEOPLE).map(async (k) => {
          const me = (await must(staff[k as keyof typeof PEOPLE], 'GET', '/me/requests')) as {
            staffMembers: { id: string; unitId: string }[];
          };
          return [k, me.staffMembers.find((s) => s.unitId === ward.id)!.id] as const;
        }),
      ),
    ) as Record<keyof typeof PEOPLE, string>;
    const laneStaff = grid1.rows
      .map((r) => r.staffMemberId)
      .filter((id) => !Object.values(people).includes(id));

    // ------------------------------------------------ A: 20 users, a solve elsewhere, SMTP down a while
    phase = 'A mixed load';
    let solveRun: string | null = null;
    if (contact) {
      const drafts = (
        await must(manager2, 'GET', `/roster-periods?status=draft&unitId=${contact.id}&pageSize=100`)
      ).items as { id: string }[];
      if (drafts[0]) {
        solveRun = (
          await must(manager2, 'POST', `/roster-periods/${drafts[0].id}/solve-runs`, {
            timeLimitSeconds: DURATION + 30,
          })
        ).id;
      }
    }
    const planners = Array.from({ length: 8 }, (_, i) => {
      const mine = laneStaff.filter((_s, j) => j % 8 === i);
      const p = new Planner(
        manager,
        p1.id,
        mine,
        grid1.dates,
        shiftTypes.map((s) => s.id),
      );
      p.seed(grid1);
      return p;
    }).filter((p) => p.staffIds.length > 0);
    const until = Date.now() + DURATION * 1000;
    let stalePublishes = 0;
    const loops: Promise<void>[] = [];
    for (const p of planners)
      loops.push(
        (async () => {
          while (Date.now() < until) await p.step();
        })(),
      );
    for (let i = 0; i < 2; i++) {
      loops.push(
        (async () => {
          while (Date.now() < until) {
            const { version } = await must(manager, 'GET', `/roster-periods/${p1.id}`);
            if (version > 0) {
              stalePublishes++;
              const res = await call(manager, 'POST', `/roster-periods/${p1.id}/publish`, {
                version: version - 1,
                acknowledgeBelowMinimum: true,
                reason: 'fault suite: a stale publish',
              });
              if (res.status >= 200 && res.status < 300) checks.stalePublishAccepted++;
            }
            await sleep(200);
          }
        })(),
      );
    }
    const readers: [string, string][] = [
      [staff.a, '/me/requests'],
      [staff.b, '/swaps'],
      [staff.c, '/open-shifts'],
      [staff.d, '/me/shifts'],
      [manager, `/roster-periods/${p1.id}/assignments`],
      [admin, '/outbox'],
    ];
    for (const [token, path] of readers)
      loops.push(
        (async () => {
          while (Date.now() < until) await call(token, 'GET', path);
        })(),
      );
    for (let i = 0; i < 4; i++) {
      loops.push(
        (async () => {
          const inputs = badInputs(p1.id, laneStaff[0], ward.id);
          while (Date.now() < until) {
            for (let burst = 0; burst < 10; burst++) {
              const [method, path, body, headers] = pick(inputs);
              await call(i % 2 ? manager : null, method, path, body, headers);
            }
            await sleep(500);
          }
        })(),
      );
    }
    await Promise.all(loops);
    if (solveRun) {
      const run = await must(manager2, 'GET', `/solve-runs/${solveRun}`);
      notes.push(`the solve on the contact centre's draft was ${run.status} at the end of the mixed load`);
      await call(manager2, 'POST', `/solve-runs/${solveRun}/cancel`);
    } else notes.push('no draft period to solve on the contact centre: the mixed load ran without a solve');

    // ------------------------------------------------ B: publish, then racing approvals
    phase = 'B swaps';
    // The SMTP server is down from here until the first restart: the mails of the publish and the
    // swaps wait in the outbox and are retried.
    await smtpDown();
    const smtpDownAt = Date.now();
    // A works an Early every other day from day 7, B, C and D a Late on the same days (shifts of
    // the same length, so a same-day swap changes nobody's paid hours).
    const offerDays = [7, 9, 11, 13, 15, 17, 19, 21].map((d) => grid1.dates[d]);
    let setupChanged = 0;
    let current = grid1;
    for (const d of grid1.dates.slice(6, 23)) {
      for (const who of ['a', 'b', 'c', 'd'] as const) {
        const shiftTypeId = offerDays.includes(d) ? (who === 'a' ? early : late) : null;
        const row = current.rows.find((r) => r.staffMemberId === people[who])!;
        const was = row.cells[current.dates.indexOf(d)];
        if (was.shiftTypeId === shiftTypeId && !was.pinned) continue;
        current = await must(manager, 'PUT', `/roster-periods/${p1.id}/assignments/cell`, {
          staffMemberId: people[who],
          date: d,
          shiftTypeId,
          overrideReason: 'fault suite',
        });
        if (was.shiftTypeId !== shiftTypeId) setupChanged++;
      }
    }
    const { version: v1 } = await must(manager, 'GET', `/roster-periods/${p1.id}`);
    const published = await call(manager, 'POST', `/roster-periods/${p1.id}/publish`, {
      version: v1,
      acknowledgeBelowMinimum: true,
      reason: 'fault suite',
    });
    if (published.status !== 200)
      notes.push(`publish with the current version: ${published.status} ${JSON.stringify(published.body)}`);
    const raceDays = offerDays.slice(0, 5);
    const killDays = offerDays.slice(5);
    const accepted: Record<string, string[]> = {};
    for (const d of offerDays) {
      accepted[d] = [];
      for (const who of ['b', 'c', 'd'] as const) {
        const offer = await call(staff.a, 'POST', '/swaps', {
          rosterPeriodId: p1.id,
          kind: 'swap',
          myDate: d,
          theirDate: d,
          colleagueStaffMemberId: people[who],
        });
        if (offer.status !== 201) {
          if (process.env.FAULTS_DEBUG)
            console.log('offer', offer.status, JSON.stringify(offer.body).slice(0, 400));
          continue;
        }
        const yes = await call(staff[who], 'POST', `/swaps/${offer.body.id}/decision`, {
          decision: 'accept',
        });
        if (yes.status === 200) accepted[d].push(offer.body.id);
      }
    }
    await Promise.all(
      raceDays.flatMap((d) =>
        accepted[d].map((id, i) =>
          call(i % 2 ? admin : manager, 'POST', `/swaps/${id}/decision`, { decision: 'approve' }),
        ),
      ),
    );

    // ------------------------------------------------ C: kill -9 during writes, restart
    phase = 'C kill -9';
    const db0 = new Database(join(dataDir, 'rotaplex.sqlite'), { readonly: true });
    const base2 = db0.prepare(`SELECT "version" FROM "roster_periods" WHERE "id" = ?`).get(p2.id) as {
      version: number;
    };
    const baseChanges2 = (
      db0
        .prepare(`SELECT COUNT(*) AS n FROM "roster_period_changes" WHERE "rosterPeriodId" = ?`)
        .get(p2.id) as { n: number }
    ).n;
    db0.close();
    const grid2 = (await must(manager, 'GET', `/roster-periods/${p2.id}/assignments`)) as Grid;
    const killPlanners = Array.from({ length: 8 }, (_, i) => {
      const p = new Planner(
        manager,
        p2.id,
        laneStaff.filter((_s, j) => j % 8 === i),
        grid2.dates,
        shiftTypes.map((s) => s.id),
      );
      p.seed(grid2);
      return p;
    });
    let killed = false;
    // Round 1: cell writes on p2, killed after a random 1-3 s.
    const writers = killPlanners.map((p) =>
      (async () => {
        while (!killed) await p.step();
      })(),
    );
    await sleep(1000 + Math.random() * 2000);
    killed = true;
    await stopApi('SIGKILL');
    await Promise.all(writers);
    await startApi(dataDir, port);
    const smtpDownSeconds = (Date.now() - smtpDownAt) / 1000;
    await smtpUp();
    // Rounds 2-4: the approvals of one day's swaps (and, in the first, a publish of p2) racing,
    // the API killed 30-400 ms after they leave, then started again.
    let kills = 1;
    for (const [round, d] of killDays.entries()) {
      const mgr = await signIn('manager@example.com');
      const adm = await signIn('admin@example.com');
      const { version: v2 } = await must(mgr, 'GET', `/roster-periods/${p2.id}`);
      const inFlight = [
        ...(round === 0
          ? [
              call(mgr, 'POST', `/roster-periods/${p2.id}/publish`, {
                version: v2,
                acknowledgeBelowMinimum: true,
                reason: 'fault suite',
              }),
            ]
          : []),
        ...accepted[d].map((id, i) =>
          call(i % 2 ? adm : mgr, 'POST', `/swaps/${id}/decision`, { decision: 'approve' }),
        ),
      ];
      await sleep(30 + Math.random() * 370);
      await stopApi('SIGKILL');
      kills++;
      await Promise.all(inFlight);
      await startApi(dataDir, port);
    }

    const db = new Database(join(dataDir, 'rotaplex.sqlite'), { readonly: true });
    checks.integrity = (db.pragma('integrity_check', { simple: true }) as string) ?? '';
    checks.lostUpdates += [...planners, ...killPlanners].reduce((n, p) => n + p.lost(db), 0);
    // Every acknowledged change of a cell made one version (one journal row); in-flight ones at
    // the kill may or may not have.
    const cellJournal = (periodId: string) =>
      (
        db
          .prepare(
            `SELECT COUNT(*) AS n FROM "roster_period_changes" WHERE "rosterPeriodId" = ? AND "kind" IN ('edit', 'pin', 'unpin')`,
          )
          .get(periodId) as { n: number }
      ).n;
    const acknowledged1 = planners.reduce((n, p) => n + p.changed, 0) + setupChanged;
    if (cellJournal(p1.id) !== acknowledged1) {
      checks.lostUpdates += Math.abs(cellJournal(p1.id) - acknowledged1);
      notes.push(`p1: ${acknowledged1} acknowledged cell changes, ${cellJournal(p1.id)} journal rows`);
    }
    const acknowledged2 = killPlanners.reduce((n, p) => n + p.changed, 0);
    const unsure2 = killPlanners.reduce((n, p) => n + p.unsure.size, 0);
    const journal2 = cellJournal(p2.id) - baseChanges2;
    if (journal2 < acknowledged2 || journal2 > acknowledged2 + unsure2) {
      checks.lostUpdates += Math.max(acknowledged2 - journal2, journal2 - acknowledged2 - unsure2);
      notes.push(
        `p2: ${acknowledged2} acknowledged cell changes (+${unsure2} in flight at the kill), ${journal2} journal rows`,
      );
    }
    if (!periodConsistent(db, p1.id, 0, 0)) checks.halfWritten++;
    if (!periodConsistent(db, p2.id, base2.version, baseChanges2)) checks.halfWritten++;
    checks.halfWritten += swapsConsistent(db, p1.id);
    const p2Row = db.prepare(`SELECT "status" FROM "roster_periods" WHERE "id" = ?`).get(p2.id) as {
      status: string;
    };
    const p2Publications = (
      db.prepare(`SELECT COUNT(*) AS n FROM "roster_publications" WHERE "rosterPeriodId" = ?`).get(p2.id) as {
        n: number;
      }
    ).n;
    if ((p2Row.status === 'published') !== p2Publications > 0) {
      checks.halfWritten++;
      notes.push(`p2 is ${p2Row.status} with ${p2Publications} publication record(s)`);
    }
    const killed2 = killDays.flatMap((d) => accepted[d]);
    const statuses = db
      .prepare(
        `SELECT "status", COUNT(*) AS n FROM "swap_requests" WHERE "id" IN (${killed2.map(() => '?').join(',') || "''"}) GROUP BY "status"`,
      )
      .all(...killed2) as { status: string; n: number }[];
    notes.push(
      `swap approvals sent just before the kills, after the restarts: ${statuses.map((x) => `${x.n} ${x.status}`).join(', ')}`,
    );
    notes.push(
      `after the kills: p2 ${p2Row.status}; swaps of the killed approvals: ${killDays.map((d) => accepted[d].length).join('/')} accepted swaps per day`,
    );
    db.close();

    // ------------------------------------------------ D: every queued mail delivered
    phase = 'D mail';
    const deadline = Date.now() + 120_000;
    let outbox: { id: string; status: string; attempts: number }[] = [];
    for (;;) {
      const dbm = new Database(join(dataDir, 'rotaplex.sqlite'), { readonly: true });
      outbox = dbm.prepare(`SELECT "id", "status", "attempts" FROM "outbox_messages"`).all() as typeof outbox;
      dbm.close();
      if (outbox.every((m) => m.status === 'sent' || m.status === 'failed') || Date.now() > deadline) break;
      await sleep(500);
    }
    const sent = outbox.filter((m) => m.status === 'sent');
    const never = outbox.filter((m) => m.status !== 'sent').length;
    const missing = sent.filter((m) => !received.get(m.id)).length;
    const twice = sent.filter((m) => (received.get(m.id) ?? 0) > 1).length;

    // ------------------------------------------------ the report
    const rows = [...tallies].map(([name, t]) => {
      const ms = [...t.ms].sort((a, b) => a - b);
      return [
        name,
        t.requests,
        t.s2,
        t.s4,
        t.s5,
        t.none,
        quantile(ms, 0.5).toFixed(1),
        quantile(ms, 0.95).toFixed(1),
      ];
    });
    const all = [...tallies.values()];
    const sum = (f: (t: Tally) => number) => all.reduce((n, t) => n + f(t), 0);
    const allMs = all.flatMap((t) => t.ms).sort((a, b) => a - b);
    rows.push([
      'total',
      sum((t) => t.requests),
      sum((t) => t.s2),
      sum((t) => t.s4),
      sum((t) => t.s5),
      sum((t) => t.none),
      quantile(allMs, 0.5).toFixed(1),
      quantile(allMs, 0.95).toFixed(1),
    ]);
    console.log(
      `\nFault and load suite: ${DURATION} s of mixed load (20 users, a solve running), SMTP down for ${smtpDownSeconds.toFixed(0)} s, ${kills} kill -9 and restarts; ${Math.round((Date.now() - t0) / 1000)} s in all\n`,
    );
    console.log(table(['phase', 'requests', '2xx', '4xx', '5xx', 'no answer', 'p50 ms', 'p95 ms'], rows));
    console.log('');
    console.log(
      table(
        ['check', 'found', 'must be'],
        [
          ['5xx answers', sum((t) => t.s5), 0],
          ['lost updates (cells, versions, approvals)', checks.lostUpdates, 0],
          ['stale publishes accepted', `${checks.stalePublishAccepted} of ${stalePublishes}`, 0],
          ['one shift approved twice', checks.doubleApprovals, 0],
          ['half-written changes after kill -9', checks.halfWritten, 0],
          ['SQLite integrity_check', checks.integrity, 'ok'],
          [
            'planner cell writes (changed a cell)',
            `${[...planners, ...killPlanners].reduce((n, p) => n + p.writes, 0)} (${[...planners, ...killPlanners].reduce((n, p) => n + p.changed, 0)})`,
            '-',
          ],
          ['outbox messages sent / not sent', `${sent.length} / ${never}`, 'all / 0'],
          ['outbox messages tried more than once', outbox.filter((m) => m.attempts > 1).length, '-'],
          ['sent but never received', missing, 0],
          ['received more than once (resent after a kill)', twice, 'ideally 0'],
        ],
      ),
    );
    for (const n of notes) console.log(`note: ${n}`);
    for (const f of fiveXX.slice(0, 20)) console.log(`5xx: ${f}`);
    const failed =
      sum((t) => t.s5) +
      checks.lostUpdates +
      checks.stalePublishAccepted +
      checks.doubleApprovals +
      checks.halfWritten +
      missing +
      never;
    if (failed || checks.integrity !== 'ok') process.exitCode = 1;
  } finally {
    await stopApi('SIGTERM');
    await smtpDown();
    rmSync(dataDir, { recursive: true, force: true });
  }
}

main().catch(async (e: unknown) => {
  console.error(e);
  console.error(apiLog.slice(-40).join(''));
  await stopApi('SIGKILL');
  process.exit(1);
});
