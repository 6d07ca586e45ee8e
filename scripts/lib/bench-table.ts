// Timing and table printing shared by the benchmark scripts (scripts/bench-*.ts).

/** Runs `f` once and returns its result with the wall time in ms, e.g. `const [product, ms] = time(() => multiply(a, b))`. */
export function time<T>(f: () => T): [T, number] {
  const t = performance.now()
  const r = f()
  return [r, performance.now() - t]
}

/** The middle value (the upper one of the two for an even count), e.g. `median([3, 1, 2]) === 2`. */
export function median(xs: number[]): number {
  const s = xs.slice().sort((a, b) => a - b)
  return s[Math.floor(s.length / 2)]!
}

/** Milliseconds with as many decimals as they deserve: `fmt(1.234) === '1.23'`, `fmt(123.4) === '123'`. */
export function fmt(ms: number): string {
  return ms < 10 ? ms.toFixed(2) : ms < 100 ? ms.toFixed(1) : ms.toFixed(0)
}

/** Prints a right-aligned table with a rule under its head. */
export function table(head: string[], rows: string[][]): void {
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map(r => r[i]!.length)))
  const line = (r: string[]) => r.map((c, i) => c.padStart(widths[i]!)).join('  ')
  console.log(line(head))
  console.log(widths.map(w => '-'.repeat(w)).join('  '))
  for (const r of rows) console.log(line(r))
}
