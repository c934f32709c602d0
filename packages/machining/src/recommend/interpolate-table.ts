/**
 * Piecewise-linear interpolation in a table of (x, y) points; outside the table the end value is
 * held and `outside` says so (the caller turns that into a warning, never a silent clamp).
 */
export function interpolateTable(points: ReadonlyArray<{ x: number; y: number }>, x: number): { value: number; outside: boolean } {
  const pts = [...points].sort((a, b) => a.x - b.x);
  const first = pts[0]!;
  const last = pts[pts.length - 1]!;
  if (x <= first.x) return { value: first.y, outside: x < first.x };
  if (x >= last.x) return { value: last.y, outside: x > last.x };
  for (let i = 1; i < pts.length; i++) {
    const b = pts[i]!;
    if (x <= b.x) {
      const a = pts[i - 1]!;
      const t = b.x === a.x ? 0 : (x - a.x) / (b.x - a.x);
      return { value: a.y + t * (b.y - a.y), outside: false };
    }
  }
  return { value: last.y, outside: false };
}

/** A sorted copy of the table turned into a function of x (end values held outside). */
export function preparedTable(points: ReadonlyArray<{ x: number; y: number }>): (x: number) => number {
  const pts = [...points].sort((a, b) => a.x - b.x);
  const xs = Float64Array.from(pts, (p) => p.x);
  const ys = Float64Array.from(pts, (p) => p.y);
  const n = xs.length;
  return (x: number): number => {
    if (x <= xs[0]!) return ys[0]!;
    if (x >= xs[n - 1]!) return ys[n - 1]!;
    let i = 1;
    while (xs[i]! < x) i++;
    const x0 = xs[i - 1]!;
    const x1 = xs[i]!;
    return x1 === x0 ? ys[i]! : ys[i - 1]! + ((x - x0) / (x1 - x0)) * (ys[i]! - ys[i - 1]!);
  };
}
