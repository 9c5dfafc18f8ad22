import type { TimerKind } from './timers.schema.js';

export interface TemperatureReading {
  at: Date | string;
  tempC: number;
}

export interface TemperatureEtaInput {
  /** In any order; unreadable times or temperatures are skipped. */
  readings: readonly TemperatureReading[];
  targetC: number;
  /** The temperature the part settles at, when known (a room for a cool-down); fitted otherwise. */
  ambientC?: number | null;
  kind: Exclude<TimerKind, 'set-time'>;
  now: Date;
}

export type TemperatureEtaStatus =
  'reached' | 'estimating' | 'not-enough-readings' | 'moving-away' | 'beyond-asymptote';
export type EtaConfidence = 'low' | 'medium' | 'high';

export interface TemperatureEta {
  status: TemperatureEtaStatus;
  etaAt: Date | null;
  secondsLeft: number | null;
  method: 'newton' | 'linear' | null;
  /** How far to trust `etaAt`; 'low' whenever there is no ETA, 'high' once reached. */
  confidence: EtaConfidence;
  /** Asymptote found from the readings when no ambient was given (°C). */
  fittedAmbientC?: number;
  /** Rate constant of the Newton fit, per second. */
  k?: number;
}

// Residual standard error (°C): hand-logged readings are whole degrees (±0.5 °C), so a curve within
// GOOD_FIT_C is as good as the readings; one off by more than poorFitC is not trusted to extrapolate.
const GOOD_FIT_C = 0.5;
const poorFitC = (spanC: number) => Math.max(2, spanC / 10);
// Confidence: how far the ETA moves when any one reading is left out, as a share of the time left.
const HIGH_SPREAD = 0.1;
const MEDIUM_SPREAD = 0.3;
// A forecast reaching further ahead than three times the span the readings cover is a guess.
const MAX_SURE_HORIZON = 3;

/** Times in seconds since the first reading; temperatures as `u`, signed so that the target lies upwards. */
interface Point {
  t: number;
  u: number;
}

interface Line {
  slope: number;
  intercept: number;
}

interface NewtonFit {
  /** Asymptote in `u` terms. */
  ambient: number;
  k: number;
  sse: number;
}

function fitLine(points: readonly Point[], y: (p: Point) => number): Line {
  const n = points.length;
  const meanT = points.reduce((s, p) => s + p.t, 0) / n;
  const meanY = points.reduce((s, p) => s + y(p), 0) / n;
  let sty = 0;
  let stt = 0;
  for (const p of points) {
    sty += (p.t - meanT) * (y(p) - meanY);
    stt += (p.t - meanT) ** 2;
  }
  const slope = sty / stt;
  return { slope, intercept: meanY - slope * meanT };
}

const sumOfSquares = (points: readonly Point[], predict: (t: number) => number) =>
  points.reduce((s, p) => s + (p.u - predict(p.t)) ** 2, 0);

/** Newton's law u(t) = Ta − e^(a − kt) for a given Ta: ln(Ta − u) is linear in t. Needs every u < Ta. */
function fitNewton(points: readonly Point[], ambient: number): NewtonFit {
  const line = fitLine(points, (p) => Math.log(ambient - p.u));
  const sse = sumOfSquares(points, (t) => ambient - Math.exp(line.intercept + line.slope * t));
  return { ambient, k: -line.slope, sse };
}

/**
 * Least squares over the unknown asymptote: for each candidate Ta above the highest reading, ln(Ta − u)
 * against t is a straight line (giving k); Ta is chosen to minimise the squared error in degrees.
 * A log-spaced grid of the distance above the highest reading (0.001 to 1000 times the span of the
 * readings) finds the basin, golden-section search refines it. Robust to uneven spacing and noise,
 * unlike the three-point closed form. Null when the best curve is the straight line (Ta → ∞).
 */
function fitNewtonAndAmbient(points: readonly Point[]): NewtonFit | null {
  const us = points.map((p) => p.u);
  const top = Math.max(...us);
  const span = top - Math.min(...us);
  const steps = 60;
  const fitAt = (logDistance: number) => fitNewton(points, top + Math.exp(logDistance));
  const grid = Array.from(
    { length: steps + 1 },
    (_, i) => Math.log(span) + Math.log(10) * (-3 + (6 * i) / steps),
  );
  const errors = grid.map((x) => fitAt(x).sse);
  const best = errors.indexOf(Math.min(...errors));
  if (best === steps) return null;
  let lo = grid[Math.max(best - 1, 0)]!;
  let hi = grid[best + 1]!;
  const ratio = (Math.sqrt(5) - 1) / 2;
  for (let i = 0; i < 80; i++) {
    const a = hi - ratio * (hi - lo);
    const b = lo + ratio * (hi - lo);
    if (fitAt(a).sse <= fitAt(b).sse) hi = b;
    else lo = a;
  }
  return fitAt((lo + hi) / 2);
}

/** Residual standard error with `params` fitted parameters; null with no degrees of freedom left. */
function residualError(sse: number, n: number, params: number): number | null {
  return n > params ? Math.sqrt(sse / (n - params)) : null;
}

const distinctTimes = (points: readonly Point[]) => new Set(points.map((p) => p.t)).size;

type Projection =
  | { kind: 'eta'; method: 'newton' | 'linear'; t: number; fit?: NewtonFit; error: number | null }
  | { kind: 'beyond-asymptote'; fit?: NewtonFit };

/**
 * When the readings (time-sorted, trending towards the target, last one short of it) reach `target`,
 * as seconds since the first reading. See `estimateTemperatureEta` for the model choice.
 */
function project(points: readonly Point[], target: number, ambient: number | null): Projection {
  const last = points.at(-1)!;
  const span = Math.max(...points.map((p) => p.u)) - Math.min(...points.map((p) => p.u));
  const trusted = (fit: NewtonFit | null, error: number | null): fit is NewtonFit =>
    fit !== null && fit.k > 0 && (error === null || error <= poorFitC(span));
  const newton = (fit: NewtonFit, error: number | null): Projection => ({
    kind: 'eta',
    method: 'newton',
    t: last.t + Math.log((fit.ambient - last.u) / (fit.ambient - target)) / fit.k,
    fit,
    error,
  });

  if (ambient !== null) {
    if (ambient <= target) return { kind: 'beyond-asymptote' };
    const approaching = points.filter((p) => p.u < ambient);
    if (distinctTimes(approaching) >= 2) {
      const fit = fitNewton(approaching, ambient);
      const error = residualError(fit.sse, approaching.length, 2);
      if (trusted(fit, error)) return newton(fit, error);
    }
  } else if (distinctTimes(points) >= 3) {
    const fit = fitNewtonAndAmbient(points);
    const error = fit && residualError(fit.sse, points.length, 3);
    if (trusted(fit, error)) {
      if (fit.ambient > target) return newton(fit, error);
      // Three readings always fit exactly: only more can show the curve levelling off short of the target.
      if (points.length > 3) return { kind: 'beyond-asymptote', fit };
    }
  }
  const line = fitLine(points, (p) => p.u);
  const error = residualError(
    sumOfSquares(points, (t) => line.intercept + line.slope * t),
    points.length,
    2,
  );
  return { kind: 'eta', method: 'linear', t: last.t + (target - last.u) / line.slope, error };
}

/**
 * Leave-one-out: the largest shift of the ETA when any single reading is dropped, relative to the time
 * left after the last reading. Infinite when dropping one changes the kind of answer or the method.
 */
function leaveOneOutSpread(
  points: readonly Point[],
  target: number,
  ambient: number | null,
  eta: Projection,
): number {
  if (eta.kind !== 'eta') return Infinity;
  const left = eta.t - points.at(-1)!.t;
  let spread = 0;
  for (let i = 0; i < points.length; i++) {
    const rest = points.filter((_, j) => j !== i);
    if (!(fitLine(rest, (p) => p.u).slope > 0)) return Infinity;
    const other = project(rest, target, ambient);
    if (other.kind !== 'eta' || other.method !== eta.method) return Infinity;
    spread = Math.max(spread, Math.abs(other.t - eta.t) / left);
  }
  return spread;
}

function confidenceOf(
  points: readonly Point[],
  target: number,
  ambient: number | null,
  eta: Projection,
): EtaConfidence {
  if (eta.kind !== 'eta') return 'low';
  // The fewest readings each model needs; with none to spare the spread cannot be measured, and
  // only a curve through a known ambient earns 'medium' then.
  const needed = eta.method === 'newton' && ambient === null ? 3 : 2;
  let confidence: EtaConfidence = eta.method === 'newton' && ambient !== null ? 'medium' : 'low';
  if (distinctTimes(points) > needed) {
    const spread = leaveOneOutSpread(points, target, ambient, eta);
    const closeFit = eta.error !== null && eta.error <= GOOD_FIT_C;
    confidence = spread <= HIGH_SPREAD && closeFit ? 'high' : spread <= MEDIUM_SPREAD ? 'medium' : 'low';
  }
  // A straight line ignores the slowing approach to the asymptote: never better than 'medium'.
  if (eta.method === 'linear' && confidence === 'high') confidence = 'medium';
  const last = points.at(-1)!.t;
  return eta.t - last > MAX_SURE_HORIZON * last ? lower(confidence) : confidence;
}

function lower(confidence: EtaConfidence): EtaConfidence {
  return confidence === 'high' ? 'medium' : 'low';
}

/**
 * Time left until a warm-up or cool-down reaches its target, by Newton's law of heating and cooling
 * T(t) = Ta + (T0 − Ta)·e^(−kt). With a known ambient, k comes from a straight-line fit of
 * ln|T − Ta| against time (exact for two readings); without one, Ta is fitted too from three or more
 * readings. With two readings and no ambient, or when the fit is unstable (k ≤ 0, poor residual, an
 * asymptote short of the target on only three readings), a straight-line rate is used instead. The
 * ETA is projected from the latest reading, so a new reading moves it at once. Confidence comes from
 * how much the ETA moves when any one reading is left out, lowered for far extrapolation.
 */
export function estimateTemperatureEta(input: TemperatureEtaInput): TemperatureEta {
  const sign = input.kind === 'warm-up' ? 1 : -1;
  const target = sign * input.targetC;
  const timed = input.readings
    .map((r) => ({ ms: new Date(r.at).getTime(), u: sign * r.tempC }))
    .filter((r) => Number.isFinite(r.ms) && Number.isFinite(r.u))
    .sort((a, b) => a.ms - b.ms);
  const first = timed[0];
  const last = timed.at(-1);
  const none = { etaAt: null, secondsLeft: null, method: null, confidence: 'low' } as const;
  if (!first || !last) return { status: 'not-enough-readings', ...none };
  if (last.u >= target) {
    return { status: 'reached', ...none, etaAt: new Date(last.ms), secondsLeft: 0, confidence: 'high' };
  }
  const points: Point[] = timed.map((r) => ({ t: (r.ms - first.ms) / 1000, u: r.u }));
  if (distinctTimes(points) < 2) return { status: 'not-enough-readings', ...none };
  // The overall least-squares trend, so one odd reading does not flip the answer.
  if (fitLine(points, (p) => p.u).slope <= 0) return { status: 'moving-away', ...none };

  const ambient = input.ambientC == null ? null : sign * input.ambientC;
  const eta = project(points, target, ambient);
  const fitted = eta.fit && {
    k: eta.fit.k,
    ...(ambient === null ? { fittedAmbientC: sign * eta.fit.ambient } : {}),
  };
  if (eta.kind === 'beyond-asymptote') return { status: 'beyond-asymptote', ...none, ...fitted };
  const etaMs = first.ms + eta.t * 1000;
  return {
    status: 'estimating',
    etaAt: new Date(etaMs),
    secondsLeft: Math.max(0, (etaMs - input.now.getTime()) / 1000),
    method: eta.method,
    confidence: confidenceOf(points, target, ambient, eta),
    ...fitted,
  };
}

export interface HoldTimerState {
  endsAt: Date;
  secondsLeft: number;
  done: boolean;
}

/** A set time (a cure, a soak): computed from its start, so it survives a restart. */
export function holdTimer(startedAt: Date | string, durationSeconds: number, now: Date): HoldTimerState {
  const endsAt = new Date(new Date(startedAt).getTime() + durationSeconds * 1000);
  const secondsLeft = Math.max(0, (endsAt.getTime() - now.getTime()) / 1000);
  return { endsAt, secondsLeft, done: secondsLeft === 0 };
}
