import { useEffect } from 'react';
import { Navigate, useLocation } from 'react-router';
import { Body1, Card, Title2, makeStyles, tokens } from '@fluentui/react-components';
import { paths } from '@/config/paths';
import { BaytimeMark } from '@/components/baytime-mark';
import { SignInForm } from '@/features/auth/components/sign-in-form';
import { useOfficeToken } from '@/features/auth/hooks/use-office-token';

const useStyles = makeStyles({
  page: {
    minHeight: '100vh',
    display: 'grid',
    placeItems: 'center',
    padding: tokens.spacingHorizontalXL,
    boxSizing: 'border-box',
  },
  card: { width: 'min(26rem, 100%)', padding: tokens.spacingHorizontalXXL, gap: tokens.spacingVerticalL },
  head: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalM },
  hint: { color: tokens.colorNeutralForeground3 },
});

export function Component() {
  const styles = useStyles();
  const token = useOfficeToken();
  const location = useLocation();
  const from = (location.state as { from?: string } | null)?.from;

  useEffect(() => {
    document.title = 'Sign in · Baytime';
  }, []);

  if (token) return <Navigate to={from && from !== paths.signIn ? from : paths.home} replace />;

  return (
    <main className={styles.page}>
      <Card className={styles.card}>
        <div className={styles.head}>
          <BaytimeMark size={40} />
          <Title2 as="h1">Baytime office</Title2>
        </div>
        <Body1 className={styles.hint}>Sign in with your shop e-mail and password.</Body1>
        <SignInForm />
      </Card>
    </main>
  );
}
