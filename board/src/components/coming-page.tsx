import { Body1, Card, makeStyles, tokens } from '@fluentui/react-components';
import { PageHeader } from './page-header';

const useStyles = makeStyles({
  card: { maxWidth: '40rem', padding: tokens.spacingHorizontalXL },
});

/** A page that is planned but not built yet: says so plainly. */
export function ComingPage({ title, what }: { title: string; what: string }) {
  const styles = useStyles();
  return (
    <>
      <PageHeader title={title} />
      <Card className={styles.card}>
        <Body1>
          <strong>Coming in a later version.</strong> {what}
        </Body1>
      </Card>
    </>
  );
}
