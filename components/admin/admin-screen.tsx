import { Screen } from '@/components/ui/screen';
import { KeyValue, Section } from '@/components/ui/sheet';
import { EmptyState } from '@/components/ui/states';
import { Mono } from '@/components/ui/text';
import { useSession } from '@/hooks/use-session';
import { shortDate } from '@/components/findings/finding-row';

/** For now the admin sees who they are signed in as; managing people comes in a later change. */
export function AdminScreen() {
  const { user, expiresAt } = useSession();
  return (
    <Screen title="Session" subtitle="Who is signed in on this device" account testID="admin-screen">
      {user ? (
        <Section title="Signed in">
          <KeyValue label="Name">{user.name}</KeyValue>
          <KeyValue label="E-mail"><Mono>{user.email}</Mono></KeyValue>
          <KeyValue label="Role">{user.role}</KeyValue>
          <KeyValue label="Organization">{user.organizationName ?? 'none'}</KeyValue>
          <KeyValue label="Session ends">{expiresAt ? shortDate(expiresAt) : '–'}</KeyValue>
        </Section>
      ) : <EmptyState title="Not signed in." />}
    </Screen>
  );
}
