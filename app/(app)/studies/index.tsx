import { StudiesScreen } from '@/components/studies/studies-screen';

export default function Studies() {
  return <StudiesScreen />;
}
