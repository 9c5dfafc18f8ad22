import { baytimeMarkUrl } from '@baytime/shared';

const MARK_URL = baytimeMarkUrl();

/** Baytime's one mark (drawn in `shared`), beside the product's name: decorative. */
export function BaytimeMark({ className }: { className?: string }) {
  return <img className={className} src={MARK_URL} alt="" />;
}
