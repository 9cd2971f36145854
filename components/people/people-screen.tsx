import { View } from 'react-native';
import { Screen } from '@/components/ui/screen';
import { EmptyState } from '@/components/ui/states';
import { TwoPane } from '@/components/ui/two-pane';
import { pagedItems } from '@/hooks/queries/paged';
import { usePeopleOrganizationsQuery } from '@/hooks/queries/people';
import { useSession } from '@/hooks/use-session';
import { InviteForm } from './invite-form';
import { OrganizationsSection } from './organizations-section';
import { PeopleList } from './people-list';
import { PendingInvitations } from './pending-invitations';

/**
 * People and access: the admin's organisations and everyone in them; a supplier's lead engineer the
 * engineers of their own organisation. Who may change whom comes from each person's `allowed` list.
 */
export function PeopleScreen() {
  const { user } = useSession();
  const admin = user?.role === 'admin';
  const manages = admin || (user?.role === 'supplier' && user.lead);
  // Role and organisation choices of the admin's forms read the organisations' kinds.
  // The pages loaded so far (the organisations section loads more): what the forms choose from.
  const orgs = usePeopleOrganizationsQuery(admin);
  const organizations = orgs.data ? pagedItems(orgs.data) : undefined;

  if (!user || !manages) {
    return (
      <Screen title="People" account testID="people-screen">
        <EmptyState
          title="Not yours to manage."
          body="An administrator, or a supplier’s lead engineer for their own engineers, manages people here."
        />
      </Screen>
    );
  }
  return (
    <Screen
      title="People"
      subtitle={
        admin ? 'Organisations, people and their roles' : `Engineers of ${user.organizationName ?? 'your organisation'}`
      }
      account
      full
      testID="people-screen"
    >
      <View style={{ width: '100%', maxWidth: 1200, alignSelf: 'center' }}>
        <TwoPane
          leftWidth={0.55}
          left={<PeopleList organizations={organizations} meId={user.id} />}
          right={
            <>
              <InviteForm me={user} organizations={organizations} />
              <PendingInvitations />
              {admin ? <OrganizationsSection /> : null}
            </>
          }
        />
      </View>
    </Screen>
  );
}
