/**
 * Indices of at most `points` samples spread evenly over `count` samples: every `stride`-th one, plus the
 * last sample so a plot always reaches the end of the recording.
 */
export function thinnedIndices(count: number, points: number): { stride: number; indices: number[] } {
  if (count === 0) return { stride: 1, indices: [] };
  const stride = Math.max(1, Math.ceil(count / Math.max(1, points - 1)));
  const indices: number[] = [];
  for (let k = 0; k < count; k += stride) indices.push(k);
  if (indices[indices.length - 1] !== count - 1) indices.push(count - 1);
  return { stride, indices };
}
