import { describe, expect, it } from 'vitest';
import { KPI_FORMULAS, KPI_GUIDELINES, labourKpis, shareFlaggedHours, shopLabourKpis } from './kpis.js';

describe(labourKpis.name, () => {
  // NADA definitions via a dealer association bulletin "Measuring technician performance":
  // available 40 h, worked on jobs 36 h, flagged 45 h → 90 %, 125 %, 112.5 %.
  it('gives 90 %, 125 %, 112.5 % for 40 h available, 36 h clocked, 45 h flagged', () => {
    const kpis = labourKpis({ attendanceHours: 40, clockedHours: 36, flaggedHours: 45 });
    expect(kpis.productivity).toBeCloseTo(0.9, 12);
    expect(kpis.efficiency).toBeCloseTo(1.25, 12);
    expect(kpis.proficiency).toBeCloseTo(1.125, 12);
    expect(kpis.proficiency).toBeCloseTo(kpis.productivity! * kpis.efficiency!, 12);
  });

  it('gives null instead of dividing by zero', () => {
    expect(labourKpis({ attendanceHours: 0, clockedHours: 0, flaggedHours: 2 })).toMatchObject({
      productivity: null,
      efficiency: null,
      proficiency: null,
    });
  });
});

describe(shopLabourKpis.name, () => {
  // 8-tech totals from the shop-management article "Time is money — tracking time":
  // available 1,483.5 h, actual 1,283.7 h, sold 1,361.8 h → 86.53 %, 106.08 %, 91.80 %.
  // The split over eight technicians is invented; only the totals are published.
  it('sums the hours first, then takes the ratios', () => {
    const techs = [
      { attendanceHours: 190, clockedHours: 170, flaggedHours: 200 },
      { attendanceHours: 185.5, clockedHours: 160.2, flaggedHours: 150.3 },
      { attendanceHours: 180, clockedHours: 150, flaggedHours: 170 },
      { attendanceHours: 186, clockedHours: 166.5, flaggedHours: 190.5 },
      { attendanceHours: 184, clockedHours: 150, flaggedHours: 140 },
      { attendanceHours: 188, clockedHours: 165, flaggedHours: 180 },
      { attendanceHours: 185, clockedHours: 162, flaggedHours: 171 },
      { attendanceHours: 185, clockedHours: 160, flaggedHours: 160 },
    ];
    const shop = shopLabourKpis(techs);
    expect(shop.attendanceHours).toBeCloseTo(1483.5, 9);
    expect(shop.clockedHours).toBeCloseTo(1283.7, 9);
    expect(shop.flaggedHours).toBeCloseTo(1361.8, 9);
    expect(shop.productivity! * 100).toBeCloseTo(86.53, 2);
    expect(shop.efficiency! * 100).toBeCloseTo(106.08, 2);
    expect(shop.proficiency! * 100).toBeCloseTo(91.8, 2);
  });

  it('weights technicians by their hours, not by head', () => {
    const shop = shopLabourKpis([
      { attendanceHours: 40, clockedHours: 40, flaggedHours: 60 },
      { attendanceHours: 10, clockedHours: 10, flaggedHours: 5 },
    ]);
    expect(shop.efficiency).toBeCloseTo(65 / 50, 12); // the mean of ratios would be 1.0
  });
});

describe('KPI guidelines and formulas', () => {
  // NADA guidelines via the dealer association bulletin "Measuring technician performance": productivity
  // 85–87.5 %, efficiency 125 %, proficiency 100 %.
  it('holds the published guidelines', () => {
    expect(KPI_GUIDELINES).toEqual({
      productivity: { low: 0.85, high: 0.875 },
      efficiency: { low: 1.25, high: 1.25 },
      proficiency: { low: 1, high: 1 },
    });
  });

  it('spells out each formula for the report page', () => {
    expect(KPI_FORMULAS.productivity).toMatch(/clocked job hours ÷ attendance hours/);
    expect(KPI_FORMULAS.efficiency).toMatch(/flagged hours ÷ clocked job hours/);
    expect(KPI_FORMULAS.proficiency).toMatch(/flagged hours ÷ attendance hours/);
  });
});

describe(shareFlaggedHours.name, () => {
  // Sharing by clocked time is common practice, no published source.
  it('splits book hours by clocked seconds', () => {
    const shares = shareFlaggedHours(
      3,
      new Map([
        [1, 3600],
        [2, 1800],
        [3, 0],
      ]),
      1,
    );
    expect(shares).toEqual(
      new Map([
        [1, 2],
        [2, 1],
      ]),
    );
  });

  it('flags an unclocked line to its assigned technician, or to nobody', () => {
    expect(shareFlaggedHours(1.5, new Map(), 4)).toEqual(new Map([[4, 1.5]]));
    expect(shareFlaggedHours(1.5, new Map([[2, 0]]), null)).toEqual(new Map());
  });
});
