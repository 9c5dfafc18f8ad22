import { baytimeMarkUrl } from '@baytime/shared';

const MARK_URL = baytimeMarkUrl();

/** Baytime's one mark (drawn in `shared`), beside the product's name: decorative. */
export function BaytimeMark({ size = 32 }: { size?: number }) {
  return <img src={MARK_URL} width={size} height={size} alt="" />;
}
