import { useSearchParams } from 'react-router';
import { Tab, TabList, makeStyles, tokens } from '@fluentui/react-components';
import { PageHeader } from '@/components/page-header';
import { useShop } from '@/features/shop/api/get-shop';
import { MailboxView } from '@/features/mailbox/components/mailbox-view';
import { TextsView } from '@/features/mailbox/components/texts-view';

export { PageError as ErrorBoundary } from './page-error';

const useStyles = makeStyles({ tabs: { marginBottom: tokens.spacingVerticalL } });

export function Component() {
  const styles = useStyles();
  const shop = useShop();
  const [params, setParams] = useSearchParams();
  const show = params.get('show') === 'texts' ? 'texts' : 'mail';
  return (
    <>
      <PageHeader
        title="Sent messages"
        description="E-mail and texts Baytime sent while no mail server or SMS provider is set up: nothing here reached a customer."
      />
      <TabList
        className={styles.tabs}
        selectedValue={show}
        onTabSelect={(_, data) =>
          setParams(data.value === 'texts' ? { show: 'texts' } : {}, { replace: true })
        }
        aria-label="Sent messages"
      >
        <Tab value="mail">E-mail</Tab>
        <Tab value="texts">Texts</Tab>
      </TabList>
      {show === 'texts' ? (
        <TextsView timeZone={shop.data?.timeZone} />
      ) : (
        <MailboxView
          selected={params.get('message')}
          onSelect={(id) => setParams({ message: id }, { replace: true })}
          timeZone={shop.data?.timeZone}
        />
      )}
    </>
  );
}
