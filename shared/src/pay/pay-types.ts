export const PAY_TYPES = ['flat-rate', 'hourly', 'flat-rate-guarantee'] as const;
export type PayType = (typeof PAY_TYPES)[number];

/** A technician's rates: cents per hour. */
export interface PayRate {
  /**
   * `flat-rate`: flagged hours × flat rate, other time at the hourly rate when the shop pays it separately.
   * `hourly`: every hour worked at the hourly rate. `flat-rate-guarantee` (29 CFR 778.111(b)): the larger of
   * the flat-rate pay and the guarantee × productive hours, plus waiting time at the hourly rate.
   */
  payType: PayType;
  flatRateCents: number;
  /** Hourly pay, or the rate for non-productive time under the flat-rate types. */
  hourlyRateCents: number;
  /** The hourly guarantee for productive time (flat-rate-guarantee only). */
  guaranteeCents: number;
  /** 29 USC 213(b)(10)(A): no federal overtime premium; the minimum wage still applies (29 CFR 779.372). */
  overtimeExempt: boolean;
}

/** What the overtime-exemption switch means, wherever it is offered. */
export const OVERTIME_EXEMPTION_CONDITION =
  '29 USC 213(b)(10)(A) exempts from overtime only a mechanic primarily engaged in servicing vehicles at an ' +
  'establishment primarily engaged in selling vehicles to ultimate purchasers (a dealership). It never ' +
  'covers an independent repair shop, and the minimum wage still applies (29 CFR 779.372). California ' +
  'overtime applies either way.';
