/** Round tick values (1, 2 or 5 × 10ⁿ apart) covering [low, high], about `target` of them. */
export function axisTicks(low: number, high: number, target: number): { values: number[]; decimals: number } {
  const raw = (high - low) / Math.max(1, target);
  const magnitude = Math.pow(10, Math.floor(Math.log10(raw)));
  const step = [1, 2, 5, 10].map((m) => m * magnitude).find((s) => s >= raw) ?? 10 * magnitude;
  const decimals = Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
  const values: number[] = [];
  for (let i = Math.ceil(low / step - 1e-9); i * step <= high + 1e-9 * step; i++) values.push(Number((i * step).toFixed(decimals)));
  return { values, decimals };
}
