import { ComingPage } from '@/components/coming-page';

export function Component() {
  return (
    <ComingPage
      title="Timecards"
      what="Here each technician's week will show punch by punch, with corrections that record who changed what and why."
    />
  );
}
