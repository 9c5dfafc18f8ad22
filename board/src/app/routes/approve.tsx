import { useEffect } from 'react';
import { useParams } from 'react-router';
import { ApprovalPage } from '@/features/customer-approval/components/approval-page';

/** The customer's approval page: public, reached only through the link the shop sent. */
export function Component() {
  const { token = '' } = useParams();
  useEffect(() => {
    document.title = 'Your approval · Baytime';
  }, []);
  return <ApprovalPage token={token} />;
}

export { RootError as ErrorBoundary } from './root-fallbacks';
