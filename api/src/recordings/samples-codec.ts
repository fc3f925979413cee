/** Channels of equal length as one little-endian float64 buffer, channel after channel. */
export function encodeChannels(channels: readonly Float64Array[]): Buffer {
  const length = channels[0]?.length ?? 0;
  const buffer = Buffer.alloc(channels.length * length * 8);
  channels.forEach((channel, c) => {
    if (channel.length !== length) throw new RangeError(`channel ${c} has ${channel.length} samples, expected ${length}`);
    for (let k = 0; k < length; k++) buffer.writeDoubleLE(channel[k]!, (c * length + k) * 8);
  });
  return buffer;
}

/** The channels back from their stored bytes (copied, so Buffer offsets need not be 8-byte aligned). */
export function decodeChannels(bytes: Uint8Array, channelCount: number, sampleCount: number): Float64Array[] {
  if (bytes.byteLength !== channelCount * sampleCount * 8) {
    throw new RangeError(`stored samples have ${bytes.byteLength} bytes, expected ${channelCount * sampleCount * 8}`);
  }
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  return Array.from({ length: channelCount }, (_, c) => {
    const channel = new Float64Array(sampleCount);
    for (let k = 0; k < sampleCount; k++) channel[k] = view.getFloat64((c * sampleCount + k) * 8, true);
    return channel;
  });
}
