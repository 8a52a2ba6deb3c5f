import { useSearchParams } from 'react-router-dom';
import { RequireAuth } from '../../features/auth/components/require-auth';
import { MailboxScreen } from '../../features/mailbox/components/mailbox-screen';
import { AppShell } from '../layout/app-shell';

export function MailboxRoute() {
  const [params, setParams] = useSearchParams();
  return (
    <RequireAuth roles={['admin']}>
      {(user) => (
        <AppShell user={user}>
          <h1 className="mb-4 text-2xl font-semibold">Mailbox</h1>
          <MailboxScreen selectedId={params.get('message')} onSelect={(id) => setParams({ message: id })} />
        </AppShell>
      )}
    </RequireAuth>
  );
}
