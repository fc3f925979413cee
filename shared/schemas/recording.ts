import * as z from 'zod';

/*
 * Recordings: uploaded CSV files, parsed and validated on the server, stored as samples per channel.
 *
 * Upload flow (two requests, both multipart/form-data with the CSV in the field `file`):
 * 1. POST /api/projects/:projectId/recordings/inspect  -> recordingInspectionSchema (nothing is stored):
 *    the header, a few rows and which columns are numeric, so the user can map the columns.
 * 2. POST /api/projects/:projectId/recordings with the fields `file`, `mapping` (JSON text of
 *    recordingMappingSchema) and optionally `name` -> 201 recordingSchema.
 * A bad file is refused with 400 `invalid_body`; the message names the line, data row and column at fault, and
 * `fields` carries `file` (the message) plus `line`, `row` and `column` when the fault is in one cell. A file
 * above the size limit gets 413 `payload_too_large`. Nothing of a refused file is stored.
 */

/** A coordinate's name as it appears in terms: a letter, then letters, digits or _ (`x`, `theta1`). */
export const coordinateNameSchema = z
  .string('Give the coordinate a name.')
  .trim()
  .regex(/^[A-Za-z][A-Za-z0-9_]*$/, 'A coordinate name starts with a letter and has only letters, digits and _.')
  .max(40, 'A coordinate name has at most 40 characters.');

const columnName = z.string('Choose a column.').trim().min(1, 'Choose a column.').max(200, 'A column name has at most 200 characters.');
/** Free text for people (`m`, `rad`, `N`, `N*m`); values are used as recorded, never converted. */
const unitText = z.string('Write the unit as text.').trim().max(40, 'A unit has at most 40 characters.').default('');

/** A mapped column and its unit. */
export const mappedColumnSchema = z.object({ column: columnName, unit: unitText }).strict();
export type MappedColumn = z.infer<typeof mappedColumnSchema>;

/** One generalized coordinate of the recording: its position column, and optionally measured velocity and force. */
export const coordinateMappingSchema = z
  .object({
    name: coordinateNameSchema,
    column: columnName,
    unit: unitText,
    /** Measured velocity; estimated from positions when absent. */
    velocity: mappedColumnSchema.optional(),
    /** Generalized force (or torque) acting on this coordinate; zero when absent. */
    force: mappedColumnSchema.optional(),
  })
  .strict();
export type CoordinateMapping = z.infer<typeof coordinateMappingSchema>;

/** Which CSV columns hold time, positions, velocities and forces, with units. */
export const recordingMappingSchema = z
  .object({
    time: z.object({ column: columnName, unit: unitText.default('s') }).strict(),
    coordinates: z.array(coordinateMappingSchema).min(1, 'Map at least one coordinate.').max(8, 'At most 8 coordinates.'),
  })
  .strict()
  .superRefine((mapping, ctx) => {
    const names = new Set<string>();
    mapping.coordinates.forEach((coordinate, i) => {
      if (names.has(coordinate.name)) {
        ctx.addIssue({ code: 'custom', message: `Coordinate "${coordinate.name}" is named twice.`, path: ['coordinates', i, 'name'] });
      }
      names.add(coordinate.name);
    });
    const used = new Map<string, string>();
    const claim = (column: string, role: string, path: (string | number)[]) => {
      const earlier = used.get(column);
      if (earlier) ctx.addIssue({ code: 'custom', message: `Column "${column}" is already mapped as ${earlier}.`, path });
      else used.set(column, role);
    };
    claim(mapping.time.column, 'time', ['time', 'column']);
    mapping.coordinates.forEach((c, i) => {
      claim(c.column, `the position of ${c.name}`, ['coordinates', i, 'column']);
      if (c.velocity) claim(c.velocity.column, `the velocity of ${c.name}`, ['coordinates', i, 'velocity', 'column']);
      if (c.force) claim(c.force.column, `the force on ${c.name}`, ['coordinates', i, 'force', 'column']);
    });
  });
export type RecordingMapping = z.infer<typeof recordingMappingSchema>;
export type RecordingMappingInput = z.input<typeof recordingMappingSchema>;

/** The non-file fields of the upload (mapping arrives as JSON text in the multipart field `mapping`). */
export const recordingUploadFieldsSchema = z
  .object({
    name: z.string().trim().min(1, 'Give the recording a name.').max(120, 'The name can have at most 120 characters.').optional(),
    mapping: recordingMappingSchema,
  })
  .strict();
export type RecordingUploadFields = z.infer<typeof recordingUploadFieldsSchema>;

/** Answer of the inspect step: what the file holds, before any mapping. */
export const recordingInspectionSchema = z.object({
  fileName: z.string(),
  sizeBytes: z.number().int(),
  header: z.array(z.string()),
  rowCount: z.number().int(),
  /** The first rows as text, for a preview table. */
  previewRows: z.array(z.array(z.string())),
  /** Columns whose every cell is a number (only these can be mapped). */
  numericColumns: z.array(z.string()),
  /** A likely time column (named like t, time, t_s ... and strictly increasing), or null. */
  suggestedTimeColumn: z.string().nullable(),
});
export type RecordingInspection = z.infer<typeof recordingInspectionSchema>;

export const channelKinds = ['time', 'position', 'velocity', 'force'] as const;
export const channelKindSchema = z.enum(channelKinds);
export type ChannelKind = z.infer<typeof channelKindSchema>;

/** One stored channel. Keys: `time`, the coordinate name (`x`), its velocity (`dx`), its force (`force:x`). */
export const recordingChannelSchema = z.object({
  key: z.string(),
  kind: channelKindSchema,
  /** The coordinate the channel belongs to; null for time. */
  coordinate: z.string().nullable(),
  /** The CSV column it came from. */
  column: z.string(),
  unit: z.string(),
});
export type RecordingChannel = z.infer<typeof recordingChannelSchema>;

const stepSummarySchema = z.object({ min: z.number(), median: z.number(), max: z.number() });

/** Sampling of one recording (shared/math/sampling-statistics.ts). */
export const recordingSamplingSchema = z.object({
  steps: stepSummarySchema.nullable(),
  /** Samples per second from the median step. */
  sampleRate: z.number().nullable(),
  /** Every step within 0.1 % of the mean step. */
  uniform: z.boolean(),
  /** Steps longer than 1.5 times the median step. */
  gapCount: z.number().int(),
});
export type RecordingSampling = z.infer<typeof recordingSamplingSchema>;

export const userRefSchema = z.object({ id: z.string(), name: z.string() });
export type UserRef = z.infer<typeof userRefSchema>;

/** A stored recording (answer of the upload, GET /api/recordings/:id and the list). */
export const recordingSchema = z.object({
  id: z.string(),
  projectId: z.string(),
  name: z.string(),
  fileName: z.string(),
  sizeBytes: z.number().int(),
  coordinates: z.array(z.string()),
  mapping: recordingMappingSchema,
  channels: z.array(recordingChannelSchema),
  sampleCount: z.number().int(),
  startTime: z.number(),
  durationSeconds: z.number(),
  sampling: recordingSamplingSchema,
  /** True when at least one force column is mapped. */
  forced: z.boolean(),
  uploadedBy: userRefSchema.nullable(),
  createdAt: z.string(),
  /** Sweeps that use it; a recording in use cannot be deleted. */
  sweepCount: z.number().int(),
});
export type RecordingView = z.infer<typeof recordingSchema>;


/** Answer of GET /api/projects/:projectId/recordings. */
export const recordingListSchema = z.object({ recordings: z.array(recordingSchema) });
export type RecordingList = z.infer<typeof recordingListSchema>;

/** Query of GET /api/recordings/:id/samples: at most `points` samples per channel (default 2000). */
export const recordingSamplesQuerySchema = z.object({
  points: z.coerce
    .number('Ask for a whole number of points from 10 to 20,000.')
    .int('Ask for a whole number of points from 10 to 20,000.')
    .min(10, 'Ask for a whole number of points from 10 to 20,000.')
    .max(20000, 'Ask for a whole number of points from 10 to 20,000.')
    .default(2000),
});

/**
 * Answer of GET /api/recordings/:id/samples: the recording thinned for plots. Each kept point is the sample
 * at the start of its bucket, and the last sample is always kept; `stride` is the bucket length in samples.
 */
export const recordingSamplesSchema = z.object({
  recordingId: z.string(),
  sampleCount: z.number().int(),
  stride: z.number().int(),
  time: z.array(z.number()),
  channels: z.array(recordingChannelSchema.extend({ values: z.array(z.number()) })),
});
export type RecordingSamples = z.infer<typeof recordingSamplesSchema>;
