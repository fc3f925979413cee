import type { RecordingRole } from '../schemas/sweep-description.js';

/**
 * One recording as the discovery works on it, whatever it was read from: samples in time order, one position
 * column per coordinate, and the optional measured velocities and generalized forces (null where absent).
 */
export interface Recording {
  /** How the user knows it (the file name), used in messages. */
  name: string;
  role: RecordingRole;
  time: Float64Array;
  /** positions[i] is coordinate i. */
  positions: Float64Array[];
  /** Measured velocity of coordinate i, or null when it must be estimated. */
  velocities: (Float64Array | null)[];
  /** Generalized force on coordinate i, or null (zero) when not given; null altogether for passive data. */
  forces: (Float64Array | null)[] | null;
}
