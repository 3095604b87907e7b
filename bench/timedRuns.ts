/**
 * Runs `run` a few times to warm up, then times it `repeats` times; the last result and the
 * timing summary as the benches print it ("N ms median (min a, max b)").
 */
export function timedRuns<T>(run: () => T, warmups: number, repeats: number): { last: T; summary: string } {
  for (let i = 0; i < warmups; i++) run();
  const times: number[] = [];
  let last = run();
  for (let i = 0; i < repeats; i++) {
    const t0 = performance.now();
    last = run();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  const median = times[Math.floor(times.length / 2)];
  return { last, summary: `${median.toFixed(0)} ms median (min ${times[0].toFixed(0)}, max ${times[times.length - 1].toFixed(0)})` };
}
