import { MipBuilder } from './builder';
import { solveDirect, STATUS_OPTIMAL } from './highs.test-helpers';

const aux = { kind: 'aux', rule: 'requests' } as const;

describe('MipBuilder', () => {
  it('sums repeated terms of a row, drops zeros and writes CSR arrays', () => {
    const b = new MipBuilder();
    const x = b.addColumn('x', 0, 1, 2, true, aux);
    const y = b.addColumn('y', 0, Infinity, -1, false, aux);
    b.addRow(
      'r0',
      -Infinity,
      4,
      [
        [y, 1],
        [x, 1],
        [y, 2],
      ],
      { rule: 'link' },
    );
    b.addRow(
      'r1',
      1,
      1,
      [
        [x, 1],
        [x, -1],
        [y, 5],
      ],
      { rule: 'link' },
    );
    b.addToRow(1, x, 3);
    b.offset = 7;
    const a = b.toHighsArrays();
    // r0: x + 3y (y listed twice: 1 + 2); r1: (1 - 1 + 3) x + 5 y = 3x + 5y.
    expect(Array.from(a.matrix.starts)).toEqual([0, 2, 4]);
    expect(Array.from(a.matrix.indices)).toEqual([x, y, x, y]);
    expect(Array.from(a.matrix.values)).toEqual([1, 3, 3, 5]);
    expect(Array.from(a.integrality)).toEqual([1, 0]);
    expect(a.offset).toBe(7);
    expect(a.rowNames).toEqual(['r0', 'r1']);
    expect(a.colNames).toEqual(['x', 'y']);
    // offset 7 + 2·1 − 1·2 = 7
    expect(b.objectiveOf([1, 2])).toBe(7);
  });

  it('drops a coefficient that sums to zero', () => {
    const b = new MipBuilder();
    const x = b.addColumn('x', 0, 1, 0, true, aux);
    const y = b.addColumn('y', 0, 1, 0, true, aux);
    b.addRow(
      'r',
      0,
      1,
      [
        [x, 1],
        [y, 1],
        [x, -1],
      ],
      { rule: 'link' },
    );
    const a = b.toHighsArrays();
    expect(Array.from(a.matrix.indices)).toEqual([y]);
  });

  it('rejects a name used twice, crossed bounds and unknown columns', () => {
    const b = new MipBuilder();
    b.addColumn('x', 0, 1, 0, true, aux);
    expect(() => b.addColumn('x', 0, 1, 0, true, aux)).toThrow(/used twice/);
    expect(() => b.addColumn('z', 2, 1, 0, true, aux)).toThrow(/lower bound/);
    b.addRow('bad', 0, 1, [[5, 1]], { rule: 'link' });
    expect(() => b.toHighsArrays()).toThrow(/column 5 does not exist/);
  });

  it('produces arrays HiGHS solves: the Giapetto example', async () => {
    // W. L. Winston, Operations Research: Applications and Algorithms, ch. 3 (Giapetto's Woodcarving;
    // from memory): max 3x1 + 2x2 s.t. 2x1 + x2 ≤ 100 (finishing), x1 + x2 ≤ 80 (carpentry),
    // x1 ≤ 40 (demand); optimum x1 = 20, x2 = 60, z = 180. Minimised here as −3x1 − 2x2, with the
    // finishing row written with x2 split into two terms to exercise the summing.
    const b = new MipBuilder();
    const x1 = b.addColumn('x1', 0, 40, -3, true, aux);
    const x2 = b.addColumn('x2', 0, Infinity, -2, true, aux);
    b.addRow(
      'finishing',
      -Infinity,
      100,
      [
        [x1, 2],
        [x2, 0.5],
        [x2, 0.5],
      ],
      { rule: 'link' },
    );
    b.addRow(
      'carpentry',
      -Infinity,
      80,
      [
        [x1, 1],
        [x2, 1],
      ],
      { rule: 'link' },
    );
    const r = await solveDirect(b.toHighsArrays());
    expect(r.status).toBe(STATUS_OPTIMAL);
    expect(r.objective).toBeCloseTo(-180, 6);
    expect(r.values[x1]).toBeCloseTo(20, 6);
    expect(r.values[x2]).toBeCloseTo(60, 6);
  });
});
