import { useEffect, useState } from 'react';
import {
  Badge,
  Button,
  Caption1,
  MessageBar,
  MessageBarBody,
  Spinner,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import {
  DEVICE_ROLES,
  type DatedPayRate,
  type PersonRole,
  type Role,
  type UserDto,
  type WorkweekSettings,
} from '@baytime/shared';
import { formErrorText } from '@/lib/form-errors';
import { useUsers } from '@/lib/api/get-users';
import { useUpdateUser } from '../api/update-user';
import { ROLE_LABELS, rateToCome, refusalAbout } from '../user-form';
import { EditUserDialog } from './edit-user-dialog';
import { PayRateDialog, rateStartWords, rateWords } from './pay-rate-dialog';

const useStyles = makeStyles({
  table: { tableLayout: 'auto' },
  scroll: { overflowX: 'auto' },
  inactive: { color: tokens.colorNeutralForeground4 },
  error: { marginBottom: tokens.spacingVerticalM },
  numeric: { fontVariantNumeric: 'tabular-nums' },
  actions: { display: 'flex', gap: tokens.spacingHorizontalS, alignItems: 'center', flexWrap: 'wrap' },
  dim: { display: 'block', color: tokens.colorNeutralForeground3 },
});

function RateToCome({ rate, shop }: { rate: DatedPayRate | null; shop: WorkweekSettings }) {
  const styles = useStyles();
  if (!rate) return null;
  return (
    <Caption1 className={styles.dim}>
      {rateStartWords(rate.effectiveFrom, shop)}: {rateWords(rate)}
    </Caption1>
  );
}

function ActiveButton({ user, onError }: { user: UserDto; onError: (message: string | null) => void }) {
  const update = useUpdateUser();
  const [confirming, setConfirming] = useState(false);

  useEffect(() => {
    if (!confirming) return;
    const timer = setTimeout(() => setConfirming(false), 5000);
    return () => clearTimeout(timer);
  }, [confirming]);

  const save = (active: boolean) => {
    onError(null);
    update.mutate(
      { id: user.id, active },
      {
        onError: (error) => onError(refusalAbout(user, formErrorText(error))),
        onSettled: () => setConfirming(false),
      },
    );
  };

  if (!user.active)
    return (
      <Button size="small" disabled={update.isPending} onClick={() => save(true)}>
        Reactivate
      </Button>
    );
  return confirming ? (
    <Button size="small" appearance="primary" disabled={update.isPending} onClick={() => save(false)}>
      Confirm: deactivate {user.name.split(' ')[0]}
    </Button>
  ) : (
    <Button size="small" onClick={() => setConfirming(true)}>
      Deactivate
    </Button>
  );
}

/** `currentUserId`: the signed-in owner, who cannot deactivate themself here. */
export function UsersTable({ currentUserId, shop }: { currentUserId?: number; shop: WorkweekSettings }) {
  const { timeZone } = shop;
  const styles = useStyles();
  const users = useUsers();
  const [error, setError] = useState<string | null>(null);
  const [editing, setEditing] = useState<UserDto | null>(null);
  const [paying, setPaying] = useState<{ user: UserDto; shown: boolean; n: number } | null>(null);

  if (users.isPending) return <Spinner label="Loading people…" />;
  if (users.isError)
    return (
      <MessageBar intent="error">
        <MessageBarBody>{formErrorText(users.error)}</MessageBarBody>
      </MessageBar>
    );

  const now = new Date();
  const sorted = [...users.data]
    .filter(
      (user): user is UserDto & { role: PersonRole } =>
        !(DEVICE_ROLES as readonly Role[]).includes(user.role),
    )
    .sort((a, b) => Number(b.active) - Number(a.active) || a.name.localeCompare(b.name));

  return (
    <>
      {error && (
        <MessageBar intent="error" className={styles.error}>
          <MessageBarBody>{error}</MessageBarBody>
        </MessageBar>
      )}
      <div className={styles.scroll}>
        <Table aria-label="People" className={styles.table}>
          <TableHeader>
            <TableRow>
              <TableHeaderCell>Name</TableHeaderCell>
              <TableHeaderCell>Role</TableHeaderCell>
              <TableHeaderCell>Signs in with</TableHeaderCell>
              <TableHeaderCell>Skill</TableHeaderCell>
              <TableHeaderCell>Pay today</TableHeaderCell>
              <TableHeaderCell>Status</TableHeaderCell>
              <TableHeaderCell>
                <span className="visually-hidden">Actions</span>
              </TableHeaderCell>
            </TableRow>
          </TableHeader>
          <TableBody>
            {sorted.map((user) => {
              const tech = user.role === 'technician';
              return (
                <TableRow key={user.id} className={user.active ? undefined : styles.inactive}>
                  <TableCell>{user.name}</TableCell>
                  <TableCell>{ROLE_LABELS[user.role]}</TableCell>
                  <TableCell>{tech ? `Badge ${user.badge ?? '—'}` : (user.email ?? '—')}</TableCell>
                  <TableCell>{tech ? user.skillLevel : '—'}</TableCell>
                  <TableCell className={styles.numeric}>
                    {tech ? rateWords(user) : '—'}
                    {tech && <RateToCome rate={rateToCome(user, now, timeZone)} shop={shop} />}
                  </TableCell>
                  <TableCell>
                    <Badge appearance="tint" color={user.active ? 'brand' : 'subtle'}>
                      {user.active ? 'Active' : 'Inactive'}
                    </Badge>
                  </TableCell>
                  <TableCell>
                    <div className={styles.actions}>
                      <Button size="small" onClick={() => setEditing(user)} aria-label={`Edit ${user.name}`}>
                        Edit
                      </Button>
                      {tech && (
                        <Button
                          size="small"
                          aria-label={`Pay for ${user.name}`}
                          onClick={() =>
                            setPaying((current) => ({ user, shown: true, n: (current?.n ?? 0) + 1 }))
                          }
                        >
                          Pay…
                        </Button>
                      )}
                      {user.id === currentUserId ? (
                        <Caption1>You</Caption1>
                      ) : (
                        <ActiveButton user={user} onError={setError} />
                      )}
                    </div>
                  </TableCell>
                </TableRow>
              );
            })}
          </TableBody>
        </Table>
      </div>
      {editing && <EditUserDialog user={editing} onClose={() => setEditing(null)} />}
      {paying && (
        <PayRateDialog
          key={paying.n}
          open={paying.shown}
          user={paying.user}
          shop={shop}
          onClose={() => setPaying({ ...paying, shown: false })}
        />
      )}
    </>
  );
}
