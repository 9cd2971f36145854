import { PeopleScreen } from '@/components/people/people-screen';

export default function People() {
  return <PeopleScreen />;
}
