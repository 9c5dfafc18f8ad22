import { useEffect, type ReactNode } from 'react';
import { Body1, Title2, makeStyles, tokens } from '@fluentui/react-components';
import { HEADING_FONT } from '@/lib/theme';

const useStyles = makeStyles({
  header: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'flex-end',
    justifyContent: 'space-between',
    gap: tokens.spacingHorizontalL,
    marginBottom: tokens.spacingVerticalXL,
  },
  text: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXS },
  title: { fontFamily: HEADING_FONT, fontSize: '34px', lineHeight: '38px', fontWeight: 700 },
  description: { color: tokens.colorNeutralForeground3 },
  actions: { display: 'flex', alignItems: 'center', gap: tokens.spacingHorizontalM },
});

export function PageHeader({
  title,
  description,
  actions,
}: {
  title: string;
  description?: ReactNode;
  actions?: ReactNode;
}) {
  const styles = useStyles();
  useEffect(() => {
    document.title = `${title} · Baytime`;
  }, [title]);
  return (
    <header className={styles.header}>
      <div className={styles.text}>
        <Title2 as="h1" className={styles.title}>
          {title}
        </Title2>
        {description && <Body1 className={styles.description}>{description}</Body1>}
      </div>
      {actions && <div className={styles.actions}>{actions}</div>}
    </header>
  );
}
