/**
 * For tests of line-dp.ts: the best line for one person, everybody else fixed, by a second method:
 * the MIP of the product's own model (rules/ and goals/) of a one-person problem, solved by HiGHS,
 * with the cover goals replaced by `extra`, what this person's shift on each day adds to the cover
 * cost of the others. (Too slow for the search itself: 30-800 ms a line on benchmark instance 8,
 * against 1-6 ms for the dynamic programme.)
 */
import type { ModelData } from 'highs';
import type { RosterProblem } from '../problem';
import { buildModel } from '../model/build-model';
import type { ProblemIndex } from '../model/context';
import type { HighsSession } from '../solve/highs-session';
import { runMip, solverArrays } from '../solve/run-mip';

interface PersonModel {
  data: ModelData;
  cost: Float64Array;
  /** col[d * S + s]: column of (d, s), or −1 when the model has none (the cell may never hold s). */
  col: Int32Array;
}

export interface LineMipResult {
  /** The line: shift index per day, −1 off; null when HiGHS found none. */
  line: Int16Array | null;
  /** HiGHS's status: 'optimal', 'infeasible', 'timeLimit' … */
  status: string;
}

export class LineMip {
  private readonly models: (PersonModel | null | undefined)[];

  constructor(
    private readonly index: ProblemIndex,
    private readonly session: HighsSession,
  ) {
    this.models = new Array(index.P);
  }

  private model(p: number): PersonModel | null {
    const known = this.models[p];
    if (known !== undefined) return known;
    const { problem, D, S } = this.index;
    const person = problem.people[p];
    const id = person.id;
    const published = problem.published?.[id];
    const sub: RosterProblem = {
      ...problem,
      people: [person],
      coverNeeds: [],
      requests: problem.requests.filter((r) => r.personId === id),
      absences: problem.absences.filter((a) => a.personId === id),
      pins: problem.pins.filter((x) => x.personId === id),
      published: problem.published ? (published ? { [id]: published } : {}) : undefined,
      weights: { ...(problem.weights ?? {}), fairNights: 0, fairWeekends: 0 },
    };
    let built;
    try {
      built = buildModel(sub);
    } catch {
      this.models[p] = null;
      return null;
    }
    const col = new Int32Array(D * S).fill(-1);
    for (let d = 0; d < D; d++) for (let s = 0; s < S; s++) col[d * S + s] = built.x(0, d, s);
    const data = solverArrays(built);
    const model: PersonModel = { data, cost: Float64Array.from(built.arrays.colCost), col };
    this.models[p] = model;
    return model;
  }

  /**
   * Person p's best line with `extra[d * S + s]` added for working shift s on day d (the change of
   * the cover cost of the others). Null when the one-person model cannot be built.
   */
  solve(p: number, extra: Float64Array, timeLimitSeconds: number): LineMipResult | null {
    const model = this.model(p);
    if (!model) return null;
    const { D, S } = this.index;
    const cost = model.cost.slice();
    for (let i = 0; i < D * S; i++) if (model.col[i] >= 0) cost[model.col[i]] += extra[i];
    const data = { ...model.data, colCost: cost } as unknown as ModelData;
    const run = runMip(this.session, data, { timeLimitSeconds, mipRelGap: 1e-9 });
    if (!run.values) return { line: null, status: run.status };
    const line = new Int16Array(D).fill(-1);
    for (let d = 0; d < D; d++) {
      for (let s = 0; s < S; s++) {
        const c = model.col[d * S + s];
        if (c >= 0 && run.values[c] > 0.5) line[d] = s;
      }
    }
    return { line, status: run.status };
  }
}
