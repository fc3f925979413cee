/**
 * The caution every model view and every export carries. A learned model can drive real hardware, and a
 * model that fits recorded data can still be wrong outside the recorded states.
 */
export const safetyCaution =
  'Caution: this model was learned from recorded data and can be wrong outside the states it was recorded in. ' +
  'Validate it on the real machine at low speed and with reduced force limits before relying on it, keep every ' +
  'hardware and software safety limit of the machine in place, and follow the codes and standards that apply where it runs.';

/** The same caution as comment lines for exported source code, prefixed with the given comment marker. */
export function safetyCautionComment(marker: string, width = 100): string[] {
  const words = safetyCaution.split(' ');
  const lines: string[] = [];
  let line = '';
  for (const word of words) {
    if (line && marker.length + 1 + line.length + 1 + word.length > width) {
      lines.push(`${marker} ${line}`);
      line = word;
    } else {
      line = line ? `${line} ${word}` : word;
    }
  }
  if (line) lines.push(`${marker} ${line}`);
  return lines;
}
