import { TravelersScreen } from '@/components/travelers/travelers-screen';

export default function Travelers() {
  return <TravelersScreen />;
}
