/**
 * Erlang B and C, and the staffing numbers a contact centre reads from them.
 *
 * Offered traffic A (Erlangs) = contacts in an interval x average handle time / interval length.
 * With N agents and random (Poisson) arrivals:
 * - Erlang B, the blocking probability of N servers without a queue, by the recurrence
 *   B(0) = 1, B(n) = A B(n-1) / (n + A B(n-1)): every step is a ratio of positive numbers at most 1,
 *   so nothing overflows (no A^N, no N!) for any N and A;
 * - Erlang C, the probability that a contact waits, C = N B / (N - A (1 - B)) for N > A (1 otherwise);
 * - service level SL(T) = 1 - C e^(-(N - A) T / AHT), the share answered within T seconds;
 * - average speed of answer ASA = C AHT / (N - A) seconds;
 * - occupancy A / N.
 * The fewest agents for a target is the smallest N > A with SL(T) at least the target and A / N at
 * most the occupancy cap. Scheduled agents add shrinkage: ceil(N / (1 - s)).
 */

/** Offered traffic in Erlangs: contacts x AHT (s) / interval length (s). */
export function trafficErlangs(contacts: number, ahtSeconds: number, intervalMinutes: number): number {
  return (contacts * ahtSeconds) / (intervalMinutes * 60);
}

/** Erlang B: the share of contacts blocked with n servers and no queue. */
export function erlangB(n: number, a: number): number {
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`agents must be a whole number >= 0, got ${n}`);
  if (!(a >= 0) || !Number.isFinite(a))
    throw new RangeError(`traffic must be a finite number >= 0, got ${a}`);
  let b = 1;
  for (let k = 1; k <= n; k++) b = (a * b) / (k + a * b);
  return b;
}

/** Erlang C from Erlang B of the same n and a: the probability of waiting (1 when n <= a). */
export function erlangCFromB(n: number, a: number, b: number): number {
  if (n <= a) return 1;
  return (n * b) / (n - a * (1 - b));
}

/** Erlang C: the probability that a contact has to wait, with n agents and traffic a. */
export function erlangC(n: number, a: number): number {
  return erlangCFromB(n, a, erlangB(n, a));
}

/** Share of contacts answered within targetSeconds (0 when n <= a: the queue grows without end). */
export function serviceLevel(n: number, a: number, targetSeconds: number, ahtSeconds: number): number {
  if (a === 0) return 1;
  if (n <= a) return 0;
  return serviceLevelFromC(n, a, erlangC(n, a), targetSeconds, ahtSeconds);
}

function serviceLevelFromC(n: number, a: number, c: number, targetSeconds: number, ahtSeconds: number) {
  return 1 - c * Math.exp((-(n - a) * targetSeconds) / ahtSeconds);
}

/** Average speed of answer in seconds (Infinity when n <= a). */
export function averageSpeedOfAnswer(n: number, a: number, ahtSeconds: number): number {
  if (a === 0) return 0;
  if (n <= a) return Infinity;
  return (erlangC(n, a) * ahtSeconds) / (n - a);
}

export interface ServiceTarget {
  /** Share answered within targetSeconds, percent (e.g. 80). */
  targetPercent: number;
  targetSeconds: number;
  /** Highest occupancy, percent (100 = no cap). */
  maxOccupancyPercent: number;
}

export interface AgentsResult {
  agents: number;
  /** Percent, null when there is no traffic. */
  serviceLevelPercent: number | null;
  asaSeconds: number | null;
  occupancyPercent: number | null;
}

/** Slack for floating-point comparisons of shares (1e-9 of a percent point). */
const EPS = 1e-11;

/**
 * The fewest agents N meeting the service target and the occupancy cap for traffic a (Erlangs).
 * 0 agents when there is no traffic.
 */
export function agentsForTarget(a: number, ahtSeconds: number, target: ServiceTarget): AgentsResult {
  if (!(a >= 0) || !Number.isFinite(a))
    throw new RangeError(`traffic must be a finite number >= 0, got ${a}`);
  if (!(ahtSeconds > 0)) throw new RangeError(`AHT must be above 0, got ${ahtSeconds}`);
  if (!(target.targetPercent > 0 && target.targetPercent < 100))
    throw new RangeError(`target percent must be above 0 and below 100, got ${target.targetPercent}`);
  if (!(target.maxOccupancyPercent > 0 && target.maxOccupancyPercent <= 100))
    throw new RangeError(`occupancy cap must be above 0 and at most 100, got ${target.maxOccupancyPercent}`);
  if (a === 0) return { agents: 0, serviceLevelPercent: null, asaSeconds: null, occupancyPercent: null };
  const goal = target.targetPercent / 100;
  const occupancy = target.maxOccupancyPercent / 100;
  // Walk n upwards carrying Erlang B, so the whole search is one pass of the recurrence.
  let b = 1;
  for (let n = 1; ; n++) {
    b = (a * b) / (n + a * b);
    if (n <= a || a / n > occupancy + EPS) continue;
    const c = erlangCFromB(n, a, b);
    const sl = serviceLevelFromC(n, a, c, target.targetSeconds, ahtSeconds);
    if (sl + EPS >= goal) {
      return {
        agents: n,
        serviceLevelPercent: sl * 100,
        asaSeconds: (c * ahtSeconds) / (n - a),
        occupancyPercent: (a / n) * 100,
      };
    }
  }
}

/** Agents to schedule so that `agents` are available after shrinkage (percent): ceil(n / (1 - s)). */
export function withShrinkage(agents: number, shrinkagePercent: number): number {
  if (!(shrinkagePercent >= 0 && shrinkagePercent < 100))
    throw new RangeError(`shrinkage must be at least 0 and below 100 percent, got ${shrinkagePercent}`);
  const exact = agents / (1 - shrinkagePercent / 100);
  // A quotient a hair above a whole number from rounding (e.g. 14 / 0.7) stays that whole number.
  const near = Math.round(exact);
  return Math.abs(exact - near) < 1e-9 ? near : Math.ceil(exact);
}
