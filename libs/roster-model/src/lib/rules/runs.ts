/** Maximal runs of consecutive days where `on(day)` holds, as [first, last] day pairs. */
export function runsOf(days: number, on: (day: number) => boolean): [number, number][] {
  const out: [number, number][] = [];
  let start = -1;
  for (let d = 0; d < days; d++) {
    if (on(d)) {
      if (start < 0) start = d;
    } else if (start >= 0) {
      out.push([start, d - 1]);
      start = -1;
    }
  }
  if (start >= 0) out.push([start, days - 1]);
  return out;
}

export function range(from: number, to: number): number[] {
  const out: number[] = [];
  for (let d = from; d <= to; d++) out.push(d);
  return out;
}
