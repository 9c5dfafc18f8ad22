import { ComingPage } from '@/components/coming-page';

export function Component() {
  return (
    <ComingPage
      title="Dispatch"
      what="Here the foreman will assign job lines to technicians and bays, set priorities and see forecast finish times."
    />
  );
}
