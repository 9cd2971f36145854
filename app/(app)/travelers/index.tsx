import { WhenShown } from '@/components/navigation/when-shown';
import { TravelersScreen } from '@/components/travelers/travelers-screen';

export default function Travelers() {
  // Beneath a page opened from its link it waits until it is shown (components/navigation/when-shown.tsx).
  return (
    <WhenShown>
      <TravelersScreen />
    </WhenShown>
  );
}
