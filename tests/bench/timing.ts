// Timing for the benchmark scripts: medians of wall and CPU time over several runs after a warm-up.

/** The middle value (the upper middle of an even count). */
export const median = (values: readonly number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];

/**
 * Runs `run` once to warm up the JIT, then `runs` times, in milliseconds. CPU time is given beside
 * wall time because a busy machine stretches wall time, not CPU time.
 */
export function timeRuns(runs: number, run: () => unknown): { wall: number; cpu: number; wallMin: number; wallMax: number } {
  run();
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let i = 0; i < runs; i++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    run();
    wall.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  return { wall: median(wall), cpu: median(cpu), wallMin: Math.min(...wall), wallMax: Math.max(...wall) };
}
