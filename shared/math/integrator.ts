/**
 * Adaptive explicit Runge-Kutta integration with the Dormand-Prince 5(4) pair (Dormand & Prince,
 * J. Comput. Appl. Math. 6 (1980) 19). Coefficients, the error estimate, the PI step-size control and the
 * fourth-order dense output follow the DOPRI5 code of Hairer, Norsett & Wanner, Solving Ordinary
 * Differential Equations I, 2nd ed., sec. II.5 and II.6.
 *
 * The step advances with the fifth-order solution (local extrapolation) and reuses the last stage as the
 * first stage of the next step (FSAL). Output times are served from the dense output of the step that
 * covers them, so asking for many outputs does not shorten the steps.
 */

/** Right-hand side y' = f(t, y). Writes into dydt; must not keep references to y or dydt. */
export type OdeRightSide = (t: number, y: Float64Array, dydt: Float64Array) => void;

export interface IntegrateOptions {
  /** Relative tolerance per component (default 1e-6). */
  rtol?: number;
  /** Absolute tolerance per component (default 1e-9). */
  atol?: number;
  /** First trial step; chosen automatically when absent (Hairer, Norsett & Wanner, sec. II.4). */
  initialStep?: number;
  /** Largest step allowed (default: the whole interval). */
  maxStep?: number;
  /** Largest number of attempted steps before giving up (default 1e6). */
  maxSteps?: number;
  /** Ascending times in [t0, tEnd] at which the state is wanted. */
  outputTimes?: ArrayLike<number>;
  /** Called after every accepted step with the new time and state; returning true ends the run there. */
  shouldStop?: (t: number, y: Float64Array) => boolean;
}

export interface IntegrationStatistics {
  acceptedSteps: number;
  rejectedSteps: number;
  evaluations: number;
  /** Smallest and largest accepted step. */
  smallestStep: number;
  largestStep: number;
}

export interface IntegrationResult {
  /** 'finished' when tEnd was reached, 'stopped' when shouldStop ended the run early. */
  status: 'finished' | 'stopped';
  /** Time of the final state (tEnd, or where the run was stopped). */
  t: number;
  /** Final state. */
  y: Float64Array;
  /** Number of output times reached; the rest (after a stop) are not filled. */
  outputCount: number;
  /** Row-major outputCount x dimension block: the state at outputTimes[k] is row k. */
  outputs: Float64Array;
  statistics: IntegrationStatistics;
}

export type IntegrationFailure = 'step-underflow' | 'too-many-steps' | 'non-finite';

/** Raised when the integration cannot continue; `t` is the time reached (the last accepted state). */
export class IntegrationError extends Error {
  constructor(
    readonly reason: IntegrationFailure,
    readonly t: number,
    message: string,
  ) {
    super(message);
    this.name = 'IntegrationError';
  }
}

// Dormand-Prince 5(4) tableau (Hairer, Norsett & Wanner, Table II.5.2).
const C2 = 1 / 5, C3 = 3 / 10, C4 = 4 / 5, C5 = 8 / 9;
const A21 = 1 / 5;
const A31 = 3 / 40, A32 = 9 / 40;
const A41 = 44 / 45, A42 = -56 / 15, A43 = 32 / 9;
const A51 = 19372 / 6561, A52 = -25360 / 2187, A53 = 64448 / 6561, A54 = -212 / 729;
const A61 = 9017 / 3168, A62 = -355 / 33, A63 = 46732 / 5247, A64 = 49 / 176, A65 = -5103 / 18656;
const A71 = 35 / 384, A73 = 500 / 1113, A74 = 125 / 192, A75 = -2187 / 6784, A76 = 11 / 84;
// Difference between the fifth- and fourth-order weights.
const E1 = 71 / 57600, E3 = -71 / 16695, E4 = 71 / 1920, E5 = -17253 / 339200, E6 = 22 / 525, E7 = -1 / 40;
// Dense output of order 4 (Hairer, Norsett & Wanner, sec. II.6, the DOPRI5 code).
const D1 = -12715105075 / 11282082432, D3 = 87487479700 / 32700410799, D4 = -10690763975 / 1880347072;
const D5 = 701980252875 / 199316789632, D6 = -1453857185 / 822651844, D7 = 69997945 / 29380423;

// Step-size control constants of DOPRI5: safety factor, bounds of the step ratio, PI stabilisation.
const SAFETY = 0.9;
const MAX_GROWTH = 10;
const MAX_SHRINK = 5;
const BETA = 0.04;
const EXPONENT = 0.2 - BETA * 0.75;
const UNIT_ROUNDOFF = 2.220446049250313e-16;
/** Step shrink after a step whose stages produced NaN or Infinity. */
const NON_FINITE_SHRINK = 0.1;

interface Workspace {
  k1: Float64Array; k2: Float64Array; k3: Float64Array; k4: Float64Array;
  k5: Float64Array; k6: Float64Array; k7: Float64Array;
  stage: Float64Array; yNew: Float64Array;
  dense: Float64Array; // 5 rows of the dense-output polynomial
}

function createWorkspace(n: number): Workspace {
  const make = () => new Float64Array(n);
  return {
    k1: make(), k2: make(), k3: make(), k4: make(), k5: make(), k6: make(), k7: make(),
    stage: make(), yNew: make(), dense: new Float64Array(5 * n),
  };
}

function allFinite(v: Float64Array): boolean {
  for (let i = 0; i < v.length; i++) if (!Number.isFinite(v[i])) return false;
  return true;
}

function validateArguments(t0: number, y0: ArrayLike<number>, tEnd: number, options: IntegrateOptions): void {
  if (!Number.isFinite(t0) || !Number.isFinite(tEnd)) throw new RangeError('integrate: t0 and tEnd must be finite numbers');
  if (!(tEnd > t0)) throw new RangeError(`integrate: tEnd (${tEnd}) must be greater than t0 (${t0})`);
  if (y0.length === 0) throw new RangeError('integrate: the initial state is empty');
  for (let i = 0; i < y0.length; i++) {
    if (!Number.isFinite(y0[i])) throw new RangeError(`integrate: initial state component ${i} is not finite (${y0[i]})`);
  }
  const { rtol, atol, maxStep, initialStep, maxSteps, outputTimes } = options;
  if (rtol !== undefined && !(rtol > 0)) throw new RangeError('integrate: rtol must be positive');
  if (atol !== undefined && !(atol >= 0)) throw new RangeError('integrate: atol must be zero or positive');
  if (maxStep !== undefined && !(maxStep > 0)) throw new RangeError('integrate: maxStep must be positive');
  if (initialStep !== undefined && !(initialStep > 0)) throw new RangeError('integrate: initialStep must be positive');
  if (maxSteps !== undefined && !(Number.isInteger(maxSteps) && maxSteps > 0)) {
    throw new RangeError('integrate: maxSteps must be a positive integer');
  }
  if (outputTimes) {
    for (let k = 0; k < outputTimes.length; k++) {
      const tk = outputTimes[k];
      if (!(tk >= t0 && tk <= tEnd)) throw new RangeError(`integrate: output time ${tk} lies outside [${t0}, ${tEnd}]`);
      if (k > 0 && tk < outputTimes[k - 1]) throw new RangeError('integrate: output times must be ascending');
    }
  }
}

/** Weighted RMS norm used by DOPRI5: sqrt(mean((v_i / (atol + rtol max(|a_i|, |b_i|)))^2)). */
function scaledNorm(v: Float64Array, a: Float64Array, b: Float64Array, rtol: number, atol: number, scale: number): number {
  let sum = 0;
  for (let i = 0; i < v.length; i++) {
    const sk = atol + rtol * Math.max(Math.abs(a[i]), Math.abs(b[i]));
    const r = (scale * v[i]) / sk;
    sum += r * r;
  }
  return Math.sqrt(sum / v.length);
}

/**
 * Starting step of Hairer, Norsett & Wanner (sec. II.4, "automatic selection of the initial step size"):
 * balance an explicit Euler step against the size of the second derivative. Uses k2 and stage as scratch.
 */
function initialStepSize(f: OdeRightSide, t: number, y: Float64Array, f0: Float64Array, w: Workspace,
  rtol: number, atol: number, maxStep: number): number {
  const n = y.length;
  let dnf = 0, dny = 0;
  for (let i = 0; i < n; i++) {
    const sk = atol + rtol * Math.abs(y[i]);
    dnf += (f0[i] / sk) ** 2;
    dny += (y[i] / sk) ** 2;
  }
  let h = dnf <= 1e-10 || dny <= 1e-10 ? 1e-6 : Math.sqrt(dny / dnf) * 0.01;
  h = Math.min(h, maxStep);
  for (let i = 0; i < n; i++) w.stage[i] = y[i] + h * f0[i];
  f(t + h, w.stage, w.k2);
  let der2 = 0;
  for (let i = 0; i < n; i++) {
    const sk = atol + rtol * Math.abs(y[i]);
    der2 += ((w.k2[i] - f0[i]) / sk) ** 2;
  }
  der2 = Math.sqrt(der2) / h;
  if (!Number.isFinite(der2)) return Math.min(h, maxStep) * NON_FINITE_SHRINK;
  const der12 = Math.max(Math.abs(der2), Math.sqrt(dnf));
  const h1 = der12 <= 1e-15 ? Math.max(1e-6, Math.abs(h) * 1e-3) : (0.01 / der12) ** 0.2;
  return Math.min(100 * h, h1, maxStep);
}

/** One Dormand-Prince step from (t, y) of size h; k1 holds f(t, y). Leaves the new state in yNew and f(t+h, yNew) in k7. */
function attemptStep(f: OdeRightSide, t: number, y: Float64Array, h: number, w: Workspace): void {
  const { k1, k2, k3, k4, k5, k6, k7, stage, yNew } = w;
  const n = y.length;
  for (let i = 0; i < n; i++) stage[i] = y[i] + h * A21 * k1[i];
  f(t + C2 * h, stage, k2);
  for (let i = 0; i < n; i++) stage[i] = y[i] + h * (A31 * k1[i] + A32 * k2[i]);
  f(t + C3 * h, stage, k3);
  for (let i = 0; i < n; i++) stage[i] = y[i] + h * (A41 * k1[i] + A42 * k2[i] + A43 * k3[i]);
  f(t + C4 * h, stage, k4);
  for (let i = 0; i < n; i++) stage[i] = y[i] + h * (A51 * k1[i] + A52 * k2[i] + A53 * k3[i] + A54 * k4[i]);
  f(t + C5 * h, stage, k5);
  for (let i = 0; i < n; i++) {
    stage[i] = y[i] + h * (A61 * k1[i] + A62 * k2[i] + A63 * k3[i] + A64 * k4[i] + A65 * k5[i]);
  }
  f(t + h, stage, k6);
  for (let i = 0; i < n; i++) {
    yNew[i] = y[i] + h * (A71 * k1[i] + A73 * k3[i] + A74 * k4[i] + A75 * k5[i] + A76 * k6[i]);
  }
  f(t + h, yNew, k7);
}

/** Local error estimate h * sum(E_i k_i), written into stage (which is free after the step). */
function errorEstimate(h: number, w: Workspace): Float64Array {
  const { k1, k3, k4, k5, k6, k7, stage } = w;
  for (let i = 0; i < stage.length; i++) {
    stage[i] = h * (E1 * k1[i] + E3 * k3[i] + E4 * k4[i] + E5 * k5[i] + E6 * k6[i] + E7 * k7[i]);
  }
  return stage;
}

/** Coefficients of the dense-output polynomial of the accepted step from y to yNew. */
function prepareDenseOutput(h: number, y: Float64Array, w: Workspace): void {
  const { k1, k3, k4, k5, k6, k7, yNew, dense } = w;
  const n = y.length;
  for (let i = 0; i < n; i++) {
    const difference = yNew[i] - y[i];
    const bspl = h * k1[i] - difference;
    dense[i] = y[i];
    dense[n + i] = difference;
    dense[2 * n + i] = bspl;
    dense[3 * n + i] = difference - h * k7[i] - bspl;
    dense[4 * n + i] = h * (D1 * k1[i] + D3 * k3[i] + D4 * k4[i] + D5 * k5[i] + D6 * k6[i] + D7 * k7[i]);
  }
}

/** Evaluates the dense output at theta = (t - tStep) / h in [0, 1] into out[offset..offset+n). */
function evaluateDenseOutput(theta: number, dense: Float64Array, n: number, out: Float64Array, offset: number): void {
  const theta1 = 1 - theta;
  for (let i = 0; i < n; i++) {
    out[offset + i] = dense[i] + theta * (dense[n + i] + theta1 * (dense[2 * n + i]
      + theta * (dense[3 * n + i] + theta1 * dense[4 * n + i])));
  }
}

/**
 * Integrates y' = f(t, y) from t0 to tEnd with error control (forward in time only).
 * Throws IntegrationError when the step size underflows (for example where f stops being finite, as with
 * a singular mass matrix) or when maxSteps attempted steps did not reach tEnd; the error carries the time
 * reached.
 */
export function integrate(f: OdeRightSide, t0: number, y0: ArrayLike<number>, tEnd: number,
  options: IntegrateOptions = {}): IntegrationResult {
  validateArguments(t0, y0, tEnd, options);
  const rtol = options.rtol ?? 1e-6;
  const atol = options.atol ?? 1e-9;
  const maxStep = Math.min(options.maxStep ?? tEnd - t0, tEnd - t0);
  const maxSteps = options.maxSteps ?? 1_000_000;
  const outputTimes = options.outputTimes ?? [];
  const n = y0.length;
  const w = createWorkspace(n);
  const outputs = new Float64Array(outputTimes.length * n);
  let y: Float64Array = Float64Array.from(y0);
  let outputCount = 0;
  const statistics: IntegrationStatistics = {
    acceptedSteps: 0, rejectedSteps: 0, evaluations: 0, smallestStep: Infinity, largestStep: 0,
  };
  const counted: OdeRightSide = (t, state, dydt) => {
    statistics.evaluations++;
    f(t, state, dydt);
  };

  let t = t0;
  counted(t, y, w.k1);
  if (!allFinite(w.k1)) {
    throw new IntegrationError('non-finite', t, `integrate: the right side is not finite at the start (t = ${t})`);
  }
  while (outputCount < outputTimes.length && outputTimes[outputCount] === t0) {
    outputs.set(y, n * outputCount++);
  }

  let h = Math.min(options.initialStep ?? initialStepSize(counted, t, y, w.k1, w, rtol, atol, maxStep), maxStep);
  let previousError = 1e-4;
  let rejectedLast = false;
  let lastFailureNonFinite = false;
  let attempts = 0;

  while (t < tEnd) {
    if (attempts++ >= maxSteps) {
      throw new IntegrationError('too-many-steps', t,
        `integrate: ${maxSteps} steps were not enough to reach t = ${tEnd}; stopped at t = ${t}`);
    }
    if (0.1 * h <= Math.abs(t) * UNIT_ROUNDOFF || h < Number.MIN_VALUE * 1e3) {
      const why = lastFailureNonFinite ? ' because the right side is not finite there' : '';
      throw new IntegrationError(lastFailureNonFinite ? 'non-finite' : 'step-underflow', t,
        `integrate: step size underflow at t = ${t}${why}`);
    }
    const last = t + 1.01 * h >= tEnd;
    if (last) h = tEnd - t;

    attemptStep(counted, t, y, h, w);
    const error = scaledNorm(errorEstimate(h, w), y, w.yNew, rtol, atol, 1);

    if (!Number.isFinite(error)) {
      statistics.rejectedSteps++;
      lastFailureNonFinite = true;
      rejectedLast = true;
      h *= NON_FINITE_SHRINK;
      continue;
    }
    lastFailureNonFinite = false;
    const growthBase = error ** EXPONENT;
    if (error > 1) {
      statistics.rejectedSteps++;
      h /= Math.min(MAX_SHRINK, growthBase / SAFETY);
      rejectedLast = true;
      continue;
    }

    // Accepted.
    statistics.acceptedSteps++;
    statistics.smallestStep = Math.min(statistics.smallestStep, h);
    statistics.largestStep = Math.max(statistics.largestStep, h);
    const tNew = last ? tEnd : t + h;
    if (outputCount < outputTimes.length && outputTimes[outputCount] <= tNew) {
      prepareDenseOutput(h, y, w);
      while (outputCount < outputTimes.length && outputTimes[outputCount] <= tNew) {
        const theta = (outputTimes[outputCount] - t) / h;
        evaluateDenseOutput(Math.min(1, theta), w.dense, n, outputs, n * outputCount++);
      }
    }
    // Swap state buffers and reuse the last stage as the next first stage (FSAL).
    const previousState = y;
    y = w.yNew;
    w.yNew = previousState;
    const k1 = w.k1;
    w.k1 = w.k7;
    w.k7 = k1;
    t = tNew;

    let factor = growthBase / previousError ** BETA;
    factor = Math.max(1 / MAX_GROWTH, Math.min(MAX_SHRINK, factor / SAFETY));
    let hNew = Math.min(h / factor, maxStep);
    if (rejectedLast) hNew = Math.min(hNew, h);
    previousError = Math.max(error, 1e-4);
    rejectedLast = false;

    if (options.shouldStop?.(t, y)) {
      return { status: 'stopped', t, y, outputCount, outputs, statistics };
    }
    h = hNew;
  }
  return { status: 'finished', t, y, outputCount, outputs, statistics };
}

/** The state at output k of a result, as a view into its output block (no copy). */
export function outputState(result: IntegrationResult, k: number): Float64Array {
  const n = result.y.length;
  if (!(k >= 0 && k < result.outputCount)) throw new RangeError(`outputState: output ${k} was not reached`);
  return result.outputs.subarray(k * n, (k + 1) * n);
}
