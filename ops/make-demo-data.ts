/**
 * `npx tsx ops/make-demo-data.ts`: writes the demo recordings (api/src/demo/recordings/*.csv) by simulating
 * the demo machines (api/src/demo/demo-mechanisms.ts) with the project's Dormand-Prince integrator, sampled
 * as a data logger would and written with 9 significant digits. Deterministic: running it again writes the
 * same files.
 */
import { writeFileSync } from 'node:fs';
import { integrate, outputState } from '../shared/math/integrator.js';
import { inspectionArm, quayCrane } from '../api/src/demo/demo-mechanisms.js';
import { demoRecordingsDir } from '../api/src/demo/demo-recordings.js';

interface Sine {
  amplitude: number;
  frequency: number;
  phase: number;
}

/** A smooth excitation that never repeats: sines with irrationally related frequencies. */
function sines(components: Sine[]): (t: number) => number {
  return (t) => components.reduce((sum, c) => sum + c.amplitude * Math.sin(2 * Math.PI * c.frequency * t + c.phase), 0);
}

function simulate(
  rightSide: (t: number, y: Float64Array) => number[],
  initial: number[],
  duration: number,
  rate: number,
): { time: Float64Array; states: Float64Array[] } {
  const count = Math.round(duration * rate) + 1;
  const time = Float64Array.from({ length: count }, (_, k) => k / rate);
  const result = integrate(
    (t, y, dydt) => {
      const derivative = rightSide(t, y);
      derivative.forEach((value, i) => (dydt[i] = value));
    },
    0,
    initial,
    time[count - 1]!,
    { rtol: 1e-10, atol: 1e-10, outputTimes: time },
  );
  return { time, states: Array.from({ length: count }, (_, k) => Float64Array.from(outputState(result, k))) };
}

const digits = (value: number) => (Object.is(value, -0) || value === 0 ? '0' : String(Number(value.toPrecision(9))));

function writeCsv(file: string, header: string[], rows: number[][]): void {
  const lines = [header.join(','), ...rows.map((row) => row.map(digits).join(','))];
  writeFileSync(new URL(file, demoRecordingsDir), `${lines.join('\n')}\n`);
  console.log(`wrote ${file} (${rows.length} samples)`);
}

const sqrt2 = Math.SQRT2;
const sqrt3 = Math.sqrt(3);
const sqrt5 = Math.sqrt(5);

// Quay crane: 90 s at 20 samples/s. The drive force is the operator's pattern (sines of some kilonewtons)
// plus the drive's position hold, a spring-damper toward the run's home position, so the trolley stays on
// its rail; the logger records the total force, which is what acts on the trolley.
const holdStiffness = 1500;
const holdDamping = 6000;
const craneRuns = [
  { file: 'quay-crane-shift-a.csv', x0: 5.0, th0: 0.04, force: sines([{ amplitude: 9000, frequency: 0.05, phase: 0.3 }, { amplitude: 5200, frequency: 0.05 * sqrt3, phase: 1.4 }, { amplitude: 2600, frequency: 0.05 * sqrt5, phase: 2.2 }]) },
  { file: 'quay-crane-shift-b.csv', x0: 9.5, th0: -0.2, force: sines([{ amplitude: 7600, frequency: 0.138, phase: 2.0 }, { amplitude: 6100, frequency: 0.043 * sqrt2, phase: 0.6 }, { amplitude: 3400, frequency: 0.043 * sqrt5, phase: 1.1 }]) },
  { file: 'quay-crane-gusty.csv', x0: 6.0, th0: 0.35, force: sines([{ amplitude: 11000, frequency: 0.149, phase: 0.9 }, { amplitude: 4300, frequency: 0.061 * sqrt3, phase: 2.9 }, { amplitude: 3900, frequency: 0.061 * sqrt2, phase: 0.2 }]) },
  { file: 'quay-crane-check.csv', x0: 4.0, th0: -0.03, force: sines([{ amplitude: 8300, frequency: 0.057, phase: 1.7 }, { amplitude: 5600, frequency: 0.057 * sqrt5, phase: 0.4 }, { amplitude: 2100, frequency: 0.057 * sqrt3, phase: 2.5 }]) },
];
for (const run of craneRuns) {
  const drive = (t: number, x: number, dx: number) => run.force(t) - holdStiffness * (x - run.x0) - holdDamping * dx;
  const { time, states } = simulate(
    (t, [x, th, dx, dth]) => {
      const [ddx, ddth] = quayCrane.accelerations(th!, dth!, drive(t, x!, dx!));
      return [dx!, dth!, ddx, ddth];
    },
    [run.x0, run.th0, 0, 0],
    90,
    20,
  );
  writeCsv(
    run.file,
    ['t_s', 'trolley_m', 'load_angle_rad', 'drive_force_N'],
    states.map((y, k) => [time[k]!, y[0]!, y[1]!, drive(time[k]!, y[0]!, y[2]!)]),
  );
}

// Inspection arm: 12 s at 400 samples/s; joint torques of a few newton metres swing the hanging arm.
const armRuns = [
  { file: 'inspection-arm-weave.csv', start: [0.25, -0.15], torques: [sines([{ amplitude: 1.95, frequency: 0.31, phase: 0 }, { amplitude: 0.95, frequency: 0.31 * sqrt3, phase: 1.2 }]), sines([{ amplitude: 0.95, frequency: 0.47, phase: 0.5 }, { amplitude: 0.55, frequency: 0.47 * sqrt2, phase: 2.1 }])] },
  { file: 'inspection-arm-reach.csv', start: [-0.3, 0.35], torques: [sines([{ amplitude: 1.55, frequency: 0.27, phase: 2.4 }, { amplitude: 1.2, frequency: 0.27 * sqrt5, phase: 0.3 }]), sines([{ amplitude: 1.2, frequency: 0.39, phase: 1.6 }, { amplitude: 0.45, frequency: 0.39 * sqrt3, phase: 0.8 }])] },
  { file: 'inspection-arm-check.csv', start: [0.1, 0.25], torques: [sines([{ amplitude: 1.75, frequency: 0.29, phase: 1.0 }, { amplitude: 0.8, frequency: 0.29 * sqrt2, phase: 2.6 }]), sines([{ amplitude: 1, frequency: 0.43, phase: 0.2 }, { amplitude: 0.65, frequency: 0.43 * sqrt5, phase: 1.9 }])] },
];
for (const run of armRuns) {
  const [shoulder, elbow] = run.torques as [(t: number) => number, (t: number) => number];
  const { time, states } = simulate(
    (t, [sh, el, dsh, del]) => {
      const [ddsh, ddel] = inspectionArm.accelerations(sh!, el!, dsh!, del!, shoulder(t), elbow(t));
      return [dsh!, del!, ddsh, ddel];
    },
    [run.start[0]!, run.start[1]!, 0, 0],
    12,
    400,
  );
  writeCsv(
    run.file,
    ['time_s', 'shoulder_enc_rad', 'elbow_enc_rad', 'shoulder_torque_Nm', 'elbow_torque_Nm'],
    states.map((y, k) => [time[k]!, y[0]!, y[1]!, shoulder(time[k]!), elbow(time[k]!)]),
  );
}
