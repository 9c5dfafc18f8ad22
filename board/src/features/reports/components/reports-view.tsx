import { useState } from 'react';
import {
  Button,
  Caption1,
  MessageBar,
  MessageBarBody,
  Spinner,
  Tab,
  TabList,
  Title3,
  makeStyles,
  shorthands,
  mergeClasses,
  tokens,
} from '@fluentui/react-components';
import { formErrorText } from '@/lib/form-errors';
import { useDownloadReportCsv, type ReportKind } from '../api/download-report';
import { useLabourReport } from '../api/get-labour-report';
import { usePayReport } from '../api/get-pay-report';
import { LabourReportView } from './labour-report';
import { PayReportView } from './pay-report';
import './report-print.css';

const useStyles = makeStyles({
  page: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
  bar: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'center',
    gap: tokens.spacingHorizontalM,
    ...shorthands.borderBottom(tokens.strokeWidthThin, 'solid', tokens.colorNeutralStroke2),
  },
  spacer: { flexGrow: 1 },
  saved: { color: tokens.colorNeutralForeground3 },
  loading: { opacity: 0.6 },
  printHead: { marginBottom: '8px' },
});

export type ReportTab = ReportKind;

/** The labour report, and for the owner the pay summary, of one workweek; with CSV and a print view. */
export function ReportsView({
  week,
  tab,
  onTab,
  canSeePay,
  printTitle,
}: {
  week: string;
  tab: ReportTab;
  onTab: (tab: ReportTab) => void;
  canSeePay: boolean;
  /** Heads the printed page: shop, report and week in words. */
  printTitle: (tab: ReportTab) => string;
}) {
  const styles = useStyles();
  const shown: ReportTab = canSeePay ? tab : 'labour';
  const labour = useLabourReport(week);
  const pay = usePayReport(week, shown === 'pay');
  const download = useDownloadReportCsv();
  const [savedAs, setSavedAs] = useState<string | null>(null);
  const query = shown === 'pay' ? pay : labour;

  return (
    <div className={mergeClasses('bt-report', styles.page)}>
      <div className="bt-print-only">
        <Title3 as="p" className={styles.printHead}>
          {printTitle(shown)}
        </Title3>
      </div>
      <div className={mergeClasses('bt-no-print', styles.bar)}>
        <TabList
          selectedValue={shown}
          onTabSelect={(_, data) => {
            setSavedAs(null);
            download.reset();
            onTab(data.value as ReportTab);
          }}
          aria-label="Report"
        >
          <Tab value="labour">Labour</Tab>
          {canSeePay && <Tab value="pay">Pay summary</Tab>}
        </TabList>
        <span className={styles.spacer} />
        {savedAs && !download.isPending && <Caption1 className={styles.saved}>Saved {savedAs}</Caption1>}
        <Button
          disabled={download.isPending}
          onClick={() => {
            setSavedAs(null);
            download.mutate({ kind: shown, week }, { onSuccess: setSavedAs });
          }}
        >
          {download.isPending ? 'Preparing CSV…' : 'Download CSV'}
        </Button>
        <Button appearance="primary" onClick={() => window.print()} disabled={!query.data}>
          Print…
        </Button>
      </div>
      {download.isError && (
        <MessageBar intent="error" className="bt-no-print">
          <MessageBarBody>The CSV could not be made: {formErrorText(download.error)}</MessageBarBody>
        </MessageBar>
      )}
      {query.isPending ? (
        <Spinner
          label={shown === 'pay' ? 'Working out the pay summary…' : 'Working out the labour report…'}
        />
      ) : query.isError ? (
        <MessageBar intent="error">
          <MessageBarBody>{formErrorText(query.error)}</MessageBarBody>
        </MessageBar>
      ) : (
        <div className={query.isPlaceholderData ? styles.loading : undefined} aria-busy={query.isFetching}>
          {shown === 'pay' && pay.data ? (
            <PayReportView report={pay.data} />
          ) : labour.data ? (
            <LabourReportView report={labour.data} />
          ) : null}
        </div>
      )}
    </div>
  );
}
