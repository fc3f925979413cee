/** A noise share (0..1) as a percentage for people: `6.2 %`, `0.31 %`, or `< 0.01 %` for clean signals. */
export function formatNoiseShare(share: number): string {
  const percent = 100 * share;
  return percent < 0.01 ? '< 0.01 %' : `${Number(percent.toPrecision(2))} %`;
}
