import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { celsiusFromFahrenheit } from '../units/units.js';
import { estimateTemperatureEta, holdTimer, type TemperatureEtaInput } from './estimator.js';

const T0 = Date.parse('2026-03-03T15:00:00Z');
const at = (minutes: number) => new Date(T0 + minutes * 60_000);
const minutesFromT0 = (date: Date | null) => (date!.getTime() - T0) / 60_000;
const readings = (...pairs: [minutes: number, tempC: number][]) =>
  pairs.map(([minutes, tempC]) => ({ at: at(minutes), tempC }));
/** T(t) = Ta + (T0 − Ta)·e^(−kt), k per minute. */
const newton = (ambient: number, start: number, kPerMinute: number) => (minutes: number) =>
  ambient + (start - ambient) * Math.exp(-kPerMinute * minutes);

function estimate(input: Partial<TemperatureEtaInput> & Pick<TemperatureEtaInput, 'readings' | 'targetC'>) {
  const last = Math.max(...input.readings.map((r) => new Date(r.at).getTime()), T0);
  return estimateTemperatureEta({ kind: 'warm-up', now: new Date(last), ...input });
}

describe(estimateTemperatureEta.name, () => {
  describe('published vectors with a known ambient', () => {
    it('cools 90 °C → 40 °C in 2.369 min (60 °C after 1 min, 25 °C ambient)', () => {
      // University of Oklahoma open course, ODE case study on Newton's law of cooling: 90 °C, 60 °C after
      // 1 min, 25 °C ambient → 40 °C at t = 2.369 min.
      const sut = estimate({
        kind: 'cool-down',
        readings: readings([0, 90], [1, 60]),
        ambientC: 25,
        targetC: 40,
      });
      expect(sut).toMatchObject({ status: 'estimating', method: 'newton', confidence: 'medium' });
      expect(Math.abs(minutesFromT0(sut.etaAt) - 2.369)).toBeLessThan(0.001);
      expect(Math.abs(sut.secondsLeft! / 60 - 1.369)).toBeLessThan(0.001);
      expect(sut.fittedAmbientC).toBeUndefined();
    });

    it('cools 170 °F → 110 °F in 4.581 min at k = 0.2/min in 70 °F surroundings', () => {
      // Dartmouth differential-equations text §3.2: 170 °F in 70 °F surroundings, k = 0.2/min, 110 °F at
      // t = 4.581 min.
      // The text gives the initial rate; the 1-minute reading comes from its own model. Converted to °C
      // with t/°C = (t/°F − 32)/1.8 (NIST SP 811).
      const f = newton(70, 170, 0.2);
      const sut = estimate({
        kind: 'cool-down',
        readings: readings([0, celsiusFromFahrenheit(f(0))], [1, celsiusFromFahrenheit(f(1))]),
        ambientC: celsiusFromFahrenheit(70),
        targetC: celsiusFromFahrenheit(110),
      });
      expect(sut.status).toBe('estimating');
      expect(Math.abs(minutesFromT0(sut.etaAt) - 4.581)).toBeLessThan(0.001);
      expect(sut.k! * 60).toBeCloseTo(0.2, 12);
    });

    it('warms 40 °F water in a 70 °F room to 60 °F in 6.026 h (45 °F after 1 h)', () => {
      // A textbook exercise on Newton's law of heating, quoted from memory: 40 °F water in a 70 °F room,
      // 45 °F after 1 h → 60 °F at t = 6.026 h (k = ln(30/25) per hour, t = ln(30/10) ÷ k). Far beyond the
      // one-hour span of the readings.
      const sut = estimate({
        readings: readings([0, celsiusFromFahrenheit(40)], [60, celsiusFromFahrenheit(45)]),
        ambientC: celsiusFromFahrenheit(70),
        targetC: celsiusFromFahrenheit(60),
      });
      expect(sut).toMatchObject({ status: 'estimating', method: 'newton', confidence: 'low' });
      expect(Math.abs(minutesFromT0(sut.etaAt) / 60 - 6.026)).toBeLessThan(0.001);
    });
  });

  describe('without a known ambient', () => {
    it('recovers k and the asymptote from four or more exact readings, in any order', () => {
      // Synthetic curve Ta = 92 °C, T0 = 20 °C, k = 0.15/min; analytic ETA for 70 °C: ln(72/22)/0.15 min.
      const f = newton(92, 20, 0.15);
      const sut = estimate({
        readings: [4, 0, 5, 2.5, 1].map((m) => ({ at: at(m).toISOString(), tempC: f(m) })),
        targetC: 70,
      });
      expect(sut).toMatchObject({ status: 'estimating', method: 'newton', confidence: 'high' });
      expect(sut.fittedAmbientC).toBeCloseTo(92, 3);
      expect(sut.k! * 60).toBeCloseTo(0.15, 5);
      expect(Math.abs(minutesFromT0(sut.etaAt) - Math.log(72 / 22) / 0.15) * 60).toBeLessThan(1);
    });

    it('fits a cool-down the same way', () => {
      // Synthetic: 95 °C cooling in a 22 °C room at k = 0.05/min; 50 °C at ln(73/28)/0.05 = 19.16 min.
      const f = newton(22, 95, 0.05);
      const sut = estimate({
        kind: 'cool-down',
        readings: readings(...[0, 2, 4, 6].map((m) => [m, f(m)] as [number, number])),
        targetC: 50,
      });
      expect(sut).toMatchObject({ status: 'estimating', method: 'newton' });
      expect(sut.fittedAmbientC).toBeCloseTo(22, 3);
      expect(Math.abs(minutesFromT0(sut.etaAt) - Math.log(73 / 28) / 0.05) * 60).toBeLessThan(1);
    });

    it('takes a linear rate from two readings: 30 °C then 36 °C a minute later, target 45 °C', () => {
      // Common practice, no published source: fluid level set at about 45 °C; from about 30 °C a running
      // engine takes a few more minutes. Linear arithmetic: 6 °C/min, 9 °C to go → 1.5 min after 36 °C.
      const sut = estimate({ readings: readings([0, 30], [1, 36]), targetC: 45 });
      expect(sut).toMatchObject({ status: 'estimating', method: 'linear', confidence: 'low' });
      expect(sut.secondsLeft).toBeCloseTo(90, 9);
      expect(sut.secondsLeft! / 60).toBeGreaterThanOrEqual(1);
      expect(sut.secondsLeft! / 60).toBeLessThanOrEqual(5);
    });

    it('falls back to a linear rate when the readings rise in a straight line', () => {
      // 3 °C/min with no slowing: no asymptote in sight; 45 °C is 6 °C above 39 °C → 2 min.
      const sut = estimate({ readings: readings([0, 30], [1, 33], [2, 36], [3, 39]), targetC: 45 });
      expect(sut).toMatchObject({ status: 'estimating', method: 'linear', confidence: 'medium' });
      expect(minutesFromT0(sut.etaAt)).toBeCloseTo(5, 9);
      expect(sut.k).toBeUndefined();
    });

    it('says the target is beyond the asymptote when the readings level off short of it', () => {
      // Synthetic: settling at 40 °C (k = 0.3/min), so 45 °C is never reached.
      const f = newton(40, 20, 0.3);
      const sut = estimate({
        readings: readings(...[0, 1, 2, 3, 4].map((m) => [m, f(m)] as [number, number])),
        targetC: 45,
      });
      expect(sut).toMatchObject({ status: 'beyond-asymptote', etaAt: null, secondsLeft: null });
      expect(sut.fittedAmbientC).toBeCloseTo(40, 3);
    });
  });

  describe('imperfect readings', () => {
    // Synthetic engine warm-up Ta = 95 °C from 20 °C at k = 0.08/min: 60 °C at ln(75/35)/0.08 = 9.527 min.
    const truth = newton(95, 20, 0.08);
    const trueEta = Math.log(75 / 35) / 0.08;
    const noise = fc.array(
      // Uniform ±2 °C in 0.01 °C steps (a probe aimed at different spots); noBias keeps fast-check from
      // favouring small and extreme values.
      fc.noBias(fc.integer({ min: -200, max: 200 })).map((hundredths) => hundredths / 100),
      { minLength: 7, maxLength: 7 },
    );
    const noisy = (offsets: number[]) =>
      estimate({ readings: offsets.map((e, m) => ({ at: at(m), tempC: truth(m) + e })), targetC: 60 });

    it('keeps an ETA near the truth from noisy readings and does not claim high confidence', () => {
      const [offsets] = fc.sample(noise, { seed: 20260303, numRuns: 1 });
      const sut = noisy(offsets!);
      expect(sut.status).toBe('estimating');
      expect(Math.abs(minutesFromT0(sut.etaAt) - trueEta)).toBeLessThan(2);
      expect(sut.confidence).not.toBe('high');
    });

    it('stays sane over many noisy runs', () => {
      const runs = fc.sample(noise, { seed: 42, numRuns: 200 }).map(noisy);
      for (const sut of runs) {
        // A noisy fit may see the curve level off short of the target, but must not be sure of it.
        if (sut.status === 'beyond-asymptote') expect(sut.confidence).toBe('low');
        else {
          expect(sut.status).toBe('estimating');
          expect(minutesFromT0(sut.etaAt)).toBeGreaterThan(6); // after the last reading
          expect(minutesFromT0(sut.etaAt)).toBeLessThan(2.5 * trueEta);
        }
      }
      expect(runs.filter((sut) => sut.confidence === 'high').length).toBeLessThan(runs.length * 0.02);
    });

    it('reads through a dip', () => {
      const sut = estimate({ readings: readings([0, 30], [1, 34], [2, 33], [3, 37], [4, 40]), targetC: 45 });
      expect(sut.status).toBe('estimating');
      expect(minutesFromT0(sut.etaAt)).toBeGreaterThan(4);
      expect(minutesFromT0(sut.etaAt)).toBeLessThan(10);
      expect(sut.confidence).not.toBe('high');
    });

    it('skips unreadable readings', () => {
      const sut = estimateTemperatureEta({
        kind: 'warm-up',
        readings: [...readings([0, 30], [1, 36]), { at: 'not a time', tempC: 50 }, { at: at(2), tempC: NaN }],
        targetC: 45,
        now: at(1),
      });
      expect(sut.secondsLeft).toBeCloseTo(90, 9);
    });
  });

  describe('statuses', () => {
    it('needs two readings at different times', () => {
      expect(estimate({ readings: [], targetC: 45 }).status).toBe('not-enough-readings');
      expect(estimate({ readings: readings([0, 30]), targetC: 45 }).status).toBe('not-enough-readings');
      expect(estimate({ readings: readings([0, 30], [0, 31]), targetC: 45 }).status).toBe(
        'not-enough-readings',
      );
    });

    it('reports the target reached from the latest reading', () => {
      expect(estimate({ readings: readings([0, 46]), targetC: 45 })).toMatchObject({
        status: 'reached',
        etaAt: at(0),
        secondsLeft: 0,
      });
      expect(
        estimate({ kind: 'cool-down', readings: readings([0, 90], [3, 39.5]), targetC: 40 }).status,
      ).toBe('reached');
    });

    it('spots readings moving away from the target', () => {
      expect(estimate({ readings: readings([0, 40], [1, 38], [2, 37]), targetC: 45 }).status).toBe(
        'moving-away',
      );
      expect(estimate({ kind: 'cool-down', readings: readings([0, 60], [1, 61]), targetC: 40 }).status).toBe(
        'moving-away',
      );
      // One reading lower than the one before is not a trend.
      expect(estimate({ readings: readings([0, 30], [1, 34], [2, 33]), targetC: 45 }).status).toBe(
        'estimating',
      );
    });

    it('says the target is beyond a known ambient', () => {
      // A part cannot cool below the room it sits in.
      const sut = estimate({
        kind: 'cool-down',
        readings: readings([0, 90], [1, 60]),
        ambientC: 25,
        targetC: 20,
      });
      expect(sut).toMatchObject({ status: 'beyond-asymptote', etaAt: null, method: null });
    });

    it('counts down from now, never below zero', () => {
      const input = {
        kind: 'cool-down' as const,
        readings: readings([0, 90], [1, 60]),
        ambientC: 25,
        targetC: 40,
      };
      expect(estimateTemperatureEta({ ...input, now: at(2) }).secondsLeft! / 60).toBeCloseTo(0.369, 3);
      expect(estimateTemperatureEta({ ...input, now: at(5) }).secondsLeft).toBe(0);
    });
  });
});

describe(holdTimer.name, () => {
  it('counts a set time down from its start', () => {
    expect(holdTimer(at(0).toISOString(), 600, at(4))).toEqual({
      endsAt: at(10),
      secondsLeft: 360,
      done: false,
    });
    expect(holdTimer(at(0), 600, at(10))).toEqual({ endsAt: at(10), secondsLeft: 0, done: true });
    expect(holdTimer(at(0), 600, at(30))).toMatchObject({ secondsLeft: 0, done: true });
  });
});
