import type { CandidateSetInputRaw } from '../../../shared/schemas/candidate-set.js';
import type { RecordingMappingInput } from '../../../shared/schemas/recording.js';
import type { SweepRunSettingsInput } from '../../../shared/schemas/sweep.js';

/** One demo recording: its file in ./recordings and the role the demo sweep gives it. */
export interface DemoRecordingFile {
  file: string;
  name: string;
  role: 'train' | 'validate';
}

/** What a demo project starts with: recordings, a candidate set, and the settings of its first sweep. */
export interface DemoProjectData {
  team: string;
  project: string;
  mapping: RecordingMappingInput;
  recordings: DemoRecordingFile[];
  candidateSet: CandidateSetInputRaw;
  sweep: { name: string; settings: SweepRunSettingsInput };
}

export const demoRecordingsDir = new URL('./recordings/', import.meta.url);

/** Written by `npx tsx ops/make-demo-data.ts`; seeded by npm start in development. */
export const demoProjectData: DemoProjectData[] = [
  {
    team: 'Harrow Dockside Automation',
    project: 'Quay crane trolley',
    mapping: {
      time: { column: 't_s', unit: 's' },
      coordinates: [
        { name: 'x', column: 'trolley_m', unit: 'm', force: { column: 'drive_force_N', unit: 'N' } },
        { name: 'th', column: 'load_angle_rad', unit: 'rad' },
      ],
    },
    recordings: [
      { file: 'quay-crane-shift-a.csv', name: 'Shift A, container moves', role: 'train' },
      { file: 'quay-crane-shift-b.csv', name: 'Shift B, container moves', role: 'train' },
      { file: 'quay-crane-gusty.csv', name: 'Gusty afternoon, large sway', role: 'train' },
      { file: 'quay-crane-check.csv', name: 'Acceptance check run', role: 'validate' },
    ],
    candidateSet: {
      name: 'Trolley and load, generated',
      coordinates: ['x', 'th'],
      terms: [],
      known: [],
      generator: { angles: ['th'] },
    },
    sweep: {
      name: 'First look at the trolley',
      settings: { sizes: { min: 1, max: 5 }, form: 'balance', derivatives: { method: 'savitzky-golay', window: 9, order: 4 }, top: 10 },
    },
  },
  {
    team: 'Harrow Dockside Automation',
    project: 'Two-link inspection arm',
    mapping: {
      time: { column: 'time_s', unit: 's' },
      coordinates: [
        { name: 'sh', column: 'shoulder_enc_rad', unit: 'rad', force: { column: 'shoulder_torque_Nm', unit: 'N*m' } },
        { name: 'el', column: 'elbow_enc_rad', unit: 'rad', force: { column: 'elbow_torque_Nm', unit: 'N*m' } },
      ],
    },
    recordings: [
      { file: 'inspection-arm-weave.csv', name: 'Weld weave pattern', role: 'train' },
      { file: 'inspection-arm-reach.csv', name: 'Reach and return', role: 'train' },
      { file: 'inspection-arm-check.csv', name: 'Held-out sweep pattern', role: 'validate' },
    ],
    candidateSet: {
      name: 'Arm, generated with joint sums',
      coordinates: ['sh', 'el'],
      terms: [],
      known: [],
      generator: { add: ['cos(sh + el)', 'sin(sh + el)'] },
    },
    sweep: {
      name: 'Arm energy, up to seven terms',
      settings: { sizes: { min: 1, max: 7 }, form: 'balance', derivatives: { method: 'savitzky-golay', window: 9, order: 4 }, top: 10 },
    },
  },
];
