/** Baytime's mark: a bay opening with a clock hand. */
export function BaytimeMark({ className }: { className?: string }) {
  return (
    <svg className={className} viewBox="0 0 32 32" aria-hidden="true" focusable="false">
      <path d="M4 28V11L16 4l12 7v17" fill="none" stroke="#4fb0c6" strokeWidth="3" strokeLinejoin="round" />
      <circle cx="16" cy="19" r="6.5" fill="none" stroke="#edf2f6" strokeWidth="2.5" />
      <path d="M16 15.5V19l2.6 1.8" fill="none" stroke="#3ec28f" strokeWidth="2.5" strokeLinecap="round" />
    </svg>
  );
}
