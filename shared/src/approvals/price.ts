/** What one finding costs the customer, in cents: labour at the shop's rate, plus parts. */
export interface FindingPrice {
  labourCents: number;
  partsCents: number;
  priceCents: number;
}

/**
 * Book hours × the labour rate, to the nearest cent (a half cent rounds up), plus the parts amount.
 * Hours are read to the thousandth, so the product is exact in integers before the one rounding.
 */
export function findingPrice(
  bookHours: number,
  labourRateCents: number,
  partsCents: number | null,
): FindingPrice {
  const labourCents = Math.round((Math.round(bookHours * 1000) * labourRateCents) / 1000);
  const parts = partsCents ?? 0;
  return { labourCents, partsCents: parts, priceCents: labourCents + parts };
}

/** "$1,234.50" */
export function formatCents(cents: number): string {
  return new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' }).format(cents / 100);
}
