/** Baytime's mark: three bays, one of each kind of state colour. */
export function BaytimeMark({ size = 32 }: { size?: number }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true" focusable="false">
      <rect width="32" height="32" rx="6" fill="#0E1116" />
      <rect x="5" y="7" width="9" height="18" rx="2" fill="#4DBB9D" />
      <rect x="18" y="7" width="9" height="8" rx="2" fill="#F0E442" />
      <rect x="18" y="17" width="9" height="8" rx="2" fill="#56B4E9" />
    </svg>
  );
}
