import { StudiesScreen } from '@/components/studies/lazy-screens';

export default function Studies() {
  return <StudiesScreen />;
}
