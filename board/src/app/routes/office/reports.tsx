import { ComingPage } from '@/components/coming-page';

export function Component() {
  return (
    <ComingPage
      title="Reports"
      what="Here the weekly labour report (productivity, efficiency, proficiency) and the pay summary will live, with CSV export."
    />
  );
}
